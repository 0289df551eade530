/**
 * Nesting of closed contours: which loop lies inside which, decided by exact point-in-loop tests on the
 * curves themselves (no chords). Used by the drawing interpretation, where every closed cut contour is a cut
 * line: a contour inside another is a cut-out, a contour inside a cut-out is a new piece of material.
 *
 * The loops are assumed not to cross or touch each other (the interpretation refuses or unites crossing
 * contours first), so one point on a loop decides whether it lies inside another.
 *
 * No quadratic step: candidate pairs come from the box grid (src/geometry/boxgrid.ts; only pairs whose boxes
 * overlap), and each loop is prepared once (y-monotone pieces, and for long loops a band index over y so that
 * a point test looks only at the pieces of its band); prepared loops are cached per Loop object.
 */
import { overlappingPairs } from './boxgrid.js';
import type { Loop, Region } from './part.js';
import { loopBox, loopSignedArea } from './part.js';
import { type Box, type Segment, ops, segmentPoint, segmentStart } from './segments.js';

interface Piece { s: Segment; ta: number; tb: number; ya: number; yb: number; xMax: number }

interface Prepared {
  loop: Loop;
  box: Box;
  area: number;
  /** y-monotone pieces: segment, parameter range and end heights. */
  pieces: Piece[];
  /** For long loops: pieces by horizontal band (band k covers y0 + k·h … y0 + (k+1)·h). */
  bands?: { y0: number; h: number; items: Piece[][] };
}

/** Loops with more pieces than this get a band index. */
const BAND_THRESHOLD = 32;

const cache = new WeakMap<Loop, Prepared>();

/** The prepared form of a loop, computed once per Loop object. */
function prepared(loop: Loop): Prepared {
  let p = cache.get(loop);
  if (!p) { p = prepare(loop); cache.set(loop, p); }
  return p;
}

function prepare(loop: Loop): Prepared {
  const pieces: Prepared['pieces'] = [];
  const segs = loop.segments;
  for (let i = 0; i < segs.length; i++) {
    const s = segs[i];
    const o = ops(s);
    const cuts = [0, ...o.yTurns(s), 1];
    const xMax = o.bbox(s)[2];
    // one height per vertex: a segment ends at the height the next one starts at. An arc's end computed from
    // its angle can differ from the next line's exact start in the last bit, and the half-open rule below
    // then counts that vertex twice or never (a ray through it gave the wrong side)
    const yEnd = segmentStart(segs[(i + 1) % segs.length])[1];
    for (let k = 0; k + 1 < cuts.length; k++) {
      const ta = cuts[k], tb = cuts[k + 1];
      const ya = ta === 0 ? segmentStart(s)[1] : segmentPoint(s, ta)[1];
      const yb = tb === 1 ? yEnd : segmentPoint(s, tb)[1];
      pieces.push({ s, ta, tb, ya, yb, xMax });
    }
  }
  const box = loopBox(loop);
  const out: Prepared = { loop, box, area: Math.abs(loopSignedArea(loop)), pieces };
  if (pieces.length > BAND_THRESHOLD && box[3] > box[1]) {
    const nb = Math.min(65536, Math.ceil(pieces.length / 4));
    const h = (box[3] - box[1]) / nb;
    const items: Piece[][] = Array.from({ length: nb }, () => []);
    const band = (y: number) => Math.min(nb - 1, Math.max(0, Math.floor((y - box[1]) / h)));
    for (const q of pieces) {
      const a = band(Math.min(q.ya, q.yb)), b = band(Math.max(q.ya, q.yb));
      for (let k = a; k <= b; k++) items[k].push(q);
    }
    out.bands = { y0: box[1], h, items };
  }
  return out;
}

function insidePrepared(x: number, y: number, P: Prepared): boolean {
  const [x0, y0, x1, y1] = P.box;
  if (x < x0 || x > x1 || y < y0 || y > y1) return false;
  let inside = false;
  const list = P.bands ? P.bands.items[Math.min(P.bands.items.length - 1, Math.max(0, Math.floor((y - P.bands.y0) / P.bands.h)))] : P.pieces;
  for (const q of list) {
    // half-open rule: a piece counts when y lies in [min, max) of its end heights
    const crosses = (q.ya <= y && y < q.yb) || (q.yb <= y && y < q.ya);
    if (!crosses || q.xMax < x) continue;
    if (ops(q.s).crossingX(q.s, q.ta, q.tb, y) > x) inside = !inside;
  }
  return inside;
}

/** Is the point strictly inside the loop (even–odd rule, exact curve crossings)? Points on the boundary give either answer. */
export function pointInLoop(x: number, y: number, loop: Loop): boolean {
  return insidePrepared(x, y, prepared(loop));
}

/** A point on the loop (the middle of its first segment): the probe for containment of non-touching loops. */
export function loopProbe(loop: Loop): [number, number] {
  return segmentPoint(loop.segments[0], 0.5);
}

export interface Nesting {
  /** Index of the smallest loop around each loop, or −1. */
  parent: Int32Array;
  /** Number of loops around each loop. */
  depth: Int32Array;
}

/**
 * Which loop lies inside which, for closed loops that do not cross or touch. Pairs `exclude(i, j)` (i < j)
 * are never taken as containing one another (crossing partners under union, say). Near O(n + pairs of
 * overlapping boxes).
 */
export function nestContours(loops: readonly Loop[], exclude?: (i: number, j: number) => boolean): Nesting {
  const n = loops.length;
  // boxes and areas for all; the y-monotone pieces only for loops that some probe is tested against (with
  // 10^5 small holes in one outline, that is the outline alone)
  const P = loops.map((l) => { const c = cache.get(l); return c ?? { box: loopBox(l), area: Math.abs(loopSignedArea(l)) }; });
  const boxes = new Float64Array(4 * n);
  P.forEach((p, i) => boxes.set(p.box, 4 * i));
  const probes = loops.map(loopProbe);
  const parent = new Int32Array(n).fill(-1);
  const depth = new Int32Array(n);
  const inside = (i: number, j: number): boolean => {
    // is loop i inside loop j?
    const bi = P[i].box, bj = P[j].box;
    if (bi[0] < bj[0] || bi[1] < bj[1] || bi[2] > bj[2] || bi[3] > bj[3]) return false;
    if (P[j].area < P[i].area) return false;
    return insidePrepared(probes[i][0], probes[i][1], prepared(loops[j]));
  };
  const found = (i: number, j: number) => {
    depth[i]++;
    if (parent[i] < 0 || P[j].area < P[parent[i]].area) parent[i] = j;
  };
  overlappingPairs(boxes, (i, j) => {
    if (exclude?.(i, j)) return;
    if (inside(i, j)) found(i, j);
    else if (inside(j, i)) found(j, i);
  });
  return { parent, depth };
}

/**
 * For each point, the innermost loop containing it (−1 for none), given the loops' nesting. Points on a
 * loop give either answer.
 */
export function locatePoints(points: readonly (readonly [number, number])[], loops: readonly Loop[], nesting: Nesting): Int32Array {
  const n = loops.length, m = points.length;
  const boxes = new Float64Array(4 * (n + m));
  loops.forEach((l, i) => boxes.set(cache.get(l)?.box ?? loopBox(l), 4 * i));
  points.forEach((q, k) => boxes.set([q[0], q[1], q[0], q[1]], 4 * (n + k)));
  const out = new Int32Array(m).fill(-1);
  overlappingPairs(boxes, (i, j) => {
    if (i >= n || j < n) return; // loop–point pairs only (i < j, loops come first)
    const k = j - n;
    const q = points[k];
    if (!insidePrepared(q[0], q[1], prepared(loops[i]))) return;
    if (out[k] < 0 || nesting.depth[i] > nesting.depth[out[k]]) out[k] = i;
  });
  return out;
}

/**
 * Group closed, mutually non-crossing loops into regions. A loop's depth is the number of loops around it:
 * depth 0, 2, 4... bound material (a region's outer loop), depth 1, 3... are holes of the loop directly
 * around them. Each region is returned as its own group, in the order of the outer loops in the input.
 * Orientation is left as given (see normalizePart).
 */
export function nestLoops(loops: Loop[]): Region[][] {
  const { parent, depth } = nestContours(loops);
  const regionOf = new Map<number, Region>();
  const groups: Region[][] = [];
  loops.forEach((l, i) => {
    if (depth[i] % 2 === 0) {
      const r: Region = { outer: l, holes: [] };
      regionOf.set(i, r);
      groups.push([r]);
    }
  });
  loops.forEach((l, i) => {
    if (depth[i] % 2 === 1) {
      const r = regionOf.get(parent[i]);
      if (r) r.holes.push(l);
      else groups.push([{ outer: l, holes: [] }]);
    }
  });
  return groups;
}
