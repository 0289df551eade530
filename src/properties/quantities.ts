/**
 * The catalogue of reported quantities: stable JSON key, what it is, and its physical dimension.
 * Every reported quantity is a `Quantity` = { value, error } in the part's units.
 * Adding a quantity: add it to QUANTITIES here, compute it in the module that owns it (section.ts, mass.ts,
 * fabrication.ts), and the table/JSON/CSV writers, reference files and manifests pick it up from the catalogue.
 */

export interface Quantity {
  value: number;
  /** Estimated absolute error, in the value's units; never negative. */
  error: number;
  /**
   * Present and false when the error is an estimate that is not known to bound the true error (an integrand
   * not proved smooth: a kink, jump or singularity); verdicts on such a value are inconclusive.
   */
  errorIsBound?: false;
}

/**
 * Dimensions in terms of the part's length unit L (and mass M for mass properties).
 * 'angle' is in degrees, 'count' is a plain number.
 */
export type Dimension =
  | 'length' | 'area' | 'length3' | 'length4' | 'length6' | 'perLength3'
  | 'angle' | 'count' | 'ratio'
  | 'mass' | 'massMoment' | 'force';

/** Powers of length in each length-based dimension (for unit conversion). */
export const LENGTH_POWER: Partial<Record<Dimension, number>> = {
  length: 1, area: 2, length3: 3, length4: 4, length6: 6, perLength3: -3,
};

export type QuantityGroup = 'section' | 'mass' | 'fabrication' | 'torsion' | 'plastic';

export interface QuantityInfo {
  readonly key: string;
  readonly group: QuantityGroup;
  readonly dimension: Dimension;
  readonly description: string;
}

/**
 * The one static catalogue of reported quantities, in print order. Key types are derived from it, and the
 * writers, stated-value files, manifests and the report read it; nothing registers quantities at import time.
 * Mass quantities are in SI (kg, N, kg·m²) except centres (the part's length unit).
 */
export const QUANTITIES = [
  { key: 'area', group: 'section', dimension: 'area', description: 'net area' },
  { key: 'perimeter', group: 'section', dimension: 'length', description: 'length of all boundary loops (cut length)' },
  { key: 'centroidX', group: 'section', dimension: 'length', description: 'centroid, x' },
  { key: 'centroidY', group: 'section', dimension: 'length', description: 'centroid, y' },
  { key: 'Ix', group: 'section', dimension: 'length4', description: 'second moment about the centroidal axis parallel to x, ∫(y−ȳ)² dA' },
  { key: 'Iy', group: 'section', dimension: 'length4', description: 'second moment about the centroidal axis parallel to y, ∫(x−x̄)² dA' },
  { key: 'Ixy', group: 'section', dimension: 'length4', description: 'product moment about centroidal axes, ∫(x−x̄)(y−ȳ) dA' },
  { key: 'IxOrigin', group: 'section', dimension: 'length4', description: 'second moment about the x axis, ∫y² dA' },
  { key: 'IyOrigin', group: 'section', dimension: 'length4', description: 'second moment about the y axis, ∫x² dA' },
  { key: 'IxyOrigin', group: 'section', dimension: 'length4', description: 'product moment about the origin, ∫xy dA' },
  { key: 'I1', group: 'section', dimension: 'length4', description: 'major principal second moment' },
  { key: 'I2', group: 'section', dimension: 'length4', description: 'minor principal second moment' },
  { key: 'principalAngle', group: 'section', dimension: 'angle', description: 'angle of the I1 axis from +x, degrees, in (−90, 90]' },
  { key: 'Ip', group: 'section', dimension: 'length4', description: 'polar second moment about the centroid, Ix + Iy' },
  { key: 'rx', group: 'section', dimension: 'length', description: 'radius of gyration about the centroidal x axis, √(Ix/A)' },
  { key: 'ry', group: 'section', dimension: 'length', description: 'radius of gyration about the centroidal y axis, √(Iy/A)' },
  { key: 'SxTop', group: 'section', dimension: 'length3', description: 'elastic section modulus about the centroidal x axis to the top fibre, Ix/(yMax−ȳ)' },
  { key: 'SxBottom', group: 'section', dimension: 'length3', description: 'elastic section modulus about the centroidal x axis to the bottom fibre, Ix/(ȳ−yMin)' },
  { key: 'SyRight', group: 'section', dimension: 'length3', description: 'elastic section modulus about the centroidal y axis to the right fibre, Iy/(xMax−x̄)' },
  { key: 'SyLeft', group: 'section', dimension: 'length3', description: 'elastic section modulus about the centroidal y axis to the left fibre, Iy/(x̄−xMin)' },
  { key: 'xMin', group: 'section', dimension: 'length', description: 'bounding box, smallest x' },
  { key: 'yMin', group: 'section', dimension: 'length', description: 'bounding box, smallest y' },
  { key: 'xMax', group: 'section', dimension: 'length', description: 'bounding box, largest x' },
  { key: 'yMax', group: 'section', dimension: 'length', description: 'bounding box, largest y' },
  { key: 'width', group: 'section', dimension: 'length', description: 'bounding box width, xMax − xMin' },
  { key: 'height', group: 'section', dimension: 'length', description: 'bounding box height, yMax − yMin' },
  { key: 'mass', group: 'mass', dimension: 'mass', description: 'mass, ∫ρ·t dA' },
  { key: 'weight', group: 'mass', dimension: 'force', description: 'weight under standard gravity 9.80665 m/s², newtons' },
  { key: 'massCentreX', group: 'mass', dimension: 'length', description: 'centre of mass, x' },
  { key: 'massCentreY', group: 'mass', dimension: 'length', description: 'centre of mass, y' },
  { key: 'massCentreZ', group: 'mass', dimension: 'length', description: 'centre of mass, z (height above z = 0, the first layer’s underside by default)' },
  { key: 'massMomentX', group: 'mass', dimension: 'massMoment', description: 'mass moment of inertia about the axis through the centre of mass parallel to x, ∫(y′² + z′²) dm' },
  { key: 'massMomentY', group: 'mass', dimension: 'massMoment', description: 'mass moment of inertia about the axis through the centre of mass parallel to y, ∫(x′² + z′²) dm' },
  { key: 'massMomentZ', group: 'mass', dimension: 'massMoment', description: 'mass moment of inertia about the axis through the centre of mass normal to the plate, ∫(x′² + y′²) dm' },
  { key: 'massProductXY', group: 'mass', dimension: 'massMoment', description: 'mass product of inertia about the centre of mass, ∫x′y′ dm' },
  { key: 'massProductXZ', group: 'mass', dimension: 'massMoment', description: 'mass product of inertia about the centre of mass, ∫x′z′ dm' },
  { key: 'massProductYZ', group: 'mass', dimension: 'massMoment', description: 'mass product of inertia about the centre of mass, ∫y′z′ dm' },
  { key: 'cutLength', group: 'fabrication', dimension: 'length', description: 'total cut length, all contours' },
  { key: 'cutLengthOuter', group: 'fabrication', dimension: 'length', description: 'cut length of the outer contours' },
  { key: 'cutLengthInner', group: 'fabrication', dimension: 'length', description: 'cut length of the inner contours (holes)' },
  { key: 'pierces', group: 'fabrication', dimension: 'count', description: 'pierce count, one per closed contour' },
  { key: 'blankWidth', group: 'fabrication', dimension: 'length', description: 'minimum-area enclosing rectangle, longer side' },
  { key: 'blankHeight', group: 'fabrication', dimension: 'length', description: 'minimum-area enclosing rectangle, shorter side' },
  { key: 'blankAngle', group: 'fabrication', dimension: 'angle', description: 'direction of the blank\'s longer side from +x, degrees, in [0, 180)' },
  { key: 'blankArea', group: 'fabrication', dimension: 'area', description: 'area of the minimum-area enclosing rectangle' },
  { key: 'scrapFraction', group: 'fabrication', dimension: 'ratio', description: '1 − net area / blank area' },
  { key: 'netMass', group: 'fabrication', dimension: 'mass', description: 'mass of the part: net area × thickness × density' },
  { key: 'blankMass', group: 'fabrication', dimension: 'mass', description: 'mass of the blank: blank area × thickness × density' },
  { key: 'J', group: 'torsion', dimension: 'length4', description: 'Saint-Venant torsion constant (shape as the cross-section of a prismatic member), finite elements on the exact curved mesh' },
  { key: 'shearCentreX', group: 'torsion', dimension: 'length', description: 'shear centre, x (Trefftz: warping orthogonal to x and y)' },
  { key: 'shearCentreY', group: 'torsion', dimension: 'length', description: 'shear centre, y' },
  { key: 'Iw', group: 'torsion', dimension: 'length6', description: 'warping constant ∫ω² dA, ω about the shear centre with ∫ω dA = 0' },
  { key: 'tauPerTorque', group: 'torsion', dimension: 'perLength3', description: 'largest Saint-Venant shear stress per unit torque, τmax/T = |∇ω + (−y, x)|max / J (infinite at a re-entrant corner)' },
  { key: 'tauAtX', group: 'torsion', dimension: 'length', description: 'where the largest shear stress occurs, x (finest mesh; an estimate, not a bound)' },
  { key: 'tauAtY', group: 'torsion', dimension: 'length', description: 'where the largest shear stress occurs, y' },
  { key: 'Zx', group: 'plastic', dimension: 'length3', description: 'plastic section modulus for bending about an axis parallel to x, ∫|y − y_p| dA' },
  { key: 'Zy', group: 'plastic', dimension: 'length3', description: 'plastic section modulus for bending about an axis parallel to y, ∫|x − x_p| dA' },
  { key: 'Z1', group: 'plastic', dimension: 'length3', description: 'plastic section modulus for bending about the major principal axis' },
  { key: 'Z2', group: 'plastic', dimension: 'length3', description: 'plastic section modulus for bending about the minor principal axis' },
  { key: 'plasticAxisY', group: 'plastic', dimension: 'length', description: 'plastic neutral axis parallel to x (equal areas): y = y_p' },
  { key: 'plasticAxisX', group: 'plastic', dimension: 'length', description: 'plastic neutral axis parallel to y (equal areas): x = x_p' },
  { key: 'plasticAxis1', group: 'plastic', dimension: 'length', description: 'plastic neutral axis parallel to the major principal axis: offset from the centroid along its normal' },
  { key: 'plasticAxis2', group: 'plastic', dimension: 'length', description: 'plastic neutral axis parallel to the minor principal axis: offset from the centroid along its normal' },
  { key: 'S1', group: 'plastic', dimension: 'length3', description: 'elastic section modulus about the major principal axis, I1 / largest fibre distance' },
  { key: 'S2', group: 'plastic', dimension: 'length3', description: 'elastic section modulus about the minor principal axis, I2 / largest fibre distance' },
  { key: 'fibre1', group: 'plastic', dimension: 'length', description: 'largest distance of the boundary from the major principal axis' },
  { key: 'fibre2', group: 'plastic', dimension: 'length', description: 'largest distance of the boundary from the minor principal axis' },
  { key: 'shapeFactorX', group: 'plastic', dimension: 'ratio', description: 'Zx / min(SxTop, SxBottom)' },
  { key: 'shapeFactorY', group: 'plastic', dimension: 'ratio', description: 'Zy / min(SyRight, SyLeft)' },
  { key: 'shapeFactor1', group: 'plastic', dimension: 'ratio', description: 'Z1 / S1' },
  { key: 'shapeFactor2', group: 'plastic', dimension: 'ratio', description: 'Z2 / S2' },
] as const satisfies readonly QuantityInfo[];

export type QuantityKey = (typeof QUANTITIES)[number]['key'];
type KeyOf<G extends QuantityGroup> = Extract<(typeof QUANTITIES)[number], { group: G }>['key'];
export type SectionKey = KeyOf<'section'>;
export type MassKey = KeyOf<'mass'>;
export type FabricationKey = KeyOf<'fabrication'>;

const inGroup = <G extends QuantityGroup>(g: G): readonly (QuantityInfo & { key: KeyOf<G> })[] =>
  (QUANTITIES as readonly QuantityInfo[]).filter((i): i is QuantityInfo & { key: KeyOf<G> } => i.group === g);
/** Area properties of a region or part, in the order they are printed. */
export const SECTION_QUANTITIES = inGroup('section');
export const MASS_QUANTITIES = inGroup('mass');
export const FABRICATION_QUANTITIES = inGroup('fabrication');
export const TORSION_QUANTITIES = inGroup('torsion');
export const PLASTIC_QUANTITIES = inGroup('plastic');
export type TorsionQuantityKey = KeyOf<'torsion'>;
export type PlasticKey = KeyOf<'plastic'>;

export type SectionValues = Record<SectionKey, number>;
export type SectionQuantities = Record<SectionKey, Quantity>;

const INFO = new Map<string, QuantityInfo>(QUANTITIES.map((i) => [i.key, i]));

export function quantityInfo(key: string): QuantityInfo | undefined {
  return INFO.get(key);
}

export function isQuantityKey(key: string): key is QuantityKey {
  return INFO.has(key);
}

/** Unit text for a dimension given the part's length unit. */
export function unitText(dim: Dimension, length: string, mass = 'kg'): string {
  switch (dim) {
    case 'length': return length;
    case 'area': return `${length}²`;
    case 'length3': return `${length}³`;
    case 'length4': return `${length}⁴`;
    case 'length6': return `${length}⁶`;
    case 'perLength3': return `${length}⁻³`;
    case 'angle': return '°';
    case 'count': return '';
    case 'ratio': return '';
    case 'mass': return mass;
    case 'massMoment': return `${mass}·m²`;
    case 'force': return 'N';
  }
}
