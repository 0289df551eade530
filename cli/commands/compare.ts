import { InputError } from '../../src/base/errors.js';
import { readInputText } from '../../src/base/files.js';
import { checkReadOptions, readParts } from '../../src/read/read.js';
import type { Part } from '../../src/geometry/part.js';
import { MASS_CAUTION } from '../../src/output/cautions.js';
import { explainMissing, measurePart } from '../../src/qa/compute.js';
import { modelFor } from '../../src/batch/task.js';
import { plateFromFlags, resolvePlate } from '../../src/model/plate.js';
import { readReference } from '../../src/qa/reference.js';
import { comparisonCsv, comparisonJson, comparisonText } from '../../src/output/compareText.js';
import { compareAll } from '../../src/qa/verdict.js';

export interface CompareFlags {
  reference: string; json?: boolean; csv?: boolean;
  thickness?: string; material?: string; density?: string; part?: string;
  degree?: number; levels?: number; format?: string; units?: string;
}

/** Pick the one part to compare: the only one, or the one named by --part or by the reference's "part". */
export function pickPart(parts: Part[], label: string, wanted: string | undefined, where: string): Part {
  if (wanted !== undefined) {
    const hit = parts.filter((p) => p.name === wanted);
    if (hit.length === 1) return hit[0];
    if (parts.length === 1 && where !== '--part') return parts[0];
    throw new InputError(where, `names part "${wanted}", but ${label} holds ${parts.map((p) => `"${p.name}"`).join(', ')}; expected one of these names`);
  }
  if (parts.length === 1) return parts[0];
  throw new InputError(label, `holds ${parts.length} parts (${parts.map((p) => `"${p.name}"`).join(', ')}); expected one, or --part naming one`);
}

export function compare(file: string, flags: CompareFlags): string {
  if (flags.json && flags.csv) throw new InputError('--csv', 'choose one of --json and --csv');
  if (flags.levels !== undefined && (flags.levels < 1 || flags.levels > 6)) throw new InputError('--levels', `expected 1 to 6, got ${flags.levels}`);
  if (file === '-' && flags.reference === '-') throw new InputError('--reference', 'the part already comes from standard input; expected a reference file');
  const readOpts = checkReadOptions(flags.format, flags.units);
  const plateSpec = plateFromFlags(flags);
  const refText = readInputText(flags.reference);
  const reference = readReference(refText.text, refText.label);
  const input = readInputText(file);
  const parts = readParts(input.text, input.label, readOpts);
  const part = flags.part !== undefined
    ? pickPart(parts, input.label, flags.part, '--part')
    : pickPart(parts, input.label, reference.part, `${refText.label}:part`);
  const plate = resolvePlate(plateSpec, part.units);
  const model = modelFor(input.text, input.label, readOpts.format, part, parts.length);
  const figures = measurePart(part, plate, { degree: flags.degree, levels: flags.levels, model });
  const comparison = compareAll(reference, figures.quantities, { lengthUnit: part.units, partSize: figures.size });
  explainMissing(comparison.rows, figures.known);
  const massStated = reference.values.some((v) => v.dimension === 'mass' || v.dimension === 'massMoment' || v.dimension === 'force');
  const meta = {
    file: input.label, part: part.name, reference: refText.label, lengthUnit: part.units,
    plate: figures.plate.thickness !== undefined ? figures.plate : undefined,
    cautions: massStated ? [MASS_CAUTION] : [],
  };
  // a fail or inconclusive verdict is a result, not an error: print it and say so in the exit status
  if (comparison.verdict !== 'pass') process.exitCode = 1;
  if (flags.json) return JSON.stringify(comparisonJson(comparison, meta), null, 2) + '\n';
  if (flags.csv) return comparisonCsv(comparison);
  return comparisonText(comparison, meta);
}
