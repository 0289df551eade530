/**
 * Length units. Factors to metres are exact by definition
 * (NIST SP 811, appendix B: 1 in = 0.0254 m exactly, 1 ft = 0.3048 m exactly).
 */
export type LengthUnit = 'mm' | 'cm' | 'm' | 'in' | 'ft';

export const LENGTH_UNITS: Readonly<Record<LengthUnit, number>> = {
  mm: 0.001,
  cm: 0.01,
  m: 1,
  in: 0.0254,
  ft: 0.3048,
};

export function isLengthUnit(u: unknown): u is LengthUnit {
  return typeof u === 'string' && Object.prototype.hasOwnProperty.call(LENGTH_UNITS, u);
}

/** Factor that turns a length in `from` into a length in `to`. */
export function lengthFactor(from: LengthUnit, to: LengthUnit): number {
  if (from === to) return 1;
  return LENGTH_UNITS[from] / LENGTH_UNITS[to];
}
