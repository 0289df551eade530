/**
 * Integrate a vector of functions over a meshed part, with a per-triangle error indicator and, on request,
 * adaptive refinement to a tolerance.
 *
 * Every active ("leaf") triangle T is integrated with the chosen rule, and so are its four children
 * (splitTriangle in src/mesh/refine.ts, the routine refineUniform uses: edge midpoints, a curved edge split at
 * its parameter midpoint on the curve). Every triangle goes through the one kernel, integrateTriangle.
 * The reported value is the sum over the children of all leaves (the fine value); the sum over the leaves
 * themselves is the coarse value; the indicator of T is |Σ children − T| per component, and the estimate of
 * a component is the sum of its indicators (≥ |fine − coarse|, and for a converging rule an upper bound of
 * the coarse value's error, hence on the safe side for the fine one). Each triangle is also integrated with a
 * companion rule (the next lower safe degree), and a leaf's indicator is the larger of |Σ children − T| and
 * |Σ children − Σ children by the companion rule|: the second check is independent of the first, so a chance
 * agreement between parent and children (seen on kinks) does not make the estimate understate.
 *
 * Smoothness and the estimate. Both differences above assume the integrand is smooth on the leaf. The
 * caller says where that is proved (`smoothOn`, from src/expr/smooth.ts: interval arithmetic on the
 * expression over the leaf's box); a leaf where it is not proved (a kink, a jump, a possible singularity,
 * or no `smoothOn` at all) keeps the larger difference, widened UNVERIFIED_WIDEN times, and is refined first;
 * if any such leaf remains, the result cannot claim the tolerance: it stops with 'unverified' and
 * `errorIsBound` is false. On a leaf proved smooth: when the companion contracts (dRc ≤ dRp/8, dRp and dRc the
 * rule-pair differences on parent and children) and parent and children did not agree by chance (dRc ≤ dP),
 * the grandchildren are integrated too and the rule's own contraction observed: if the second refinement
 * difference dP2 = |Σ grandchildren − Σ children| is at most dP/8, the children's error is about
 * dP2/(1 − ρ) ≤ 1.15·dP2 and the indicator is RICHARDSON_SAFETY·dP2 (never more than the fallback); otherwise
 * (not yet asymptotic: a peak narrower than the leaf) UNRESOLVED_WIDEN·max(dP, dRc). The companion's
 * contraction alone was tried first and understated near-singular integrands up to 12 times (its rate is
 * not the rule's outside the asymptotic range).
 * Without this the estimate was that of the coarse value, 10³–10⁵ times the fine value's error.
 *
 * Without a tolerance the leaves are the base mesh: the same two levels (mesh and its uniform refinement) as
 * measureSection. With a tolerance, the leaves with the largest indicators are split (each into its four
 * children, without touching neighbours: hanging nodes do no harm to integration, since the children still
 * partition the parent exactly) until every driving component's estimate is below its tolerance, or a cap on
 * triangles or time is reached — the result says which (`stopped`).
 *
 * Negligible triangles. With `boundsOn` (interval arithmetic on the integrand over a triangle's box), a base
 * triangle whose proved bound of its whole contribution (largest |f_k| on its box times the box's area) is at
 * most ROUNDOFF·S_k/n for every component — S_k the sum of those bounds over the n base triangles — is held:
 * never evaluated, counted 0, its bound added to the estimate (a bound, not an estimate, of what it leaves
 * out). Held triangles take part in the marking with their bounds; a marked one is evaluated and becomes an
 * ordinary leaf. A Gaussian bump on the 1,250-hole panel holds 32,648 of 32,690 base triangles.
 *
 * Functions are evaluated only at rule points of the safe Dunavant rules, which lie strictly inside each
 * triangle, through the exact (curved) map; they are never evaluated outside the part.
 */
import { type Mesh, TriangleMap } from '../mesh/mesh.js';
import { GrowingMesh, splitTriangle } from '../mesh/refine.js';
import { type PointFunction, integrateTriangle, makeKernel } from '../quadrature/integrate.js';
import { SAFE_DEGREES, getRule } from '../quadrature/rules.js';
import type { StopReason } from '../quadrature/stop.js';
import { InputError } from '../base/errors.js';
import { addCompensated } from '../numeric/sum.js';
import { PROPAGATION_ROUNDOFF } from '../properties/mass.js';

export type { PointFunction } from '../quadrature/integrate.js';

export interface AdaptiveOptions {
  /** Dunavant rule degree (a safe degree: points strictly inside, positive weights). */
  degree: number;
  /** Relative tolerance; undefined = no adaptivity (mesh and its uniform refinement). */
  tolerance?: number;
  /**
   * Absolute floor of each component's tolerance as a fraction of Σ|∫ f_k| over the triangles
   * (default 1e-3): a component whose integral is near zero (a first moment about a central origin,
   * a load that changes sign) needs a floor to be reachable at all.
   */
  floorFraction?: number;
  /**
   * Optional absolute tolerance per component (same units as the component), from the current fine values
   * (e.g. a first moment to within tolerance × integral × part size); the larger one applies.
   */
  absTolerance?: (fine: Float64Array, tolerance: number) => readonly (number | undefined)[];
  /** Components that must meet the tolerance (default: all). */
  drive?: readonly number[];
  /** Cap on the triangles of the fine level (default 400 000). */
  maxTriangles?: number;
  /** Cap on the time spent, milliseconds (default 30 000). */
  maxMillis?: number;
  /**
   * Is the integrand proved smooth on the open box [x0, x1] × [y0, y1] (part coordinates)? Undefined: not
   * known anywhere (every leaf unverified).
   */
  smoothOn?: (x0: number, y0: number, x1: number, y1: number) => boolean;
  /**
   * Bounds of |f_k| for every component on the closed box [x0, x1] × [y0, y1] (part coordinates) into
   * out[0 … K), proved (interval arithmetic), or false when none can be given. With it, a base triangle whose
   * bounds times its box's area are negligible (see `boundedLeaves`) is not evaluated: it counts 0 with that
   * product as its estimate (a bound of its whole contribution), until refinement asks for it.
   */
  boundsOn?: (x0: number, y0: number, x1: number, y1: number, out: Float64Array) => boolean;
  /**
   * A bound per component of what the mesh leaves out (the part outside a meshed piece,
   * src/analysis/localize.ts), added to the estimate throughout, so the tolerance is met with it.
   */
  outside?: ArrayLike<number>;
}

export interface AdaptiveResult {
  /** Σ over children of the leaves: the reported value of each component. */
  fine: Float64Array;
  /** Σ over the leaves. */
  coarse: Float64Array;
  /** Σ over leaves of |Σ children − leaf|, per component. */
  estimate: Float64Array;
  /** Σ over fine triangles of |∫ f_k| (for round-off floors and tolerance floors). */
  scale: Float64Array;
  /** Tolerance each component had to meet (absolute), or NaN without adaptivity. */
  target: Float64Array;
  /**
   * Why it stopped: 'levels' without a tolerance (the two levels above), else 'tolerance', 'unverified' (the
   * estimate met the tolerance but the integrand is not proved smooth on every leaf), 'triangle-cap' or 'time-cap'.
   */
  stopped: StopReason;
  /** Leaves on which smoothness was not proved (their differences need not bound the error). */
  unverifiedLeaves: number;
  /**
   * Leaves counted as 0 within a proved bound of their contribution (`boundsOn`), never evaluated: a base
   * triangle whose bound (largest |f_k| on its box times the box's area) is at most ROUNDOFF·S_k/n for every
   * component, S_k the sum of those bounds over the n base triangles. Their bounds are in the estimate.
   */
  boundedLeaves: number;
  /** False when some leaf is unverified: the estimate is then not a bound. */
  errorIsBound: boolean;
  /** Triangles of the fine level (4 × leaves). */
  triangles: number;
  leaves: number;
  baseTriangles: number;
  rounds: number;
  /** Quadrature points evaluated. */
  points: number;
  rulePoints: number;
  degree: number;
  /** Smallest curved-map Jacobian over the straight triangle's, at every point of both rules. */
  minJacobianRatio: number;
  millis: number;
}

export const DEFAULT_MAX_TRIANGLES = 400_000;
export const DEFAULT_MAX_MILLIS = 30_000;
export const DEFAULT_FLOOR_FRACTION = 1e-3;
const ROUNDOFF = 64 * Number.EPSILON;
/**
 * The largest bound of a piece's whole contribution that counts as negligible: ROUNDOFF·S/n, S the sum of the
 * bounds of all n pieces (so all negligible pieces together stay within ROUNDOFF·S). Held base triangles here
 * and the grid cells left unmeshed by src/analysis/localize.ts use the one rule.
 */
export const negligibleBound = (total: number, n: number): number => ROUNDOFF * total / n;
/** Widening of the indicator of a leaf where smoothness is not proved (see the file comment). */
export const UNVERIFIED_WIDEN = 4;
/** Safety factor on the observed contraction in the asymptotic estimate (see the file comment). */
export const RICHARDSON_SAFETY = 4;
/**
 * Widening of the indicator of a smooth leaf outside the asymptotic range: the children's error is
 * dP·ρ/(1 − ρ) for a contraction ρ, so 2·dP covers ρ ≤ 2/3 (a peak narrower than the leaf, such as
 * 1/√(r² + 10⁻⁶), contracts by about 1/2 per halving: dP alone was seen at 0.8 of the error).
 */
export const UNRESOLVED_WIDEN = 2;

/**
 * Integrate K components over the mesh (see the file comment). Throws whatever `f` throws (an InputError
 * for a non-finite or out-of-range value, located by the caller).
 */
export function integrateAdaptive(mesh: Mesh, K: number, f: PointFunction, opts: AdaptiveOptions): AdaptiveResult {
  const start = Date.now();
  const rule = getRule(opts.degree);
  // companion rule: the next lower safe degree (degree 1: the next higher), a second, independent check
  const si = SAFE_DEGREES.indexOf(opts.degree);
  const rule2 = getRule(SAFE_DEGREES[si > 0 ? si - 1 : 1]);
  if (rule.negativeWeight || rule.pointsOutside) {
    throw new InputError('degree', `rule of degree ${opts.degree} has points outside the triangle or negative weights; adaptive integration needs a safe degree`);
  }
  const maxTriangles = opts.maxTriangles ?? DEFAULT_MAX_TRIANGLES;
  const maxMillis = opts.maxMillis ?? DEFAULT_MAX_MILLIS;
  const floorFraction = opts.floorFraction ?? DEFAULT_FLOOR_FRACTION;
  const drive = opts.drive ?? [...Array(K).keys()];
  // the base mesh and every child made so far, in one growing mesh (children of a split are appended)
  const g = GrowingMesh.copyOf(mesh, 8);
  const map = new TriangleMap();
  const kernel = makeKernel(K, false, f, mesh.origin);
  let points = 0;

  // value of every stored triangle (K per triangle) by the rule and by the companion rule, grown as needed
  let vals = new Float64Array(Math.max(16, mesh.count * 8) * K);
  let vals2 = new Float64Array(vals.length);
  const ensure = (nTri: number) => {
    if (nTri * K <= vals.length) return;
    const bigger = new Float64Array(Math.max(nTri * K, vals.length * 2));
    bigger.set(vals);
    vals = bigger;
    const bigger2 = new Float64Array(bigger.length);
    bigger2.set(vals2);
    vals2 = bigger2;
  };
  const evalTriangle = (t: number) => {
    map.load(g, t);
    integrateTriangle(map, rule, kernel, vals, t * K);
    integrateTriangle(map, rule2, kernel, vals2, t * K);
    points += rule.n + rule2.n;
  };
  // smoothness of each stored triangle: 0 not yet asked, 1 proved smooth, 2 not proved
  let smooth = new Uint8Array(vals.length / K);
  const [ox, oy] = mesh.origin;
  const box = new Float64Array(4);
  /** The box of stored triangle t in part coordinates, padded by half the chord of a curved edge. */
  const boxOf = (t: number): Float64Array => {
    const c = g.coords, tri = g.triangles;
    let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity, pad = 0;
    for (let j = 0; j < 3; j++) {
      const v = tri[3 * t + j], x = c[2 * v], y = c[2 * v + 1];
      if (x < x0) x0 = x; if (x > x1) x1 = x; if (y < y0) y0 = y; if (y > y1) y1 = y;
      if (g.edgeCurve[3 * t + j] >= 0) {
        // a curved edge stays within half its chord of the chord (turning below 180°)
        const w = tri[3 * t + (j + 1) % 3];
        pad = Math.max(pad, 0.5 * Math.hypot(c[2 * w] - x, c[2 * w + 1] - y));
      }
    }
    box[0] = ox + x0 - pad; box[1] = oy + y0 - pad; box[2] = ox + x1 + pad; box[3] = oy + y1 + pad;
    return box;
  };
  const smoothAt = (t: number): boolean => {
    if (smooth.length <= t) { const b = new Uint8Array(Math.max(t + 1, 2 * smooth.length)); b.set(smooth); smooth = b; }
    if (smooth[t] === 0) {
      let ok = false;
      if (opts.smoothOn) {
        const b = boxOf(t);
        ok = opts.smoothOn(b[0], b[1], b[2], b[3]);
      }
      smooth[t] = ok ? 1 : 2;
    }
    return smooth[t] === 1;
  };
  /**
   * Indicator of leaf t, component k (see the file comment): on a leaf not proved smooth, the larger of
   * |Σ children − t| and |Σ children − Σ children by the companion rule|, widened; on a smooth leaf in the
   * asymptotic range, the observed-contraction estimate.
   */
  const indicatorOf = (t: number, k: number): number => {
    const c = firstChild[t];
    let ch = 0, ch2 = 0;
    for (let j = 0; j < 4; j++) { ch += vals[(c + j) * K + k]; ch2 += vals2[(c + j) * K + k]; }
    const dP = Math.abs(ch - vals[t * K + k]), dRc = Math.abs(ch - ch2);
    const plain = Math.max(dP, dRc);
    if (!smoothAt(t)) return UNVERIFIED_WIDEN * plain;
    const dRp = Math.abs(vals[t * K + k] - vals2[t * K + k]);
    let size = 0;
    for (let j = 0; j < 4; j++) size += Math.abs(vals[(c + j) * K + k]);
    const noise = 16 * ROUNDOFF * size;
    // the companion contracts (a cheap sign of the asymptotic range) and parent and children did not agree by
    // chance: observe the rule's own contraction one level further down (the grandchildren)
    // (not worth it where the fallback is already below the round-off allowance's share of a leaf)
    if (dRp > noise && dRc <= dRp / 8 && dRc <= dP && UNRESOLVED_WIDEN * plain > negligible[k]) {
      let gc = 0;
      for (let j = 0; j < 4; j++) {
        if (firstChild[c + j] === undefined) expand(c + j);
        const d = firstChild[c + j];
        for (let i = 0; i < 4; i++) gc += vals[(d + i) * K + k];
      }
      const dP2 = Math.abs(gc - ch);
      if (dP2 <= dP / 8) return Math.min(UNRESOLVED_WIDEN * plain, RICHARDSON_SAFETY * dP2);
    }
    return UNRESOLVED_WIDEN * plain;
  };
  // children[t] = index of the first of t's four children, for leaves
  const firstChild: number[] = [];
  const expand = (t: number) => {
    const c = g.count;
    splitTriangle(g, t, g, c, null);
    ensure(c + 4);
    for (let i = 0; i < 4; i++) evalTriangle(c + i);
    firstChild[t] = c;
  };

  const nBase = mesh.count;
  ensure(nBase);
  // base triangles whose whole contribution is proved negligible: counted 0 within their bound (see boundedLeaves)
  const bounded = new Uint8Array(nBase), boundOf = new Float64Array(opts.boundsOn ? nBase * K : 0);
  if (opts.boundsOn) {
    const b = new Float64Array(K), total = new Float64Array(K), ok = new Uint8Array(nBase);
    for (let t = 0; t < nBase; t++) {
      const bx = boxOf(t);
      if (!opts.boundsOn(bx[0], bx[1], bx[2], bx[3], b)) continue;
      const area = (bx[2] - bx[0]) * (bx[3] - bx[1]);
      let finite = true;
      for (let k = 0; k < K; k++) { const v = b[k] * area; boundOf[t * K + k] = v; if (!Number.isFinite(v)) finite = false; }
      if (!finite) continue;
      ok[t] = 1;
      for (let k = 0; k < K; k++) total[k] += boundOf[t * K + k];
    }
    for (let t = 0; t < nBase; t++) {
      if (ok[t] === 0) continue;
      let small = true;
      for (let k = 0; k < K && small; k++) small = boundOf[t * K + k] <= negligibleBound(total[k], nBase);
      if (small) bounded[t] = 1;
    }
  }
  // leaves: the evaluated leaves; held: the bounded base triangles (leaves too, counted 0 within their bounds)
  let leaves: number[] = [];
  let held: number[] = [];
  for (let t = 0; t < nBase; t++) {
    if (bounded[t] === 0) { evalTriangle(t); expand(t); leaves.push(t); } else held.push(t);
  }
  const heldEstimate = new Float64Array(K);
  const sumHeld = () => {
    for (let k = 0; k < K; k++) heldEstimate[k] = opts.outside?.[k] ?? 0;
    for (const t of held) for (let k = 0; k < K; k++) heldEstimate[k] += boundOf[t * K + k];
  };
  sumHeld();

  // a leaf's share of the round-off allowance (ROUNDOFF × Σ|children| over the base, per base triangle)
  const negligible = new Float64Array(K);
  for (const t of leaves) {
    const c = firstChild[t];
    for (let k = 0; k < K; k++) for (let j = 0; j < 4; j++) negligible[k] += Math.abs(vals[(c + j) * K + k]);
  }
  for (let k = 0; k < K; k++) negligible[k] *= ROUNDOFF / Math.max(1, nBase);
  const fine = new Float64Array(K), coarse = new Float64Array(K), estimate = new Float64Array(K), scale = new Float64Array(K);
  const target = new Float64Array(K).fill(NaN);
  const totals = () => {
    const cf = new Float64Array(K), cc = new Float64Array(K);
    fine.fill(0); coarse.fill(0); scale.fill(0);
    estimate.set(heldEstimate);
    const add = addCompensated;
    for (const t of leaves) {
      const c = firstChild[t];
      for (let k = 0; k < K; k++) {
        const a = vals[c * K + k], b = vals[(c + 1) * K + k], d = vals[(c + 2) * K + k], e = vals[(c + 3) * K + k];
        const ch = a + b + d + e;
        add(fine, cf, k, ch);
        add(coarse, cc, k, vals[t * K + k]);
        estimate[k] += indicatorOf(t, k);
        scale[k] += Math.abs(a) + Math.abs(b) + Math.abs(d) + Math.abs(e);
      }
    }
    for (let k = 0; k < K; k++) { fine[k] += cf[k]; coarse[k] += cc[k]; }
  };
  totals();

  const allBounded = () => leaves.every(smoothAt);
  let stopped: StopReason = 'levels';
  let rounds = 0;
  if (opts.tolerance !== undefined) {
    const tol = opts.tolerance;
    const setTargets = () => {
      const absTol = opts.absTolerance?.(fine, tol);
      for (let k = 0; k < K; k++) {
        const abs = absTol?.[k] ?? 0;
        target[k] = Math.max(tol * Math.abs(fine[k]), tol * floorFraction * scale[k], abs, ROUNDOFF * 4 * scale[k]);
      }
    };
    setTargets();
    for (;;) {
      // met when the ± the caller will show (the estimate plus the round-off allowance of propagateErrors,
      // src/properties/mass.ts) is within the tolerance, not the estimate alone
      const met = drive.every((k) => estimate[k] + PROPAGATION_ROUNDOFF * (Math.abs(fine[k]) + scale[k]) <= target[k]);
      if (met) { stopped = allBounded() ? 'tolerance' : 'unverified'; break; }
      if (Date.now() - start > maxMillis) { stopped = 'time-cap'; break; }
      const room = Math.floor((maxTriangles - 4 * leaves.length) / 12); // each split adds 3 leaves = 12 fine triangles
      if (room < 1) { stopped = 'triangle-cap'; break; }
      // normalised indicator of each leaf, evaluated (i < n) then held (i ≥ n): the largest share of any
      // driving component's target
      const n = leaves.length, all = n + held.length;
      const r = new Float64Array(all);
      let total = 0;
      const nd = drive.length;
      for (let i = 0; i < n; i++) {
        const t = leaves[i];
        let worst = 0;
        for (let j = 0; j < nd; j++) { const k = drive[j], v = indicatorOf(t, k) / target[k]; if (v > worst) worst = v; }
        r[i] = worst;
        total += worst;
      }
      let heldMarked = false;
      for (let i = n; i < all; i++) {
        const at = held[i - n] * K;
        let worst = 0;
        for (let j = 0; j < nd; j++) { const k = drive[j], v = boundOf[at + k] / target[k]; if (v > worst) worst = v; }
        r[i] = worst;
        total += worst;
      }
      // Dörfler-style marking: the largest indicators until they cover half of the total. Only leaves with
      // r ≥ total/(2·all) can be needed (all the others together hold less than half), so only those are sorted.
      const floor = total / (2 * all);
      const order: number[] = [];
      for (let i = 0; i < all; i++) if (r[i] >= floor && r[i] > 0) order.push(i);
      order.sort((a, b) => r[b] - r[a]);
      const marked = new Uint8Array(all);
      let covered = 0, markedCount = 0;
      for (const i of order) {
        if (covered >= 0.5 * total || markedCount >= room) break;
        marked[i] = 1;
        markedCount++;
        covered += r[i];
        if (i >= n) heldMarked = true;
      }
      if (markedCount === 0) { stopped = allBounded() ? 'tolerance' : 'unverified'; break; }
      const next: number[] = [];
      let timedOut = false;
      for (let i = 0; i < n; i++) {
        const t = leaves[i];
        if (marked[i] === 0 || timedOut) { next.push(t); continue; }
        const c = firstChild[t];
        for (let j = 0; j < 4; j++) { if (firstChild[c + j] === undefined) expand(c + j); next.push(c + j); }
        if ((i & 63) === 0 && Date.now() - start > maxMillis) timedOut = true;
      }
      // a marked held triangle is evaluated after all and becomes an ordinary leaf
      if (heldMarked && !timedOut) {
        const still: number[] = [];
        for (let i = n; i < all; i++) {
          const t = held[i - n];
          if (marked[i] === 0) { still.push(t); continue; }
          evalTriangle(t);
          expand(t);
          next.push(t);
        }
        if (still.length !== held.length) { held = still; sumHeld(); }
      }
      leaves = next;
      rounds++;
      totals();
      setTargets();
    }
  }
  let unverifiedLeaves = 0;
  for (const t of leaves) if (!smoothAt(t)) unverifiedLeaves++;
  const boundedLeaves = held.length;
  return {
    fine, coarse, estimate, scale, target, stopped, unverifiedLeaves, boundedLeaves, errorIsBound: allBounded(),
    triangles: 4 * leaves.length, leaves: leaves.length + boundedLeaves, baseTriangles: nBase, rounds, points,
    rulePoints: rule.n, degree: opts.degree, minJacobianRatio: kernel.minRatio === Infinity ? 1 : kernel.minRatio,
    millis: Date.now() - start,
  };
}
