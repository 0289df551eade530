/**
 * Quadratic Bézier curve with control points P0 (start), P1, P2 (end).
 * Exact: point, derivative, bbox, areaTerm (polynomial), turning, deviation, yTurns, affine images.
 * Numerical: length (adaptive Gauss–Legendre), crossingX (bisection to machine precision).
 */
import { adaptiveGaussLegendre } from '../../numeric/gaussLegendre.js';
import { applyAffine, isIdentity } from './affine.js';
import { MARGIN, angleBetween, areaWeights, bezierArea, bezierCommand, bezierDeviation, bezierLineCrossings, bezierSubCurve, bisectCrossingX, inOpenUnit } from './bezier.js';
import type { LineSegment } from './line.js';
import { bezierMoments, bezierNodes } from './moments.js';
import type { Affine, Out2, SegmentOps } from './types.js';

export interface QuadraticSegment {
  kind: 'quadratic';
  x0: number; y0: number;
  x1: number; y1: number;
  x2: number; y2: number;
}

const W2 = areaWeights(2);
const LX = new Float64Array(3), LY = new Float64Array(3);
const xsOf = (s: QuadraticSegment) => [s.x0, s.x1, s.x2];
const ysOf = (s: QuadraticSegment) => [s.y0, s.y1, s.y2];
const fromPoints = (x: number[], y: number[]): QuadraticSegment => ({ kind: 'quadratic', x0: x[0], y0: y[0], x1: x[1], y1: y[1], x2: x[2], y2: y[2] });

function mapped(s: QuadraticSegment, m: Affine): QuadraticSegment {
  const [x0, y0] = applyAffine(m, s.x0, s.y0), [x1, y1] = applyAffine(m, s.x1, s.y1), [x2, y2] = applyAffine(m, s.x2, s.y2);
  return { kind: 'quadratic', x0, y0, x1, y1, x2, y2 };
}

export const quadraticOps: SegmentOps<QuadraticSegment> = {
  kind: 'quadratic',
  straight: false,
  point(s, t, out) {
    const m = 1 - t;
    const a = m * m, b = 2 * m * t, c = t * t;
    out[0] = a * s.x0 + b * s.x1 + c * s.x2;
    out[1] = a * s.y0 + b * s.y1 + c * s.y2;
  },
  derivative(s, t, out) {
    const m = 1 - t;
    out[0] = 2 * (m * (s.x1 - s.x0) + t * (s.x2 - s.x1));
    out[1] = 2 * (m * (s.y1 - s.y0) + t * (s.y2 - s.y1));
  },
  evaluate(s, t, p, d) {
    quadraticOps.point(s, t, p);
    quadraticOps.derivative(s, t, d);
  },
  start(s, out) { quadraticOps.point(s, 0, out); },
  end(s, out) { quadraticOps.point(s, 1, out); },
  reverse: (s) => ({ kind: 'quadratic', x0: s.x2, y0: s.y2, x1: s.x1, y1: s.y1, x2: s.x0, y2: s.y0 }),
  translate: (s, dx, dy) => ({ kind: 'quadratic', x0: s.x0 + dx, y0: s.y0 + dy, x1: s.x1 + dx, y1: s.y1 + dy, x2: s.x2 + dx, y2: s.y2 + dy }),
  sub(s, a, b) {
    const [x, y] = bezierSubCurve(xsOf(s), ysOf(s), a, b);
    return fromPoints(x, y);
  },
  affine: mapped,
  rotate(s, c, sn, _angle, x, y) {
    const m: Affine = [c, sn, -sn, c, x, y];
    return isIdentity(m) ? s : mapped(s, m);
  },
  moveStart: (s, x, y) => ({ ...s, x0: x, y0: y }),
  moveEnd: (s, x, y) => ({ ...s, x2: x, y2: y }),
  length(s) {
    const o: Out2 = [0, 0];
    return adaptiveGaussLegendre((t) => { quadraticOps.derivative(s, t, o); return Math.hypot(o[0], o[1]); }, 0, 1);
  },
  bbox(s) {
    let xMin = Math.min(s.x0, s.x2), xMax = Math.max(s.x0, s.x2);
    let yMin = Math.min(s.y0, s.y2), yMax = Math.max(s.y0, s.y2);
    const p: Out2 = [0, 0];
    const dx = s.x0 - 2 * s.x1 + s.x2, dy = s.y0 - 2 * s.y1 + s.y2;
    for (const t of inOpenUnit([dx !== 0 ? (s.x0 - s.x1) / dx : -1, dy !== 0 ? (s.y0 - s.y1) / dy : -1])) {
      quadraticOps.point(s, t, p);
      xMin = Math.min(xMin, p[0]); xMax = Math.max(xMax, p[0]);
      yMin = Math.min(yMin, p[1]); yMax = Math.max(yMax, p[1]);
    }
    return [xMin, yMin, xMax, yMax];
  },
  moments(s, ox, oy, out) {
    LX[0] = s.x0 - ox; LX[1] = s.x1 - ox; LX[2] = s.x2 - ox;
    LY[0] = s.y0 - oy; LY[1] = s.y1 - oy; LY[2] = s.y2 - oy;
    bezierMoments(LX, LY, out);
  },
  greenNodes(s, ox, oy, degree, visit) {
    LX[0] = s.x0 - ox; LX[1] = s.x1 - ox; LX[2] = s.x2 - ox;
    LY[0] = s.y0 - oy; LY[1] = s.y1 - oy; LY[2] = s.y2 - oy;
    bezierNodes(LX, LY, degree, visit);
  },
  areaTerm: (s) => bezierArea(xsOf(s), ysOf(s), W2),
  // The derivative runs along a straight segment in vector space, so its direction turns monotonically:
  // the turning is the angle between the end derivatives (π when the segment passes through zero).
  turning(s, ta, tb) {
    const a: Out2 = [0, 0], b: Out2 = [0, 0];
    quadraticOps.derivative(s, ta, a);
    quadraticOps.derivative(s, tb, b);
    const cr = a[0] * b[1] - a[1] * b[0], dt = a[0] * b[0] + a[1] * b[1];
    const scale = Math.hypot(a[0], a[1]) * Math.hypot(b[0], b[1]);
    if (scale === 0) return 0; // a zero derivative at an end of a straight quadratic: direction constant
    if (Math.abs(cr) <= 1e-15 * scale && dt < 0) return Math.PI * (1 + MARGIN);
    return angleBetween(a[0], a[1], b[0], b[1]) * (1 + MARGIN);
  },
  deviation(s, ta, tb) {
    const [px, py] = bezierSubCurve(xsOf(s), ysOf(s), ta, tb);
    return bezierDeviation(px, py);
  },
  yTurns(s) {
    const dy = s.y0 - 2 * s.y1 + s.y2;
    return dy !== 0 ? inOpenUnit([(s.y0 - s.y1) / dy]) : [];
  },
  crossingX: (s, ta, tb, y) => bisectCrossingX(quadraticOps.point, s, ta, tb, y),
  crossings: { line: (a, b: LineSegment, tol: number) => bezierLineCrossings(xsOf(a), ysOf(a), quadraticOps.point, a, b, tol) },
  pathCommands: (s, t0, t1) => [bezierCommand(xsOf(s), ysOf(s), t0, t1)],
};
