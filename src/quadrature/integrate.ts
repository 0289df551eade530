/**
 * The one integration kernel, and the whole-mesh pass built on it.
 *
 * `integrateTriangle` integrates K integrands over one (possibly curved) triangle with one rule: at each
 * rule point it evaluates the curved map (TriangleMap, src/mesh/mesh.ts), forms the Jacobian-weighted weight
 * w_q·J(q)/2 and accumulates it times each integrand. Components 0…5 may be the raw moments
 * [1, x, y, x², xy, y²] in local coordinates, computed inline; the rest come from a PointFunction that fills
 * a scratch vector. It allocates nothing. Both `integrate` (every triangle of a mesh, Neumaier-compensated
 * mesh-wide sums) and the adaptive integrator (src/analysis/adaptive.ts) call it.
 *
 * Moments use the mesh's local coordinates (relative to mesh.origin); integrands receive both the part's
 * own coordinates and the local ones.
 */
import { type MeshView, TriangleMap } from '../mesh/mesh.js';
import { type TriangleRule, getRule, safeDegreeAtLeast } from './rules.js';
import { addCompensated } from '../numeric/sum.js';

export type Integrand = (x: number, y: number) => number;

/**
 * Fill out[first … K) with the integrands at one point. (x, y) are part coordinates; (lx, ly) the same point
 * relative to the mesh's local origin (use these for moments: they keep their digits far from the origin).
 */
export type PointFunction = (x: number, y: number, lx: number, ly: number, out: Float64Array) => void;

/** Index of each raw moment in the result vector. */
export const M_AREA = 0, M_X = 1, M_Y = 2, M_XX = 3, M_XY = 4, M_YY = 5;
export const MOMENT_COUNT = 6;

/** What the kernel integrates: set up once per pass, reused for every triangle. */
export interface Kernel {
  /** Components in all. */
  readonly K: number;
  /** Components 0 … 5 are the raw moments [1, x, y, x², xy, y²] (local coordinates), computed inline. */
  readonly moments: boolean;
  /** Fills components from `first` (6 with moments, else 0) to K; null when the moments are all. */
  readonly fill: PointFunction | null;
  readonly first: number;
  /** Mesh origin (added to local coordinates for `fill`). */
  readonly ox: number;
  readonly oy: number;
  /** Scratch vector for `fill` (length K). */
  readonly scratch: Float64Array;
  /** Smallest Jacobian ratio (curved map over straight triangle) met so far at curved triangles' points. */
  minRatio: number;
}

export function makeKernel(K: number, moments: boolean, fill: PointFunction | null, origin: readonly [number, number]): Kernel {
  if (moments && K < MOMENT_COUNT) throw new RangeError(`a kernel with moments has at least ${MOMENT_COUNT} components, got ${K}`);
  if (!moments && fill === null) throw new RangeError('a kernel without moments needs a point function');
  return { K, moments, fill, first: moments ? MOMENT_COUNT : 0, ox: origin[0], oy: origin[1], scratch: new Float64Array(K), minRatio: Infinity };
}

/**
 * Integrate the kernel's K components over the triangle loaded in `map`, with `rule`, into
 * acc[at … at + K) (overwritten). Lowers kernel.minRatio by the Jacobian ratios met on a curved triangle.
 * Throws whatever `fill` throws.
 */
export function integrateTriangle(map: TriangleMap, rule: TriangleRule, kernel: Kernel, acc: Float64Array, at: number): void {
  const K = kernel.K, fill = kernel.fill, first = kernel.first, moments = kernel.moments;
  const ox = kernel.ox, oy = kernel.oy, out = kernel.scratch;
  for (let k = 0; k < K; k++) acc[at + k] = 0;
  const curved = map.curved;
  let minRatio = kernel.minRatio;
  const n = rule.n, L1 = rule.l1, L2 = rule.l2, W = rule.w;
  for (let q = 0; q < n; q++) {
    map.at(L1[q], L2[q]);
    const x = map.x, y = map.y;
    const wj = W[q] * map.jac * 0.5;
    if (curved) {
      const r = map.jac / map.det;
      if (r < minRatio) minRatio = r;
    }
    if (moments) {
      acc[at] += wj;
      acc[at + 1] += wj * x;
      acc[at + 2] += wj * y;
      acc[at + 3] += wj * x * x;
      acc[at + 4] += wj * x * y;
      acc[at + 5] += wj * y * y;
    }
    if (fill !== null) {
      fill(x + ox, y + oy, x, y, out);
      for (let k = first; k < K; k++) acc[at + k] += wj * out[k];
    }
  }
  kernel.minRatio = minRatio;
}

export interface IntegrateOptions {
  degree: number;
  /** Extra integrands, evaluated in part coordinates. */
  functions?: readonly Integrand[];
  /**
   * Largest polynomial degree among the integrands, when all are polynomials (moments alone: 2).
   * Straight triangles then use the lowest rule that is exact for it; null = use `degree` everywhere.
   */
  polynomialDegree?: number | null;
  /** Also return each triangle's contribution (K values per triangle). */
  perTriangle?: boolean;
  /** Restrict to these triangles (indices); default all. */
  only?: Uint32Array;
}

export interface Integrals {
  /** Sums: 6 moments followed by one per user function. */
  sums: Float64Array;
  /** Per-triangle contributions (K per triangle) when requested. */
  perTriangle?: Float64Array;
  /** Smallest Jacobian (area factor) relative to the straight triangle's, over all quadrature points. */
  minJacobianRatio: number;
  /** Quadrature points evaluated. */
  points: number;
}

/** Lowest safe Dunavant rule exact for polynomials of degree d, but never above the requested degree. */
function exactRuleFor(d: number, cap: number): TriangleRule {
  return getRule(Math.min(safeDegreeAtLeast(Math.max(1, d)), cap));
}

/** Point function for user integrands: component 6 + i is fns[i] at the part coordinates. */
function userFunctions(fns: readonly Integrand[]): PointFunction | null {
  if (fns.length === 0) return null;
  return (x, y, _lx, _ly, out) => {
    for (let i = 0; i < fns.length; i++) out[MOMENT_COUNT + i] = fns[i](x, y);
  };
}

/** One pass over the mesh (or the triangles in `only`): the kernel on each triangle, compensated sums. */
export function integrate(mesh: MeshView, opts: IntegrateOptions): Integrals {
  const fns = opts.functions ?? [];
  const K = MOMENT_COUNT + fns.length;
  const curvedRule = getRule(opts.degree);
  const pd = opts.polynomialDegree === undefined ? (fns.length === 0 ? 2 : null) : opts.polynomialDegree;
  const straightRule = pd === null ? curvedRule : exactRuleFor(pd, opts.degree);
  const sum = new Float64Array(K), comp = new Float64Array(K), local = new Float64Array(K);
  const nT = mesh.count;
  const per = opts.perTriangle ? new Float64Array(nT * K) : undefined;
  const map = new TriangleMap();
  const kernel = makeKernel(K, true, userFunctions(fns), mesh.origin);
  let points = 0;
  const count = opts.only ? opts.only.length : nT;
  for (let idx = 0; idx < count; idx++) {
    const t = opts.only ? opts.only[idx] : idx;
    map.load(mesh, t);
    const rule = map.curved ? curvedRule : straightRule;
    integrateTriangle(map, rule, kernel, local, 0);
    points += rule.n;
    for (let k = 0; k < K; k++) addCompensated(sum, comp, k, local[k]);
    if (per) per.set(local, t * K);
  }
  for (let k = 0; k < K; k++) sum[k] += comp[k];
  const minRatio = kernel.minRatio === Infinity ? 1 : kernel.minRatio;
  return { sums: sum, perTriangle: per, minJacobianRatio: minRatio, points };
}
