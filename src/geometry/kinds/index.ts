/**
 * The segment kinds and their registry. A segment is plain data (serialisable) with a `kind` tag,
 * parametrised over t in [0, 1]; curves are stored exactly (a circular arc by centre, radius and angles,
 * never as a polyline).
 *
 * Adding a segment kind: write src/geometry/kinds/<kind>.ts with its interface and a `SegmentOps` for it,
 * add the interface to `Segment` and the ops to `OPS` below. Everything else (chording, the curved-triangle
 * map, validation, booleans, nesting, patterns, transforms, fabrication figures, drawing) works through the
 * operations only; tests/architecture/kinds.test.ts keeps branches on a segment's kind out of the rest of
 * the code (readers that create segments excepted).
 */
import { type ArcSegment, arcOps } from './arc.js';
import { type CubicSegment, cubicOps } from './cubic.js';
import { type EllipticalArcSegment, ellipticalArcOps } from './ellipticalArc.js';
import { type LineSegment, lineOps } from './line.js';
import { type QuadraticSegment, quadraticOps } from './quadratic.js';
import type { Crossing, SegmentOps } from './types.js';

export type { ArcSegment, CubicSegment, EllipticalArcSegment, LineSegment, QuadraticSegment };
export type { Affine, Box, Crossing, Out2, PathCommand } from './types.js';

export type Segment = LineSegment | ArcSegment | EllipticalArcSegment | QuadraticSegment | CubicSegment;
export type SegmentKind = Segment['kind'];

/** The registry: kind → operations. */
export const OPS: { readonly [K in SegmentKind]: SegmentOps<Extract<Segment, { kind: K }>, Segment> } = {
  line: lineOps,
  arc: arcOps,
  ellipticalArc: ellipticalArcOps,
  quadratic: quadraticOps,
  cubic: cubicOps,
};

/** The operations of a segment's kind. */
export function ops(s: Segment): SegmentOps<Segment> {
  // the registry is keyed by kind, so the operations found under s.kind accept s (a narrowing the compiler cannot see)
  return OPS[s.kind] as SegmentOps<Segment>;
}

export function segmentPoint(s: Segment, t: number): [number, number] {
  const out: [number, number] = [0, 0];
  ops(s).point(s, t, out);
  return out;
}

export function segmentStart(s: Segment): [number, number] {
  const out: [number, number] = [0, 0];
  ops(s).start(s, out);
  return out;
}

export function segmentEnd(s: Segment): [number, number] {
  const out: [number, number] = [0, 0];
  ops(s).end(s, out);
  return out;
}

/** Split a segment's parameter range into the fewest equal pieces whose tangent turns at most maxTurn each. */
export function piecesForTurning(s: Segment, maxTurn: number): number {
  const o = ops(s);
  if (o.straight) return 1;
  return Math.max(1, Math.ceil(o.turning(s, 0, 1) / maxTurn - 1e-9));
}

type CrossingFn = (a: Segment, b: Segment, tol: number) => Crossing[];

/**
 * Exact crossings of two segments from a closed form listed by either kind (ta on a, tb on b), or null
 * when neither kind lists one for the other (the caller then subdivides).
 */
export function exactCrossings(a: Segment, b: Segment, tol: number): Crossing[] | null {
  // each table is keyed by the other segment's kind, so the segment passed as `b` has that kind
  const f = ops(a).crossings?.[b.kind] as CrossingFn | undefined;
  if (f) return f(a, b, tol);
  const g = ops(b).crossings?.[a.kind] as CrossingFn | undefined;
  if (g) return g(b, a, tol).map((h) => ({ ...h, ta: h.tb, tb: h.ta }));
  return null;
}

/** Retraced stretch shared by two segments where their kinds have a closed form ([x, y, length]), else undefined. */
export function exactOverlap(s: Segment, t: Segment, tol: number): [number, number, number] | undefined {
  const f = ops(s).overlap?.[t.kind] as ((a: Segment, b: Segment, tol: number) => [number, number, number] | undefined) | undefined;
  return f?.(s, t, tol);
}

/** s followed by t as one segment, where their kinds say how (same line, same circle), else null. */
export function exactMerge(s: Segment, t: Segment, tol: number): Segment | null {
  const f = ops(s).merge?.[t.kind] as ((a: Segment, b: Segment, tol: number) => Segment | null) | undefined;
  return f ? f(s, t, tol) : null;
}

/**
 * A closed contour with every run of segments on one line or one circle merged into one segment, and the
 * seam moved so that the first segment does not continue the last: the same shape drawn with other splits
 * gives the same segments (start points aside).
 */
export function mergedContour(segs: readonly Segment[], tol: number): Segment[] {
  const out: Segment[] = [];
  for (const s of segs) {
    const m = out.length > 0 ? exactMerge(out[out.length - 1], s, tol) : null;
    if (m) out[out.length - 1] = m; else out.push(s);
  }
  while (out.length > 1) {
    const m = exactMerge(out[out.length - 1], out[0], tol);
    if (!m) break;
    out[0] = m;
    out.pop();
  }
  return out;
}
