import { measureSection } from '../../src/analysis/measure.js';
import { InputError } from '../../src/base/errors.js';
import { TRIANGULATORS, type Triangulator } from '../../src/mesh/triangulate.js';
import { readInputText } from '../../src/base/files.js';
import { sectionJson, sectionText } from '../../src/output/text.js';
import type { MassFlags } from './measureMass.js';
import { checkReadOptions, readParts } from '../../src/read/read.js';
import type { FabricationFlags } from './measureFabrication.js';

export interface MeasureFlags { json?: boolean; degree?: number; levels?: number; triangulation?: string; method?: string; format?: string; units?: string }

/** Does the run involve thickness, density, materials or fabrication figures? (Then load those modules.) */
function involvesPlate(text: string, flags: MeasureFlags & MassFlags & FabricationFlags): boolean {
  const f = flags;
  return f.fabrication === true || f.thickness !== undefined || f.density !== undefined || f.material !== undefined ||
    f.materialsFile !== undefined || f.massUnit !== undefined || f.inertiaUnit !== undefined || f.tolerance !== undefined ||
    f.maxTriangles !== undefined || f.timeLimit !== undefined || /"(thickness|density|material|layers)"\s*:/.test(text);
}

export async function measure(file: string, flags: MeasureFlags & MassFlags): Promise<string> {
  if (flags.triangulation !== undefined && !TRIANGULATORS.includes(flags.triangulation as Triangulator)) {
    throw new InputError('--triangulation', `expected one of ${TRIANGULATORS.join(', ')}, got "${flags.triangulation}"`);
  }
  if (flags.method !== undefined && flags.method !== 'auto' && flags.method !== 'mesh') throw new InputError('--method', `expected auto or mesh, got "${flags.method}"`);
  if (flags.levels !== undefined && (flags.levels < 1 || flags.levels > 6)) throw new InputError('--levels', `expected 1 to 6, got ${flags.levels}`);
  const readOpts = checkReadOptions(flags.format, flags.units);
  const input = readInputText(file);
  const sectionOptions = {
    degree: flags.degree, levels: flags.levels, triangulation: flags.triangulation as Triangulator | undefined, method: flags.method as 'auto' | 'mesh' | undefined,
  };
  const plainResults = () => readParts(input.text, input.label, readOpts).map((p) => measureSection(p, sectionOptions));
  const plainOutput = (results: ReturnType<typeof plainResults>) => {
    if (!flags.json) return results.map(sectionText).join('\n');
    const docs = results.map(sectionJson);
    return JSON.stringify(docs.length === 1 ? docs[0] : { parts: docs }, null, 2) + '\n';
  };
  // plain area properties: the mass and fabrication modules are not even loaded (start-up time)
  if (!involvesPlate(input.text, flags)) return plainOutput(plainResults());
  const { measurePlate } = await import('./measureMass.js');
  const { withFabrication } = await import('./measureFabrication.js');
  const fabFlags = { ...(flags as FabricationFlags), json: flags.json };
  // thickness, density, materials and layers (cli/commands/measureMass.ts); undefined for a plain part
  const plate = measurePlate(input, flags, readOpts, { degree: flags.degree, levels: flags.levels, triangulation: sectionOptions.triangulation });
  if (plate !== undefined) return withFabrication(plate.out, input, readOpts, fabFlags, sectionOptions, plate.areas);
  const results = plainResults();
  return withFabrication(plainOutput(results), input, readOpts, fabFlags, sectionOptions, results);
}
