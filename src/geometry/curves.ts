/**
 * Curved segment kinds beyond the circular arc: the elliptical arc and the quadratic and cubic
 * Bézier curves. Each implements the SegmentOps contract of segments.ts (parameter t in [0, 1]).
 *
 * Exact where a closed form exists: point, derivative, bbox (derivative roots), areaTerm (closed form
 * for the ellipse, polynomial for the Béziers), yTurns, turning and deviation of the elliptical arc and of
 * the quadratic. Numerical with a margin that never understates: length (adaptive Gauss–Legendre to
 * about 1e-14 relative), the cubic's turning (exact between inflections, sampled within).
 *
 * Only type imports from segments.ts here, so there is no runtime import cycle.
 */
import { angleInSweep } from './angles.js';
import type { Out2, SegmentOps } from './segments.js';

/**
 * Elliptical arc in parametric form p(θ) = c + R(phi)·(rx cos θ, ry sin θ), θ running from t0 to t1
 * (radians; t1 > t0 runs counter-clockwise when rx, ry > 0). Not restricted to rx ≥ ry.
 */
export interface EllipticalArcSegment {
  kind: 'ellipticalArc';
  cx: number; cy: number;
  rx: number; ry: number;
  phi: number;
  t0: number; t1: number;
}

/** Quadratic Bézier curve with control points P0 (start), P1, P2 (end). */
export interface QuadraticSegment {
  kind: 'quadratic';
  x0: number; y0: number;
  x1: number; y1: number;
  x2: number; y2: number;
}

/** Cubic Bézier curve with control points P0 (start), P1, P2, P3 (end). */
export interface CubicSegment {
  kind: 'cubic';
  x0: number; y0: number;
  x1: number; y1: number;
  x2: number; y2: number;
  x3: number; y3: number;
}

/** Relative safety margin added to the numerical bounds (turning, deviation). */
const MARGIN = 1e-12;

// ---------------------------------------------------------------------------------------------
// Gauss–Legendre nodes and adaptive integration (for arc length)

function gaussLegendre(n: number): { x: Float64Array; w: Float64Array } {
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let z = Math.cos(Math.PI * (i + 0.75) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1, p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1; p1 = p2;
      }
      dp = n * (z * p1 - p0) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x[i] = z;
    w[i] = 2 / ((1 - z * z) * dp * dp);
  }
  return { x, w };
}

const GL = gaussLegendre(20);

function glOn(f: (t: number) => number, a: number, b: number): number {
  const h = (b - a) / 2, m = (a + b) / 2;
  let s = 0;
  for (let i = 0; i < GL.x.length; i++) s += GL.w[i] * f(m + h * GL.x[i]);
  return s * h;
}

/**
 * Adaptive 20-point Gauss–Legendre: an interval is accepted when its estimate and the sum over its halves
 * agree to relTol of the whole integral. Iterative (explicit stack), at most 4000 intervals.
 */
export function integrateAdaptive(f: (t: number) => number, a: number, b: number, relTol = 1e-14): number {
  const whole = glOn(f, a, b);
  const stack: [number, number, number, number][] = [[a, b, whole, 0]];
  let total = 0, comp = 0;
  let scale = Math.abs(whole);
  let count = 0;
  while (stack.length > 0) {
    const [lo, hi, est, depth] = stack.pop()!;
    const mid = (lo + hi) / 2;
    const left = glOn(f, lo, mid), right = glOn(f, mid, hi);
    const refined = left + right;
    scale = Math.max(scale, Math.abs(refined));
    count++;
    if (Math.abs(refined - est) <= relTol * scale || depth >= 40 || count > 4000) {
      const t = total + refined; // Neumaier
      comp += Math.abs(total) >= Math.abs(refined) ? (total - t) + refined : (refined - t) + total;
      total = t;
    } else {
      stack.push([lo, mid, left, depth + 1], [mid, hi, right, depth + 1]);
    }
  }
  return total + comp;
}

// ---------------------------------------------------------------------------------------------
// small helpers

/** Real roots of a t² + b t + c (a may be 0), using the cancellation-free form. */
export function quadraticRoots(a: number, b: number, c: number): number[] {
  const scale = Math.max(Math.abs(a), Math.abs(b), Math.abs(c));
  if (scale === 0) return [];
  if (Math.abs(a) <= 1e-14 * scale) {
    return b !== 0 ? [-c / b] : [];
  }
  const disc = b * b - 4 * a * c;
  if (disc < 0) {
    // a tangential double root can come out slightly negative by round-off
    if (disc > -1e-14 * b * b) return [-b / (2 * a)];
    return [];
  }
  const sq = Math.sqrt(disc);
  const q = -0.5 * (b + (b >= 0 ? sq : -sq));
  const r1 = q / a;
  const r2 = q !== 0 ? c / q : r1;
  return r1 <= r2 ? [r1, r2] : [r2, r1];
}

function inOpenUnit(ts: number[]): number[] {
  return ts.filter((t) => t > 0 && t < 1).sort((p, q) => p - q);
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

// ---------------------------------------------------------------------------------------------
// elliptical arc

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

export const ellipticalArcOps: SegmentOps<EllipticalArcSegment> = {
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
  reverse: (s) => ({ ...s, t0: s.t1, t1: s.t0 }),
  translate: (s, dx, dy) => ({ ...s, cx: s.cx + dx, cy: s.cy + dy }),
  length(s) {
    const d = Math.abs(s.t1 - s.t0);
    if (s.rx === s.ry) return Math.abs(s.rx) * d;
    const a = s.rx, b = s.ry;
    return integrateAdaptive((th) => Math.hypot(a * Math.sin(th), b * Math.cos(th)), Math.min(s.t0, s.t1), Math.max(s.t0, s.t1));
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
};

// ---------------------------------------------------------------------------------------------
// Bézier helpers

function binom(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return r;
}

/** ∫0^1 B_i^m B_k^p dt = C(m,i) C(p,k) / (C(m+p, i+k) (m+p+1)). */
function bernsteinProductIntegral(m: number, i: number, p: number, k: number): number {
  if (i < 0 || i > m || k < 0 || k > p) return 0;
  return (binom(m, i) * binom(p, k)) / (binom(m + p, i + k) * (m + p + 1));
}

/**
 * Antisymmetric weights W[i][j] = ∫ B_i B_j' − B_j B_i' for degree n, so that
 * ∫ q × dq = Σ_{i<j} (q_i × q_j) W[i][j] for a Bézier curve q with control points q_i.
 */
function areaWeights(n: number): number[][] {
  const w = (i: number, j: number) => n * (bernsteinProductIntegral(n, i, n - 1, j - 1) - bernsteinProductIntegral(n, i, n - 1, j));
  const W: number[][] = [];
  for (let i = 0; i <= n; i++) {
    W.push([]);
    for (let j = 0; j <= n; j++) W[i].push(w(i, j) - w(j, i));
  }
  return W;
}

const W2 = areaWeights(2);
const W3 = areaWeights(3);

function bezierArea(xs: readonly number[], ys: readonly number[], W: number[][]): number {
  // about P0 to keep digits for drawings far from the origin; P0 × Pn accounts for the shift
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

/** Control points of the piece of a Bézier curve over [ta, tb] (de Casteljau). */
export function bezierSubCurve(xs: readonly number[], ys: readonly number[], ta: number, tb: number): [number[], number[]] {
  const split = (px: number[], py: number[], t: number, keepLeft: boolean): [number[], number[]] => {
    const n = px.length - 1;
    const lx: number[] = [], ly: number[] = [], rx: number[] = [], ry: number[] = [];
    const cx = px.slice(), cy = py.slice();
    for (let r = 0; r <= n; r++) {
      lx.push(cx[0]); ly.push(cy[0]);
      rx.push(cx[n - r]); ry.push(cy[n - r]);
      for (let i = 0; i < n - r; i++) {
        cx[i] = cx[i] + (cx[i + 1] - cx[i]) * t;
        cy[i] = cy[i] + (cy[i + 1] - cy[i]) * t;
      }
    }
    return keepLeft ? [lx, ly] : [rx.reverse(), ry.reverse()];
  };
  let px = xs.slice(), py = ys.slice();
  if (tb < 1) [px, py] = split(px, py, tb, true);
  if (ta > 0) [px, py] = split(px, py, tb > 0 ? ta / tb : 0, false);
  return [px, py];
}

/** Largest distance of a Bézier curve (control points) from its chord; exact when the hull projects onto the chord. */
function bezierDeviation(qx: number[], qy: number[]): number {
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
        const b = binom(n, i) * u ** i * (1 - u) ** (n - i);
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

const angleBetween = (ax: number, ay: number, bx: number, by: number) => Math.abs(Math.atan2(ax * by - ay * bx, ax * bx + ay * by));

// ---------------------------------------------------------------------------------------------
// quadratic Bézier

const qxs = (s: QuadraticSegment) => [s.x0, s.x1, s.x2];
const qys = (s: QuadraticSegment) => [s.y0, s.y1, s.y2];

export const quadraticOps: SegmentOps<QuadraticSegment> = {
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
  reverse: (s) => ({ kind: 'quadratic', x0: s.x2, y0: s.y2, x1: s.x1, y1: s.y1, x2: s.x0, y2: s.y0 }),
  translate: (s, dx, dy) => ({ kind: 'quadratic', x0: s.x0 + dx, y0: s.y0 + dy, x1: s.x1 + dx, y1: s.y1 + dy, x2: s.x2 + dx, y2: s.y2 + dy }),
  length(s) {
    const o: Out2 = [0, 0];
    return integrateAdaptive((t) => { quadraticOps.derivative(s, t, o); return Math.hypot(o[0], o[1]); }, 0, 1);
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
  areaTerm: (s) => bezierArea(qxs(s), qys(s), W2),
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
    const [px, py] = bezierSubCurve(qxs(s), qys(s), ta, tb);
    return bezierDeviation(px, py);
  },
  yTurns(s) {
    const dy = s.y0 - 2 * s.y1 + s.y2;
    return dy !== 0 ? inOpenUnit([(s.y0 - s.y1) / dy]) : [];
  },
};

// ---------------------------------------------------------------------------------------------
// cubic Bézier

const cxs = (s: CubicSegment) => [s.x0, s.x1, s.x2, s.x3];
const cys = (s: CubicSegment) => [s.y0, s.y1, s.y2, s.y3];

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
  reverse: (s) => ({ kind: 'cubic', x0: s.x3, y0: s.y3, x1: s.x2, y1: s.y2, x2: s.x1, y2: s.y1, x3: s.x0, y3: s.y0 }),
  translate: (s, dx, dy) => ({
    kind: 'cubic', x0: s.x0 + dx, y0: s.y0 + dy, x1: s.x1 + dx, y1: s.y1 + dy,
    x2: s.x2 + dx, y2: s.y2 + dy, x3: s.x3 + dx, y3: s.y3 + dy,
  }),
  length(s) {
    const o: Out2 = [0, 0];
    return integrateAdaptive((t) => { cubicOps.derivative(s, t, o); return Math.hypot(o[0], o[1]); }, 0, 1);
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
  areaTerm: (s) => bezierArea(cxs(s), cys(s), W3),
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
    const [px, py] = bezierSubCurve(cxs(s), cys(s), Math.min(ta, tb), Math.max(ta, tb));
    return bezierDeviation(px, py);
  },
  yTurns(s) {
    return inOpenUnit(quadraticRoots(...cubicDerivCoeffs(s.y0, s.y1, s.y2, s.y3)));
  },
};
