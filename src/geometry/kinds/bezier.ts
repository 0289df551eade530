/**
 * Helpers shared by the Bézier kinds (quadratic.ts, cubic.ts), on control-point lists xs, ys.
 */
import { bernstein, bernsteinProductIntegral, bernsteinRestrict } from '../../numeric/bernstein.js';
import { quadraticRoots } from '../../numeric/roots.js';
import type { Crossing, Out2, PathCommand } from './types.js';

/** Relative safety margin added to the numerical bounds (turning, deviation). */
export const MARGIN = 1e-12;

export const angleBetween = (ax: number, ay: number, bx: number, by: number) => Math.abs(Math.atan2(ax * by - ay * bx, ax * bx + ay * by));

export function inOpenUnit(ts: number[]): number[] {
  return ts.filter((t) => t > 0 && t < 1).sort((p, q) => p - q);
}

/**
 * Antisymmetric weights W[i][j] = ∫ B_i B_j' − B_j B_i' for degree n, so that
 * ∫ q × dq = Σ_{i<j} (q_i × q_j) W[i][j] for a Bézier curve q with control points q_i.
 */
export function areaWeights(n: number): number[][] {
  const w = (i: number, j: number) => n * (bernsteinProductIntegral(n, i, n - 1, j - 1) - bernsteinProductIntegral(n, i, n - 1, j));
  const W: number[][] = [];
  for (let i = 0; i <= n; i++) {
    W.push([]);
    for (let j = 0; j <= n; j++) W[i].push(w(i, j) - w(j, i));
  }
  return W;
}

/** ∫ (x dy − y dx)/2 along a Bézier curve, taken about P0 to keep digits far from the origin (P0 × Pn accounts for the shift). */
export function bezierArea(xs: readonly number[], ys: readonly number[], W: number[][]): number {
  const n = xs.length - 1;
  let sum = 0;
  for (let i = 1; i <= n; i++) {
    const qxi = xs[i] - xs[0], qyi = ys[i] - ys[0];
    for (let j = i + 1; j <= n; j++) {
      const qxj = xs[j] - xs[0], qyj = ys[j] - ys[0];
      sum += (qxi * qyj - qyi * qxj) * W[i][j];
    }
  }
  return (sum + (xs[0] * ys[n] - ys[0] * xs[n])) / 2;
}

/** Control points of the piece of a Bézier curve over [ta, tb] (de Casteljau, each coordinate alike). */
export function bezierSubCurve(xs: readonly number[], ys: readonly number[], ta: number, tb: number): [number[], number[]] {
  return [bernsteinRestrict(xs, ta, tb), bernsteinRestrict(ys, ta, tb)];
}

/** Largest distance of a Bézier curve (control points) from its chord; exact when the hull projects onto the chord. */
export function bezierDeviation(qx: number[], qy: number[]): number {
  const n = qx.length - 1;
  const cxv = qx[n] - qx[0], cyv = qy[n] - qy[0];
  const L = Math.hypot(cxv, cyv);
  let hull = 0, size = 0;
  let within = true;
  for (let i = 1; i < n; i++) {
    size = Math.max(size, Math.hypot(qx[i] - qx[0], qy[i] - qy[0]));
  }
  if (!(L > 1e-12 * Math.max(size, L))) {
    // closed or nearly closed piece: distance from the start point bounded by the hull
    return Math.max(size, L) * (1 + MARGIN);
  }
  const d: number[] = [];
  for (let i = 0; i <= n; i++) {
    const px = qx[i] - qx[0], py = qy[i] - qy[0];
    d.push((cxv * py - cyv * px) / L);
    const proj = (cxv * px + cyv * py) / L;
    if (proj < 0 || proj > L) within = false;
    // distance from the chord segment (hull bound)
    const pc = Math.min(Math.max(proj, 0), L);
    hull = Math.max(hull, Math.hypot(px - (cxv / L) * pc, py - (cyv / L) * pc));
  }
  if (!within) {
    // the curve bulges past an end of the chord: sample the distance from the chord segment and add the
    // largest change possible between samples (speed ≤ n · longest control-polygon edge; distance is 1-Lipschitz)
    let edge = 0;
    for (let i = 0; i < n; i++) edge = Math.max(edge, Math.hypot(qx[i + 1] - qx[i], qy[i + 1] - qy[i]));
    const N = 256;
    let sampled = 0;
    for (let k = 0; k <= N; k++) {
      const u = k / N;
      let x = 0, y = 0;
      for (let i = 0; i <= n; i++) {
        const b = bernstein(n, i, u);
        x += b * (qx[i] - qx[0]); y += b * (qy[i] - qy[0]);
      }
      const pc = Math.min(Math.max((cxv * x + cyv * y) / L, 0), L);
      sampled = Math.max(sampled, Math.hypot(x - (cxv / L) * pc, y - (cyv / L) * pc));
    }
    return Math.min(hull, sampled + (n * edge) / (2 * N)) * (1 + MARGIN);
  }
  let best = 0;
  if (n === 2) {
    best = Math.abs(d[1]) / 2;
  } else {
    // d(u) = 3u(1−u)² d1 + 3u²(1−u) d2; d'(u)/3 in Bernstein form [d1, d2 − d1, −d2]
    const e0 = d[1], e1 = d[2] - d[1], e2 = -d[2];
    const roots = quadraticRoots(e0 - 2 * e1 + e2, 2 * (e1 - e0), e0);
    for (const u of roots) {
      if (u > 0 && u < 1) {
        const v = 3 * u * (1 - u) * ((1 - u) * d[1] + u * d[2]);
        best = Math.max(best, Math.abs(v));
      }
    }
  }
  return best * (1 + MARGIN);
}

/**
 * x where the y-monotone piece [ta, tb] of a curve meets height y: bisection on the monotone piece, then
 * the point (for kinds without a closed-form inverse).
 */
export function bisectCrossingX<S>(point: (s: S, t: number, out: Out2) => void, s: S, ta: number, tb: number, y: number): number {
  const p: Out2 = [0, 0];
  point(s, ta, p);
  const ya = p[1];
  point(s, tb, p);
  const up = p[1] > ya;
  let lo = ta, hi = tb;
  for (let i = 0; i < 200 && hi - lo > 0; i++) {
    const mid = (lo + hi) / 2;
    if (mid <= lo || mid >= hi) break;
    point(s, mid, p);
    if ((p[1] < y) === up) lo = mid; else hi = mid;
  }
  point(s, (lo + hi) / 2, p);
  return p[0];
}

/** The exact `Q`/`C` command for the piece t0 → t1 (either order) of a Bézier curve. */
export function bezierCommand(xs: number[], ys: number[], t0: number, t1: number): PathCommand {
  let [px, py] = t0 === 0 && t1 === 1 ? [xs, ys] : bezierSubCurve(xs, ys, Math.min(t0, t1), Math.max(t0, t1));
  if (t0 > t1) { px = px.slice().reverse(); py = py.slice().reverse(); }
  if (px.length === 3) return { cmd: 'Q', args: [px[1], py[1], px[2], py[2]] };
  return { cmd: 'C', args: [px[1], py[1], px[2], py[2], px[3], py[3]] };
}

/**
 * Crossings of a Bézier curve (control points xs, ys; `point` its kind's evaluator; ta on the curve) with a
 * line segment (tb on it), within `tol`. The signed distance of the curve from the line is a polynomial of
 * the curve's degree (≤ 3) whose Bernstein coefficients are the control points' distances; its derivative
 * (degree ≤ 2) has its roots in closed form, which split [0, 1] into monotone pieces with at most one root
 * each, found by bisection to the last bit. A turning point of the distance within tol of zero is a touch
 * (one crossing, the curve tangent to the line).
 */
export function bezierLineCrossings<S>(
  xs: readonly number[], ys: readonly number[], point: (s: S, t: number, out: Out2) => void, s: S,
  line: { x0: number; y0: number; x1: number; y1: number }, tol: number,
): Crossing[] {
  const ex = line.x1 - line.x0, ey = line.y1 - line.y0, L = Math.hypot(ex, ey);
  if (!(L > 0)) return [];
  const nx = -ey / L, ny = ex / L;
  const n = xs.length - 1;
  const g = xs.map((x, i) => nx * (x - line.x0) + ny * (ys[i] - line.y0));
  if (Math.min(...g) > tol || Math.max(...g) < -tol) return [];
  // derivative of the distance in Bernstein form (degree n − 1), then in powers of t
  const d = g.slice(1).map((v, i) => n * (v - g[i]));
  const turns = inOpenUnit(d.length === 3
    ? quadraticRoots(d[0] - 2 * d[1] + d[2], 2 * (d[1] - d[0]), d[0])
    : d.length === 2 ? quadraticRoots(0, d[1] - d[0], d[0]) : []);
  const p: Out2 = [0, 0];
  const dist = (t: number) => { point(s, t, p); return nx * (p[0] - line.x0) + ny * (p[1] - line.y0); };
  const roots: number[] = [];
  const knots = [0, ...turns, 1];
  for (let i = 0; i < knots.length; i++) {
    const t = knots[i], gt = dist(t);
    if (Math.abs(gt) <= tol) { roots.push(t); continue; }
    if (i + 1 === knots.length) break;
    const u = knots[i + 1], gu = dist(u);
    if (Math.abs(gu) <= tol || (gt > 0) === (gu > 0)) continue;
    let lo = t, hi = u;
    for (let k = 0; k < 200; k++) {
      const mid = (lo + hi) / 2;
      if (mid <= lo || mid >= hi) break;
      if ((dist(mid) > 0) === (gt > 0)) lo = mid; else hi = mid;
    }
    roots.push((lo + hi) / 2);
  }
  const out: Crossing[] = [];
  const slack = tol / L;
  for (const ta of roots) {
    point(s, ta, p);
    const tb = ((p[0] - line.x0) * ex + (p[1] - line.y0) * ey) / (L * L);
    if (tb < -slack || tb > 1 + slack) continue;
    if (out.length > 0 && out[out.length - 1].ta === ta) continue;
    out.push({ x: p[0], y: p[1], ta, tb });
  }
  return out;
}
