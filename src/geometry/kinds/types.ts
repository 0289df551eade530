/**
 * The contract every segment kind fulfils (`SegmentOps`) and the small types it speaks in. A segment is
 * plain data (serialisable) with a `kind` tag, parametrised over t in [0, 1]; everything the rest of the
 * code does with a segment goes through its kind's operations (src/geometry/kinds/index.ts holds the
 * registry and the `Segment` union, which this file cannot name without importing every kind file, and
 * every kind file imports this one).
 */

import type { GreenVisitor } from './moments.js';

/** Output pair written by point/derivative (no allocation in hot loops). */
export type Out2 = { 0: number; 1: number };

export type Box = [xMin: number, yMin: number, xMax: number, yMax: number];

/** Affine map [a, b, c, d, e, f]: (x, y) ↦ (a x + c y + e, b x + d y + f), the SVG matrix order. */
export type Affine = [a: number, b: number, c: number, d: number, e: number, f: number];

/** A point where two segments meet: ta on the first, tb on the second. */
export interface Crossing { x: number; y: number; ta: number; tb: number }

/**
 * One exact SVG path command (SVG 1.1, chapter 8), in the part's own coordinates (y up), drawn from where
 * the pen already is. Arc flags keep SVG's meaning in that y-up frame: sweep 1 is the direction of growing
 * angle (counter-clockwise seen with y up); the rotation is in degrees, counter-clockwise. The output layer
 * maps the points and formats the numbers (and flips the sweep and the rotation where its map flips y).
 */
export type PathCommand =
  | { cmd: 'L'; args: [x: number, y: number] }
  | { cmd: 'Q'; args: [x1: number, y1: number, x: number, y: number] }
  | { cmd: 'C'; args: [x1: number, y1: number, x2: number, y2: number, x: number, y: number] }
  | { cmd: 'A'; args: [rx: number, ry: number, rotationDeg: number, largeArc: 0 | 1, sweep: 0 | 1, x: number, y: number] };

/** Largest sweep of one arc command; below π the large-arc flag is always 0. */
export const MAX_ARC_COMMAND_SWEEP = (2 * Math.PI) / 3;

/**
 * Operations of one segment kind S. `Image` is the type of its affine images (a circular arc under a
 * shear becomes an elliptical arc). Ops are exact where a closed form exists; where numerical (length,
 * turning, deviation) they never understate.
 */
export interface SegmentOps<S extends { kind: string }, Image extends { kind: string } = S> {
  readonly kind: S['kind'];
  /** The segment is the straight chord between its ends (exact as a chord; never makes a curved triangle). */
  readonly straight: boolean;

  // ---- evaluation
  point(s: S, t: number, out: Out2): void;
  /** d(point)/dt. */
  derivative(s: S, t: number, out: Out2): void;
  /** point and derivative together (the curved-triangle map's inner loop; a kind may share work). */
  evaluate(s: S, t: number, p: Out2, d: Out2): void;
  /** The exact start and end points (the stored ones where the kind stores them). */
  start(s: S, out: Out2): void;
  end(s: S, out: Out2): void;

  // ---- new segments
  reverse(s: S): S;
  translate(s: S, dx: number, dy: number): S;
  /** The exact piece over [t0, t1], 0 ≤ t0 < t1 ≤ 1, parametrised over [0, 1]; ends at 0 and 1 stay exact. */
  sub(s: S, t0: number, t1: number): S;
  /** Image under an affine map; the traversal follows the points, so a mirror image reverses an arc's sense. */
  affine(s: S, m: Affine): Image;
  /**
   * Turned by an angle about the origin, then moved by (dx, dy), as hole patterns place their copies:
   * cos and sin of the angle are given (exact at multiples of 90°) along with the angle itself in radians.
   */
  rotate(s: S, cos: number, sin: number, angle: number, dx: number, dy: number): Image;
  /**
   * The same segment with its start (end) moved exactly to (x, y), for kinds defined by their end points
   * (lines, Béziers); null for kinds whose ends follow from other data (arcs).
   */
  moveStart(s: S, x: number, y: number): S | null;
  moveEnd(s: S, x: number, y: number): S | null;

  // ---- measures
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
  /** x where the y-monotone piece [ta, tb] meets the horizontal line at height y (y within the piece's range). */
  crossingX(s: S, ta: number, tb: number, y: number): number;
  /** Exact support function max⟨p, u⟩ over the segment for a unit vector u, where a closed form exists. */
  support?(s: S, ux: number, uy: number): number;
  /**
   * Exact crossings with segments of the kinds named (closed forms), keyed by the other segment's kind;
   * the registry passes only segments of that kind as `b` (hence `never` here). Pairs not listed in
   * either kind's table are found by subdivision (src/geometry/validate.ts).
   */
  /**
   * Retraced stretch shared with a segment of the kind named (keyed by the other segment's kind), within tol:
   * [x, y of its middle, length], or undefined. Used to report entities drawn twice over (src/geometry/join.ts).
   */
  /**
   * The one segment that `a` followed by `b` (a's end at b's start) makes, when both lie on one line or one
   * circle and run on in the same direction (within tol), else null. Used to compare contours drawn with
   * different splits (a circle as two arcs or as four).
   */
  readonly merge?: { readonly [otherKind: string]: ((a: S, b: never, tol: number) => S | null) | undefined };
  readonly overlap?: { readonly [otherKind: string]: ((a: S, b: never, tol: number) => [number, number, number] | undefined) | undefined };
  readonly crossings?: { readonly [otherKind: string]: ((a: S, b: never, tol: number) => Crossing[]) | undefined };

  // ---- drawing
  /** Exact SVG commands for the piece from t0 to t1 (either order), starting at the point for t0. */
  pathCommands(s: S, t0: number, t1: number): PathCommand[];

  // ---- boundary moments
  /**
   * Adds ∫ f·(x dy − y dx)/(k + 2) along the segment, for f = 1, x, y, x², xy, y² (k its degree) in local
   * coordinates x = X − ox, y = Y − oy, to out[0..5] — the segment's share of the area, first and second
   * moments of the region its loop bounds (Green's theorem with the polygon formula's field; see
   * kinds/moments.ts) — and bounds on their round-off, in units of ε, to out[6..11]. Exact: closed forms on lines and arcs, Gauss–Legendre of exact order on Béziers.
   */
  moments(s: S, ox: number, oy: number, out: Float64Array): void;
  /**
   * An exact rule for ∫ P(x, y)·(x dy − y dx) along the segment, for every polynomial P of total degree ≤
   * `degree` in local coordinates x = X − ox, y = Y − oy: calls `visit` once per node with the node, its
   * weight and their rounding bounds (kinds/moments.ts, GreenVisitor). Gauss–Legendre of exact order on
   * lines and Béziers, equally spaced samples of the trigonometric polynomial on arcs. The boundary path for
   * polynomial integrands (src/properties/boundaryPolynomial.ts) is built on it.
   */
  greenNodes(s: S, ox: number, oy: number, degree: number, visit: GreenVisitor): void;
}
