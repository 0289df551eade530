import { measureSection } from '../../src/accuracy/measure.js';
import { InputError } from '../../src/errors.js';
import { TRIANGULATORS, type Triangulator } from '../../src/mesh/triangulate.js';
import { readInputText } from '../../src/io/files.js';
import { sectionJson, sectionText } from '../../src/io/output.js';
import { type MassFlags, measurePlate } from './measureMass.js';
import { checkReadOptions, readParts } from '../../src/io/read.js';
import { type FabricationFlags, withFabrication } from './measureFabrication.js';

export interface MeasureFlags { json?: boolean; degree?: number; levels?: number; triangulation?: string; method?: string; format?: string; units?: string }

export function measure(file: string, flags: MeasureFlags & MassFlags): string {
  if (flags.triangulation !== undefined && !TRIANGULATORS.includes(flags.triangulation as Triangulator)) {
    throw new InputError('--triangulation', `expected one of ${TRIANGULATORS.join(', ')}, got "${flags.triangulation}"`);
  }
  if (flags.method !== undefined && flags.method !== 'auto' && flags.method !== 'mesh') throw new InputError('--method', `expected auto or mesh, got "${flags.method}"`);
  if (flags.levels !== undefined && (flags.levels < 1 || flags.levels > 6)) throw new InputError('--levels', `expected 1 to 6, got ${flags.levels}`);
  const readOpts = checkReadOptions(flags.format, flags.units);
  const input = readInputText(file);
  // thickness, density, materials and layers (cli/commands/measureMass.ts); undefined for a plain part
  const plate = measurePlate(input, flags, readOpts, { degree: flags.degree, levels: flags.levels, triangulation: flags.triangulation as Triangulator | undefined });
  if (plate !== undefined) return withFabrication(plate, input, readOpts, { ...(flags as FabricationFlags), json: flags.json }, { degree: flags.degree, levels: flags.levels });
  const parts = readParts(input.text, input.label, readOpts);
  const results = parts.map((p) => measureSection(p, {
    degree: flags.degree, levels: flags.levels, triangulation: flags.triangulation as Triangulator | undefined, method: flags.method as 'auto' | 'mesh' | undefined,
  }));
  if (flags.json) {
    const docs = results.map(sectionJson);
    return withFabrication(JSON.stringify(docs.length === 1 ? docs[0] : { parts: docs }, null, 2) + '\n', input, readOpts, { ...(flags as FabricationFlags), json: flags.json }, { degree: flags.degree, levels: flags.levels });
  }
  return withFabrication(results.map(sectionText).join('\n'), input, readOpts, { ...(flags as FabricationFlags), json: flags.json }, { degree: flags.degree, levels: flags.levels });
}
