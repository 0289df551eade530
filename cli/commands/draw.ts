import { measureSection } from '../../src/analysis/measure.js';
import { InputError } from '../../src/base/errors.js';
import { TRIANGULATORS, type Triangulator } from '../../src/mesh/triangulate.js';
import { readInputText, writeFileAtomic, writeFilesAtomic } from '../../src/base/files.js';
import { checkReadOptions, readParts } from '../../src/read/read.js';
import { detectFormat } from '../../src/read/detect.js';
import { readPlateModel } from '../../src/read/partJson.js';

export interface DrawFlags {
  output?: string; mesh?: boolean; shade?: string; sheet?: boolean;
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
  const model = readPlateModel(text, label);
  if (model.layers.length !== 1) throw new InputError('--shade', `the part has ${model.layers.length} layers, each with its own ${what}; give an expression instead`);
  const field = model.layers[0][what];
  if (!field) throw new InputError('--shade', `the part file gives no "${what}"; give an expression instead`);
  return String(field.value);
}

export async function draw(file: string, flags: DrawFlags): Promise<string> {
  if (flags.triangulation !== undefined && !TRIANGULATORS.includes(flags.triangulation as Triangulator)) {
    throw new InputError('--triangulation', `expected one of ${TRIANGULATORS.join(', ')}, got "${flags.triangulation}"`);
  }
  if (flags.output !== undefined && flags.output.trim() === '') throw new InputError('--output', 'expected a file name, got an empty text');
  const readOpts = checkReadOptions(flags.format, flags.units);
  const input = readInputText(file);
  const parts = readParts(input.text, input.label, readOpts);
  const results = parts.map((p) => measureSection(p, { degree: flags.degree, triangulation: flags.triangulation as Triangulator | undefined }));
  // the drawing stack is loaded only here, never by measure
  const { drawPart, drawSheet } = await import('../../src/output/draw.js');
  const shade = shadeText(flags.shade, input.text, input.label, readOpts.format ?? detectFormat(input.label === 'stdin' ? undefined : input.label, input.text));
  const named = flags.shade?.trim() === 'thickness' || flags.shade?.trim() === 'density';
  const unit = flags.shade?.trim() === 'density' ? 'kg/m³' : parts[0]?.units ?? '';
  const opts = { mesh: flags.mesh, shade, degree: flags.degree, shadeTitle: named ? `${flags.shade!.trim()} = ${shade} ${unit}` : undefined };
  if (flags.sheet || (results.length > 1 && flags.output === undefined)) {
    const svg = await drawSheet(results, opts);
    if (flags.output === undefined) return svg + '\n';
    writeFileAtomic(flags.output, svg + '\n', [file]);
    return '';
  }
  const svgs: string[] = [];
  for (const r of results) svgs.push(await drawPart(r, opts));
  if (flags.output === undefined) return svgs[0] + '\n';
  const names = svgs.length === 1 ? [flags.output] : svgs.map((_, i) => numberedName(flags.output!, i + 1));
  for (const n of names) if (n === file) throw new InputError(n, 'is the input file of this run; choose another output name (inputs are never overwritten)');
  writeFilesAtomic(svgs.map((s, i) => ({ target: names[i], data: s + '\n' })), [file]);
  return '';
}
