/**
 * Units written in reference files, and their conversion to the units platewise reports in
 * (the part's length unit and its powers, degrees, kg, kg·m², N).
 *
 * Every unit carries an exact `scale`: a whole number of a small tick of its dimension
 * (length: 0.1 mm, so mm = 10, in = 254, ft = 3048, m = 10000; mass: 1e-8 kg, so lb = 45359237;
 * force: 1e-13 N, so lbf = 44482216152605), raised to the power of length where needed. Conversion is one
 * division of two such numbers, so factors such as in² → mm² (645.16) and ft² → mm² (92903.04) are the
 * doubles nearest the exact values. Exact definitions: NIST SP 811 appendix B (1 in = 0.0254 m,
 * 1 ft = 0.3048 m, 1 lb = 0.45359237 kg, 1 lbf = 0.45359237 kg × 9.80665 m/s²).
 */
import type { LengthUnit } from '../base/units.js';
import type { Dimension } from '../properties/quantities.js';

export interface ParsedUnit {
  dimension: Dimension;
  /** Size of the unit in ticks of its dimension (see the module comment). */
  scale: number;
  /** The unit as written. */
  text: string;
}

/** Length units in ticks of 0.1 mm. */
const LENGTH_TICKS: Record<string, { unit: LengthUnit; ticks: number }> = {
  mm: { unit: 'mm', ticks: 10 },
  cm: { unit: 'cm', ticks: 100 },
  m: { unit: 'm', ticks: 10000 },
  in: { unit: 'in', ticks: 254 },
  inch: { unit: 'in', ticks: 254 },
  inches: { unit: 'in', ticks: 254 },
  ft: { unit: 'ft', ticks: 3048 },
  foot: { unit: 'ft', ticks: 3048 },
  feet: { unit: 'ft', ticks: 3048 },
};
const PART_TICKS: Record<LengthUnit, number> = { mm: 10, cm: 100, m: 10000, in: 254, ft: 3048 };

/** Mass units in ticks of 1e-8 kg. */
const MASS_TICKS: Record<string, number> = {
  kg: 1e8, g: 1e5, t: 1e11, tonne: 1e11, lb: 45359237, lbs: 45359237,
};
/** Force units in ticks of 1e-13 N. */
const FORCE_TICKS: Record<string, number> = { n: 1e13, kn: 1e16, lbf: 44482216152605 };
const ANGLE_SCALE: Record<string, number> = {
  deg: 1, degree: 1, degrees: 1, '°': 1, rad: 180 / Math.PI, radian: 180 / Math.PI, radians: 180 / Math.PI,
};

const POWER_OF: Record<number, Dimension> = { 1: 'length', 2: 'area', 3: 'length3', 4: 'length4', 6: 'length6' };
const SUPERSCRIPT: Record<string, string> = { '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁶': '6' };

/** Examples of units for each dimension, for error messages. */
export const UNIT_EXAMPLES: Record<Dimension, string> = {
  length: 'mm, cm, m, in, ft',
  area: 'mm², cm², m², in², ft² (or mm2, mm^2)',
  length3: 'mm³, cm³, in³ (or mm3, mm^3)',
  length4: 'mm⁴, cm⁴, in⁴ (or mm4, mm^4)',
  length6: 'mm⁶, cm⁶, in⁶ (or mm6, mm^6)',
  perLength3: 'mm⁻³, cm⁻³, in⁻³ (or mm^-3, 1/mm³)',
  angle: 'deg (or °), rad',
  count: 'no unit',
  ratio: 'no unit, or %',
  mass: 'kg, g, t, lb',
  massMoment: 'kg·m², kg·mm², g·cm², lb·in², lb·ft²',
  force: 'N, kN, lbf',
};

/** Each dimension in words, for messages. */
export const DIMENSION_WORDS: Record<Dimension, string> = {
  length: 'length', area: 'area', length3: 'length³', length4: 'length⁴', length6: 'length⁶', perLength3: 'length⁻³',
  angle: 'angle', count: 'count', ratio: 'ratio', mass: 'mass', massMoment: 'mass × length²', force: 'force',
};

/** "mm²", "mm2", "mm^2", "in ^ 3", "mm⁶" → { name, power }; null if not of that form. */
function splitPower(s: string): { name: string; power: number } | null {
  const t = s.replace(/[¹²³⁴⁶]/g, (c) => '^' + SUPERSCRIPT[c]).replace(/\s+/g, '');
  const m = /^([a-z]+)(?:\^?([1-46]))?$/.exec(t);
  if (!m) return null;
  return { name: m[1], power: m[2] ? Number(m[2]) : 1 };
}

/** Parse a unit text; null if it is not a unit this module knows. Case is ignored. */
export function parseUnit(text: string): ParsedUnit | null {
  const raw = text.trim();
  const s = raw.toLowerCase();
  if (s === '') return { dimension: 'count', scale: 1, text: raw };
  if (s === '%') return { dimension: 'ratio', scale: 1, text: raw };
  if (Object.prototype.hasOwnProperty.call(ANGLE_SCALE, s)) return { dimension: 'angle', scale: ANGLE_SCALE[s], text: raw };
  if (Object.prototype.hasOwnProperty.call(MASS_TICKS, s)) return { dimension: 'mass', scale: MASS_TICKS[s], text: raw };
  if (Object.prototype.hasOwnProperty.call(FORCE_TICKS, s)) return { dimension: 'force', scale: FORCE_TICKS[s], text: raw };
  // mass × length²: "kg·m²", "kg*m^2", "kg m2", "lb·in²"
  const mm = /^([a-z]+)\s*[·*⋅ ]\s*(.+)$/.exec(s);
  if (mm && Object.prototype.hasOwnProperty.call(MASS_TICKS, mm[1])) {
    const lp = splitPower(mm[2]);
    if (lp && lp.power === 2 && Object.prototype.hasOwnProperty.call(LENGTH_TICKS, lp.name)) {
      const l = LENGTH_TICKS[lp.name].ticks;
      return { dimension: 'massMoment', scale: MASS_TICKS[mm[1]] * l * l, text: raw };
    }
    return null;
  }
  // per length cubed (τmax/T): "mm⁻³", "mm^-3", "mm-3", "1/mm³", "1/mm^3"; the scale is the reciprocal of a
  // whole number of ticks, so a conversion is within a few ulps of the exact factor instead of exact
  const inv = /^1\s*\/\s*(.+)$/.exec(s);
  const neg = /^([a-z]+)\s*(?:⁻³|\^\s*-\s*3|-3)$/.exec(s);
  if (inv || neg) {
    const lp = inv ? splitPower(inv[1]) : { name: neg![1], power: 3 };
    if (lp && lp.power === 3 && Object.prototype.hasOwnProperty.call(LENGTH_TICKS, lp.name)) {
      return { dimension: 'perLength3', scale: 1 / LENGTH_TICKS[lp.name].ticks ** 3, text: raw };
    }
    return null;
  }
  const lp = splitPower(s);
  if (lp && Object.prototype.hasOwnProperty.call(LENGTH_TICKS, lp.name)) {
    return { dimension: POWER_OF[lp.power], scale: LENGTH_TICKS[lp.name].ticks ** lp.power, text: raw };
  }
  return null;
}

/**
 * Scale of the unit platewise reports a dimension in: the part's length unit to the right power, degrees,
 * kg, kg·m², N, a plain number.
 */
export function reportScale(dim: Dimension, lengthUnit: LengthUnit): number {
  switch (dim) {
    case 'length': return PART_TICKS[lengthUnit];
    case 'area': return PART_TICKS[lengthUnit] ** 2;
    case 'length3': return PART_TICKS[lengthUnit] ** 3;
    case 'length4': return PART_TICKS[lengthUnit] ** 4;
    case 'length6': return PART_TICKS[lengthUnit] ** 6;
    case 'perLength3': return 1 / PART_TICKS[lengthUnit] ** 3;
    case 'angle': return 1;
    case 'count': return 1;
    case 'ratio': return 100; // a plain fraction is 100 ticks of %
    case 'mass': return MASS_TICKS.kg;
    case 'massMoment': return MASS_TICKS.kg * PART_TICKS.m * PART_TICKS.m;
    case 'force': return FORCE_TICKS.n;
  }
}

/** Scale of a dimensionless value written without a unit. */
export function plainScale(dim: Dimension): number {
  return dim === 'ratio' ? 100 : 1;
}

/** Factor turning a value in `unit` into the unit platewise reports `unit.dimension` in. */
export function factorToReport(unit: ParsedUnit, lengthUnit: LengthUnit): number {
  const to = reportScale(unit.dimension, lengthUnit);
  return unit.scale === to ? 1 : unit.scale / to;
}
