import { createHash } from 'node:crypto';
import { analyzePart } from '../../src/analysis/analyze.js';
import { measureSection } from '../../src/analysis/measure.js';
import { checkSectionOptions } from '../../src/analysis/options.js';
import { InputError } from '../../src/base/errors.js';
import { checkOutputTarget, readInputText, writeFileAtomic } from '../../src/base/files.js';
import { loadModels } from '../../src/read/load.js';
import { interpretationText, unitSourceText } from '../../src/output/words.js';
import { VERSION } from '../version.js';
import { type DrawingFlags, plateSettings, readOptions } from './settings.js';

export interface ReportFlags extends DrawingFlags {
  output?: string; force?: boolean; degree?: number; levels?: number; triangulation?: string; format?: string; units?: string;
  thickness?: string; density?: string; material?: string;
  /** Fixed date (ISO) instead of now: for reproducible output in tests. */
  date?: string;
}

/** Levels of the run behind the convergence plot (at least three refinements). */
export const CONVERGENCE_LEVELS = 3;

export async function report(file: string, flags: ReportFlags): Promise<string> {
  const section = checkSectionOptions({ degree: flags.degree, levels: flags.levels, triangulation: flags.triangulation });
  if (flags.output !== undefined && flags.output.trim() === '') throw new InputError('--output', 'expected a file name, got an empty text');
  if (flags.output === '-') flags = { ...flags, output: undefined };
  const write = { force: flags.force, flag: '--output' };
  if (flags.output !== undefined) checkOutputTarget(flags.output, [file], write);
  if (flags.output !== undefined && !/\.html?$/i.test(flags.output)) throw new InputError('--output', `the report is an HTML page; name the file .html (got "${flags.output}"); for a PDF, open the page in a browser and print it`);
  const input = readInputText(file);
  const models = await loadModels(input.text, input.label, readOptions(flags));
  const given = plateSettings(flags);
  // exactly the run `measure` makes with the same flags, so the table equals `measure --json`
  const reports = models.map((m) => analyzePart(m, { section, given, mass: 'optional', fabrication: 'never' }));
  // the convergence plot needs at least three refinement levels: a separate run on the same shape
  const convergence = reports.map((r) => (r.section.levels.length > CONVERGENCE_LEVELS
    ? r.section.levels
    : measureSection(r.section.geometry.part, { ...section, levels: CONVERGENCE_LEVELS }).levels));
  const notes = reports.map((r) => (r.mass ? undefined : r.missing.length > 0
    ? `Mass not shown: no ${r.missing.join(' and ')} — add "thickness" and "density" or "material" to the part file, or use --thickness with --density or --material.`
    : 'Mass not shown: no thickness and density (or material) were given — add "thickness" and "density" or "material" to the part file, or use --thickness with --density or --material.'));

  const { buildReport } = await import('../../src/output/html.js');
  const html = await buildReport({
    file: { name: input.label, sha256: createHash('sha256').update(input.bytes).digest('hex') },
    version: VERSION,
    date: flags.date ?? new Date().toISOString(),
    settings: { degree: flags.degree, levels: flags.levels, triangulation: flags.triangulation, format: flags.format, units: flags.units, thickness: flags.thickness, density: flags.density, material: flags.material },
    parts: reports.map((r, i) => ({
      result: r.section, convergence: convergence[i], mass: r.mass, massNote: notes[i],
      reading: {
        lines: r.interpretation ? interpretationText(r.interpretation, r.part) : [`length unit ${r.units}: ${unitSourceText(r.unitSource)}`],
        draw: { notCut: r.notCut, gapsClosed: r.interpretation?.gapsClosed, unitSource: r.unitSource },
      },
    })),
  });
  if (flags.output === undefined) return html;
  writeFileAtomic(flags.output, html, [file], write);
  return '';
}
