/**
 * Writers for fabrication figures (src/properties/fabrication.ts): a block of text printed under the area
 * properties by `measure`, and the same figures as JSON. Kept apart from src/output/text.ts.
 */
import type { FabricationFigures } from '../properties/fabrication.js';
import type { Quantity } from '../properties/quantities.js';
import type { ConstantPlate } from '../model/plate.js';
import { densityText } from './words.js';
import { MASS_CAUTION } from './cautions.js';
import { formatNumber, quantityRows, renderRows } from './text.js';

/** Order of the fabrication quantities in every writer. */
export const FABRICATION_ORDER = [
  'cutLength', 'cutLengthOuter', 'cutLengthInner', 'pierces', 'blankWidth', 'blankHeight', 'blankAngle', 'blankArea',
  'scrapFraction', 'netMass', 'blankMass',
] as const;

export function orderedFabrication(f: FabricationFigures): Record<string, Quantity> {
  const out: Record<string, Quantity> = {};
  for (const k of FABRICATION_ORDER) {
    const q = f.quantities[k];
    if (q) out[k] = q;
  }
  return out;
}

function methodText(f: FabricationFigures): string {
  const b = f.blank;
  const how = b.method === 'calipers'
    ? 'rotating calipers on the convex hull (exact for straight edges)'
    : `angle scan with a certified lower bound (${b.evaluations} support evaluations; no enclosing rectangle is smaller than ${formatNumber(b.lowerBound, 8)})`;
  const spread = b.angleSpread > 0.01
    ? `; other rectangles of the same area lie up to ${formatNumber(b.angleSpread, 3)}° away, so the angle is not unique`
    : b.angleSpread > 0 ? `; angle determined to within ${formatNumber(b.angleSpread, 2)}°` : '';
  return `blank: the minimum-area enclosing rectangle, by ${how}${spread}`;
}

/** The fabrication block for one part, in its length unit; `plate` when masses were computed. */
export function fabricationText(f: FabricationFigures, units: string, plate?: ConstantPlate, withCaution = true): string {
  const x = f.box;
  const lines = [
    `fabrication figures — lengths in ${units}`,
    '',
    renderRows(quantityRows(orderedFabrication(f), units)),
    '',
    `bounding rectangle (axis-aligned): ${formatNumber(x.width)} × ${formatNumber(x.height)} ${units}, ` +
      `x ${formatNumber(x.xMin)} to ${formatNumber(x.xMax)}, y ${formatNumber(x.yMin)} to ${formatNumber(x.yMax)}`,
    `blank corners: ${f.blank.corners.map(([a, b]) => `(${formatNumber(a, 8)}, ${formatNumber(b, 8)})`).join(' ')}`,
    methodText(f),
    'pierces: one per closed contour (outer contours and holes); cut length: every contour once',
  ];
  if (f.quantities.netMass && plate) {
    lines.push(`masses: thickness ${formatNumber(plate.thickness ?? NaN)} ${units}, density ${formatNumber(plate.density ?? NaN)} kg/m³` +
      ` (${densityText(plate.densityFrom)}); blank mass = blank area × thickness × density`);
  } else {
    lines.push('masses: not computed (give a thickness and a material or density)');
  }
  if (f.caution && withCaution) lines.push('', MASS_CAUTION);
  return lines.join('\n') + '\n';
}

export function fabricationJson(f: FabricationFigures, units: string, plate?: ConstantPlate): Record<string, unknown> {
  const q: Record<string, Quantity> = {};
  for (const [k, v] of Object.entries(orderedFabrication(f))) q[k] = { value: v.value, error: v.error };
  return {
    units: { length: units, angle: 'deg', mass: 'kg' },
    quantities: q,
    box: { ...f.box },
    blank: {
      width: f.blank.width, height: f.blank.height, angle: f.blank.angle, area: f.blank.area, corners: f.blank.corners,
      method: f.blank.method, lowerBound: f.blank.lowerBound, angleSpread: f.blank.angleSpread,
    },
    plate: plate ? { thickness: plate.thickness, density: plate.density, ...(plate.material ? { material: plate.material } : {}), densitySource: densityText(plate.densityFrom) } : null,
    ...(f.caution ? { caution: MASS_CAUTION } : {}),
  };
}
