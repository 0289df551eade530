/**
 * Elliptical arc in parametric form p(θ) = c + R(phi)·(rx cos θ, ry sin θ), θ running from t0 to t1
 * (radians; t1 > t0 runs counter-clockwise when rx, ry > 0). Not restricted to rx ≥ ry.
 *
 * Exact: point, derivative, bbox, areaTerm, turning, deviation, yTurns, crossingX, affine images.
 * Numerical: length (adaptive Gauss–Legendre to about 1e-14 relative).
 */
import { adaptiveGaussLegendre } from '../../numeric/gaussLegendre.js';
import { applyAffine, isIdentity } from './affine.js';
import { angleInSweep, sweepParam } from './angles.js';
import type { LineSegment } from './line.js';
import { trigArcMoments, trigArcNodes } from './moments.js';
import { MAX_ARC_COMMAND_SWEEP, type Affine, type Crossing, type Out2, type PathCommand, type SegmentOps } from './types.js';

export interface EllipticalArcSegment {
  kind: 'ellipticalArc';
  cx: number; cy: number;
  rx: number; ry: number;
  phi: number;
  t0: number; t1: number;
}

/** Relative safety margin added to the numerical bounds (turning, deviation). */
const MARGIN = 1e-12;

function ellAt(s: EllipticalArcSegment, th: number, out: Out2): void {
  const c = Math.cos(s.phi), n = Math.sin(s.phi);
  const u = s.rx * Math.cos(th), v = s.ry * Math.sin(th);
  out[0] = s.cx + c * u - n * v;
  out[1] = s.cy + n * u + c * v;
}

/** Continuous angle of the ellipse's normal at parameter angle θ (increases with θ, by 2π per turn). */
function ellNormalAngle(rx: number, ry: number, th: number): number {
  const sn = Math.sin(th), cs = Math.cos(th);
  return th + Math.atan(((rx - ry) * sn * cs) / (ry * cs * cs + rx * sn * sn));
}

/** All angles a + kπ strictly inside the sweep (a0, a1), as parameters t in (0, 1), sorted. */
function sweepParams(a: number, a0: number, a1: number): number[] {
  const lo = Math.min(a0, a1), hi = Math.max(a0, a1);
  const d = a1 - a0;
  const out: number[] = [];
  if (d === 0) return out;
  for (let b = a + Math.ceil((lo - a) / Math.PI) * Math.PI; b < hi; b += Math.PI) {
    if (b > lo) out.push((b - a0) / d);
  }
  return out.sort((p, q) => p - q);
}

/**
 * Image of an elliptical arc c + A(cos θ, sin θ), A = R(phi)·diag(rx, ry), under m: the new matrix M·A is
 * split as R(phi')·diag(sx, sy)·R(w) (closed-form 2×2 singular value decomposition). When sy < 0 the
 * right factor is a reflection, which reverses the parameter: θ' = −θ − w; otherwise θ' = θ + w.
 */
export function transformEllipse(s: EllipticalArcSegment, m: Affine): EllipticalArcSegment {
  const cp = Math.cos(s.phi), sp = Math.sin(s.phi);
  const a00 = s.rx * cp, a10 = s.rx * sp, a01 = -s.ry * sp, a11 = s.ry * cp;
  const m00 = m[0] * a00 + m[2] * a10, m10 = m[1] * a00 + m[3] * a10;
  const m01 = m[0] * a01 + m[2] * a11, m11 = m[1] * a01 + m[3] * a11;
  const E = (m00 + m11) / 2, F = (m00 - m11) / 2, G = (m10 + m01) / 2, H = (m10 - m01) / 2;
  const Q = Math.hypot(E, H), R = Math.hypot(F, G);
  const sx = Q + R, sy = Q - R;
  const a1 = Math.atan2(G, F), a2 = Math.atan2(H, E);
  const w = (a2 - a1) / 2, phi = (a2 + a1) / 2;
  const [cx, cy] = applyAffine(m, s.cx, s.cy);
  if (sy >= 0) return { kind: 'ellipticalArc', cx, cy, rx: sx, ry: sy, phi, t0: s.t0 + w, t1: s.t1 + w };
  return { kind: 'ellipticalArc', cx, cy, rx: sx, ry: -sy, phi, t0: -s.t0 - w, t1: -s.t1 - w };
}

/**
 * Crossings of an elliptical arc (ta) with a line segment (tb) within `tol`, in closed form: in the frame
 * where the ellipse is the unit circle (turned by −phi, scaled by 1/rx, 1/ry) the line stays a line with the
 * same parameter, and meets the circle where a quadratic in that parameter vanishes. A tangent within tol
 * (measured against the smaller radius) counts once.
 */
function ellipseLineCrossings(e: EllipticalArcSegment, a: LineSegment, tol: number): Crossing[] {
  const c = Math.cos(e.phi), n = Math.sin(e.phi);
  const toU = (x: number, y: number): [number, number] => {
    const dx = x - e.cx, dy = y - e.cy;
    return [(c * dx + n * dy) / e.rx, (-n * dx + c * dy) / e.ry];
  };
  const [u0, v0] = toU(a.x0, a.y0), [u1, v1] = toU(a.x1, a.y1);
  const du = u1 - u0, dv = v1 - v0, dd = du * du + dv * dv;
  if (!(dd > 0)) return [];
  const s0 = -(u0 * du + v0 * dv) / dd;
  const h = Math.hypot(u0 + du * s0, v0 + dv * s0);
  const rel = tol / Math.min(Math.abs(e.rx), Math.abs(e.ry));
  if (h > 1 + rel) return [];
  const half = h >= 1 - rel ? 0 : Math.sqrt((1 - h) * (1 + h) / dd);
  const L = Math.hypot(a.x1 - a.x0, a.y1 - a.y0), slackT = tol / L;
  const out: Crossing[] = [];
  for (const tb of half === 0 ? [s0] : [s0 - half, s0 + half]) {
    if (tb < -slackT || tb > 1 + slackT) continue;
    const ta = sweepParam(Math.atan2(v0 + dv * tb, u0 + du * tb), e.t0, e.t1, rel);
    if (Number.isNaN(ta)) continue;
    out.push({ x: a.x0 + (a.x1 - a.x0) * tb, y: a.y0 + (a.y1 - a.y0) * tb, ta, tb });
  }
  return out;
}

export const ellipticalArcOps: SegmentOps<EllipticalArcSegment> = {
  kind: 'ellipticalArc',
  straight: false,
  point(s, t, out) {
    ellAt(s, s.t0 + (s.t1 - s.t0) * t, out);
  },
  derivative(s, t, out) {
    const d = s.t1 - s.t0;
    const th = s.t0 + d * t;
    const c = Math.cos(s.phi), n = Math.sin(s.phi);
    const du = -s.rx * d * Math.sin(th), dv = s.ry * d * Math.cos(th);
    out[0] = c * du - n * dv;
    out[1] = n * du + c * dv;
  },
  evaluate(s, t, p, d) {
    ellipticalArcOps.point(s, t, p);
    ellipticalArcOps.derivative(s, t, d);
  },
  start(s, out) { ellipticalArcOps.point(s, 0, out); },
  end(s, out) { ellipticalArcOps.point(s, 1, out); },
  reverse: (s) => ({ ...s, t0: s.t1, t1: s.t0 }),
  translate: (s, dx, dy) => ({ ...s, cx: s.cx + dx, cy: s.cy + dy }),
  sub(s, a, b) {
    const d = s.t1 - s.t0;
    return { ...s, t0: a === 0 ? s.t0 : s.t0 + d * a, t1: b === 1 ? s.t1 : s.t0 + d * b };
  },
  affine: transformEllipse,
  rotate(s, c, sn, _angle, x, y) {
    const m: Affine = [c, sn, -sn, c, x, y];
    return isIdentity(m) ? s : transformEllipse(s, m);
  },
  moveStart: () => null,
  moveEnd: () => null,
  length(s) {
    const d = Math.abs(s.t1 - s.t0);
    if (s.rx === s.ry) return Math.abs(s.rx) * d;
    const a = s.rx, b = s.ry;
    return adaptiveGaussLegendre((th) => Math.hypot(a * Math.sin(th), b * Math.cos(th)), Math.min(s.t0, s.t1), Math.max(s.t0, s.t1));
  },
  bbox(s) {
    const p: Out2 = [0, 0];
    ellAt(s, s.t0, p);
    let xMin = p[0], xMax = p[0], yMin = p[1], yMax = p[1];
    ellAt(s, s.t1, p);
    xMin = Math.min(xMin, p[0]); xMax = Math.max(xMax, p[0]);
    yMin = Math.min(yMin, p[1]); yMax = Math.max(yMax, p[1]);
    const c = Math.cos(s.phi), n = Math.sin(s.phi);
    const tx = Math.atan2(-s.ry * n, s.rx * c); // dx/dθ = 0
    const ty = Math.atan2(s.ry * c, s.rx * n); // dy/dθ = 0
    for (const th of [tx, tx + Math.PI, ty, ty + Math.PI]) {
      if (angleInSweep(th, s.t0, s.t1)) {
        ellAt(s, th, p);
        xMin = Math.min(xMin, p[0]); xMax = Math.max(xMax, p[0]);
        yMin = Math.min(yMin, p[1]); yMax = Math.max(yMax, p[1]);
      }
    }
    return [xMin, yMin, xMax, yMax];
  },
  // p(θ) = c + R(phi)·diag(rx, ry)·(cos θ, sin θ): a trigonometric arc whose C and S columns are the
  // rotated semi-axes (closed form, kinds/moments.ts)
  moments(s, ox, oy, out) {
    const c = Math.cos(s.phi), n = Math.sin(s.phi);
    trigArcMoments(s.cx - ox, s.cy - oy, s.rx * c, -s.ry * n, s.rx * n, s.ry * c, s.t0, s.t1, out);
  },
  greenNodes(s, ox, oy, degree, visit) {
    const c = Math.cos(s.phi), n = Math.sin(s.phi);
    trigArcNodes(s.cx - ox, s.cy - oy, s.rx * c, -s.ry * n, s.rx * n, s.ry * c, s.t0, s.t1, degree, visit);
  },
  // With x = cx + U(θ), y = cy + V(θ), (U, V) = R(phi)(rx cos θ, ry sin θ):
  // x dy − y dx = (U dV − V dU) + cx dV − cy dU and U dV − V dU = rx·ry dθ (a rotation keeps the cross
  // product), so the integral is [rx ry (t1 − t0) + cx (V1 − V0) − cy (U1 − U0)] / 2. Differences of
  // sines and cosines are written as products to avoid cancellation on short arcs.
  areaTerm(s) {
    const { cx, cy, rx, ry, t0, t1 } = s;
    const c = Math.cos(s.phi), n = Math.sin(s.phi);
    const hs = Math.sin((t1 - t0) / 2), m = (t0 + t1) / 2;
    const dCos = -2 * Math.sin(m) * hs; // cos t1 − cos t0
    const dSin = 2 * Math.cos(m) * hs; // sin t1 − sin t0
    const dU = c * rx * dCos - n * ry * dSin;
    const dV = n * rx * dCos + c * ry * dSin;
    return (rx * ry * (t1 - t0) + cx * dV - cy * dU) / 2;
  },
  // The normal angle is monotone in θ (an ellipse is convex), so the turning is its exact change.
  turning(s, ta, tb) {
    const d = s.t1 - s.t0;
    const A = ellNormalAngle(Math.abs(s.rx), Math.abs(s.ry), s.t0 + d * ta);
    const B = ellNormalAngle(Math.abs(s.rx), Math.abs(s.ry), s.t0 + d * tb);
    return Math.abs(B - A) * (1 + MARGIN);
  },
  // Image of the unit circle under A = R(phi)·diag(rx, ry): distances from the chord line scale by
  // det A · |chord| / |A·chord|, and the circle's largest distance is 1 − cos(Δ/2) = 2 sin²(Δ/4) at the
  // middle of the sweep. Exact for the distance from the chord's line.
  deviation(s, ta, tb) {
    const d = s.t1 - s.t0;
    const a = s.t0 + d * ta, b = s.t0 + d * tb;
    const delta = Math.abs(b - a), m = (a + b) / 2;
    const rx = Math.abs(s.rx), ry = Math.abs(s.ry);
    const h = Math.sin(delta / 4);
    const dev = (rx * ry * 2 * h * h) / Math.hypot(rx * Math.sin(m), ry * Math.cos(m));
    return dev * (1 + MARGIN);
  },
  yTurns(s) {
    const c = Math.cos(s.phi), n = Math.sin(s.phi);
    return sweepParams(Math.atan2(s.ry * c, s.rx * n), s.t0, s.t1).filter((t) => t > 0 && t < 1);
  },
  crossings: { line: ellipseLineCrossings },
  crossingX(s, ta, tb, y) {
    // y(θ) = cy + Y sin(θ + δ) with Y = hypot(rx sin φ, ry cos φ), δ = atan2(rx sin φ, ry cos φ)
    const sp = Math.sin(s.phi), cp = Math.cos(s.phi);
    const Y = Math.hypot(s.rx * sp, s.ry * cp);
    const delta = Math.atan2(s.rx * sp, s.ry * cp);
    const thm = s.t0 + (s.t1 - s.t0) * ((ta + tb) / 2);
    const um = thm + delta; // on this piece u = θ + δ stays within one half period where sin is monotone
    let u = Math.asin(Math.max(-1, Math.min(1, (y - s.cy) / Y)));
    if (Math.cos(um) < 0) u = Math.PI - u;
    u += 2 * Math.PI * Math.round((um - u) / (2 * Math.PI));
    const th = u - delta;
    const c = s.rx * Math.cos(th), d = s.ry * Math.sin(th);
    return s.cx + cp * c - sp * d;
  },
  pathCommands(s, t0, t1) {
    const b0 = s.t0 + (s.t1 - s.t0) * t0, b1 = s.t0 + (s.t1 - s.t0) * t1;
    const n = Math.max(1, Math.ceil(Math.abs(b1 - b0) / MAX_ARC_COMMAND_SWEEP - 1e-12));
    const rx = Math.abs(s.rx), ry = Math.abs(s.ry);
    // counter-clockwise (y up) when the parameter grows and rx·ry > 0
    const sweep = (b1 - b0) * s.rx * s.ry > 0 ? 1 : 0;
    const rot = (s.phi * 180) / Math.PI;
    const c = Math.cos(s.phi), sn = Math.sin(s.phi);
    const out: PathCommand[] = [];
    for (let i = 1; i <= n; i++) {
      const t = i === n ? b1 : b0 + ((b1 - b0) * i) / n;
      const ex = s.rx * Math.cos(t), ey = s.ry * Math.sin(t);
      out.push({ cmd: 'A', args: [rx, ry, rot, 0, sweep, s.cx + c * ex - sn * ey, s.cy + sn * ex + c * ey] });
    }
    return out;
  },
};
