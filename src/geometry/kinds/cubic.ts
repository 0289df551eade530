/**
 * Cubic Bézier curve with control points P0 (start), P1, P2, P3 (end).
 * Exact: point, derivative, bbox (derivative roots), areaTerm (polynomial), deviation, yTurns, affine images.
 * Numerical with a margin that never understates: length (adaptive Gauss–Legendre), turning (exact
 * between inflections, sampled within); crossingX by bisection to machine precision.
 */
import { adaptiveGaussLegendre } from '../../numeric/gaussLegendre.js';
import { quadraticRoots } from '../../numeric/roots.js';
import { applyAffine, isIdentity } from './affine.js';
import { angleBetween, areaWeights, bezierArea, bezierCommand, bezierDeviation, bezierLineCrossings, bezierSubCurve, bisectCrossingX, inOpenUnit } from './bezier.js';
import type { LineSegment } from './line.js';
import { bezierMoments, bezierNodes } from './moments.js';
import type { Affine, Out2, SegmentOps } from './types.js';

export interface CubicSegment {
  kind: 'cubic';
  x0: number; y0: number;
  x1: number; y1: number;
  x2: number; y2: number;
  x3: number; y3: number;
}

const W3 = areaWeights(3);
const LX = new Float64Array(4), LY = new Float64Array(4);
const xsOf = (s: CubicSegment) => [s.x0, s.x1, s.x2, s.x3];
const ysOf = (s: CubicSegment) => [s.y0, s.y1, s.y2, s.y3];

function mapped(s: CubicSegment, m: Affine): CubicSegment {
  const [x0, y0] = applyAffine(m, s.x0, s.y0), [x1, y1] = applyAffine(m, s.x1, s.y1);
  const [x2, y2] = applyAffine(m, s.x2, s.y2), [x3, y3] = applyAffine(m, s.x3, s.y3);
  return { kind: 'cubic', x0, y0, x1, y1, x2, y2, x3, y3 };
}

/** Power-basis coefficients of B'(t)/3 = a t² + b t + c for one coordinate. */
function cubicDerivCoeffs(p0: number, p1: number, p2: number, p3: number): [number, number, number] {
  return [-p0 + 3 * p1 - 3 * p2 + p3, 2 * (p0 - 2 * p1 + p2), p1 - p0];
}

/** Direction of the tangent at t, taking the one-sided limit where the derivative vanishes. */
function cubicDirection(s: CubicSegment, t: number, side: 1 | -1, out: Out2): void {
  const [ax, bx, cx] = cubicDerivCoeffs(s.x0, s.x1, s.x2, s.x3);
  const [ay, by, cy] = cubicDerivCoeffs(s.y0, s.y1, s.y2, s.y3);
  const dx = (ax * t + bx) * t + cx, dy = (ay * t + by) * t + cy;
  const size = Math.max(Math.abs(ax), Math.abs(bx), Math.abs(cx), Math.abs(ay), Math.abs(by), Math.abs(cy));
  if (Math.hypot(dx, dy) > 1e-12 * size) { out[0] = dx; out[1] = dy; return; }
  const ddx = 2 * ax * t + bx, ddy = 2 * ay * t + by;
  if (Math.hypot(ddx, ddy) > 1e-12 * size) { out[0] = side * ddx; out[1] = side * ddy; return; }
  out[0] = ax; out[1] = ay;
}

export const cubicOps: SegmentOps<CubicSegment> = {
  kind: 'cubic',
  straight: false,
  point(s, t, out) {
    const m = 1 - t;
    const a = m * m * m, b = 3 * m * m * t, c = 3 * m * t * t, d = t * t * t;
    out[0] = a * s.x0 + b * s.x1 + c * s.x2 + d * s.x3;
    out[1] = a * s.y0 + b * s.y1 + c * s.y2 + d * s.y3;
  },
  derivative(s, t, out) {
    const m = 1 - t;
    const a = 3 * m * m, b = 6 * m * t, c = 3 * t * t;
    out[0] = a * (s.x1 - s.x0) + b * (s.x2 - s.x1) + c * (s.x3 - s.x2);
    out[1] = a * (s.y1 - s.y0) + b * (s.y2 - s.y1) + c * (s.y3 - s.y2);
  },
  evaluate(s, t, p, d) {
    cubicOps.point(s, t, p);
    cubicOps.derivative(s, t, d);
  },
  start(s, out) { cubicOps.point(s, 0, out); },
  end(s, out) { cubicOps.point(s, 1, out); },
  reverse: (s) => ({ kind: 'cubic', x0: s.x3, y0: s.y3, x1: s.x2, y1: s.y2, x2: s.x1, y2: s.y1, x3: s.x0, y3: s.y0 }),
  translate: (s, dx, dy) => ({
    kind: 'cubic', x0: s.x0 + dx, y0: s.y0 + dy, x1: s.x1 + dx, y1: s.y1 + dy,
    x2: s.x2 + dx, y2: s.y2 + dy, x3: s.x3 + dx, y3: s.y3 + dy,
  }),
  sub(s, a, b) {
    const [x, y] = bezierSubCurve(xsOf(s), ysOf(s), a, b);
    return { kind: 'cubic', x0: x[0], y0: y[0], x1: x[1], y1: y[1], x2: x[2], y2: y[2], x3: x[3], y3: y[3] };
  },
  affine: mapped,
  rotate(s, c, sn, _angle, x, y) {
    const m: Affine = [c, sn, -sn, c, x, y];
    return isIdentity(m) ? s : mapped(s, m);
  },
  moveStart: (s, x, y) => ({ ...s, x0: x, y0: y }),
  moveEnd: (s, x, y) => ({ ...s, x3: x, y3: y }),
  length(s) {
    const o: Out2 = [0, 0];
    return adaptiveGaussLegendre((t) => { cubicOps.derivative(s, t, o); return Math.hypot(o[0], o[1]); }, 0, 1);
  },
  bbox(s) {
    let xMin = Math.min(s.x0, s.x3), xMax = Math.max(s.x0, s.x3);
    let yMin = Math.min(s.y0, s.y3), yMax = Math.max(s.y0, s.y3);
    const p: Out2 = [0, 0];
    const ts = [
      ...quadraticRoots(...cubicDerivCoeffs(s.x0, s.x1, s.x2, s.x3)),
      ...quadraticRoots(...cubicDerivCoeffs(s.y0, s.y1, s.y2, s.y3)),
    ];
    for (const t of inOpenUnit(ts)) {
      cubicOps.point(s, t, p);
      xMin = Math.min(xMin, p[0]); xMax = Math.max(xMax, p[0]);
      yMin = Math.min(yMin, p[1]); yMax = Math.max(yMax, p[1]);
    }
    return [xMin, yMin, xMax, yMax];
  },
  moments(s, ox, oy, out) {
    LX[0] = s.x0 - ox; LX[1] = s.x1 - ox; LX[2] = s.x2 - ox; LX[3] = s.x3 - ox;
    LY[0] = s.y0 - oy; LY[1] = s.y1 - oy; LY[2] = s.y2 - oy; LY[3] = s.y3 - oy;
    bezierMoments(LX, LY, out);
  },
  greenNodes(s, ox, oy, degree, visit) {
    LX[0] = s.x0 - ox; LX[1] = s.x1 - ox; LX[2] = s.x2 - ox; LX[3] = s.x3 - ox;
    LY[0] = s.y0 - oy; LY[1] = s.y1 - oy; LY[2] = s.y2 - oy; LY[3] = s.y3 - oy;
    bezierNodes(LX, LY, degree, visit);
  },
  areaTerm: (s) => bezierArea(xsOf(s), ysOf(s), W3),
  // Between inflections (zeros of B' × B'', a quadratic) the tangent angle is monotone; there the turning is
  // the sum of angles between derivative samples (16 per piece, so that no step reaches π on a looped curve).
  turning(s, ta, tb) {
    const lo = Math.min(ta, tb), hi = Math.max(ta, tb);
    if (hi === lo) return 0;
    const [ax, bx, cx] = cubicDerivCoeffs(s.x0, s.x1, s.x2, s.x3);
    const [ay, by, cy] = cubicDerivCoeffs(s.y0, s.y1, s.y2, s.y3);
    const axb = ax * by - ay * bx, cxa = cx * ay - cy * ax, cxb = cx * by - cy * bx;
    const cuts = [lo, ...quadraticRoots(-axb, 2 * cxa, cxb).filter((t) => t > lo && t < hi).sort((p, q) => p - q), hi];
    let total = 0;
    const a: Out2 = [0, 0], b: Out2 = [0, 0];
    const N = 16;
    for (let k = 0; k + 1 < cuts.length; k++) {
      const p = cuts[k], q = cuts[k + 1];
      cubicDirection(s, p, 1, a);
      // a cusp between pieces: the one-sided directions differ (by π)
      if (k > 0) total += angleBetween(b[0], b[1], a[0], a[1]);
      for (let i = 1; i <= N; i++) {
        const t = p + ((q - p) * i) / N;
        cubicDirection(s, t, i === N ? -1 : 1, b);
        total += angleBetween(a[0], a[1], b[0], b[1]);
        a[0] = b[0]; a[1] = b[1];
      }
    }
    return total * (1 + 1e-9) + 1e-15;
  },
  deviation(s, ta, tb) {
    const [px, py] = bezierSubCurve(xsOf(s), ysOf(s), Math.min(ta, tb), Math.max(ta, tb));
    return bezierDeviation(px, py);
  },
  yTurns(s) {
    return inOpenUnit(quadraticRoots(...cubicDerivCoeffs(s.y0, s.y1, s.y2, s.y3)));
  },
  crossingX: (s, ta, tb, y) => bisectCrossingX(cubicOps.point, s, ta, tb, y),
  crossings: { line: (a, b: LineSegment, tol: number) => bezierLineCrossings(xsOf(a), ysOf(a), cubicOps.point, a, b, tol) },
  pathCommands: (s, t0, t1) => [bezierCommand(xsOf(s), ysOf(s), t0, t1)],
};
