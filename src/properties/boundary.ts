/**
 * Exact raw moments of a straight-edged part from its boundary alone (Green's theorem), in O(n):
 * the fast path for polygonal parts with polynomial integrands, where the mesh would add nothing but time.
 * For the closed polygon with vertices (x_i, y_i) and c_i = x_i·y_{i+1} − x_{i+1}·y_i:
 *   A = Σc/2, ∫x = Σ(x_i + x_{i+1})c/6, ∫y = Σ(y_i + y_{i+1})c/6,
 *   ∫x² = Σ(x_i² + x_i·x_{i+1} + x_{i+1}²)c/12, ∫y² likewise,
 *   ∫xy = Σ(2x_i·y_i + x_i·y_{i+1} + x_{i+1}·y_i + 2x_{i+1}·y_{i+1})c/24
 * (standard polygon moment formulas; holes run clockwise and subtract themselves).
 */
import type { Part } from '../geometry/part.js';
import { type Out2, ops } from '../geometry/segments.js';

/** True when every segment of the part is straight (its kind says so). */
export function isStraightEdged(part: Part): boolean {
  for (const r of part.regions) for (const l of [r.outer, ...r.holes]) for (const s of l.segments) if (!ops(s).straight) return false;
  return true;
}

/**
 * Raw moments [A, ∫x, ∫y, ∫x², ∫xy, ∫y²] about `origin` of a straight-edged part, with
 * Neumaier-compensated sums. Loops may run either way: each loop's sums are taken with the sign that
 * makes an outline add and a hole subtract (its own signed area decides). Returns null if the part has a
 * curved segment.
 */
export function boundaryMoments(part: Part, origin: readonly [number, number]): Float64Array | null {
  if (!isStraightEdged(part)) return null;
  const sum = new Float64Array(6), comp = new Float64Array(6), loopSum = new Float64Array(6), loopComp = new Float64Array(6);
  const p: Out2 = [0, 0], q: Out2 = [0, 0];
  // Neumaier-compensated accumulation into (acc, cmp): the step of addCompensated (src/numeric/sum.ts), kept
  // as a local closure on purpose. Measured on the 10^6-vertex straight plate of the benchmark, calling the
  // imported helper here took boundaryMoments from about 130 ms to 210–380 ms (median of 15, Node 20); the
  // closure keeps it at the old speed. Elsewhere (quadrature/integrate.ts) the helper measured no different.
  const add = (acc: Float64Array, cmp: Float64Array, k: number, v: number) => {
    const s = acc[k], t = s + v;
    cmp[k] += Math.abs(s) >= Math.abs(v) ? (s - t) + v : (v - t) + s;
    acc[k] = t;
  };
  const [ox, oy] = origin;
  for (const r of part.regions) {
    const loops = [r.outer, ...r.holes];
    for (let li = 0; li < loops.length; li++) {
      loopSum.fill(0);
      loopComp.fill(0);
      for (const s of loops[li].segments) {
        const o = ops(s);
        if (!o.straight) return null;
        o.start(s, p); o.end(s, q);
        const x0 = p[0] - ox, y0 = p[1] - oy, x1 = q[0] - ox, y1 = q[1] - oy;
        const c = x0 * y1 - x1 * y0;
        add(loopSum, loopComp, 0, c / 2);
        add(loopSum, loopComp, 1, (x0 + x1) * c / 6);
        add(loopSum, loopComp, 2, (y0 + y1) * c / 6);
        add(loopSum, loopComp, 3, (x0 * x0 + x0 * x1 + x1 * x1) * c / 12);
        add(loopSum, loopComp, 4, (2 * x0 * y0 + x0 * y1 + x1 * y0 + 2 * x1 * y1) * c / 24);
        add(loopSum, loopComp, 5, (y0 * y0 + y0 * y1 + y1 * y1) * c / 12);
      }
      // outline counter-clockwise adds, hole clockwise subtracts, whatever the direction it was drawn in
      const sign = (li === 0) === (loopSum[0] + loopComp[0] > 0) ? 1 : -1;
      for (let k = 0; k < 6; k++) { add(sum, comp, k, sign * loopSum[k]); add(sum, comp, k, sign * loopComp[k]); }
    }
  }
  for (let k = 0; k < 6; k++) sum[k] += comp[k];
  return sum;
}
