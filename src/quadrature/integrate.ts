/**
 * One pass over the mesh: at each quadrature point evaluate the Jacobian-weighted vector
 * [1, x, y, x², xy, y², f1(x, y), …] and accumulate with Neumaier-compensated sums.
 * Moments use the mesh's local coordinates (relative to mesh.origin); user functions are called with
 * the part's own coordinates.
 */
import { type Mesh, TriangleMap } from '../mesh/mesh.js';
import { type TriangleRule, getRule, safeDegreeAtLeast } from './rules.js';
import { addCompensated } from '../numeric/sum.js';

export type Integrand = (x: number, y: number) => number;

/** Index of each raw moment in the result vector. */
export const M_AREA = 0, M_X = 1, M_Y = 2, M_XX = 3, M_XY = 4, M_YY = 5;
export const MOMENT_COUNT = 6;

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

export function integrate(mesh: Mesh, opts: IntegrateOptions): Integrals {
  const fns = opts.functions ?? [];
  const K = MOMENT_COUNT + fns.length;
  const curvedRule = getRule(opts.degree);
  const pd = opts.polynomialDegree === undefined ? (fns.length === 0 ? 2 : null) : opts.polynomialDegree;
  const straightRule = pd === null ? curvedRule : exactRuleFor(pd, opts.degree);
  const sum = new Float64Array(K), comp = new Float64Array(K), local = new Float64Array(K);
  const nT = mesh.triangles.length / 3;
  const per = opts.perTriangle ? new Float64Array(nT * K) : undefined;
  const map = new TriangleMap();
  const [ox, oy] = mesh.origin;
  let minRatio = Infinity;
  let points = 0;
  const count = opts.only ? opts.only.length : nT;
  for (let idx = 0; idx < count; idx++) {
    const t = opts.only ? opts.only[idx] : idx;
    map.load(mesh, t);
    const rule = map.curved ? curvedRule : straightRule;
    local.fill(0);
    const n = rule.n, L1 = rule.l1, L2 = rule.l2, W = rule.w;
    for (let q = 0; q < n; q++) {
      map.at(L1[q], L2[q]);
      const x = map.x, y = map.y;
      const wj = W[q] * map.jac * 0.5;
      if (map.curved) {
        const r = map.jac / map.det;
        if (r < minRatio) minRatio = r;
      }
      local[0] += wj;
      local[1] += wj * x;
      local[2] += wj * y;
      local[3] += wj * x * x;
      local[4] += wj * x * y;
      local[5] += wj * y * y;
      for (let f = 0; f < fns.length; f++) local[MOMENT_COUNT + f] += wj * fns[f](x + ox, y + oy);
    }
    points += n;
    for (let k = 0; k < K; k++) addCompensated(sum, comp, k, local[k]);
    if (per) per.set(local, t * K);
  }
  for (let k = 0; k < K; k++) sum[k] += comp[k];
  if (minRatio === Infinity) minRatio = 1;
  return { sums: sum, perTriangle: per, minJacobianRatio: minRatio, points };
}
