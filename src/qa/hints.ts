/**
 * Hints for a failed row: when the difference is what a common slip would make, say which (facts; words in
 * src/output/compareText.ts). Checked in this order, each within the row's tolerance plus our estimate:
 *   - a product of inertia stated with the opposite sign convention (stated = −computed);
 *   - a principal angle stated for the other principal axis (stated = computed ± 90°);
 *   - a unit slip: stated / computed is a power of ten or of 25.4 raised to the quantity's length power
 *     (mm written for cm, inches for millimetres);
 *   - a mass or weight stated for another plate thickness: stated / computed × the thickness used is a round
 *     thickness (a multiple of 0.5 mm, or of 1/16 in for parts in inches or feet). Mass and weight are linear
 *     in a constant thickness. The ratio alone cannot tell this from another density; the words say so.
 */
import { LENGTH_UNITS, type LengthUnit } from '../base/units.js';
import type { Dimension } from '../properties/quantities.js';
import { LENGTH_POWER } from '../properties/quantities.js';

export type RowHint =
  | { code: 'opposite-sign' }
  | { code: 'other-principal-axis' }
  | { code: 'unit-slip'; factor: number; base: 10 | 25.4; power: number }
  /** `thickness` the stated value fits, `used` the one computed with (both in `unit`, the part's). */
  | { code: 'thickness-slip'; thickness: number; used: number; unit: LengthUnit };

const PRODUCTS = new Set(['Ixy', 'IxyOrigin', 'massProductXY', 'massProductXZ', 'massProductYZ']);

export function hintFor(
  r: { quantity: string; stated: number; computed: number | null; error: number | null; tolerance: number; verdict: string },
  dimension: Dimension,
  thickness?: number,
  lengthUnit?: LengthUnit,
): RowHint | undefined {
  if (r.verdict !== 'fail' || r.computed === null || r.error === null) return undefined;
  const c = r.computed, s = r.stated, slack = r.tolerance + r.error;
  const close = (a: number, b: number) => Math.abs(a - b) <= slack;
  if (PRODUCTS.has(r.quantity) && close(s, -c)) return { code: 'opposite-sign' };
  if (r.quantity === 'principalAngle') {
    for (const d of [90, -90, 180, -180]) if (close(s, c + d)) return { code: 'other-principal-axis' };
    return undefined;
  }
  if (!(c !== 0 && s !== 0 && Math.sign(c) === Math.sign(s))) return undefined;
  const p = LENGTH_POWER[dimension];
  // powers of 25.4 matching the quantity's length power (a whole drawing in the wrong unit)
  if (p) for (const sign of [1, -1]) {
    const f = 25.4 ** (sign * p);
    if (close(s, c * f)) return { code: 'unit-slip', factor: f, base: 25.4, power: sign * p };
  }
  for (let k = -12; k <= 12; k++) {
    if (k === 0) continue;
    const f = 10 ** k;
    if (close(s, c * f)) return { code: 'unit-slip', factor: f, base: 10, power: k };
  }
  if ((dimension === 'mass' || dimension === 'force') && thickness !== undefined && thickness > 0 && lengthUnit !== undefined) {
    // the round thickness nearest to the one the stated value implies
    const step = lengthUnit === 'in' ? 1 / 16 : lengthUnit === 'ft' ? 1 / 192 : 0.5e-3 / LENGTH_UNITS[lengthUnit];
    const t = Math.round((thickness * s) / c / step) * step;
    if (t > 0 && Math.abs(t - thickness) > step / 2 && close(s, (c * t) / thickness)) return { code: 'thickness-slip', thickness: t, used: thickness, unit: lengthUnit };
  }
  return undefined;
}
