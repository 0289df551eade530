/**
 * Everything platewise computes for one part, in one place, for `compare` and `batch`: the section
 * quantities of `measureSection`, the fabrication figures of `fabricationFigures`, and the masses when a
 * thickness and a density are known. All values are { value, error } in the part's length unit (masses kg).
 *
 * Mass: computed here as net area × thickness × density through `fabricationFigures` (keys netMass,
 * blankMass). Mass moments of inertia are not computed here.
 */
import { type MeasureOptions, type SectionResult, measureSection } from '../accuracy/measure.js';
import type { Part } from '../geometry/part.js';
import { type FabricationFigures, fabricationFigures } from '../properties/fabrication.js';
import type { Quantity } from '../properties/quantities.js';
import type { ResolvedPlate } from './plate.js';

export interface PartFigures {
  section: SectionResult;
  fabrication: FabricationFigures;
  /** Section and fabrication quantities by key. */
  quantities: Record<string, Quantity>;
  plate: ResolvedPlate;
  /** Bounding-box diagonal in the part's unit (for default length tolerances). */
  size: number;
}

export function measurePart(part: Part, plate: ResolvedPlate, options: MeasureOptions = {}): PartFigures {
  const section = measureSection(part, options);
  const fabrication = fabricationFigures(section.geometry.part, {
    area: section.quantities.area, thickness: plate.thickness, density: plate.density,
  });
  const quantities: Record<string, Quantity> = { ...section.quantities };
  for (const [k, v] of Object.entries(fabrication.quantities)) if (v) quantities[k] = v;
  const b = fabrication.box;
  return { section, fabrication, quantities, plate, size: Math.hypot(b.width, b.height) };
}

/** Say why a stated mass was not computed (no thickness or density), instead of the generic note. */
export function explainMissing(rows: { quantity: string; note?: string; computed: number | null }[], plate: ResolvedPlate): void {
  for (const r of rows) {
    if (r.computed === null && (r.quantity === 'netMass' || r.quantity === 'blankMass')) {
      const need = [plate.thickness === undefined ? 'a thickness' : '', plate.density === undefined ? 'a density (material or density)' : '']
        .filter(Boolean).join(' and ');
      r.note = `not computed: needs ${need}`;
    }
  }
}
