/**
 * B-spline → exact Bézier pieces.
 *
 * Each knot span [u_i, u_{i+1}] (u_i < u_{i+1}) inside the domain [u_p, u_n] of a degree-p spline with n
 * control points is one polynomial piece. Its Bézier control points are the blossom values
 * b_k = f(u_i, …, u_i, u_{i+1}, …, u_{i+1}) (p − k copies of u_i, k of u_{i+1}); evaluating the blossom
 * with de Boor's triangle is the same computation as inserting u_i and u_{i+1} until each has multiplicity
 * p (Boehm's knot insertion), done locally per span so that the whole conversion is O(n p²) instead of
 * growing the knot vector. Clamped and unclamped (periodic) knot vectors are handled alike. Rational
 * splines are converted in homogeneous coordinates (w x, w y, w).
 *
 * Degree 1 gives lines, 2 quadratics, 3 cubics. A rational piece is accepted only when it is exactly a
 * straight line (degree 1) or a circular arc: a quadratic whose control legs are equal and whose middle
 * weight, normalised to end weights 1, equals the cosine of the angle between a leg and the chord
 * (the standard conic form of a circular arc; from memory, checked in tests against ezdxf's own
 * arc-to-spline construction). Anything else is refused by the caller with the spline's handle and layer.
 */
import type { Segment } from '../geometry/segments.js';

export interface SplineInput {
  degree: number;
  knots: number[];
  /** Control points in x, y pairs. */
  points: number[];
  /** Weights (one per control point) or undefined for a non-rational spline. */
  weights?: number[];
}

/** Relative tolerance of the circular-arc test on rational quadratic pieces (data written with ≥ 10 digits). */
export const ARC_WEIGHT_TOLERANCE = 1e-9;

export type SplineResult = { ok: true; segments: Segment[] } | { ok: false; reason: string };

export function splineToSegments(sp: SplineInput): SplineResult {
  const p = sp.degree;
  const n = sp.points.length / 2;
  const U = sp.knots;
  if (!Number.isInteger(p) || p < 1 || p > 3) return { ok: false, reason: `degree ${p} (only degrees 1 to 3 are read)` };
  if (n < p + 1) return { ok: false, reason: `${n} control points for degree ${p} (at least ${p + 1} needed)` };
  if (U.length !== n + p + 1) return { ok: false, reason: `${U.length} knots for ${n} control points of degree ${p} (${n + p + 1} expected)` };
  for (let k = 1; k < U.length; k++) if (!(U[k] >= U[k - 1])) return { ok: false, reason: `knots decrease at knot ${k}` };
  for (const v of U) if (!Number.isFinite(v)) return { ok: false, reason: 'a knot is not a finite number' };
  let W = sp.weights;
  if (W) {
    if (W.length !== n) return { ok: false, reason: `${W.length} weights for ${n} control points` };
    for (const w of W) if (!(w > 0) || !Number.isFinite(w)) return { ok: false, reason: 'a weight is not positive' };
    const w0 = W[0];
    if (W.every((w) => Math.abs(w - w0) <= 1e-14 * w0)) W = undefined; // equal weights: polynomial
  }
  if (!(U[n] > U[p])) return { ok: false, reason: 'empty parameter domain (knots u_p and u_n are equal)' };
  const hx = new Float64Array(p + 1), hy = new Float64Array(p + 1), hw = new Float64Array(p + 1);
  const bx = new Float64Array(p + 1), by = new Float64Array(p + 1), bw = new Float64Array(p + 1);
  const segs: Segment[] = [];
  let lastX = NaN, lastY = NaN;
  for (let i = p; i < n; i++) {
    const ua = U[i], ub = U[i + 1];
    if (!(ub > ua)) continue;
    for (let k = 0; k <= p; k++) {
      // blossom f(ua^(p−k), ub^k) by de Boor's triangle on control points i−p … i
      for (let j = 0; j <= p; j++) {
        const w = W ? W[i - p + j] : 1;
        hx[j] = sp.points[2 * (i - p + j)] * w;
        hy[j] = sp.points[2 * (i - p + j) + 1] * w;
        hw[j] = w;
      }
      for (let r = 1; r <= p; r++) {
        const t = r <= p - k ? ua : ub;
        for (let j = p; j >= r; j--) {
          const idx = i - p + j;
          const a = (t - U[idx]) / (U[idx + p + 1 - r] - U[idx]);
          hx[j] = (1 - a) * hx[j - 1] + a * hx[j];
          hy[j] = (1 - a) * hy[j - 1] + a * hy[j];
          hw[j] = (1 - a) * hw[j - 1] + a * hw[j];
        }
      }
      bx[k] = hx[p] / hw[p]; by[k] = hy[p] / hw[p]; bw[k] = hw[p];
    }
    // consecutive pieces share their joint exactly
    if (segs.length > 0) { bx[0] = lastX; by[0] = lastY; }
    lastX = bx[p]; lastY = by[p];
    const rational = W !== undefined && !(Math.abs(bw[1] - bw[0]) <= 1e-14 * bw[0] && Math.abs(bw[p] - bw[0]) <= 1e-14 * bw[0] && (p < 3 || Math.abs(bw[2] - bw[0]) <= 1e-14 * bw[0]));
    if (p === 1) {
      if (bx[0] !== bx[1] || by[0] !== by[1]) segs.push({ kind: 'line', x0: bx[0], y0: by[0], x1: bx[1], y1: by[1] });
    } else if (!rational) {
      segs.push(p === 2
        ? { kind: 'quadratic', x0: bx[0], y0: by[0], x1: bx[1], y1: by[1], x2: bx[2], y2: by[2] }
        : { kind: 'cubic', x0: bx[0], y0: by[0], x1: bx[1], y1: by[1], x2: bx[2], y2: by[2], x3: bx[3], y3: by[3] });
    } else if (p === 2) {
      const arc = rationalQuadraticArc(bx[0], by[0], bx[1], by[1], bx[2], by[2], bw[1] / Math.sqrt(bw[0] * bw[2]));
      if (!arc) return { ok: false, reason: `rational piece ${segs.length + 1} is not a circular arc (only non-rational splines and rational circular arcs are read)` };
      segs.push(arc);
    } else {
      return { ok: false, reason: `rational degree-3 piece ${segs.length + 1} (only non-rational splines and rational circular arcs are read)` };
    }
  }
  return { ok: true, segments: segs };
}

/** The circular arc that a rational quadratic Bézier (end weights 1, middle weight w) traces, if it is one. */
export function rationalQuadraticArc(x0: number, y0: number, x1: number, y1: number, x2: number, y2: number, w: number): Segment | undefined {
  const l0 = Math.hypot(x1 - x0, y1 - y0), l1 = Math.hypot(x2 - x1, y2 - y1);
  const cx2 = x2 - x0, cy2 = y2 - y0, chord = Math.hypot(cx2, cy2);
  if (!(w > 0) || chord === 0 || l0 === 0 || l1 === 0) return undefined;
  if (Math.abs(l0 - l1) > ARC_WEIGHT_TOLERANCE * Math.max(l0, l1)) return undefined;
  const ux = x1 - x0, uy = y1 - y0;
  const cross = ux * cy2 - uy * cx2, dot = ux * cx2 + uy * cy2;
  const half = Math.atan2(Math.abs(cross), dot); // angle between leg and chord = half the sweep
  if (Math.abs(w - Math.cos(half)) > ARC_WEIGHT_TOLERANCE) return undefined;
  if (!(half > 0)) return undefined;
  const r = chord / (2 * Math.sin(half));
  const mx = (x0 + x2) / 2, my = (y0 + y2) / 2;
  const vx = mx - x1, vy = my - y1, vl = Math.hypot(vx, vy);
  const d = r * Math.cos(half);
  const cx = mx + (vx / vl) * d, cy = my + (vy / vl) * d;
  const a0 = Math.atan2(y0 - cy, x0 - cx);
  const sweep = 2 * half * (cross > 0 ? 1 : -1);
  return { kind: 'arc', cx, cy, r, a0, a1: a0 + sweep };
}
