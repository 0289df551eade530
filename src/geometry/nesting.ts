/**
 * Nesting of closed contours: which loop lies inside which, decided by exact point-in-loop tests on the
 * curves themselves (no chords). Used by the drawing readers, where every closed contour is a cut line:
 * a contour inside another is a cut-out, a contour inside a cut-out is a new piece of material.
 *
 * The loops are assumed not to cross each other (crossing loops are reported by the shared validation).
 */
import type { Loop, Region } from './part.js';
import { loopBox, loopSignedArea } from './part.js';
import { type Box, type Segment, ops, segmentEnd, segmentPoint, segmentStart } from './segments.js';

interface Prepared {
  loop: Loop;
  box: Box;
  area: number;
  /** y-monotone pieces: segment, parameter range and end heights. */
  pieces: { s: Segment; ta: number; tb: number; ya: number; yb: number; xMax: number }[];
}

function prepare(loop: Loop): Prepared {
  const pieces: Prepared['pieces'] = [];
  for (const s of loop.segments) {
    const o = ops(s);
    const cuts = [0, ...o.yTurns(s), 1];
    const xMax = o.bbox(s)[2];
    for (let k = 0; k + 1 < cuts.length; k++) {
      const ta = cuts[k], tb = cuts[k + 1];
      const ya = ta === 0 ? segmentStart(s)[1] : segmentPoint(s, ta)[1];
      const yb = tb === 1 ? segmentEnd(s)[1] : segmentPoint(s, tb)[1];
      pieces.push({ s, ta, tb, ya, yb, xMax });
    }
  }
  return { loop, box: loopBox(loop), area: Math.abs(loopSignedArea(loop)), pieces };
}

function insidePrepared(x: number, y: number, P: Prepared): boolean {
  const [x0, y0, x1, y1] = P.box;
  if (x < x0 || x > x1 || y < y0 || y > y1) return false;
  let inside = false;
  for (const q of P.pieces) {
    // half-open rule: a piece counts when y lies in [min, max) of its end heights
    const crosses = (q.ya <= y && y < q.yb) || (q.yb <= y && y < q.ya);
    if (!crosses || q.xMax < x) continue;
    if (ops(q.s).crossingX(q.s, q.ta, q.tb, y) > x) inside = !inside;
  }
  return inside;
}

/** Is the point strictly inside the loop (even–odd rule, exact curve crossings)? Points on the boundary give either answer. */
export function pointInLoop(x: number, y: number, loop: Loop): boolean {
  return insidePrepared(x, y, prepare(loop));
}

/** Test points on a loop: midpoints of up to three of its segments. */
function samplePoints(loop: Loop): [number, number][] {
  const n = loop.segments.length;
  const idx = n <= 3 ? [...Array(n).keys()] : [0, Math.floor(n / 3), Math.floor((2 * n) / 3)];
  return idx.map((i) => segmentPoint(loop.segments[i], 0.5));
}

/**
 * Group closed, mutually non-crossing loops into regions and parts. A loop's depth is the number of loops
 * around it: depth 0, 2, 4... bound material (a region's outer loop), depth 1, 3... are holes of the loop
 * directly around them. Each region is returned as its own group (one piece of material = one part),
 * in the order of the outer loops in the input. Orientation is left as given (see normalizePart).
 */
export function nestLoops(loops: Loop[]): Region[][] {
  const P = loops.map(prepare);
  const n = P.length;
  const parent = new Array<number>(n).fill(-1);
  const depth = new Array<number>(n).fill(0);
  const samples = loops.map(samplePoints);
  for (let i = 0; i < n; i++) {
    let best = -1;
    for (let j = 0; j < n; j++) {
      if (i === j || P[j].area < P[i].area || (P[j].area === P[i].area && j > i)) continue;
      const bj = P[j].box, bi = P[i].box;
      if (bi[0] < bj[0] || bi[1] < bj[1] || bi[2] > bj[2] || bi[3] > bj[3]) continue;
      let votes = 0;
      for (const [x, y] of samples[i]) if (insidePrepared(x, y, P[j])) votes++;
      if (2 * votes > samples[i].length) {
        depth[i]++;
        if (best < 0 || P[j].area < P[best].area) best = j;
      }
    }
    parent[i] = best;
  }
  const regionOf = new Map<number, Region>();
  const groups: Region[][] = [];
  for (let i = 0; i < n; i++) {
    if (depth[i] % 2 === 0) {
      const r: Region = { outer: loops[i], holes: [] };
      regionOf.set(i, r);
      groups.push([r]);
    }
  }
  for (let i = 0; i < n; i++) {
    if (depth[i] % 2 === 1) {
      const r = regionOf.get(parent[i]);
      if (r) r.holes.push(loops[i]);
      else groups.push([{ outer: loops[i], holes: [] }]); // only when loops cross; validation reports that
    }
  }
  return groups;
}
