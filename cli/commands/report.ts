import { createHash } from 'node:crypto';
import { checkSectionOptions } from '../../src/analysis/options.js';
import { InputError } from '../../src/base/errors.js';
import { checkOutputTarget, readInputText, writeFileAtomic } from '../../src/base/files.js';
import { loadModels } from '../../src/read/load.js';
import { VERSION } from '../version.js';
import { marksOfModels } from '../../src/analysis/torsionMember.js';
import { type DrawingFlags, type MarkFlags, markWants, plateSettings, readOptions } from './settings.js';

export interface ReportFlags extends DrawingFlags, MarkFlags {
  output?: string; force?: boolean; degree?: number; levels?: number; triangulation?: string; format?: string; units?: string;
  thickness?: string; density?: string; material?: string;
  /** Fixed date (ISO) instead of now: for reproducible output in tests. */
  date?: string;
}

export async function report(file: string, flags: ReportFlags): Promise<string> {
  const section = checkSectionOptions({ degree: flags.degree, levels: flags.levels, triangulation: flags.triangulation });
  if (flags.output !== undefined && flags.output.trim() === '') throw new InputError('--output', 'expected a file name, got an empty text');
  if (flags.output === '-') flags = { ...flags, output: undefined };
  const write = { force: flags.force, flag: '--output' };
  if (flags.output !== undefined) checkOutputTarget(flags.output, [file], write);
  if (flags.output !== undefined && !/\.html?$/i.test(flags.output)) throw new InputError('--output', `the report is an HTML page; name the file .html (got "${flags.output}"); for a PDF, open the page in a browser and print it`);
  const wants = markWants(flags);
  const input = readInputText(file);
  const models = await loadModels(input.text, input.label, readOptions(flags));
  const given = plateSettings(flags);
  // the drawing stack is loaded only here, never by measure
  const { reportHtml } = await import('../../src/output/reportPart.js');
  const html = await reportHtml(models, {
    section, given, marks: wants ? marksOfModels(models, wants, flags.thickness) : undefined,
    file: { name: input.label, sha256: createHash('sha256').update(input.bytes).digest('hex') },
    version: VERSION,
    date: flags.date ?? new Date().toISOString(),
    settings: { degree: flags.degree, levels: flags.levels, triangulation: flags.triangulation, format: flags.format, units: flags.units, thickness: flags.thickness, density: flags.density, material: flags.material },
  });
  if (flags.output === undefined) return html;
  writeFileAtomic(flags.output, html, [file], write);
  return '';
}
