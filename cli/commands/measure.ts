/** `platewise measure`: flags in, one call per part into the analysis entry point, a writer out. */
import { analyzePart } from '../../src/analysis/analyze.js';
import { checkIntegrationOptions, checkSectionOptions } from '../../src/analysis/options.js';
import { InputError, jsonTerminalText, terminalText } from '../../src/base/errors.js';
import { readInputText } from '../../src/base/files.js';
import { reportsJson, reportsText } from '../../src/output/partReport.js';
import { loadModels } from '../../src/read/load.js';
import { userMaterials } from './materials.js';
import { type DrawingFlags, massUnits, plateSettings, readOptions } from './settings.js';

export interface MeasureFlags extends DrawingFlags {
  json?: boolean; degree?: number; levels?: number; triangulation?: string; method?: string; format?: string; units?: string;
  fabrication?: boolean; thickness?: string; density?: string; material?: string; materialsFile?: string;
  massUnit?: string; inertiaUnit?: string; tolerance?: number; maxTriangles?: number; timeLimit?: number;
}

export async function measure(file: string, flags: MeasureFlags): Promise<string> {
  const section = checkSectionOptions(flags);
  const integration = checkIntegrationOptions({ tolerance: flags.tolerance, maxTriangles: flags.maxTriangles, timeLimit: flags.timeLimit });
  const units = massUnits(flags);
  const given = plateSettings(flags);
  const materials = userMaterials(flags.materialsFile);
  const input = readInputText(file);
  const models = await loadModels(input.text, input.label, readOptions(flags));
  const reports = models.map((model) => analyzePart(model, {
    section, given, materials, integration, mass: 'required', fabrication: flags.fabrication ? 'always' : 'auto',
  }));
  if (!reports.some((r) => r.mass)) {
    for (const [k, flag] of [['massUnit', '--mass-unit'], ['inertiaUnit', '--inertia-unit'], ['tolerance', '--tolerance']] as const) {
      if (flags[k] !== undefined) throw new InputError(flag, 'applies to mass properties; give a thickness and a density or material (in the file or with --thickness and --density/--material)');
    }
  }
  return flags.json ? jsonTerminalText(reportsJson(reports, units)) : terminalText(reportsText(reports, units));
}
