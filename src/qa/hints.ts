/**
 * Hints for a failed row: when the difference is what a common slip would make, say which (facts; words in
 * src/output/compareText.ts). Checked in this order, each within the row's tolerance plus our estimate:
 *   - a product of inertia stated with the opposite sign convention (stated = −computed);
 *   - a principal angle stated for the other principal axis (stated = computed ± 90°);
 *   - a unit slip: stated / computed is a power of ten or of 25.4 raised to the quantity's length power
 *     (mm written for cm, inches for millimetres);
 *   - a mass stated for another thickness is left to the reader (the ratio alone cannot tell it from density).
 */
import type { Dimension } from '../properties/quantities.js';
import { LENGTH_POWER } from '../properties/quantities.js';

export type RowHint =
  | { code: 'opposite-sign' }
  | { code: 'other-principal-axis' }
  | { code: 'unit-slip'; factor: number; base: 10 | 25.4; power: number };

const PRODUCTS = new Set(['Ixy', 'IxyOrigin', 'massProductXY', 'massProductXZ', 'massProductYZ']);

export function hintFor(
  r: { quantity: string; stated: number; computed: number | null; error: number | null; tolerance: number; verdict: string },
  dimension: Dimension,
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
  return undefined;
}
