/**
 * The catalogue of reported quantities: stable JSON key, what it is, and its physical dimension.
 * Every reported quantity is a `Quantity` = { value, error } in the part's units.
 * Adding a quantity: add it here, compute it in src/properties/section.ts (or the module that owns it),
 * and the table/JSON/CSV writers pick it up from this list.
 */

export interface Quantity {
  value: number;
  /** Estimated absolute error, in the value's units; never negative. */
  error: number;
}

/**
 * Dimensions in terms of the part's length unit L (and mass M for mass properties).
 * 'angle' is in degrees, 'count' is a plain number.
 */
export type Dimension =
  | 'length' | 'area' | 'length3' | 'length4'
  | 'angle' | 'count' | 'ratio'
  | 'mass' | 'massMoment' | 'force';

/** Powers of length in each length-based dimension (for unit conversion). */
export const LENGTH_POWER: Partial<Record<Dimension, number>> = {
  length: 1, area: 2, length3: 3, length4: 4,
};

export interface QuantityInfo {
  key: string;
  dimension: Dimension;
  description: string;
}

const q = (key: string, dimension: Dimension, description: string): QuantityInfo => ({ key, dimension, description });

/** Area properties of a region or part, in the order they are printed. */
export const SECTION_QUANTITIES: readonly QuantityInfo[] = [
  q('area', 'area', 'net area'),
  q('perimeter', 'length', 'length of all boundary loops (cut length)'),
  q('centroidX', 'length', 'centroid, x'),
  q('centroidY', 'length', 'centroid, y'),
  q('Ix', 'length4', 'second moment about the centroidal axis parallel to x, ∫(y−ȳ)² dA'),
  q('Iy', 'length4', 'second moment about the centroidal axis parallel to y, ∫(x−x̄)² dA'),
  q('Ixy', 'length4', 'product moment about centroidal axes, ∫(x−x̄)(y−ȳ) dA'),
  q('IxOrigin', 'length4', 'second moment about the x axis, ∫y² dA'),
  q('IyOrigin', 'length4', 'second moment about the y axis, ∫x² dA'),
  q('IxyOrigin', 'length4', 'product moment about the origin, ∫xy dA'),
  q('I1', 'length4', 'major principal second moment'),
  q('I2', 'length4', 'minor principal second moment'),
  q('principalAngle', 'angle', 'angle of the I1 axis from +x, degrees, in (−90, 90]'),
  q('Ip', 'length4', 'polar second moment about the centroid, Ix + Iy'),
  q('rx', 'length', 'radius of gyration about the centroidal x axis, √(Ix/A)'),
  q('ry', 'length', 'radius of gyration about the centroidal y axis, √(Iy/A)'),
  q('SxTop', 'length3', 'elastic section modulus about the centroidal x axis to the top fibre, Ix/(yMax−ȳ)'),
  q('SxBottom', 'length3', 'elastic section modulus about the centroidal x axis to the bottom fibre, Ix/(ȳ−yMin)'),
  q('SyRight', 'length3', 'elastic section modulus about the centroidal y axis to the right fibre, Iy/(xMax−x̄)'),
  q('SyLeft', 'length3', 'elastic section modulus about the centroidal y axis to the left fibre, Iy/(x̄−xMin)'),
  q('xMin', 'length', 'bounding box, smallest x'),
  q('yMin', 'length', 'bounding box, smallest y'),
  q('xMax', 'length', 'bounding box, largest x'),
  q('yMax', 'length', 'bounding box, largest y'),
  q('width', 'length', 'bounding box width, xMax − xMin'),
  q('height', 'length', 'bounding box height, yMax − yMin'),
];

export type SectionKey =
  | 'area' | 'perimeter' | 'centroidX' | 'centroidY'
  | 'Ix' | 'Iy' | 'Ixy' | 'IxOrigin' | 'IyOrigin' | 'IxyOrigin'
  | 'I1' | 'I2' | 'principalAngle' | 'Ip' | 'rx' | 'ry'
  | 'SxTop' | 'SxBottom' | 'SyRight' | 'SyLeft'
  | 'xMin' | 'yMin' | 'xMax' | 'yMax' | 'width' | 'height';

export type SectionValues = Record<SectionKey, number>;
export type SectionQuantities = Record<SectionKey, Quantity>;

const INFO = new Map<string, QuantityInfo>(SECTION_QUANTITIES.map((i) => [i.key, i]));

/** Register quantities owned by other modules (mass properties, fabrication figures). */
export function registerQuantities(list: readonly QuantityInfo[]): void {
  for (const i of list) INFO.set(i.key, i);
}

export function quantityInfo(key: string): QuantityInfo | undefined {
  return INFO.get(key);
}

/** Unit text for a dimension given the part's length unit. */
export function unitText(dim: Dimension, length: string, mass = 'kg'): string {
  switch (dim) {
    case 'length': return length;
    case 'area': return `${length}²`;
    case 'length3': return `${length}³`;
    case 'length4': return `${length}⁴`;
    case 'angle': return '°';
    case 'count': return '';
    case 'ratio': return '';
    case 'mass': return mass;
    case 'massMoment': return `${mass}·m²`;
    case 'force': return 'N';
  }
}
