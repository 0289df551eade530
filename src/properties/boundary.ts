/**
 * Exact raw moments of a part from its boundary alone (Green's theorem), in O(n), for every segment kind:
 * the boundary path for polynomial integrands, where a mesh would add nothing but time.
 *
 * Each kind's `moments` operation (src/geometry/kinds/moments.ts) integrates the one field the polygon
 * formula uses, f·(x dy − y dx)/(k + 2) for f homogeneous of degree k, over its exact curve: closed forms on
 * lines, circular and elliptical arcs, Gauss–Legendre of exact order on Béziers. For straight segments this
 * is the classical polygon formula: with c_i = x_i·y_{i+1} − x_{i+1}·y_i,
 *   A = Σc/2, ∫x = Σ(x_i + x_{i+1})c/6, ∫y = Σ(y_i + y_{i+1})c/6,
 *   ∫x² = Σ(x_i² + x_i·x_{i+1} + x_{i+1}²)c/12, ∫y² likewise,
 *   ∫xy = Σ(2x_i·y_i + x_i·y_{i+1} + x_{i+1}·y_i + 2x_{i+1}·y_{i+1})c/24.
 * Loops may run either way: each loop's sums take the sign that makes an outline add and a hole subtract.
 */
import { type Part, localFrame } from '../geometry/part.js';
import { ops } from '../geometry/segments.js';

/** True when every segment of the part is straight (its kind says so). */
export function isStraightEdged(part: Part): boolean {
  for (const r of part.regions) for (const l of [r.outer, ...r.holes]) for (const s of l.segments) if (!ops(s).straight) return false;
  return true;
}

/** Raw moments [A, ∫x, ∫y, ∫x², ∫xy, ∫y²] about the local origin and a bound on their summation round-off. */
export interface BoundaryIntegrals {
  moments: Float64Array;
  /** Absolute bound on each raw moment's round-off (a multiple of ε times the size of what was summed). */
  roundoff: Float64Array;
}

/**
 * Raw moments about `origin` of a part with segments of any kind, Neumaier-compensated across segments
 * and loops, with their round-off bound (the segments' error bounds plus the compensated sums' own).
 */
export function boundaryIntegrals(part: Part, origin: readonly [number, number]): BoundaryIntegrals {
  const sum = new Float64Array(6), comp = new Float64Array(6), loopSum = new Float64Array(6), loopComp = new Float64Array(6);
  const seg = new Float64Array(12), mag = new Float64Array(6);
  // Neumaier-compensated accumulation into (acc, cmp): the step of addCompensated (src/numeric/sum.ts), kept
  // as a local closure on purpose. Measured on the 10^6-vertex straight plate of the benchmark, calling the
  // imported helper here took boundaryMoments from about 130 ms to 210–380 ms (median of 15, Node 20); the
  // closure keeps it at the old speed.
  const add = (acc: Float64Array, cmp: Float64Array, k: number, v: number) => {
    const s = acc[k], t = s + v;
    cmp[k] += Math.abs(s) >= Math.abs(v) ? (s - t) + v : (v - t) + s;
    acc[k] = t;
  };
  // a part held about this very origin gives its local loops (constructed points kept to local precision)
  const frame = localFrame(part);
  const local = frame !== undefined && frame.origin[0] === origin[0] && frame.origin[1] === origin[1];
  const [ox, oy] = local ? [0, 0] : origin;
  let terms = 0;
  for (const r of local ? frame.regions : part.regions) {
    const loops = [r.outer, ...r.holes];
    for (let li = 0; li < loops.length; li++) {
      loopSum.fill(0);
      loopComp.fill(0);
      const segs = loops[li].segments;
      for (let i = 0; i < segs.length; i++) {
        const s = segs[i];
        seg.fill(0);
        ops(s).moments(s, ox, oy, seg);
        for (let k = 0; k < 6; k++) { add(loopSum, loopComp, k, seg[k]); mag[k] += seg[6 + k]; }
      }
      terms += segs.length;
      // outline counter-clockwise adds, hole clockwise subtracts, whatever the direction it was drawn in
      const sign = (li === 0) === (loopSum[0] + loopComp[0] > 0) ? 1 : -1;
      for (let k = 0; k < 6; k++) { add(sum, comp, k, sign * loopSum[k]); add(sum, comp, k, sign * loopComp[k]); }
    }
  }
  for (let k = 0; k < 6; k++) sum[k] += comp[k];
  // Neumaier's sum is within 2ε|S| + O(n ε²)·Σ|terms| of the exact sum of the (rounded) terms
  const roundoff = new Float64Array(6);
  for (let k = 0; k < 6; k++) roundoff[k] = Number.EPSILON * (mag[k] + 2 * Math.abs(sum[k]) + 4 * terms * Number.EPSILON * mag[k]);
  return { moments: sum, roundoff };
}

/**
 * Raw moments [A, ∫x, ∫y, ∫x², ∫xy, ∫y²] about `origin` of a part with segments of any kind (see
 * boundaryIntegrals). Never null since every kind has an exact `moments` operation; the type keeps the
 * signature of the straight-edged version.
 */
export function boundaryMoments(part: Part, origin: readonly [number, number]): Float64Array | null {
  return boundaryIntegrals(part, origin).moments;
}
