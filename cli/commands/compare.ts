import { analyzePart } from '../../src/analysis/analyze.js';
import { checkSectionOptions } from '../../src/analysis/options.js';
import { InputError, jsonTerminalText, terminalText } from '../../src/base/errors.js';
import { readInputText } from '../../src/base/files.js';
import type { PlateModel } from '../../src/model/plate.js';
import { MASS_CAUTION } from '../../src/output/cautions.js';
import { comparisonCsv, comparisonJson, comparisonText } from '../../src/output/compareText.js';
import { densityText } from '../../src/output/words.js';
import { explainMissing, partSize } from '../../src/qa/compute.js';
import { readReference } from '../../src/qa/reference.js';
import { compareAll } from '../../src/qa/verdict.js';
import { loadModels } from '../../src/read/load.js';
import { type DrawingFlags, plateSettings, readOptions } from './settings.js';

export interface CompareFlags extends DrawingFlags {
  reference: string; json?: boolean; csv?: boolean;
  thickness?: string; material?: string; density?: string; part?: string;
  degree?: number; levels?: number; format?: string; units?: string;
}

/** Pick the one part to compare: the only one, or the one named by --part or by the reference's "part". */
export function pickPart<P extends { name: string }>(parts: P[], label: string, wanted: string | undefined, where: string): P {
  if (wanted !== undefined) {
    const hit = parts.filter((p) => p.name === wanted);
    if (hit.length === 1) return hit[0];
    const names = parts.map((p) => `"${p.name}"`).join(', ');
    // a stated-values file about another part is refused, even when the file holds one part: --part says which to use
    if (where !== '--part') throw new InputError(where, `names part "${wanted}", but ${label} holds ${names}; compare against another part only by naming it with --part`);
    throw new InputError(where, `names part "${wanted}", but ${label} holds ${names}; expected one of these names`);
  }
  if (parts.length === 1) return parts[0];
  throw new InputError(label, `holds ${parts.length} parts (${parts.map((p) => `"${p.name}"`).join(', ')}); expected one, or --part naming one`);
}

export async function compare(file: string, flags: CompareFlags): Promise<string> {
  if (flags.json && flags.csv) throw new InputError('--csv', 'choose one of --json and --csv');
  const section = checkSectionOptions({ degree: flags.degree, levels: flags.levels });
  if (file === '-' && flags.reference === '-') throw new InputError('--reference', 'the part already comes from standard input; expected a reference file');
  const readOpts = readOptions(flags);
  const given = plateSettings(flags);
  const refText = readInputText(flags.reference);
  const reference = readReference(refText.text, refText.label);
  const input = readInputText(file);
  const models = await loadModels(input.text, input.label, readOpts);
  const model: PlateModel = flags.part !== undefined
    ? pickPart(models, input.label, flags.part, '--part')
    : pickPart(models, input.label, reference.part, `${refText.label}:part`);
  const report = analyzePart(model, { section, given, mass: 'optional', fabrication: 'always' });
  const comparison = compareAll(reference, report.quantities, { lengthUnit: report.units, partSize: partSize(report) });
  explainMissing(comparison.rows, report);
  const massStated = reference.values.some((v) => v.dimension === 'mass' || v.dimension === 'massMoment' || v.dimension === 'force');
  const p = report.plate;
  const meta = {
    file: input.label, part: report.part, reference: refText.label, lengthUnit: report.units,
    plate: p ? { thickness: p.thickness, density: p.density, material: p.material, densitySource: densityText(p.densityFrom) } : undefined,
    cautions: massStated ? [MASS_CAUTION] : [],
  };
  // a fail or inconclusive verdict is a result, not an error: print it and say so in the exit status
  if (comparison.verdict !== 'pass') process.exitCode = 1;
  if (flags.json) return jsonTerminalText(JSON.stringify(comparisonJson(comparison, meta), null, 2) + '\n');
  if (flags.csv) return comparisonCsv(comparison);
  return terminalText(comparisonText(comparison, meta));
}
