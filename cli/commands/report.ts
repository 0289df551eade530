import { createHash } from 'node:crypto';
import { measureSection } from '../../src/analysis/measure.js';
import { type MassResult, type PlateFlags, hasMassInput, measureMass, resolvePlate } from '../../src/analysis/plate.js';
import { InputError } from '../../src/base/errors.js';
import { TRIANGULATORS, type Triangulator } from '../../src/mesh/triangulate.js';
import { readInputText, writeFileAtomic } from '../../src/base/files.js';
import { type PlateModel, readPlateModel, singleLayerModel } from '../../src/read/partJson.js';
import { checkReadOptions, readParts } from '../../src/read/read.js';
import { detectFormat } from '../../src/read/detect.js';
import type { Part } from '../../src/geometry/part.js';
import { VERSION } from '../version.js';

export interface ReportFlags {
  output?: string; degree?: number; levels?: number; triangulation?: string; format?: string; units?: string;
  thickness?: string; density?: string; material?: string;
  /** Fixed date (ISO) instead of now: for reproducible output in tests. */
  date?: string;
}

/** Levels of the run behind the convergence plot (at least three refinements). */
export const CONVERGENCE_LEVELS = 3;

function plateModels(text: string, label: string, format: string, parts: Part[]): PlateModel[] {
  // part JSON states thickness, density, material or layers itself; drawings get them from the flags only
  if (format === 'part-json') return [readPlateModel(text, label)];
  return parts.map(singleLayerModel);
}

export async function report(file: string, flags: ReportFlags): Promise<string> {
  if (flags.triangulation !== undefined && !TRIANGULATORS.includes(flags.triangulation as Triangulator)) {
    throw new InputError('--triangulation', `expected one of ${TRIANGULATORS.join(', ')}, got "${flags.triangulation}"`);
  }
  if (flags.levels !== undefined && (flags.levels < 1 || flags.levels > 6)) throw new InputError('--levels', `expected 1 to 6, got ${flags.levels}`);
  if (flags.output !== undefined && flags.output.trim() === '') throw new InputError('--output', 'expected a file name, got an empty text');
  const readOpts = checkReadOptions(flags.format, flags.units);
  const input = readInputText(file);
  const format = readOpts.format ?? detectFormat(input.label === 'stdin' ? undefined : input.label, input.text);
  const parts = readParts(input.text, input.label, readOpts);
  const triangulation = flags.triangulation as Triangulator | undefined;
  // exactly the run `measure` makes with the same flags, so the table equals `measure --json`
  const results = parts.map((p) => measureSection(p, { degree: flags.degree, levels: flags.levels, triangulation }));
  const convergence = parts.map((p, i) => (results[i].levels.length > CONVERGENCE_LEVELS
    ? results[i].levels
    : measureSection(p, { degree: flags.degree, levels: CONVERGENCE_LEVELS, triangulation }).levels));

  const plateFlags: PlateFlags = { thickness: flags.thickness, density: flags.density, material: flags.material };
  const models = plateModels(input.text, input.label, format, parts);
  const masses: (MassResult | undefined)[] = [];
  const notes: (string | undefined)[] = [];
  parts.forEach((_, i) => {
    const model = models.length === parts.length ? models[i] : undefined;
    if (!model) { masses.push(undefined); notes.push('Mass not shown: the file holds several parts and mass input could not be matched to them.'); return; }
    if (!hasMassInput(model, plateFlags)) {
      masses.push(undefined);
      notes.push('Mass not shown: no thickness and density (or material) were given — add "thickness" and "density" or "material" to the part file, or use --thickness with --density or --material.');
      return;
    }
    masses.push(measureMass(model.name, model.units, resolvePlate(model, plateFlags), { degree: flags.degree, triangulation }));
    notes.push(undefined);
  });

  const { buildReport } = await import('../../src/output/html.js');
  const html = await buildReport({
    file: { name: input.label, sha256: createHash('sha256').update(input.bytes).digest('hex') },
    version: VERSION,
    date: flags.date ?? new Date().toISOString(),
    settings: { degree: flags.degree, levels: flags.levels, triangulation: flags.triangulation, format: flags.format, units: flags.units, thickness: flags.thickness, density: flags.density, material: flags.material },
    parts: results.map((result, i) => ({ result, convergence: convergence[i], mass: masses[i], massNote: notes[i] })),
  });
  if (flags.output === undefined) return html;
  writeFileAtomic(flags.output, html, [file]);
  return '';
}
