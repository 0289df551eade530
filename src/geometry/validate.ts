/**
 * Validation shared by all readers: loops are closed and simple, cut-outs lie strictly inside their
 * outline and apart from each other, regions do not overlap. Problems are InputErrors naming the loop's
 * `where` and the place (coordinates) where it happens.
 *
 * Intersections are exact (closed form) for the pairs of kinds whose ops list one (`crossings`: today
 * line/line, line/arc and arc/arc); other pairs use recursive subdivision on the exact curve down to the
 * touching tolerance.
 */
import { InputError } from '../base/errors.js';
import { overlappingPairs } from './boxgrid.js';
import { pointInLoop } from './nesting.js';
import { type Loop, type Part, type Region, loopSignedArea } from './part.js';
import { lineLineCrossings } from './kinds/line.js';
import { type Box, type Crossing, type LineSegment, type Out2, type Segment, exactCrossings, ops, segmentEnd, segmentPoint, segmentStart } from './segments.js';

type Hit = Crossing;

const fmt = (v: number) => Number(v.toPrecision(6)).toString();
const at = (x: number, y: number) => `(${fmt(x)}, ${fmt(y)})`;

/** Throws InputError on the first problem found; returns the touching tolerance used. */
export function validatePart(part: Part): number {
  if (part.regions.length === 0) throw new InputError('outline', 'the part has no material (no outline)');
  const loops: Loop[] = [];
  const outer: boolean[] = [];
  for (const r of part.regions) {
    loops.push(r.outer); outer.push(true);
    for (const h of r.holes) { loops.push(h); outer.push(false); }
  }
  // every segment's box once, into flat arrays (parts reach 10^6 edges): the range and scale checks, the
  // part's box, the loops' boxes and the pair search all read these (a one-shot run paid for four passes
  // of box computations and their small arrays before)
  let nSeg = 0;
  for (const l of loops) nSeg += l.segments.length;
  const boxes = new Float64Array(4 * nSeg);
  const loopBoxes = new Float64Array(4 * loops.length);
  const segLoop = new Int32Array(nSeg), segIndex = new Int32Array(nSeg);
  const segs: Segment[] = new Array(nSeg);
  let k = 0;
  for (let li = 0; li < loops.length; li++) {
    const l = loops[li];
    let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
    for (let index = 0; index < l.segments.length; index++, k++) {
      const seg = l.segments[index];
      const b = ops(seg).bbox(seg);
      checkRange(l, b);
      boxes[4 * k] = b[0]; boxes[4 * k + 1] = b[1]; boxes[4 * k + 2] = b[2]; boxes[4 * k + 3] = b[3];
      x0 = Math.min(x0, b[0]); y0 = Math.min(y0, b[1]); x1 = Math.max(x1, b[2]); y1 = Math.max(y1, b[3]);
      segs[k] = seg; segLoop[k] = li; segIndex[k] = index;
    }
    loopBoxes[4 * li] = x0; loopBoxes[4 * li + 1] = y0; loopBoxes[4 * li + 2] = x1; loopBoxes[4 * li + 3] = y1;
  }
  // the part's box: the outlines bound everything
  const box: Box = [Infinity, Infinity, -Infinity, -Infinity];
  for (let li = 0; li < loops.length; li++) {
    if (!outer[li]) continue;
    box[0] = Math.min(box[0], loopBoxes[4 * li]); box[1] = Math.min(box[1], loopBoxes[4 * li + 1]);
    box[2] = Math.max(box[2], loopBoxes[4 * li + 2]); box[3] = Math.max(box[3], loopBoxes[4 * li + 3]);
  }
  checkScale(part, box);
  const size = Math.max(box[2] - box[0], box[3] - box[1]);
  if (!Number.isFinite(size) || !(size > 0)) throw new InputError('outline', 'expected an outline with finite, non-zero extent');
  const scale = Math.max(size, Math.abs(box[0]), Math.abs(box[1]), Math.abs(box[2]), Math.abs(box[3]));
  const tol = 1e-9 * scale;

  for (const l of loops) checkLoop(l, tol);

  // all segments; candidate pairs from a uniform grid over their boxes grown by the tolerance
  for (let i = 0; i < 4 * nSeg; i += 4) { boxes[i] -= tol; boxes[i + 1] -= tol; boxes[i + 2] += tol; boxes[i + 3] += tol; }
  overlappingPairs(boxes, (i, j) => checkPair(segs[i], segLoop[i], segIndex[i], segs[j], segLoop[j], segIndex[j], loops, tol));

  for (const l of loops) checkArea(l, tol);

  // nesting: every hole inside its outline, holes not inside each other, regions apart
  let li = 0;
  for (const reg of part.regions) {
    const first = ++li; // the region's holes follow its outline in `loops`
    for (const h of reg.holes) {
      const p = loopProbe(h);
      if (!pointInLoop(p[0], p[1], reg.outer)) {
        throw new InputError(h.where ?? 'cutout', `lies outside ${reg.outer.where ?? 'the outline'}; a cut-out must be inside the outline`);
      }
      li++;
    }
    checkHoleNesting(reg.holes, loopBoxes.subarray(4 * first, 4 * li));
  }
  checkRegionNesting(part.regions, loopBoxes);
  return tol;
}

function loopName(l: Loop): string { return l.where ?? 'loop'; }

/** Largest coordinate magnitude accepted from any reader (the part-file reader's limit, src/read/partJson.ts). */
export const MAX_COORDINATE_MAGNITUDE = 1e12;

/**
 * Every segment's box must be finite and within ±MAX_COORDINATE_MAGNITUDE: beyond that the touching tolerance
 * (relative to the part's size) swallows whole segments and squares of coordinates lose all digits, so the
 * later checks would give misleading messages ("zero-length segment").
 */
function checkRange(l: Loop, b: Box): void {
  for (let i = 0; i < 4; i++) {
    const v = b[i];
    if (!Number.isFinite(v) || Math.abs(v) > MAX_COORDINATE_MAGNITUDE) {
      throw new InputError(loopName(l), `reaches coordinate ${fmt(v)}; expected finite coordinates of magnitude at most ${MAX_COORDINATE_MAGNITUDE} (in the part's length unit)`);
    }
  }
}

/** Smallest part extent measured, in the part's length unit (its fourth power stays a normal number). */
export const MIN_PART_EXTENT = 1e-9;
/** Smallest ratio of the part's extent to its distance from the origin (coordinates carry ~16 digits). */
export const MIN_EXTENT_TO_OFFSET = 1e-9;

/**
 * The part must be large enough to compute with and near enough to the origin for its size: a subnormal or
 * 1e-100 part underflows in its second moments and the later checks would speak of self-crossings at
 * (NaN, NaN) or of the mesher; a 0.0001-wide part at 9e11 has edges that doubles cannot tell apart, which
 * the later checks would call a zero-length segment. Issue 16: name the real cause instead.
 */
function checkScale(part: Part, outlines: Box): void {
  const [x0, y0, x1, y1] = outlines;
  if (!(x1 >= x0 && y1 >= y0)) return; // empty parts are refused elsewhere
  const extent = Math.max(x1 - x0, y1 - y0);
  const offset = Math.max(Math.abs(x0), Math.abs(x1), Math.abs(y0), Math.abs(y1));
  const name = part.regions[0] ? loopName(part.regions[0].outer) : 'part';
  if (extent < MIN_PART_EXTENT) {
    throw new InputError(name, `the part is only ${fmt(extent)} across (in its length unit); the smallest part measured is ${MIN_PART_EXTENT} across, since its second moments would underflow: check the unit or scale the drawing`);
  }
  if (extent < offset * MIN_EXTENT_TO_OFFSET) {
    throw new InputError(name, `the part is ${fmt(extent)} across but lies ${fmt(offset)} from the origin; numbers carry about 16 significant digits, too few to place its edges at that distance: move the part near the origin (its properties about the origin follow from the parallel-axis theorem)`);
  }
}

const endPt: Out2 = [0, 0], nextPt: Out2 = [0, 0];

function checkLoop(loop: Loop, tol: number): void {
  const n = loop.segments.length;
  if (n === 0) throw new InputError(loopName(loop), 'expected a closed loop with at least one segment');
  for (let i = 0; i < n; i++) {
    const s = loop.segments[i], o = ops(s);
    if (!(o.length(s) > tol)) {
      const p = segmentStart(s);
      throw new InputError(loopName(loop), `has a zero-length segment at ${at(p[0], p[1])}`);
    }
    const next = loop.segments[i + 1 < n ? i + 1 : 0];
    o.end(s, endPt); ops(next).start(next, nextPt);
    const ex = endPt[0], ey = endPt[1];
    if (Math.hypot(ex - nextPt[0], ey - nextPt[1]) > tol * 10) {
      throw new InputError(loopName(loop), `is not closed: a segment ends at ${at(ex, ey)} but the next starts at ${at(nextPt[0], nextPt[1])}`);
    }
    if (!Number.isFinite(ex) || !Number.isFinite(ey)) throw new InputError(loopName(loop), 'has a coordinate that is not a finite number');
  }
}

function checkArea(loop: Loop, tol: number): void {
  const a = loopSignedArea(loop);
  if (!(Math.abs(a) > tol * tol)) throw new InputError(loopName(loop), 'encloses no area');
}

function checkPair(sa: Segment, la: number, ia: number, sb: Segment, lb: number, ib: number, loops: Loop[], tol: number): void {
  // joints shared by neighbouring segments of a loop are not crossings; the subdivision search must skip
  // them and go on looking (it stops at its first hit, which for neighbours was the joint: a line crossing
  // the elliptical arc that follows it was missed)
  const joints: [number, number][] = [];
  if (la === lb) {
    const n = loops[la].segments.length;
    if ((ia + 1) % n === ib) joints.push(segmentEnd(sa));
    if ((ib + 1) % n === ia) joints.push(segmentEnd(sb));
  }
  const atJoint = (x: number, y: number) => joints.some((p) => Math.hypot(x - p[0], y - p[1]) <= 100 * tol);
  const hits = intersect(sa, sb, tol, joints.length > 0 ? atJoint : undefined);
  if (hits.length === 0) return;
  if (la === lb) {
    const real = hits.filter((h) => !atJoint(h.x, h.y));
    if (real.length === 0) return;
    if (ia === ib) return;
    const h = real[0];
    throw new InputError(loopName(loops[la]), `crosses or touches itself near ${at(h.x, h.y)}; a loop must be simple`);
  }
  const h = hits[0];
  // name the later loop (a cut-out rather than the outline) as the subject
  const [first, later] = la < lb ? [loops[la], loops[lb]] : [loops[lb], loops[la]];
  throw new InputError(loopName(later), `crosses or touches ${loopName(first)} near ${at(h.x, h.y)}; cut-outs must lie strictly inside the outline and apart from each other`);
}

/**
 * Intersections of two segments, within `tol` (tangency counts as a touch). For curve kinds without a
 * closed form the search stops at its first hit; hits where `ignore` is true do not count there.
 */
export function intersect(a: Segment, b: Segment, tol: number, ignore?: (x: number, y: number) => boolean): Hit[] {
  return exactCrossings(a, b, tol) ?? generic(a, 0, 1, b, 0, 1, tol, 0, ignore);
}

/** Subdivision on exact curves: boxes of sub-ranges are the chord's box grown by the curve's deviation. */
function generic(a: Segment, a0: number, a1: number, b: Segment, b0: number, b1: number, tol: number, depth: number, ignore?: (x: number, y: number) => boolean): Hit[] {
  const ba = subBox(a, a0, a1), bb = subBox(b, b0, b1);
  if (ba[0] > bb[2] + tol || bb[0] > ba[2] + tol || ba[1] > bb[3] + tol || bb[1] > ba[3] + tol) return [];
  const da = ops(a).deviation(a, a0, a1), db = ops(b).deviation(b, b0, b1);
  if ((da <= tol && db <= tol) || depth > 60) {
    const pa0 = segmentPoint(a, a0), pa1 = segmentPoint(a, a1), pb0 = segmentPoint(b, b0), pb1 = segmentPoint(b, b1);
    const la: LineSegment = { kind: 'line', x0: pa0[0], y0: pa0[1], x1: pa1[0], y1: pa1[1] };
    const lb: LineSegment = { kind: 'line', x0: pb0[0], y0: pb0[1], x1: pb1[0], y1: pb1[1] };
    if (ops(la).length(la) === 0 || ops(lb).length(lb) === 0) return [];
    return lineLineCrossings(la, lb, tol).map((h) => ({ ...h, ta: a0 + (a1 - a0) * h.ta, tb: b0 + (b1 - b0) * h.tb })).filter((h) => !ignore?.(h.x, h.y));
  }
  const am = (a0 + a1) / 2, bm = (b0 + b1) / 2;
  const out: Hit[] = [];
  // split the piece with the larger deviation, or with the much larger box: a long straight segment
  // (deviation 0) next to a curve would otherwise stay whole and overlap every piece of the curve
  const wa = Math.max(da, 0.01 * Math.hypot(ba[2] - ba[0], ba[3] - ba[1]));
  const wb = Math.max(db, 0.01 * Math.hypot(bb[2] - bb[0], bb[3] - bb[1]));
  const splitA = wa >= wb;
  const parts: [number, number, number, number][] = splitA ? [[a0, am, b0, b1], [am, a1, b0, b1]] : [[a0, a1, b0, bm], [a0, a1, bm, b1]];
  for (const [p0, p1, q0, q1] of parts) {
    out.push(...generic(a, p0, p1, b, q0, q1, tol, depth + 1, ignore));
    if (out.length > 0) return out;
  }
  return out;
}

function subBox(s: Segment, t0: number, t1: number): Box {
  const p = segmentPoint(s, t0), q = segmentPoint(s, t1);
  const d = ops(s).deviation(s, t0, t1);
  return [Math.min(p[0], q[0]) - d, Math.min(p[1], q[1]) - d, Math.max(p[0], q[0]) + d, Math.max(p[1], q[1]) + d];
}

/** A point on the loop's boundary used to decide nesting once crossings are excluded. */
function loopProbe(l: Loop): [number, number] {
  return segmentPoint(l.segments[0], 0.5);
}

/** Is box i of `a` inside box j of `b` (flat xMin, yMin, xMax, yMax)? */
const insideBox = (a: Float64Array, i: number, b: Float64Array, j: number) =>
  a[4 * i] >= b[4 * j] && a[4 * i + 1] >= b[4 * j + 1] && a[4 * i + 2] <= b[4 * j + 2] && a[4 * i + 3] <= b[4 * j + 3];

/** `boxes`: the holes' boxes (flat, in order). */
function checkHoleNesting(holes: Loop[], boxes: Float64Array): void {
  if (holes.length < 2) return;
  overlappingPairs(boxes, (i, j) => {
    for (const [inner, outer] of [[i, j], [j, i]]) {
      if (!insideBox(boxes, inner, boxes, outer)) continue;
      const p = loopProbe(holes[inner]);
      if (pointInLoop(p[0], p[1], holes[outer])) {
        throw new InputError(holes[inner].where ?? 'cutout', `lies inside ${holes[outer].where ?? 'another cut-out'}; cut-outs must not overlap`);
      }
    }
  });
}

/**
 * No region's outline lies on another region's material. Each outline's probe point is tested only against
 * the loops (outlines and holes of the other regions) whose boxes hold it, found through the box grid:
 * near O(n + candidates), where testing every region against every other (and all its holes) was
 * quadratic on drawings of many separate parts. `loopBoxes`: every loop's box, outlines and holes in region
 * order (as validatePart lists them).
 */
function checkRegionNesting(regions: Region[], loopBoxes: Float64Array): void {
  const R = regions.length;
  if (R < 2) return;
  const loops: Loop[] = [], owner: number[] = [], isOuter: boolean[] = [];
  regions.forEach((r, ri) => {
    loops.push(r.outer); owner.push(ri); isOuter.push(true);
    for (const h of r.holes) { loops.push(h); owner.push(ri); isOuter.push(false); }
  });
  const probes = regions.map((r) => loopProbe(r.outer));
  // boxes: the R probe points first, then every loop
  const flat = new Float64Array(4 * (R + loops.length));
  probes.forEach(([x, y], i) => flat.set([x, y, x, y], 4 * i));
  flat.set(loopBoxes, 4 * R);
  // per probe: the regions whose outline holds it, and those with a hole that holds it
  const inOuter = new Map<number, number[]>(), inHole = new Set<string>();
  overlappingPairs(flat, (a, b) => {
    if (a >= R || b < R) return; // probe (a) against loop (b) only
    const k = b - R, j = owner[k];
    if (j === a) return;
    const [x, y] = probes[a];
    if (!pointInLoop(x, y, loops[k])) return;
    if (isOuter[k]) (inOuter.get(a) ?? inOuter.set(a, []).get(a)!).push(j);
    else inHole.add(`${a},${j}`);
  });
  for (const [i, js] of inOuter) {
    for (const j of js) {
      if (!inHole.has(`${i},${j}`)) {
        throw new InputError(regions[i].outer.where ?? 'outline', `lies on the material of ${regions[j].outer.where ?? 'another outline'}; regions must not overlap`);
      }
    }
  }
}
