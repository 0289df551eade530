import { analyzePart } from '../../src/analysis/analyze.js';
import { checkSectionOptions } from '../../src/analysis/options.js';
import { InputError } from '../../src/base/errors.js';
import { checkOutputTarget, readInputText, writeFileAtomic, writeFilesAtomic } from '../../src/base/files.js';
import { detectFormat } from '../../src/read/detect.js';
import { loadModels } from '../../src/read/load.js';
import { readModels } from '../../src/read/models.js';
import { marksOfModels } from '../../src/analysis/torsionMember.js';
import { type DrawingFlags, type MarkFlags, markWants, readOptions } from './settings.js';

export interface DrawFlags extends DrawingFlags, MarkFlags {
  output?: string; force?: boolean; mesh?: boolean; shade?: string; sheet?: boolean;
  degree?: number; triangulation?: string; format?: string; units?: string;
}

/** `name.svg` → `name-<i>.svg` (1-based) for files holding several parts. */
export function numberedName(target: string, i: number): string {
  const m = /^(.*?)(\.[^./\\]*)?$/.exec(target)!;
  return `${m[1]}-${i}${m[2] ?? ''}`;
}

/**
 * `--shade thickness` / `--shade density` take the part file's own field (a number or an expression);
 * anything else is passed on ("error" or an expression).
 */
export function shadeText(shade: string | undefined, text: string, label: string, format: string): string | undefined {
  const what = shade?.trim();
  if (what !== 'thickness' && what !== 'density') return shade;
  if (format !== 'part-json') throw new InputError('--shade', `"${what}" comes from a part JSON file; this input is ${format}: give an expression instead, e.g. --shade "7850"`);
  const model = readModels(text, label, { format: 'part-json' })[0];
  if (model.layers.length !== 1) throw new InputError('--shade', `the part has ${model.layers.length} layers, each with its own ${what}; give an expression instead`);
  const field = model.layers[0][what];
  if (!field) throw new InputError('--shade', `the part file gives no "${what}"; give an expression instead`);
  return String(field.text);
}

export async function draw(file: string, flags: DrawFlags): Promise<string> {
  const section = checkSectionOptions({ degree: flags.degree, triangulation: flags.triangulation });
  if (flags.output !== undefined && flags.output.trim() === '') throw new InputError('--output', 'expected a file name, got an empty text');
  if (flags.output === '-') flags = { ...flags, output: undefined };
  const write = { force: flags.force, flag: '--output' };
  // the output name is checked before any work (the numbered names once the parts are known)
  if (flags.output !== undefined) checkOutputTarget(flags.output, [file], write);
  const readOpts = readOptions(flags);
  const wants = markWants(flags);
  const input = readInputText(file);
  const models = await loadModels(input.text, input.label, readOpts);
  const reports = models.map((m) => analyzePart(m, { section, mass: 'never', fabrication: 'never' }));
  const results = reports.map((r) => r.section);
  const marks = wants ? marksOfModels(models, wants) : undefined;
  // the drawing stack is loaded only here, never by measure
  const { drawPart, drawSheet } = await import('../../src/output/draw.js');
  const shade = shadeText(flags.shade, input.text, input.label, readOpts.format ?? detectFormat(input.label === 'stdin' ? undefined : input.label, input.text));
  const named = flags.shade?.trim() === 'thickness' || flags.shade?.trim() === 'density';
  const unit = flags.shade?.trim() === 'density' ? 'kg/m³' : models[0]?.units ?? '';
  const first = reports[0];
  const reading = first ? { notCut: first.notCut, gapsClosed: first.interpretation?.gapsClosed, unitSource: first.unitSource } : undefined;
  const opts = { mesh: flags.mesh, shade, degree: flags.degree, shadeTitle: named ? `${flags.shade!.trim()} = ${shade} ${unit}` : undefined, reading };
  if (flags.sheet || (results.length > 1 && flags.output === undefined)) {
    const svg = await drawSheet(results, opts, marks);
    if (flags.output === undefined) return svg + '\n';
    writeFileAtomic(flags.output, svg + '\n', [file], write);
    return '';
  }
  const svgs: string[] = [];
  for (const [i, r] of results.entries()) svgs.push(await drawPart(r, marks ? { ...opts, marks: marks[i] } : opts));
  if (flags.output === undefined) return svgs[0] + '\n';
  const names = svgs.length === 1 ? [flags.output] : svgs.map((_, i) => numberedName(flags.output!, i + 1));
  writeFilesAtomic(svgs.map((s, i) => ({ target: names[i], data: s + '\n' })), [file], write);
  return '';
}
