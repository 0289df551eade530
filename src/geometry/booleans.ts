/**
 * Booleans on exact shapes: an outline joined with added shapes (union), minus cut-outs (difference),
 * where cut-outs may cross the outline (edge notches, open slots) and overlap each other.
 *
 * Curves survive the operation. The clipping itself runs on finely chorded polygons (polygon-clipping by
 * default); every chord vertex is tagged with its source segment and parameter. The result's rings are
 * rebuilt edge by edge: each output edge is matched to the source chord it lies on, consecutive edges on
 * the same source segment are merged back into that exact segment (restricted to a parameter sub-range),
 * and where the source segment changes, the junction is snapped to the exact intersection of the two source
 * segments (Newton's method on the exact curves, started from the chord crossing). So a plate notched by a
 * circle keeps a true circular arc from the exact crossing point to the exact crossing point.
 *
 * Results that are empty, fall apart into several pieces, contain a sliver thinner than `minWidth`, or come
 * from a cut-out that removes nothing are InputErrors naming the shapes involved. A failure inside the
 * clipping library (polygon-clipping 0.15.7 can throw "Unable to complete output ring" on near-degenerate
 * input) becomes an InputError naming the operation and shapes, never a stack trace.
 *
 * Fast path: when there are no added shapes and a cut-out is clear of the outline and of every other
 * cut-out (by exact bounding boxes) and lies inside the outline, it stays a plain hole without clipping.
 */
import { overlappingPairs } from './boxgrid.js';
import { createRequire } from 'node:module';
import type PolygonClippingModule from 'polygon-clipping';

// loaded on first use (its CommonJS build), so parts without booleans do not pay for it at start-up
type PolygonClipping = typeof PolygonClippingModule;
let clipperModule: PolygonClipping | undefined;
function polygonClipping(): PolygonClipping {
  return (clipperModule ??= createRequire(import.meta.url)('polygon-clipping') as PolygonClipping);
}
import { InputError, MethodError } from '../base/errors.js';
import { pointInLoop } from './nesting.js';
import { type Loop, type Region, loopBox, loopLength, loopSignedArea } from './part.js';
import { type Out2, type Segment, ops, segmentPoint } from './segments.js';
import { validatePart } from './validate.js';

export type ClipPair = [number, number];
export type ClipRing = ClipPair[];
export type ClipPolygon = ClipRing[];
export type ClipMultiPolygon = ClipPolygon[];
type ClipGeom = ClipPolygon | ClipMultiPolygon;

/** The polygon clipper used underneath (polygon-clipping's API; polyclip-ts has the same one). */
export interface ClipEngine {
  name: string;
  union(geom: ClipGeom, ...more: ClipGeom[]): ClipMultiPolygon;
  difference(geom: ClipGeom, ...more: ClipGeom[]): ClipMultiPolygon;
}

export const POLYGON_CLIPPING: ClipEngine = {
  name: 'polygon-clipping',
  union: (g, ...m) => polygonClipping().union(g, ...m),
  difference: (g, ...m) => polygonClipping().difference(g, ...m),
};

export interface BooleanInput {
  outline: Loop;
  /** Shapes joined to the outline (material added). */
  add?: Loop[];
  /** Shapes removed; may cross the outline and each other. */
  cutouts?: Loop[];
}

export interface BooleanOptions {
  engine?: ClipEngine;
  /** Largest tangent turning per chord of a curve for the clipping polygons, radians (default π/90). */
  maxTurn?: number;
  /** Thinnest piece of material or hole accepted (default 1e-6 × the outline's size). */
  minWidth?: number;
}

export const DEFAULT_BOOLEAN_TURN = Math.PI / 90;

const fmt = (v: number) => Number(v.toPrecision(6)).toString();
const at = (x: number, y: number) => `(${fmt(x)}, ${fmt(y)})`;
const nameOf = (l: Loop, fallback: string) => l.where ?? fallback;

// -------------------------------------------------------------------------------------------------
// exact sub-segments

/** The exact piece of a segment from parameter a to parameter b (b < a gives the piece reversed). */
export function subSegment(s: Segment, a: number, b: number): Segment {
  if (a > b) return ops(s).reverse(subSegment(s, b, a));
  if (a <= 0 && b >= 1) return s;
  a = Math.max(0, a); b = Math.min(1, b);
  return ops(s).sub(s, a, b);
}

// -------------------------------------------------------------------------------------------------
// exact intersection of two segments near a guess

/**
 * Solve A(ta) = B(tb) by Newton's method from (ta, tb). Returns the refined parameters, or null when the
 * iteration does not settle (tangent or coincident curves).
 */
export function refineCrossing(A: Segment, ta: number, B: Segment, tb: number, tol: number): [number, number] | null {
  const oa = ops(A), ob = ops(B);
  const p: Out2 = [0, 0], q: Out2 = [0, 0], da: Out2 = [0, 0], db: Out2 = [0, 0];
  for (let it = 0; it < 60; it++) {
    oa.point(A, ta, p); ob.point(B, tb, q);
    const fx = p[0] - q[0], fy = p[1] - q[1];
    oa.derivative(A, ta, da); ob.derivative(B, tb, db);
    // J = [da, −db]; solve J·(δa, δb) = −f
    const det = -da[0] * db[1] + da[1] * db[0];
    const scale = Math.hypot(da[0], da[1]) * Math.hypot(db[0], db[1]);
    if (!(Math.abs(det) > 1e-10 * scale)) return null;
    const dA = (-fx * -db[1] - -fy * -db[0]) / det;
    const dB = (da[0] * -fy - da[1] * -fx) / det;
    ta += dA; tb += dB;
    if (!(Math.abs(ta) < 4 && Math.abs(tb) < 4)) return null;
    if (Math.abs(dA) < 1e-15 && Math.abs(dB) < 1e-15) break;
  }
  oa.point(A, ta, p); ob.point(B, tb, q);
  if (!(Math.hypot(p[0] - q[0], p[1] - q[1]) <= tol)) return null;
  return [ta, tb];
}

/** Parameter on B of the point nearest to P, by Newton on (B(t) − P)·B'(t) = 0 from t. */
function projectOn(B: Segment, x: number, y: number, t: number): number {
  const o = ops(B);
  const q: Out2 = [0, 0], d: Out2 = [0, 0], q2: Out2 = [0, 0];
  const h = 1e-7;
  for (let it = 0; it < 40; it++) {
    o.point(B, t, q); o.derivative(B, t, d);
    const g = (q[0] - x) * d[0] + (q[1] - y) * d[1];
    // derivative of g by a finite difference of the derivative (adequate for a few corrective steps)
    o.derivative(B, t + h, q2);
    const d2x = (q2[0] - d[0]) / h, d2y = (q2[1] - d[1]) / h;
    const gp = d[0] * d[0] + d[1] * d[1] + (q[0] - x) * d2x + (q[1] - y) * d2y;
    if (!(gp > 0)) break;
    const step = g / gp;
    t -= step;
    if (Math.abs(step) < 1e-15) break;
  }
  return t;
}

// -------------------------------------------------------------------------------------------------
// chording with tags

interface SourceSeg { seg: Segment; loop: number; index: number; next: number; prev: number }
interface Chord { src: number; ta: number; tb: number; x0: number; y0: number; x1: number; y1: number }

class Sources {
  segs: SourceSeg[] = [];
  chords: Chord[] = [];
  loops: Loop[] = [];
  names: string[] = [];
  /** Exact input vertex coordinates → (source segment, parameter). */
  tags = new Map<string, { src: number; t: number }[]>();

  /** Chord a loop into a ring (counter-clockwise when ccw) and record tags; returns the ring. */
  add(loop: Loop, name: string, maxTurn: number): ClipRing {
    const li = this.loops.length;
    this.loops.push(loop);
    this.names.push(name);
    const first = this.segs.length;
    const n = loop.segments.length;
    loop.segments.forEach((seg, i) => {
      this.segs.push({ seg, loop: li, index: i, next: first + ((i + 1) % n), prev: first + ((i + n - 1) % n) });
    });
    const ring: ClipRing = [];
    const tagged: { src: number; t: number; x: number; y: number }[] = [];
    for (let i = 0; i < n; i++) {
      const s = loop.segments[i];
      const o = ops(s);
      const pieces = o.straight ? 1 : Math.max(2, Math.ceil(o.turning(s, 0, 1) / maxTurn - 1e-9));
      for (let k = 0; k < pieces; k++) {
        const t = k / pieces;
        const p = segmentPoint(s, t);
        tagged.push({ src: first + i, t, x: p[0], y: p[1] });
      }
    }
    for (let k = 0; k < tagged.length; k++) {
      const a = tagged[k], b = tagged[(k + 1) % tagged.length];
      const tb = b.src === a.src ? b.t : 1;
      this.chords.push({ src: a.src, ta: a.t, tb, x0: a.x, y0: a.y, x1: b.x, y1: b.y });
      ring.push([a.x, a.y]);
      const key = `${a.x},${a.y}`;
      const list = this.tags.get(key);
      const tag = { src: a.src, t: a.t };
      if (list) list.push(tag); else this.tags.set(key, [tag]);
    }
    return ring;
  }
}

/** Uniform grid over chords: each chord is entered in the cells of points sampled along it. */
class ChordGrid {
  private cells = new Map<string, number[]>();
  constructor(private chords: Chord[], private cell: number) {
    chords.forEach((c, i) => {
      const L = Math.hypot(c.x1 - c.x0, c.y1 - c.y0);
      const steps = Math.max(1, Math.ceil(L / (cell / 2)));
      const seen = new Set<string>();
      for (let k = 0; k <= steps; k++) {
        const key = this.key(c.x0 + ((c.x1 - c.x0) * k) / steps, c.y0 + ((c.y1 - c.y0) * k) / steps);
        if (seen.has(key)) continue;
        seen.add(key);
        const list = this.cells.get(key);
        if (list) list.push(i); else this.cells.set(key, [i]);
      }
    });
  }
  private key(x: number, y: number): string { return `${Math.floor(x / this.cell)},${Math.floor(y / this.cell)}`; }
  near(x: number, y: number): number[] {
    const cx = Math.floor(x / this.cell), cy = Math.floor(y / this.cell);
    const out = new Set<number>();
    for (let i = -1; i <= 1; i++) for (let j = -1; j <= 1; j++) for (const c of this.cells.get(`${cx + i},${cy + j}`) ?? []) out.add(c);
    return [...out];
  }
}

// -------------------------------------------------------------------------------------------------
// main entry

function probePoint(loop: Loop): [number, number] {
  return segmentPoint(loop.segments[0], 0.5);
}

/** Even-odd point test against a clipping result. */
function insideClip(mp: ClipMultiPolygon, x: number, y: number): boolean {
  let inside = false;
  for (const poly of mp) for (const ring of poly) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const [xi, yi] = ring[i], [xj, yj] = ring[j];
      if ((yi > y) !== (yj > y) && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
    }
  }
  return inside;
}

function runClip<T>(what: string, names: string[], body: () => T): T {
  try {
    return body();
  } catch (e) {
    if (e instanceof InputError) throw e;
    const msg = e instanceof Error ? e.message : String(e);
    throw new MethodError('polygon clipper', `the ${what} of ${names[0]} with ${names.slice(1).join(', ') || 'itself'} failed (${msg})`, 'shapes that touch or nearly coincide can cause this: move or resize one of them slightly');
  }
}

/**
 * Outline ∪ add − cutouts as one region with exact curves. Throws InputError when the result is empty,
 * falls apart, has slivers, or when a cut-out removes nothing.
 */
export function combineShapes(input: BooleanInput, options: BooleanOptions = {}): Region {
  const add = input.add ?? [];
  const cutouts = input.cutouts ?? [];
  const outline = input.outline;
  const outlineName = nameOf(outline, 'outline');
  const obox = loopBox(outline);
  const size = Math.max(obox[2] - obox[0], obox[3] - obox[1]);

  // fast path: cut-outs clear of everything stay plain holes
  const plain: Loop[] = [];
  const clipped: Loop[] = [];
  if (add.length === 0) {
    // boxes of the outline's segments, then of the cut-outs; a cut-out is clear when its box meets no other
    const nSeg = outline.segments.length;
    const flat = new Float64Array(4 * (nSeg + cutouts.length));
    outline.segments.forEach((s, i) => flat.set(ops(s).bbox(s), 4 * i));
    cutouts.forEach((c, i) => flat.set(loopBox(c), 4 * (nSeg + i)));
    const touched = new Uint8Array(cutouts.length);
    overlappingPairs(flat, (i, j) => {
      if (i >= nSeg) touched[i - nSeg] = 1;
      if (j >= nSeg) touched[j - nSeg] = 1;
    });
    cutouts.forEach((c, i) => {
      const [px, py] = probePoint(c);
      if (!touched[i] && pointInLoop(px, py, outline)) plain.push(c); else clipped.push(c);
    });
  } else {
    clipped.push(...cutouts);
  }
  if (add.length === 0 && clipped.length === 0) return { outer: outline, holes: cutouts };

  // every operand must be a simple closed loop on its own before clipping (the clipper would quietly
  // reinterpret a self-crossing loop)
  for (const l of [outline, ...add, ...clipped]) validatePart({ name: nameOf(l, 'shape'), units: 'mm', regions: [{ outer: l, holes: [] }] });
  const engine = options.engine ?? POLYGON_CLIPPING;
  const maxTurn = options.maxTurn ?? DEFAULT_BOOLEAN_TURN;
  const minWidth = options.minWidth ?? 1e-6 * size;
  const src = new Sources();
  const ringOf = (l: Loop, name: string): ClipPolygon => {
    const ring = src.add(l, name, maxTurn);
    return [loopSignedArea(l) > 0 ? ring : ring.slice().reverse()];
  };
  const outlinePoly = ringOf(outline, outlineName);
  const addPolys = add.map((l, i) => ringOf(l, nameOf(l, `add[${i}]`)));
  const cutPolys = clipped.map((l, i) => ringOf(l, nameOf(l, `cutouts[${i}]`)));
  const addNames = add.map((l, i) => nameOf(l, `add[${i}]`));
  const cutNames = clipped.map((l, i) => nameOf(l, `cutouts[${i}]`));

  const material = addPolys.length > 0
    ? runClip('union', [outlineName, ...addNames], () => engine.union(outlinePoly, ...addPolys))
    : [outlinePoly];
  const result = cutPolys.length > 0
    ? runClip('difference', [outlineName, ...cutNames], () => engine.difference(material, ...cutPolys))
    : material;

  if (result.length === 0) {
    throw new InputError(outlineName, `the cut-outs ${cutNames.join(', ')} remove all the material; expected some plate to remain`);
  }

  // rebuild every ring with exact segments
  let scale = size;
  for (const v of [obox[0], obox[1], obox[2], obox[3]]) scale = Math.max(scale, Math.abs(v));
  const eps = 1e-8 * scale;
  const totalLen = src.chords.reduce((s, c) => s + Math.hypot(c.x1 - c.x0, c.y1 - c.y0), 0);
  const grid = new ChordGrid(src.chords, Math.max(totalLen / src.chords.length, size * 1e-6));
  const used = new Set<number>(); // source loops that bound the result
  const pieces = result.map((poly) => poly.map((ring) => rebuildRing(ring, src, grid, eps, used)));

  // a cut-out that contributes no edge either lies inside other cut-outs or removes nothing at all
  clipped.forEach((c, i) => {
    const li = src.loops.indexOf(c);
    if (used.has(li)) return;
    const ring = cutPolys[i][0];
    if (!ring.some(([x, y]) => insideClip(material, x, y))) {
      throw new InputError(cutNames[i], `lies outside ${outlineName}: it removes no material; expected a cut-out that overlaps the plate`);
    }
  });

  for (const poly of pieces) for (const r of poly) {
    const A = Math.abs(loopSignedArea(r.loop));
    const P = loopLength(r.loop);
    const width = (2 * A) / P;
    if (!(width >= minWidth)) {
      const b = loopBox(r.loop);
      throw new InputError(r.loop.where ?? outlineName, `leaves a sliver about ${fmt(width)} wide near ${at((b[0] + b[2]) / 2, (b[1] + b[3]) / 2)} (thinner than ${fmt(minWidth)}); make the shapes overlap clearly or keep them clearly apart`);
    }
  }

  if (pieces.length > 1) {
    const where = pieces.map((p) => { const b = loopBox(p[0].loop); return at((b[0] + b[2]) / 2, (b[1] + b[3]) / 2); });
    const names = [...used].map((li) => src.names[li]).filter((n) => n !== outlineName);
    throw new InputError(outlineName, `${names.length ? `${names.join(', ')} ${names.length > 1 ? 'split' : 'splits'}` : 'the shapes split'} the plate into ${pieces.length} separate pieces (near ${where.join(', ')}); expected one piece — describe separate pieces as "regions"`);
  }

  const [outer, ...holes] = pieces[0].map((r) => r.loop);
  return { outer, holes: [...holes, ...plain] };
}

interface Edge { src: number; ta: number; tb: number }

function rebuildRing(ring: ClipRing, src: Sources, grid: ChordGrid, eps: number, used: Set<number>): { loop: Loop } {
  const pts = ring.slice();
  if (pts.length > 1 && pts[0][0] === pts[pts.length - 1][0] && pts[0][1] === pts[pts.length - 1][1]) pts.pop();
  const n = pts.length;
  const edges: Edge[] = [];
  for (let i = 0; i < n; i++) {
    const [px, py] = pts[i], [qx, qy] = pts[(i + 1) % n];
    edges.push(matchEdge(px, py, qx, qy, src, grid, eps));
  }
  // exact parameters at each vertex: tags where the input vertex is on that segment, else the crossing
  for (let i = 0; i < n; i++) {
    const e1 = edges[(i + n - 1) % n], e2 = edges[i];
    const [x, y] = pts[i];
    const tags = src.tags.get(`${x},${y}`) ?? [];
    const exact = (e: Edge): number | undefined => {
      for (const t of tags) {
        if (t.src === e.src) return t.t;
        if (t.t === 0 && src.segs[e.src].next === t.src) return 1; // the end of e's segment
      }
      return undefined;
    };
    const t1 = exact(e1), t2 = exact(e2);
    if (t1 !== undefined) e1.tb = t1;
    if (t2 !== undefined) e2.ta = t2;
    if (e1.src === e2.src) continue;
    if (t1 !== undefined && t2 !== undefined) continue;
    const A = src.segs[e1.src].seg, B = src.segs[e2.src].seg;
    const hit = refineCrossing(A, e1.tb, B, e2.ta, eps);
    if (hit) {
      if (t1 === undefined) e1.tb = clamp01(hit[0]);
      if (t2 === undefined) e2.ta = clamp01(hit[1]);
      continue;
    }
    // tangent or coincident curves: place the junction on one curve and project onto the other
    const base = t1 !== undefined ? 1 : 2;
    const p = base === 1 ? segmentPoint(A, e1.tb) : segmentPoint(B, e2.ta);
    if (base === 1) e2.ta = clamp01(projectOn(B, p[0], p[1], e2.ta)); else e1.tb = clamp01(projectOn(A, p[0], p[1], e1.tb));
    const q = base === 1 ? segmentPoint(B, e2.ta) : segmentPoint(A, e1.tb);
    if (!(Math.hypot(p[0] - q[0], p[1] - q[1]) <= eps)) {
      throw new MethodError('boolean operation', `${src.names[src.segs[e2.src].loop]} meets ${src.names[src.segs[e1.src].loop]} at a grazing angle near ${at(x, y)} where the exact crossing could not be located`, 'make the shapes cross clearly or keep them apart');
    }
  }
  // merge runs on the same source segment
  let start = 0;
  while (start < n && edges[start].src === edges[(start + n - 1) % n].src) start++;
  const segs: Segment[] = [];
  const names = new Set<string>();
  if (start === n) {
    // every edge on one segment: the whole segment, in the ring's direction
    const e = edges[0];
    const seg = src.segs[e.src].seg;
    segs.push(e.ta <= e.tb ? seg : ops(seg).reverse(seg));
    used.add(src.segs[e.src].loop);
    names.add(src.names[src.segs[e.src].loop]);
  } else {
    let k = 0;
    while (k < n) {
      const first = edges[(start + k) % n];
      let last = first;
      k++;
      while (k < n && edges[(start + k) % n].src === first.src) { last = edges[(start + k) % n]; k++; }
      const ss = src.segs[first.src];
      used.add(ss.loop);
      names.add(src.names[ss.loop]);
      if (first.ta === last.tb) continue; // degenerate run (a vertex only)
      segs.push(subSegment(ss.seg, first.ta, last.tb));
    }
  }
  return { loop: { segments: dropTiny(segs, eps / 4), where: [...names].join(' − ') } };
}

/**
 * Remove pieces shorter than `tiny` (two crossings closer than the validation tolerance, as nearly
 * coincident edges make): the neighbours are joined, closing the gap exactly when one of them is a line.
 */
function dropTiny(segs: Segment[], tiny: number): Segment[] {
  if (segs.length <= 3) return segs;
  const out = segs.slice();
  for (let i = 0; i < out.length && out.length > 3; ) {
    const s = out[i];
    const a = segmentPoint(s, 0), b = segmentPoint(s, 1);
    if (Math.hypot(b[0] - a[0], b[1] - a[1]) > tiny || ops(s).length(s) > tiny) { i++; continue; }
    out.splice(i, 1);
    const pi = (i + out.length - 1) % out.length, ni = i % out.length;
    const prev = out[pi], next = out[ni];
    const end = segmentPoint(prev, 1), start = segmentPoint(next, 0);
    const po = ops(prev), no = ops(next);
    if (po.straight) out[pi] = po.moveEnd(prev, start[0], start[1]) ?? prev;
    else if (no.straight) out[ni] = no.moveStart(next, end[0], end[1]) ?? next;
  }
  return out;
}

function clamp01(t: number): number {
  return t < 0 ? 0 : t > 1 ? 1 : t;
}

/** The source chord on which the output edge p→q lies, with approximate parameters of p and q. */
function matchEdge(px: number, py: number, qx: number, qy: number, src: Sources, grid: ChordGrid, eps: number): Edge {
  const mx = (px + qx) / 2, my = (py + qy) / 2;
  let best = -1, bestD = Infinity, bestU = 0, bestV = 0;
  for (const ci of grid.near(mx, my)) {
    const c = src.chords[ci];
    const dx = c.x1 - c.x0, dy = c.y1 - c.y0;
    const L2 = dx * dx + dy * dy;
    if (!(L2 > 0)) continue;
    const L = Math.sqrt(L2);
    const u = ((px - c.x0) * dx + (py - c.y0) * dy) / L2;
    const v = ((qx - c.x0) * dx + (qy - c.y0) * dy) / L2;
    const slack = eps / L;
    if (u < -slack || u > 1 + slack || v < -slack || v > 1 + slack) continue;
    const dp = Math.abs((px - c.x0) * dy - (py - c.y0) * dx) / L;
    const dq = Math.abs((qx - c.x0) * dy - (qy - c.y0) * dx) / L;
    const d = Math.max(dp, dq);
    if (d < bestD) { bestD = d; best = ci; bestU = u; bestV = v; }
  }
  if (best < 0 || !(bestD <= eps)) {
    throw new Error(`booleans: an edge of the clipped result near ${at(mx, my)} lies on no source shape`);
  }
  const c = src.chords[best];
  const lerp = (u: number) => c.ta + (c.tb - c.ta) * Math.min(1, Math.max(0, u));
  return { src: c.src, ta: lerp(bestU), tb: lerp(bestV) };
}
