/** Straight line segment from (x0, y0) to (x1, y1). */
import { lineMoments, lineNodes } from './moments.js';
import type { Crossing, SegmentOps } from './types.js';

export interface LineSegment {
  kind: 'line';
  x0: number; y0: number;
  x1: number; y1: number;
}

/**
 * Crossings of two lines within `tol` (parallel lines touch only when collinear within tol and
 * overlapping; then the middle of the overlap is reported). Also used on chords by the subdivision search.
 */
export function lineLineCrossings(a: LineSegment, b: LineSegment, tol: number): Crossing[] {
  const dx = a.x1 - a.x0, dy = a.y1 - a.y0, ex = b.x1 - b.x0, ey = b.y1 - b.y0;
  const la = Math.hypot(dx, dy), lb = Math.hypot(ex, ey);
  const den = dx * ey - dy * ex;
  const wx = b.x0 - a.x0, wy = b.y0 - a.y0;
  if (Math.abs(den) <= 1e-14 * la * lb) {
    const dist = Math.abs(wx * dy - wy * dx) / la;
    if (dist > tol) return [];
    const t0 = (wx * dx + wy * dy) / (la * la);
    const t1 = ((b.x1 - a.x0) * dx + (b.y1 - a.y0) * dy) / (la * la);
    const lo = Math.max(0, Math.min(t0, t1)), hi = Math.min(1, Math.max(t0, t1));
    if (hi < lo - tol / la) return [];
    const t = (lo + hi) / 2;
    return [{ x: a.x0 + dx * t, y: a.y0 + dy * t, ta: t, tb: 0 }];
  }
  const ta = (wx * ey - wy * ex) / den;
  const tb = (wx * dy - wy * dx) / den;
  const ea = tol / la, eb = tol / lb;
  if (ta < -ea || ta > 1 + ea || tb < -eb || tb > 1 + eb) return [];
  return [{ x: a.x0 + dx * ta, y: a.y0 + dy * ta, ta, tb }];
}

export const lineOps: SegmentOps<LineSegment> = {
  kind: 'line',
  straight: true,
  point(s, t, out) {
    out[0] = s.x0 + (s.x1 - s.x0) * t;
    out[1] = s.y0 + (s.y1 - s.y0) * t;
  },
  derivative(s, _t, out) {
    out[0] = s.x1 - s.x0;
    out[1] = s.y1 - s.y0;
  },
  evaluate(s, t, p, d) {
    lineOps.point(s, t, p);
    lineOps.derivative(s, t, d);
  },
  start(s, out) { out[0] = s.x0; out[1] = s.y0; },
  end(s, out) { out[0] = s.x1; out[1] = s.y1; },
  reverse: (s) => ({ kind: 'line', x0: s.x1, y0: s.y1, x1: s.x0, y1: s.y0 }),
  translate: (s, dx, dy) => ({ kind: 'line', x0: s.x0 + dx, y0: s.y0 + dy, x1: s.x1 + dx, y1: s.y1 + dy }),
  sub(s, a, b) {
    const p: [number, number] = [s.x0, s.y0], q: [number, number] = [s.x1, s.y1];
    if (a !== 0) lineOps.point(s, a, p);
    if (b !== 1) lineOps.point(s, b, q);
    return { kind: 'line', x0: p[0], y0: p[1], x1: q[0], y1: q[1] };
  },
  // no temporaries: drawings map hundreds of thousands of lines through their viewport transform
  affine: (s, m) => ({
    kind: 'line',
    x0: m[0] * s.x0 + m[2] * s.y0 + m[4], y0: m[1] * s.x0 + m[3] * s.y0 + m[5],
    x1: m[0] * s.x1 + m[2] * s.y1 + m[4], y1: m[1] * s.x1 + m[3] * s.y1 + m[5],
  }),
  rotate: (s, c, sn, _angle, x, y) => ({
    kind: 'line', x0: x + c * s.x0 - sn * s.y0, y0: y + sn * s.x0 + c * s.y0, x1: x + c * s.x1 - sn * s.y1, y1: y + sn * s.x1 + c * s.y1,
  }),
  moveStart: (s, x, y) => ({ ...s, x0: x, y0: y }),
  moveEnd: (s, x, y) => ({ ...s, x1: x, y1: y }),
  length: (s) => Math.hypot(s.x1 - s.x0, s.y1 - s.y0),
  bbox: (s) => [Math.min(s.x0, s.x1), Math.min(s.y0, s.y1), Math.max(s.x0, s.x1), Math.max(s.y0, s.y1)],
  moments: (s, ox, oy, out) => lineMoments(s.x0 - ox, s.y0 - oy, s.x1 - ox, s.y1 - oy, out),
  greenNodes: (s, ox, oy, degree, visit) => lineNodes(s.x0 - ox, s.y0 - oy, s.x1 - ox, s.y1 - oy, degree, visit),
  areaTerm: (s) => (s.x0 * s.y1 - s.x1 * s.y0) / 2,
  turning: () => 0,
  deviation: () => 0,
  yTurns: () => [],
  crossingX(s, _ta, _tb, y) {
    const t = (y - s.y0) / (s.y1 - s.y0);
    return s.x0 + (s.x1 - s.x0) * t;
  },
  support: (s, ux, uy) => Math.max(s.x0 * ux + s.y0 * uy, s.x1 * ux + s.y1 * uy),
  crossings: { line: lineLineCrossings },
  overlap: { line: lineOverlap },
  merge: { line: lineMerge },
  pathCommands(s, _t0, t1) {
    const p: [number, number] = [0, 0];
    lineOps.point(s, t1, p);
    return [{ cmd: 'L', args: p }];
  },
};

/** Shared stretch of two collinear lines (within tol): [x, y of its middle, length], or undefined. */
function lineOverlap(s: LineSegment, t: LineSegment, tol: number): [number, number, number] | undefined {
  const dx = s.x1 - s.x0, dy = s.y1 - s.y0, L = Math.hypot(dx, dy);
  if (L === 0) return undefined;
  const ux = dx / L, uy = dy / L;
  const off0 = (t.x0 - s.x0) * -uy + (t.y0 - s.y0) * ux;
  const off1 = (t.x1 - s.x0) * -uy + (t.y1 - s.y0) * ux;
  if (Math.abs(off0) > tol || Math.abs(off1) > tol) return undefined;
  const p0 = (t.x0 - s.x0) * ux + (t.y0 - s.y0) * uy, p1 = (t.x1 - s.x0) * ux + (t.y1 - s.y0) * uy;
  const lo = Math.max(0, Math.min(p0, p1)), hi = Math.min(L, Math.max(p0, p1));
  if (hi - lo <= tol) return undefined;
  const mid = (lo + hi) / 2;
  return [s.x0 + ux * mid, s.y0 + uy * mid, hi - lo];
}

/** a then b as one line, when b continues a straight on (its far end within tol of a's line, same direction). */
function lineMerge(a: LineSegment, b: LineSegment, tol: number): LineSegment | null {
  if (Math.abs(a.x1 - b.x0) > tol || Math.abs(a.y1 - b.y0) > tol) return null;
  const dx = b.x1 - a.x0, dy = b.y1 - a.y0, L = Math.hypot(dx, dy);
  if (!(L > 0)) return null;
  // the joint must lie on the chord from a's start to b's end, and between them
  const off = Math.abs((a.x1 - a.x0) * dy - (a.y1 - a.y0) * dx) / L;
  const along = ((a.x1 - a.x0) * dx + (a.y1 - a.y0) * dy) / L;
  if (off > tol || along <= 0 || along >= L) return null;
  return { kind: 'line', x0: a.x0, y0: a.y0, x1: b.x1, y1: b.y1 };
}
