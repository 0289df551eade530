/**
 * The mass part of `measure`: thickness, density, materials and layers. Kept apart from measure.ts; measure
 * calls measurePlate first and goes on with its own area report when this returns undefined (a plain part
 * without thickness or density).
 */
import { type SectionResult, measureSection } from '../../src/analysis/measure.js';
import { type PlateFlags, hasMassInput, measureMass, resolvePlate } from '../../src/analysis/plate.js';
import { InputError } from '../../src/base/errors.js';
import { detectFormat } from '../../src/read/detect.js';
import type { InputText } from '../../src/base/files.js';
import { type MassUnits, massJson, massText } from '../../src/output/massText.js';
import { sectionJson, sectionText } from '../../src/output/text.js';
import { type PlateModel, readPlateModel, singleLayerModel } from '../../src/read/partJson.js';
import { type ReadOptions, readParts } from '../../src/read/read.js';
import { parseMassMomentUnit, parseMassUnit } from '../../src/model/massUnits.js';
import { integrationOptions } from './integrate.js';
import { userMaterials } from './materials.js';

export interface MassFlags {
  thickness?: string; density?: string; material?: string; materialsFile?: string;
  massUnit?: string; inertiaUnit?: string; tolerance?: number; maxTriangles?: number; timeLimit?: number;
}

/** The plate models in the input: a part file keeps its layers; drawings give one single-layer model per part. */
function plateModels(input: InputText, readOpts: ReadOptions): PlateModel[] {
  const format = readOpts.format ?? detectFormat(input.label === 'stdin' ? undefined : input.label, input.text);
  if (format === 'part-json') {
    if (readOpts.units !== undefined) throw new InputError('--units', 'applies to SVG, GeoJSON and WKT drawings; a part file states its own "units"');
    return [readPlateModel(input.text, input.label)];
  }
  return readParts(input.text, input.label, readOpts).map(singleLayerModel);
}

/**
 * Area properties per layer and mass properties, or undefined when the input has neither layers nor any
 * thickness/density (then measure's own report applies). `section` holds measure's area options.
 * Returns the text and, per part, the area results of its first layer (for the fabrication figures).
 */
export function measurePlate(input: InputText, flags: MassFlags & { json?: boolean }, readOpts: ReadOptions, section: Parameters<typeof measureSection>[1]): { out: string; areas: SectionResult[] } | undefined {
  const models = plateModels(input, readOpts);
  const plateFlags: PlateFlags = { thickness: flags.thickness, density: flags.density, material: flags.material, materials: userMaterials(flags.materialsFile) };
  const wantMass = models.some((m) => hasMassInput(m, plateFlags));
  if (!wantMass && !models.some((m) => m.layered)) {
    for (const k of ['massUnit', 'inertiaUnit', 'tolerance'] as const) {
      if (flags[k] !== undefined) throw new InputError(`--${k === 'massUnit' ? 'mass-unit' : k === 'inertiaUnit' ? 'inertia-unit' : 'tolerance'}`, 'applies to mass properties; give a thickness and a density or material (in the file or with --thickness and --density/--material)');
    }
    return undefined;
  }
  const units: MassUnits = {
    mass: flags.massUnit === undefined ? 'kg' : parseMassUnit(flags.massUnit, '--mass-unit'),
    inertia: flags.inertiaUnit === undefined ? 'kg·m²' : parseMassMomentUnit(flags.inertiaUnit, '--inertia-unit'),
  };
  const opts = { ...integrationOptions({ ...flags, degree: section?.degree }), triangulation: section?.triangulation };
  const texts: string[] = [];
  const docs: Record<string, unknown>[] = [];
  const firstLayers: SectionResult[] = [];
  for (const model of models) {
    const areas = model.layers.map((l) => measureSection(l.part, section));
    firstLayers.push(areas[0]);
    const mass = wantMass ? measureMass(model.name, model.units, resolvePlate(model, plateFlags), opts) : undefined;
    if (flags.json) {
      const doc: Record<string, unknown> = model.layered
        // top-level quantities: the first layer's (the base plate), as readers that take one Part see it
        ? { ...sectionJson(areas[0]), part: model.name, quantitiesOf: `layer "${model.layers[0].name}"`, layers: areas.map((a, i) => ({ layer: model.layers[i].name, ...sectionJson(a) })) }
        : sectionJson(areas[0]);
      if (mass) doc.massProperties = massJson(mass, units);
      docs.push(doc);
    } else {
      for (const a of areas) texts.push(sectionText(a));
      if (mass) texts.push(massText(mass, units));
    }
  }
  const out = flags.json ? JSON.stringify(docs.length === 1 ? docs[0] : { parts: docs }, null, 2) + '\n' : texts.join('\n');
  return { out, areas: firstLayers };
}
