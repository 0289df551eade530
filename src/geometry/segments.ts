/**
 * Exact boundary segments. A segment is plain data (serialisable), parametrised over t in [0, 1].
 * Curves are stored exactly: a circular arc by centre, radius and start/end angle, never as a polyline.
 *
 * Adding a segment kind: add its interface to `Segment`, write a `SegmentOps` for it and register it
 * in `OPS`. Everything downstream (chording, the curved-triangle map, validation, drawing) works
 * through these operations only.
 */
import {
  type CubicSegment, type EllipticalArcSegment, type QuadraticSegment,
  cubicOps, ellipticalArcOps, quadraticOps,
} from './curves.js';

export type { CubicSegment, EllipticalArcSegment, QuadraticSegment } from './curves.js';

import { angleInSweep } from './angles.js';

export interface LineSegment {
  kind: 'line';
  x0: number; y0: number;
  x1: number; y1: number;
}

/** Circular arc: centre (cx, cy), radius r, from angle a0 to a1 in radians; a1 > a0 runs counter-clockwise. */
export interface ArcSegment {
  kind: 'arc';
  cx: number; cy: number;
  r: number;
  a0: number; a1: number;
}

export type Segment = LineSegment | ArcSegment | EllipticalArcSegment | QuadraticSegment | CubicSegment;
export type SegmentKind = Segment['kind'];

/** Output pair written by point/derivative (no allocation in hot loops). */
export type Out2 = { 0: number; 1: number };

export type Box = [xMin: number, yMin: number, xMax: number, yMax: number];

export interface SegmentOps<S extends Segment = Segment> {
  /** Straight segments are exact as chords and never make a curved triangle. */
  readonly straight: boolean;
  point(s: S, t: number, out: Out2): void;
  /** d(point)/dt. */
  derivative(s: S, t: number, out: Out2): void;
  reverse(s: S): S;
  translate(s: S, dx: number, dy: number): S;
  /** Arc length over [0, 1]. */
  length(s: S): number;
  /** Exact axis-aligned bounding box. */
  bbox(s: S): Box;
  /** ∫ (x dy − y dx) / 2 along the segment: its contribution to the enclosed signed area. */
  areaTerm(s: S): number;
  /** Total turning of the tangent over [t0, t1], radians (non-negative). */
  turning(s: S, t0: number, t1: number): number;
  /** Largest distance between the curve over [t0, t1] and the chord joining its ends. */
  deviation(s: S, t0: number, t1: number): number;
  /** Parameters in (0, 1) at which the y coordinate has an extremum (splits into y-monotone pieces). */
  yTurns(s: S): number[];
}

const lineOps: SegmentOps<LineSegment> = {
  straight: true,
  point(s, t, out) {
    out[0] = s.x0 + (s.x1 - s.x0) * t;
    out[1] = s.y0 + (s.y1 - s.y0) * t;
  },
  derivative(s, _t, out) {
    out[0] = s.x1 - s.x0;
    out[1] = s.y1 - s.y0;
  },
  reverse: (s) => ({ kind: 'line', x0: s.x1, y0: s.y1, x1: s.x0, y1: s.y0 }),
  translate: (s, dx, dy) => ({ kind: 'line', x0: s.x0 + dx, y0: s.y0 + dy, x1: s.x1 + dx, y1: s.y1 + dy }),
  length: (s) => Math.hypot(s.x1 - s.x0, s.y1 - s.y0),
  bbox: (s) => [Math.min(s.x0, s.x1), Math.min(s.y0, s.y1), Math.max(s.x0, s.x1), Math.max(s.y0, s.y1)],
  areaTerm: (s) => (s.x0 * s.y1 - s.x1 * s.y0) / 2,
  turning: () => 0,
  deviation: () => 0,
  yTurns: () => [],
};

const arcOps: SegmentOps<ArcSegment> = {
  straight: false,
  point(s, t, out) {
    const a = s.a0 + (s.a1 - s.a0) * t;
    out[0] = s.cx + s.r * Math.cos(a);
    out[1] = s.cy + s.r * Math.sin(a);
  },
  derivative(s, t, out) {
    const d = s.a1 - s.a0;
    const a = s.a0 + d * t;
    out[0] = -s.r * d * Math.sin(a);
    out[1] = s.r * d * Math.cos(a);
  },
  reverse: (s) => ({ kind: 'arc', cx: s.cx, cy: s.cy, r: s.r, a0: s.a1, a1: s.a0 }),
  translate: (s, dx, dy) => ({ kind: 'arc', cx: s.cx + dx, cy: s.cy + dy, r: s.r, a0: s.a0, a1: s.a1 }),
  length: (s) => s.r * Math.abs(s.a1 - s.a0),
  bbox(s) {
    const p: Out2 = [0, 0];
    arcOps.point(s, 0, p);
    let xMin = p[0], xMax = p[0], yMin = p[1], yMax = p[1];
    arcOps.point(s, 1, p);
    xMin = Math.min(xMin, p[0]); xMax = Math.max(xMax, p[0]);
    yMin = Math.min(yMin, p[1]); yMax = Math.max(yMax, p[1]);
    if (angleInSweep(0, s.a0, s.a1)) xMax = s.cx + s.r;
    if (angleInSweep(Math.PI, s.a0, s.a1)) xMin = s.cx - s.r;
    if (angleInSweep(Math.PI / 2, s.a0, s.a1)) yMax = s.cy + s.r;
    if (angleInSweep(-Math.PI / 2, s.a0, s.a1)) yMin = s.cy - s.r;
    return [xMin, yMin, xMax, yMax];
  },
  // ∫(x dy − y dx)/2 with x = cx + r cos a, y = cy + r sin a:
  // x dy − y dx = (r² + cx r cos a + cy r sin a) da, so the integral is
  // [r² (a1 − a0) + cx r (sin a1 − sin a0) + cy r (cos a0 − cos a1)] / 2.
  areaTerm(s) {
    const { cx, cy, r, a0, a1 } = s;
    return (r * r * (a1 - a0) + cx * r * (Math.sin(a1) - Math.sin(a0)) + cy * r * (Math.cos(a0) - Math.cos(a1))) / 2;
  },
  turning: (s, t0, t1) => Math.abs((s.a1 - s.a0) * (t1 - t0)),
  deviation: (s, t0, t1) => s.r * (1 - Math.cos(Math.abs((s.a1 - s.a0) * (t1 - t0)) / 2)),
  yTurns(s) {
    const out: number[] = [];
    const d = s.a1 - s.a0;
    if (d === 0) return out;
    // extrema of sin(a) at a = π/2 + kπ
    const lo = Math.min(s.a0, s.a1), hi = Math.max(s.a0, s.a1);
    for (let k = Math.ceil((lo - Math.PI / 2) / Math.PI); Math.PI / 2 + k * Math.PI < hi; k++) {
      const a = Math.PI / 2 + k * Math.PI;
      if (a > lo) out.push((a - s.a0) / d);
    }
    return out.sort((a, b) => a - b);
  },
};

export const OPS: { readonly [K in SegmentKind]: SegmentOps<Extract<Segment, { kind: K }>> } = {
  line: lineOps,
  arc: arcOps,
  ellipticalArc: ellipticalArcOps,
  quadratic: quadraticOps,
  cubic: cubicOps,
};

export function ops(s: Segment): SegmentOps {
  return OPS[s.kind] as SegmentOps;
}

export function segmentPoint(s: Segment, t: number): [number, number] {
  const out: [number, number] = [0, 0];
  ops(s).point(s, t, out);
  return out;
}

export function segmentStart(s: Segment): [number, number] {
  return s.kind === 'line' ? [s.x0, s.y0] : segmentPoint(s, 0);
}

export function segmentEnd(s: Segment): [number, number] {
  return s.kind === 'line' ? [s.x1, s.y1] : segmentPoint(s, 1);
}

/** Split a segment's parameter range into the fewest equal pieces whose tangent turns at most maxTurn each. */
export function piecesForTurning(s: Segment, maxTurn: number): number {
  const o = ops(s);
  if (o.straight) return 1;
  return Math.max(1, Math.ceil(o.turning(s, 0, 1) / maxTurn - 1e-9));
}
