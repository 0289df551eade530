/**
 * Exact integrals of polynomial integrands over a part from its boundary alone (Green's theorem), in O(n):
 * the boundary path for a polynomial thickness, density or user integrand.
 *
 * Field. The one field of the area moments (src/geometry/kinds/moments.ts): for g homogeneous of degree k
 * about the local origin, ∫∫ g dA = ∮ g·(x dy − y dx)/(k + 2). A polynomial g of degree D is the sum of its
 * homogeneous parts g_k, and Σ g_k(x, y)/(k + 2) = ∫₀¹ λ·g(λx, λy) dλ (since ∫₀¹ λ^(k+1) dλ = 1/(k + 2)), so
 *
 *   ∫∫ g dA = ∮ h(x, y)·(x dy − y dx),   h(x, y) = ∫₀¹ λ·g(λx, λy) dλ,
 *
 * with h found from values of g alone by Gauss–Legendre in λ with ⌈(D + 2)/2⌉ points (λ·g(λx, λy) has
 * degree ≤ D + 1 in λ: exact). h is a polynomial of degree ≤ D, and each segment kind's `greenNodes`
 * integrates P·(x dy − y dx) exactly for such P. (For g = 1, x, y, x², xy, y² this is the field of the area
 * moments: both paths agree term by term.) The points λ·(node) lie between the local origin and the node.
 *
 * Round-off (never understated; every term an upper bound):
 *  - evaluating integrand k anywhere the rule looks (the box |x| ≤ X, |y| ≤ Y of the nodes met, local),
 *    with the nodes' positions off by up to posErr: within E_k, the integrand's own running error bound
 *    (`bounds`; src/expr/smooth.ts roundingOnBox for user expressions); h sums ⌈(D + 2)/2⌉ such values with
 *    weights adding to 1/2, rounding within ε(⌈(D + 2)/2⌉ + 4)·B_k/2, B_k the largest |integrand k| there;
 *  - a node's weight within NODE_ULPS·ε·wMag, so Σ wMag·(E_k/2 + …) bounds the products;
 *  - the compensated sum over nodes: 2ε|S| + 4nε²·Σ|terms| (Neumaier).
 * The total is doubled for the products and sums not counted singly.
 */
import type { Part } from '../geometry/part.js';
import { type GreenVisitor, NODE_ULPS, unitGaussLegendre } from '../geometry/kinds/moments.js';
import { ops } from '../geometry/segments.js';
import type { PointFunction } from '../quadrature/integrate.js';

/** Highest total degree the boundary path takes (above it the nodes grow as D² per arc; the mesh is used). */
export const MAX_BOUNDARY_DEGREE = 40;

/** K polynomial integrands of total degree ≤ `degree` in (x, y). */
export interface PolynomialIntegrand {
  count: number;
  degree: number;
  /** Values at a point: part coordinates (x, y) and local ones (lx, ly) (the mesh path's PointFunction). */
  fill: PointFunction;
  /**
   * Bounds over the local box |lx| ≤ X, |ly| ≤ Y with every coordinate handed to `fill` (local or part) off by
   * up to `posErr` besides its own rounding: out[k] ≥ |integrand k|, out[count + k] ≥ the error of its
   * floating-point value (see boundBox, boundMul, boundAdd).
   */
  bounds(X: number, Y: number, posErr: number, out: Float64Array): void;
}

export interface PolynomialIntegrals {
  /** ∫∫ integrand k dA. */
  sums: Float64Array;
  /** Bound on each sum's round-off. */
  roundoff: Float64Array;
  /** Largest |integrand| over the box the rule looked at (for the caller's representation allowance). */
  bound: Float64Array;
  /** Boundary nodes used. */
  nodes: number;
}

/** ∫∫ of each integrand over the part (either loop direction), about `origin`, with its round-off bound. */
export function boundaryPolynomialIntegrals(part: Part, origin: readonly [number, number], g: PolynomialIntegrand): PolynomialIntegrals {
  const K = g.count, D = g.degree;
  const [ox, oy] = origin;
  const radial = unitGaussLegendre(Math.max(1, Math.ceil((D + 2) / 2)));
  const lam = radial.t, lw = new Float64Array(radial.t.length);
  for (let q = 0; q < lam.length; q++) lw[q] = radial.w[q] * lam[q];
  const sum = new Float64Array(K), comp = new Float64Array(K), loopSum = new Float64Array(K), loopComp = new Float64Array(K);
  const h = new Float64Array(K), tmp = new Float64Array(K);
  const add = (acc: Float64Array, cmp: Float64Array, k: number, v: number) => {
    const s = acc[k], t = s + v;
    cmp[k] += Math.abs(s) >= Math.abs(v) ? (s - t) + v : (v - t) + s;
    acc[k] = t;
  };
  let A1 = 0, P = 0, X = 0, Y = 0, nodes = 0;
  const visit: GreenVisitor = (lx, ly, w, wMag, posErr) => {
    h.fill(0);
    for (let q = 0; q < lam.length; q++) {
      const l = lam[q];
      g.fill(ox + l * lx, oy + l * ly, l * lx, l * ly, tmp);
      for (let k = 0; k < K; k++) h[k] += lw[q] * tmp[k];
    }
    for (let k = 0; k < K; k++) add(loopSum, loopComp, k, w * h[k]);
    A1 += wMag;
    if (posErr > P) P = posErr;
    const ax = Math.abs(lx), ay = Math.abs(ly);
    if (ax > X) X = ax;
    if (ay > Y) Y = ay;
    nodes++;
  };
  for (const r of part.regions) {
    const loops = [r.outer, ...r.holes];
    for (let li = 0; li < loops.length; li++) {
      loopSum.fill(0); loopComp.fill(0);
      let area = 0;
      for (const s of loops[li].segments) {
        const o = ops(s);
        o.greenNodes(s, ox, oy, D, visit);
        area += o.areaTerm(s);
      }
      // outline counter-clockwise adds, hole clockwise subtracts, whatever the direction it was drawn in
      const sign = (li === 0) === (area > 0) ? 1 : -1;
      for (let k = 0; k < K; k++) { add(sum, comp, k, sign * loopSum[k]); add(sum, comp, k, sign * loopComp[k]); }
    }
  }
  for (let k = 0; k < K; k++) sum[k] += comp[k];
  const b = new Float64Array(2 * K);
  g.bounds(X, Y, P, b);
  const eps = Number.EPSILON;
  const roundoff = new Float64Array(K), bound = new Float64Array(K);
  for (let k = 0; k < K; k++) {
    const B = b[k], E = b[K + k];
    bound[k] = B;
    const perWeight = E / 2 + eps * (lam.length + 4 + NODE_ULPS) * B / 2;
    roundoff[k] = 2 * (perWeight * A1 + eps * (2 * Math.abs(sum[k]) + 4 * nodes * eps * A1 * B));
  }
  return { sums: sum, roundoff, bound, nodes };
}

/** A bound [largest |value|, its evaluation error] for the running error analysis of the integrands. */
export type Bound = readonly [max: number, error: number];
const EPS = Number.EPSILON;
/** Product of two bounded values, rounded (|a|e_b + |b|e_a + e_a e_b + ε|ab|, a margin for the bound's own rounding). */
export const boundMul = (a: Bound, b: Bound): Bound => [a[0] * b[0], (a[0] * b[1] + b[0] * a[1] + a[1] * b[1] + EPS * a[0] * b[0]) * (1 + 1e-12)];
/** Sum (or difference) of two bounded values, rounded. */
export const boundAdd = (a: Bound, b: Bound): Bound => [a[0] + b[0], (a[1] + b[1] + EPS * (a[0] + b[0])) * (1 + 1e-12)];
/** A local coordinate up to X with a position error posErr, scaled by λ ≤ 1 (one rounding). */
export const boundCoordinate = (X: number, posErr: number): Bound => [X, posErr + EPS * X];
