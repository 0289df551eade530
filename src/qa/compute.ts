/**
 * Everything platewise computes for one part, in one place, for `compare` and `batch`: the section
 * quantities of `measureSection`, the fabrication figures of `fabricationFigures`, and the mass properties of
 * `measureMass` (src/analysis/plate.ts) when a thickness and a density are known. All values are
 * { value, error } in the part's length unit (masses kg, weight N, mass moments kg·m²).
 *
 * Where thickness and density come from, per part: the part file first (part JSON "thickness", "density",
 * "material", "layers"), then the settings given to compare/batch (flags, manifest cells) for what the file
 * leaves unset. A setting given in both places is refused by `resolvePlate` (one place for each figure);
 * command-line defaults of `batch` only fill gaps (see `gapsOnly`).
 *
 * netMass and blankMass (fabrication) need one constant thickness and density; a layered part or one whose
 * thickness or density varies gets the integrated `mass` and friends only.
 */
import { type MeasureOptions, type SectionResult, measureSection } from '../analysis/measure.js';
import { type ResolvedLayer, measureMass, resolvePlate as resolveLayers } from '../analysis/plate.js';
import type { Part } from '../geometry/part.js';
import { type PlateModel, singleLayerModel } from '../read/partJson.js';
import { type FabricationFigures, fabricationFigures } from '../properties/fabrication.js';
import type { Quantity } from '../properties/quantities.js';
import type { PlateSpec, ResolvedPlate } from '../model/plate.js';

export interface PartFigures {
  section: SectionResult;
  fabrication: FabricationFigures;
  /** Section, fabrication and (when computed) mass quantities by key. */
  quantities: Record<string, Quantity>;
  /** Constant thickness and density used for netMass/blankMass (empty when none or not constant). */
  plate: ResolvedPlate;
  /** What is known, file or settings (NaN marks a value known but not constant or from the file): for messages. */
  known: ResolvedPlate;
  /** True when mass properties (mass, weight, centres, mass moments) were integrated. */
  massProperties: boolean;
  /** Bounding-box diagonal in the part's unit (for default length tolerances). */
  size: number;
}

/** A single-layer model for a part read from a drawing (or a part JSON without plate keys). */
export { singleLayerModel as plainModel } from '../read/partJson.js';

/** Settings in the part's unit as flag texts for `resolvePlate` (src/analysis/plate.ts). */
function flagTexts(plate: ResolvedPlate): { thickness?: string; density?: string } {
  return {
    thickness: plate.thickness !== undefined ? String(plate.thickness) : undefined,
    density: plate.density !== undefined ? String(plate.density) : undefined,
  };
}

/** Drop the settings the model already states (command-line defaults of `batch` fill gaps only). */
export function gapsOnly(model: PlateModel, spec: PlateSpec): PlateSpec {
  const out: PlateSpec = { ...spec };
  if (model.layers.some((l) => l.thickness !== undefined)) delete out.thickness;
  if (model.layers.some((l) => l.density !== undefined || l.material !== undefined)) {
    delete out.density; delete out.material;
  }
  return out;
}

export interface MeasurePartOptions extends MeasureOptions {
  /** The part's plate model (part JSON with thickness/density/material/layers); default: the part alone. */
  model?: PlateModel;
  /**
   * Integrate mass properties when thickness and density are known (default true). false skips them for a
   * constant single-layer plate (netMass is then the mass); layered or varying plates are always integrated.
   */
  massProperties?: boolean;
}

export function measurePart(part: Part, plate: ResolvedPlate, options: MeasurePartOptions = {}): PartFigures {
  const model = options.model ?? singleLayerModel(part);
  const section = measureSection(part, options);
  const flags = flagTexts(plate);
  // resolve when both are known (from the file or the settings); an InputError names a figure given twice
  const haveThickness = flags.thickness !== undefined || model.layers.every((l) => l.thickness !== undefined);
  const haveDensity = flags.density !== undefined || model.layers.every((l) => l.density !== undefined || l.material !== undefined);
  const layers: ResolvedLayer[] | null = haveThickness && haveDensity ? resolveLayers(model, flags) : null;
  const known: ResolvedPlate = { ...plate };
  if (haveThickness && known.thickness === undefined) known.thickness = NaN;
  if (haveDensity && known.density === undefined) known.density = NaN;
  // constant single-layer plate: fabrication masses
  const constant: ResolvedPlate = {};
  if (layers && layers.length === 1 && layers[0].thickness.constant !== undefined && layers[0].density.constant !== undefined) {
    constant.thickness = layers[0].thickness.constant;
    constant.density = layers[0].density.constant;
    constant.material = layers[0].material ?? plate.material;
    constant.densitySource = plate.density !== undefined && layers[0].density.where === '--density' ? plate.densitySource : layers[0].densitySource;
  }
  const fabrication = fabricationFigures(section.geometry.part, {
    area: section.quantities.area, thickness: constant.thickness, density: constant.density,
  });
  const quantities: Record<string, Quantity> = { ...section.quantities };
  for (const [k, v] of Object.entries(fabrication.quantities)) if (v) quantities[k] = v;
  let massProperties = false;
  // without a constant plate there is no netMass: integrate the mass then even when not asked to
  if (layers && (options.massProperties !== false || constant.thickness === undefined)) {
    const m = measureMass(model.name, model.units, layers, { degree: options.degree, triangulation: options.triangulation });
    for (const [k, v] of Object.entries(m.quantities)) quantities[k] = v;
    massProperties = true;
  }
  const b = fabrication.box;
  return { section, fabrication, quantities, plate: constant, known, massProperties, size: Math.hypot(b.width, b.height) };
}

const MASS_KEYS_NEEDING_PLATE = new Set([
  'netMass', 'blankMass', 'mass', 'weight', 'massCentreX', 'massCentreY', 'massCentreZ',
  'massMomentX', 'massMomentY', 'massMomentZ', 'massProductXY', 'massProductXZ', 'massProductYZ',
]);

/** Is this a key that needs a thickness and a density? */
export function needsPlate(key: string): boolean {
  return MASS_KEYS_NEEDING_PLATE.has(key);
}

/** Say why a stated mass was not computed (no thickness or density), instead of the generic note. */
export function explainMissing(rows: { quantity: string; note?: string; computed: number | null }[], plate: ResolvedPlate): void {
  for (const r of rows) {
    if (r.computed === null && needsPlate(r.quantity)) {
      const need = [plate.thickness === undefined ? 'a thickness' : '', plate.density === undefined ? 'a density (material or density)' : '']
        .filter(Boolean).join(' and ');
      r.note = need
        ? `not computed: needs ${need}`
        : 'not computed: netMass and blankMass need one constant thickness and density (see mass for layered or varying plates)';
    }
  }
}
