/**
 * Fabrication figures of a Part, from its exact boundary (no mesh): cut length, pierces, the axis-aligned
 * bounding box and the minimum-area enclosing rectangle (the blank), and from these the blank mass and the
 * scrap fraction.
 *
 * Everything goes through the segment operations (src/geometry/kinds/), so new segment kinds work:
 * - lengths use `ops.length`;
 * - the support function h(θ) = max over the boundary of ⟨p, (cos θ, sin θ)⟩ is exact for lines (end points)
 *   and circular arcs (end points, plus the circle's support point when its angle lies in the sweep): the
 *   kind's `support` op; any kind without one is handled by `supportByOps`: the parameter range is cut into pieces whose tangent turns
 *   at most 0.2 rad, the derivative ⟨γ′(t), u⟩ is evaluated at the cuts, and every sign change from + to −
 *   (a local maximum of ⟨γ(t), u⟩) is located by bisection to machine precision. A maximum missed inside a
 *   piece (only possible when the derivative changes sign twice in it) is off by at most the piece's
 *   `deviation`, which is tiny for so small a turn.
 *
 * Minimum-area rectangle: the rectangle at angle θ has sides along u = (cos θ, sin θ) and v = (−sin θ, cos θ),
 * width h(θ) + h(θ+π) and height h(θ+π/2) + h(θ+3π/2).
 * - Straight-edged parts: exact rotating calipers over the convex hull of the vertices; an optimal rectangle
 *   has a side collinear with a hull edge (Freeman & Shapira 1975, from memory).
 * - Parts with curves: A(θ) has period π/2. Candidates are the directions of the hull edges of the vertex set,
 *   a scan of 128 angles over [0, π/2), and golden-section refinement of the best local minima of the scan.
 *   The result is then certified by a Lipschitz branch-and-bound: with R the half-diagonal of the bounding
 *   box, every boundary point lies within R of the box centre c, so h (taken about c) is a maximum of
 *   functions ⟨p − c, u(θ)⟩ whose slopes are at most R; hence W and H are 2R-Lipschitz and at most 2R,
 *   and |A(a) − A(b)| ≤ 8R²|a − b|.
 *   On an interval [a, b] A ≥ (A(a)+A(b))/2 − 8R²(b−a)/2. Intervals are split until every lower bound is
 *   within 1e-7 of the best area (relative), or until 60,000 evaluations; the smallest remaining lower bound
 *   is `lowerBound`: no enclosing rectangle at any angle has a smaller area (up to rounding). The reported
 *   rectangle itself is an exact enclosing rectangle; `area − lowerBound` is its optimality gap and is the
 *   error given for blankArea.
 */
import { InputError } from '../base/errors.js';
import type { Part } from '../geometry/part.js';
import { partBox, loopLength } from '../geometry/part.js';
import { type Segment, type Out2, ops } from '../geometry/segments.js';
import { LENGTH_UNITS } from '../base/units.js';
import { FABRICATION_QUANTITIES, type FabricationKey, type Quantity } from './quantities.js';

const EPS = Number.EPSILON;
const TWO_PI = 2 * Math.PI;

// ---------------------------------------------------------------- quantity keys

export { FABRICATION_QUANTITIES };

export type { FabricationKey };

// ---------------------------------------------------------------- support function

/**
 * max over t ∈ [0, 1] of ⟨γ(t), u⟩ using only the segment's operations (see the module comment).
 * Exported so that it can be tested on kinds that also have an exact formula.
 */
export function supportByOps(s: Segment, ux: number, uy: number): number {
  const o = ops(s);
  const turn = o.turning(s, 0, 1);
  const n = Math.max(8, Math.ceil(turn / 0.2));
  const p: Out2 = [0, 0];
  const val = (t: number) => { o.point(s, t, p); return p[0] * ux + p[1] * uy; };
  const der = (t: number) => { o.derivative(s, t, p); return p[0] * ux + p[1] * uy; };
  let best = Math.max(val(0), val(1));
  let gPrev = der(0);
  for (let k = 1; k <= n; k++) {
    const t1 = k / n;
    const g1 = der(t1);
    best = Math.max(best, val(t1));
    if (gPrev > 0 && g1 < 0) {
      let lo = (k - 1) / n, hi = t1;
      for (let it = 0; it < 60 && hi - lo > 4 * EPS; it++) {
        const m = (lo + hi) / 2;
        if (der(m) > 0) lo = m; else hi = m;
      }
      best = Math.max(best, val(lo), val(hi));
    }
    gPrev = g1;
  }
  return best;
}

/** The kind's exact support (lines, arcs) where it has one, else the ops-based one, in the unit direction u. */
export function segmentSupport(s: Segment, ux: number, uy: number): number {
  const o = ops(s);
  return o.support ? o.support(s, ux, uy) : supportByOps(s, ux, uy);
}

// ---------------------------------------------------------------- convex hull

function cross(o: readonly number[], a: readonly number[], b: readonly number[]): number {
  return (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
}

/** Convex hull, counter-clockwise, collinear points dropped (Andrew's monotone chain). */
export function convexHull(points: readonly (readonly [number, number])[]): [number, number][] {
  const pts = points.map((p) => [p[0], p[1]] as [number, number]).sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  const uniq: [number, number][] = [];
  for (const p of pts) {
    const q = uniq[uniq.length - 1];
    if (!q || q[0] !== p[0] || q[1] !== p[1]) uniq.push(p);
  }
  if (uniq.length < 3) return uniq;
  const lower: [number, number][] = [];
  for (const p of uniq) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: [number, number][] = [];
  for (let i = uniq.length - 1; i >= 0; i--) {
    const p = uniq[i];
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], p) <= 0) upper.pop();
    upper.push(p);
  }
  lower.pop();
  upper.pop();
  return lower.concat(upper);
}

// ---------------------------------------------------------------- minimum-area rectangle

export interface MinRectangle {
  /** Direction of the `width` side from +x, degrees, in [0, 180). */
  angle: number;
  /** Longer side. */
  width: number;
  /** Shorter side. */
  height: number;
  area: number;
  /** Counter-clockwise corners. */
  corners: [number, number][];
  /** 'calipers': exact for straight-edged parts; 'certified-scan': parts with curves (see module comment). */
  method: 'calipers' | 'certified-scan';
  /** No enclosing rectangle has a smaller area than this (up to rounding). */
  lowerBound: number;
  /** Support-function evaluations used (4 per angle); 0 for calipers. */
  evaluations: number;
  /**
   * How far (degrees, modulo 90°) the angle of another enclosing rectangle of equal area (calipers: within
   * 1e-12 relative; scan: within the optimality gap) lies from `angle`: 0 when the optimum is unique, 30 for
   * a regular hexagon, 45 for a circle. The blank angle is determined only to within this spread.
   */
  angleSpread: number;
}

interface Outline {
  /** Hull vertices of all segment end points (counter-clockwise). */
  hull: [number, number][];
  /** Curved segments (everything but straight ones). */
  curves: Segment[];
}

function outlineOf(part: Part): Outline {
  const pts: [number, number][] = [];
  const curves: Segment[] = [];
  const p: Out2 = [0, 0];
  for (const r of part.regions) {
    for (const s of r.outer.segments) {
      const o = ops(s);
      o.point(s, 0, p); pts.push([p[0], p[1]]);
      o.point(s, 1, p); pts.push([p[0], p[1]]);
      if (!o.straight) curves.push(s);
    }
  }
  if (pts.length === 0) throw new InputError('part.regions', 'expected at least one region with an outer contour');
  return { hull: convexHull(pts), curves };
}

function support(ol: Outline, ux: number, uy: number): number {
  let m = -Infinity;
  for (const q of ol.hull) m = Math.max(m, q[0] * ux + q[1] * uy);
  for (const s of ol.curves) m = Math.max(m, segmentSupport(s, ux, uy));
  return m;
}

interface Extents { uMin: number; uMax: number; vMin: number; vMax: number }

function extentsAt(ol: Outline, th: number): Extents {
  const c = Math.cos(th), s = Math.sin(th);
  return { uMax: support(ol, c, s), uMin: -support(ol, -c, -s), vMax: support(ol, -s, c), vMin: -support(ol, s, -c) };
}

function rectangleFrom(
  th: number, e: Extents, method: MinRectangle['method'], lowerBound: number, evaluations: number, angleSpread: number,
): MinRectangle {
  const c = Math.cos(th), s = Math.sin(th);
  const at = (a: number, b: number): [number, number] => [a * c - b * s, a * s + b * c];
  const corners = [at(e.uMin, e.vMin), at(e.uMax, e.vMin), at(e.uMax, e.vMax), at(e.uMin, e.vMax)];
  const wu = e.uMax - e.uMin, hv = e.vMax - e.vMin;
  let deg = th * 180 / Math.PI;
  let width = wu, height = hv;
  if (hv > wu) { width = hv; height = wu; deg += 90; }
  deg = ((deg % 180) + 180) % 180;
  if (deg >= 180 - 1e-12) deg = 0;
  return { angle: deg, width, height, area: wu * hv, corners, method, lowerBound, evaluations, angleSpread };
}

/** Distance between two rectangle angles (radians) modulo π/2. */
function dist90(a: number, b: number): number {
  return offAxis(a - b);
}

/** Angle closeness to the axes, for choosing among equal-area rectangles (prefer axis-aligned). */
function offAxis(th: number): number {
  const m = ((th % (Math.PI / 2)) + Math.PI / 2) % (Math.PI / 2);
  return Math.min(m, Math.PI / 2 - m);
}

/** Exact minimum-area rectangle of a convex polygon (counter-clockwise, no collinear points) by rotating calipers. */
export function minRectangleOfHull(hull: readonly [number, number][]): { theta: number; ext: Extents; spread: number } {
  const n = hull.length;
  if (n === 0) throw new InputError('part', 'expected a contour with points');
  if (n < 3) {
    // degenerate (all points collinear): a zero-height rectangle along the segment
    const [a, b] = [hull[0], hull[n - 1]];
    const th = Math.atan2(b[1] - a[1], b[0] - a[0]);
    const c = Math.cos(th), s = Math.sin(th);
    const us = hull.map((p) => p[0] * c + p[1] * s), vs = hull.map((p) => -p[0] * s + p[1] * c);
    return { theta: th, ext: { uMin: Math.min(...us), uMax: Math.max(...us), vMin: Math.min(...vs), vMax: Math.max(...vs) }, spread: 0 };
  }
  const dot = (k: number, x: number, y: number) => hull[k % n][0] * x + hull[k % n][1] * y;
  let best: { theta: number; ext: Extents; area: number } | null = null;
  const seen: [number, number][] = []; // [angle, area] of every edge
  let iU = 0, iL = 0, iV = 0; // pointers: max along u, min along u, max along v
  for (let i = 0; i < n; i++) {
    const a = hull[i], b = hull[(i + 1) % n];
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    const ux = (b[0] - a[0]) / len, uy = (b[1] - a[1]) / len;
    const vx = -uy, vy = ux; // inward normal (hull is counter-clockwise)
    if (i === 0) {
      for (let k = 0; k < n; k++) {
        if (dot(k, ux, uy) > dot(iU, ux, uy)) iU = k;
        if (dot(k, ux, uy) < dot(iL, ux, uy)) iL = k;
        if (dot(k, vx, vy) > dot(iV, vx, vy)) iV = k;
      }
    } else {
      for (let g = 0; g < n && dot(iU + 1, ux, uy) >= dot(iU, ux, uy); g++) iU = (iU + 1) % n;
      for (let g = 0; g < n && dot(iV + 1, vx, vy) >= dot(iV, vx, vy); g++) iV = (iV + 1) % n;
      for (let g = 0; g < n && dot(iL + 1, ux, uy) <= dot(iL, ux, uy); g++) iL = (iL + 1) % n;
    }
    const ext: Extents = {
      uMin: dot(iL, ux, uy), uMax: dot(iU, ux, uy),
      vMin: a[0] * vx + a[1] * vy, vMax: dot(iV, vx, vy),
    };
    const area = (ext.uMax - ext.uMin) * (ext.vMax - ext.vMin);
    const th = Math.atan2(uy, ux);
    seen.push([th, area]);
    if (!best || area < best.area * (1 - 1e-12) ||
        (area <= best.area * (1 + 1e-12) && offAxis(th) < offAxis(best.theta) - 1e-12)) {
      best = { theta: th, ext, area };
    }
  }
  let spread = 0;
  for (const [th, a] of seen) if (a <= best!.area * (1 + 1e-12)) spread = Math.max(spread, dist90(th, best!.theta));
  return { theta: best!.theta, ext: best!.ext, spread };
}

const SCAN = 128;
const CERT_TOL = 1e-7;
const MAX_EVALS = 60000;

/** The minimum-area enclosing rectangle of a part (see the module comment for the method and its accuracy). */
export function minAreaRectangle(part: Part): MinRectangle {
  const ol = outlineOf(part);
  if (ol.curves.length === 0) {
    const { theta, ext, spread } = minRectangleOfHull(ol.hull);
    const r = rectangleFrom(theta, ext, 'calipers', 0, 0, spread * 180 / Math.PI);
    r.lowerBound = r.area;
    return r;
  }
  let evals = 0;
  const tried: [number, number][] = []; // [angle, area] of every evaluation
  const area = (th: number) => {
    evals++;
    const e = extentsAt(ol, th);
    const a = (e.uMax - e.uMin) * (e.vMax - e.vMin);
    tried.push([th, a]);
    return a;
  };
  const Q = Math.PI / 2;
  let bestTh = 0, bestA = area(0);
  const consider = (th: number, a: number) => {
    if (a < bestA * (1 - 1e-12) || (a <= bestA * (1 + 1e-12) && offAxis(th) < offAxis(bestTh) - 1e-12)) {
      bestA = a; bestTh = th;
    }
  };
  // candidates: hull edge directions of the vertex set
  const h = ol.hull;
  for (let i = 0; i < h.length; i++) {
    const a = h[i], b = h[(i + 1) % h.length];
    const th = ((Math.atan2(b[1] - a[1], b[0] - a[0]) % Q) + Q) % Q;
    consider(th, area(th));
  }
  // scan
  const grid: number[] = [];
  for (let k = 0; k <= SCAN; k++) grid.push(k === SCAN ? grid[0] : area(k * Q / SCAN));
  for (let k = 0; k < SCAN; k++) consider(k * Q / SCAN, grid[k]);
  // golden-section refinement of the best local minima
  const mins: number[] = [];
  for (let k = 0; k < SCAN; k++) {
    const prev = grid[(k + SCAN - 1) % SCAN], next = grid[k + 1];
    if (grid[k] <= prev && grid[k] <= next) mins.push(k);
  }
  mins.sort((x, y) => grid[x] - grid[y]);
  const gr = (Math.sqrt(5) - 1) / 2;
  for (const k of mins.slice(0, 8)) {
    let lo = (k - 1) * Q / SCAN, hi = (k + 1) * Q / SCAN;
    let x1 = hi - gr * (hi - lo), x2 = lo + gr * (hi - lo);
    let f1 = area(x1), f2 = area(x2);
    while (hi - lo > 1e-12) {
      if (f1 <= f2) { hi = x2; x2 = x1; f2 = f1; x1 = hi - gr * (hi - lo); f1 = area(x1); }
      else { lo = x1; x1 = x2; f1 = f2; x2 = lo + gr * (hi - lo); f2 = area(x2); }
    }
    consider(((x1 % Q) + Q) % Q, f1);
    consider(((x2 % Q) + Q) % Q, f2);
  }
  // certification by Lipschitz branch-and-bound
  const box = partBox(part);
  const R = Math.hypot(box[2] - box[0], box[3] - box[1]) / 2;
  const L = 8 * R * R;
  let live: [number, number, number, number][] = []; // [a, b, A(a), A(b)]
  for (let k = 0; k < SCAN; k++) live.push([k * Q / SCAN, (k + 1) * Q / SCAN, grid[k], grid[k + 1]]);
  const lb = (iv: [number, number, number, number]) => (iv[2] + iv[3]) / 2 - L * (iv[1] - iv[0]) / 2;
  for (;;) {
    live = live.filter((iv) => lb(iv) < bestA * (1 - CERT_TOL));
    if (live.length === 0 || evals + live.length > MAX_EVALS) break;
    const next: [number, number, number, number][] = [];
    for (const iv of live) {
      const m = (iv[0] + iv[1]) / 2;
      const fm = area(m);
      consider(m, fm);
      next.push([iv[0], m, iv[2], fm], [m, iv[1], fm, iv[3]]);
    }
    live = next;
  }
  let lower = bestA * (1 - CERT_TOL);
  for (const iv of live) lower = Math.min(lower, lb(iv));
  const near = bestA + Math.max(bestA - lower, 0) + 1e-12 * bestA;
  let spread = 0;
  for (const [th, a] of tried) if (a <= near) spread = Math.max(spread, dist90(th, bestTh));
  return rectangleFrom(bestTh, extentsAt(ol, bestTh), 'certified-scan', Math.max(0, lower), evals, spread * 180 / Math.PI);
}

// ---------------------------------------------------------------- figures

export interface FabricationOptions {
  /** Net area of the part in the part's units² (from the section computation), with its error. */
  area: Quantity;
  /** Plate thickness in the part's length unit. */
  thickness?: number;
  /** Density in kg/m³. */
  density?: number;
}

export interface FabricationFigures {
  quantities: Partial<Record<FabricationKey, Quantity>> & Record<Exclude<FabricationKey, 'netMass' | 'blankMass'>, Quantity>;
  /** Axis-aligned bounding rectangle of the material. */
  box: { xMin: number; yMin: number; xMax: number; yMax: number; width: number; height: number };
  blank: MinRectangle;
  /** 'mass' whenever a mass is given (masses are for planning only); the output layer words the caution. */
  caution?: 'mass';
}


function roundoff(v: number, terms: number): number {
  return 4 * EPS * Math.abs(v) * Math.max(1, terms);
}

export function fabricationFigures(part: Part, options: FabricationOptions): FabricationFigures {
  const { area } = options;
  if (!(Number.isFinite(area.value) && area.value > 0)) {
    throw new InputError('area', `expected the part's positive net area, got ${area.value}`);
  }
  if (options.thickness !== undefined && !(Number.isFinite(options.thickness) && options.thickness > 0)) {
    throw new InputError('thickness', `expected a positive number, got ${options.thickness}`);
  }
  if (options.density !== undefined && !(Number.isFinite(options.density) && options.density > 0)) {
    throw new InputError('density', `expected a positive number in kg/m³, got ${options.density}`);
  }
  let outer = 0, inner = 0, contours = 0, nSeg = 0;
  for (const r of part.regions) {
    outer += loopLength(r.outer);
    nSeg += r.outer.segments.length;
    contours++;
    for (const hl of r.holes) {
      inner += loopLength(hl);
      nSeg += hl.segments.length;
      contours++;
    }
  }
  const b = partBox(part);
  const blank = minAreaRectangle(part);
  const total = outer + inner;
  const gap = Math.max(0, blank.area - blank.lowerBound);
  const blankAreaErr = gap + roundoff(blank.area, 8);
  const scrap = 1 - area.value / blank.area;
  // d(scrap) = dA/B + A dB/B²
  const scrapErr = area.error / blank.area + area.value * blankAreaErr / (blank.area * blank.area) + roundoff(1, 4);
  const quantities: FabricationFigures['quantities'] = {
    cutLength: { value: total, error: roundoff(total, nSeg) },
    cutLengthOuter: { value: outer, error: roundoff(outer, nSeg) },
    cutLengthInner: { value: inner, error: roundoff(inner, nSeg) },
    pierces: { value: contours, error: 0 },
    blankWidth: { value: blank.width, error: roundoff(blank.width, 8) },
    blankHeight: { value: blank.height, error: roundoff(blank.height, 8) },
    // the angle of an equal-area rectangle may differ (circle, regular polygons): that spread is its error
    blankAngle: { value: blank.angle, error: blank.angleSpread + 1e-9 },
    blankArea: { value: blank.area, error: blankAreaErr },
    scrapFraction: { value: scrap, error: scrapErr },
  };
  let caution: 'mass' | undefined;
  if (options.thickness !== undefined && options.density !== undefined) {
    const toM = LENGTH_UNITS[part.units];
    const k = options.thickness * options.density * toM * toM * toM; // kg per (part unit)² of area
    quantities.netMass = { value: area.value * k, error: area.error * k + roundoff(area.value * k, 4) };
    quantities.blankMass = { value: blank.area * k, error: blankAreaErr * k + roundoff(blank.area * k, 4) };
    caution = 'mass';
  }
  return {
    quantities,
    box: { xMin: b[0], yMin: b[1], xMax: b[2], yMax: b[3], width: b[2] - b[0], height: b[3] - b[1] },
    blank,
    caution,
  };
}
