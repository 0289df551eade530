/**
 * From an exact part to a typed-array mesh: chord the boundary (curve-tagged), triangulate with cdt2d
 * constrained to the chords, tag every triangle edge that lies on a curve, and split chords until every
 * curved triangle's map is safely valid.
 */
import cdt2d from 'cdt2d';
import { InputError } from '../errors.js';
import { type Part, partBox, translatePart } from '../geometry/part.js';
import { type Segment, ops, piecesForTurning, segmentPoint, segmentStart } from '../geometry/segments.js';
import { type Mesh, TriangleMap, curvedEdgeRatio } from './mesh.js';

export interface MeshOptions {
  /** Largest tangent turning per chord on a curve, radians (default π/4: 8 chords on a circle). */
  maxTurn?: number;
  /** cdt2d mode: 'delaunay' (edge flips to the Delaunay triangulation) or 'sweep' (monotone sweep only). */
  triangulation?: 'delaunay' | 'sweep';
  /** Largest allowed ratio of a curved edge's deviation from its chord to the triangle's height over it. */
  maxBulge?: number;
}

export const DEFAULT_MAX_TURN = Math.PI / 4;
export const DEFAULT_MAX_BULGE = 0.25;

/** One boundary vertex: on segment `seg` at parameter `t`. */
interface BVert { seg: number; t: number }

/** Chosen local origin: the centre of the part's bounding box. */
export function localOrigin(part: Part): [number, number] {
  const b = partBox(part);
  return [(b[0] + b[2]) / 2, (b[1] + b[3]) / 2];
}

export interface MeshReport { mesh: Mesh; chordSplits: number; passes: number }

/**
 * Mesh a validated, normalised part. Coordinates are moved to the local origin first.
 */
export function buildMesh(part: Part, options: MeshOptions = {}): MeshReport {
  const maxTurn = options.maxTurn ?? DEFAULT_MAX_TURN;
  const maxBulge = options.maxBulge ?? DEFAULT_MAX_BULGE;
  const origin = localOrigin(part);
  const local = translatePart(part, -origin[0], -origin[1]);

  const segments: Segment[] = [];
  const loops: BVert[][] = [];
  for (const r of local.regions) {
    for (const loop of [r.outer, ...r.holes]) {
      const verts: BVert[] = [];
      for (const s of loop.segments) {
        const si = segments.length;
        segments.push(s);
        const n = piecesForTurning(s, maxTurn);
        for (let i = 0; i < n; i++) verts.push({ seg: si, t: i / n });
      }
      loops.push(verts);
    }
  }

  let splits = 0;
  splits += separateChords(loops, segments);
  for (let pass = 1; pass <= 12; pass++) {
    const extra = steinerPoints(loops, segments);
    const mesh = triangulate(loops, segments, origin, options.triangulation ?? 'delaunay', extra);
    const bad = badCurvedEdges(mesh, maxBulge);
    if (bad.size === 0) return { mesh, chordSplits: splits, passes: pass };
    // split the offending chords at their parameter midpoint, on the curve
    for (const verts of loops) {
      for (let i = verts.length - 1; i >= 0; i--) {
        const key = chordKey(verts, i);
        if (!bad.has(key)) continue;
        const a = verts[i], b = verts[(i + 1) % verts.length];
        const t1 = b.seg === a.seg ? b.t : 1;
        verts.splice(i + 1, 0, { seg: a.seg, t: (a.t + t1) / 2 });
        splits++;
      }
    }
    splits += separateChords(loops, segments);
  }
  throw new InputError('mesh', 'could not make valid curved triangles after 12 passes of chord splitting (a feature is too thin for its curvature?)');
}

function chordKey(verts: BVert[], i: number): string {
  const a = verts[i];
  return `${a.seg}:${a.t}`;
}

/**
 * Make sure the region between each curved chord and its curve is clear of every other boundary edge:
 * split curved chords whose "lens" (chord box grown by its deviation) comes near a non-adjacent edge.
 */
function separateChords(loops: BVert[][], segments: Segment[]): number {
  let total = 0;
  for (let round = 0; round < 30; round++) {
    interface E { loop: number; i: number; x0: number; y0: number; x1: number; y1: number; dev: number; box: [number, number, number, number] }
    const edges: E[] = [];
    loops.forEach((verts, li) => {
      for (let i = 0; i < verts.length; i++) {
        const a = verts[i], b = verts[(i + 1) % verts.length];
        const s = segments[a.seg];
        const t1 = b.seg === a.seg ? b.t : 1;
        const p = segmentPoint(s, a.t), q = b.seg === a.seg ? segmentPoint(s, b.t) : segmentStart(segments[b.seg]);
        const dev = ops(s).straight ? 0 : ops(s).deviation(s, a.t, t1);
        const g = dev * 1.5;
        edges.push({ loop: li, i, x0: p[0], y0: p[1], x1: q[0], y1: q[1], dev,
          box: [Math.min(p[0], q[0]) - g, Math.min(p[1], q[1]) - g, Math.max(p[0], q[0]) + g, Math.max(p[1], q[1]) + g] });
      }
    });
    const order = edges.map((_, i) => i).sort((i, j) => edges[i].box[0] - edges[j].box[0]);
    const active: number[] = [];
    const toSplit = new Set<E>();
    for (const i of order) {
      const e = edges[i];
      for (let k = active.length - 1; k >= 0; k--) if (edges[active[k]].box[2] < e.box[0]) { active[k] = active[active.length - 1]; active.pop(); }
      for (const j of active) {
        const f = edges[j];
        if (f.box[1] > e.box[3] || e.box[1] > f.box[3]) continue;
        if (e.dev === 0 && f.dev === 0) continue;
        if (e.loop === f.loop) {
          const n = loops[e.loop].length;
          if (Math.abs(e.i - f.i) <= 1 || Math.abs(e.i - f.i) === n - 1) continue;
        }
        // near in box terms: split the curved one(s) whose lens is the larger
        const dist = segDist(e, f);
        if (dist <= 1.5 * Math.max(e.dev, f.dev)) {
          if (e.dev >= f.dev) toSplit.add(e); else toSplit.add(f);
        }
      }
      active.push(i);
    }
    if (toSplit.size === 0) return total;
    const byLoop = new Map<number, number[]>();
    for (const e of toSplit) {
      const l = byLoop.get(e.loop) ?? [];
      l.push(e.i);
      byLoop.set(e.loop, l);
    }
    for (const [li, idx] of byLoop) {
      const verts = loops[li];
      for (const i of idx.sort((a, b) => b - a)) {
        const a = verts[i], b = verts[(i + 1) % verts.length];
        const t1 = b.seg === a.seg ? b.t : 1;
        verts.splice(i + 1, 0, { seg: a.seg, t: (a.t + t1) / 2 });
        total++;
      }
    }
  }
  return total;
}

function segDist(e: { x0: number; y0: number; x1: number; y1: number }, f: { x0: number; y0: number; x1: number; y1: number }): number {
  const pd = (px: number, py: number, s: typeof e) => {
    const dx = s.x1 - s.x0, dy = s.y1 - s.y0;
    const L2 = dx * dx + dy * dy;
    let t = L2 > 0 ? ((px - s.x0) * dx + (py - s.y0) * dy) / L2 : 0;
    t = Math.max(0, Math.min(1, t));
    return Math.hypot(px - s.x0 - t * dx, py - s.y0 - t * dy);
  };
  // segments that cross have distance 0
  const o = (ax: number, ay: number, bx: number, by: number, cx: number, cy: number) => Math.sign((bx - ax) * (cy - ay) - (by - ay) * (cx - ax));
  if (o(e.x0, e.y0, e.x1, e.y1, f.x0, f.y0) * o(e.x0, e.y0, e.x1, e.y1, f.x1, f.y1) < 0 &&
      o(f.x0, f.y0, f.x1, f.y1, e.x0, e.y0) * o(f.x0, f.y0, f.x1, f.y1, e.x1, e.y1) < 0) return 0;
  return Math.min(pd(e.x0, e.y0, f), pd(e.x1, e.y1, f), pd(f.x0, f.y0, e), pd(f.x1, f.y1, e));
}

/** Uniform hash grid over boxes, for neighbourhood queries. */
class Grid<T> {
  private readonly cells = new Map<number, T[]>();
  constructor(private readonly size: number) {}
  private key(i: number, j: number) { return (i + 1048576) * 2097152 + (j + 1048576); }
  add(item: T, x0: number, y0: number, x1: number, y1: number): void {
    const s = this.size;
    for (let i = Math.floor(x0 / s); i <= Math.floor(x1 / s); i++) for (let j = Math.floor(y0 / s); j <= Math.floor(y1 / s); j++) {
      const k = this.key(i, j);
      const c = this.cells.get(k);
      if (c) c.push(item); else this.cells.set(k, [item]);
    }
  }
  /** Calls fn for items in cells overlapping the box (an item may come more than once). */
  query(x0: number, y0: number, x1: number, y1: number, fn: (item: T) => boolean | void): boolean {
    const s = this.size;
    for (let i = Math.floor(x0 / s); i <= Math.floor(x1 / s); i++) for (let j = Math.floor(y0 / s); j <= Math.floor(y1 / s); j++) {
      const c = this.cells.get(this.key(i, j));
      if (c) for (const it of c) if (fn(it) === true) return true;
    }
    return false;
  }
}

function pointSegDist(px: number, py: number, x0: number, y0: number, x1: number, y1: number): number {
  const dx = x1 - x0, dy = y1 - y0;
  const L2 = dx * dx + dy * dy;
  let t = L2 > 0 ? ((px - x0) * dx + (py - y0) * dy) / L2 : 0;
  t = Math.max(0, Math.min(1, t));
  return Math.hypot(px - x0 - t * dx, py - y0 - t * dy);
}

/**
 * Interior points that give each curved chord a well-shaped triangle: the apex of a near-equilateral
 * triangle on the material side (left of the chord: outer loops run counter-clockwise, holes clockwise).
 * A point is kept only where it is clear of every boundary chord and of the points already kept.
 */
function steinerPoints(loops: BVert[][], segments: Segment[]): [number, number][] {
  interface Chord { x0: number; y0: number; x1: number; y1: number; curved: boolean }
  const chords: Chord[] = [];
  for (const verts of loops) {
    for (let i = 0; i < verts.length; i++) {
      const a = verts[i], b = verts[(i + 1) % verts.length];
      const p = a.t === 0 ? segmentStart(segments[a.seg]) : segmentPoint(segments[a.seg], a.t);
      const q = b.t === 0 ? segmentStart(segments[b.seg]) : segmentPoint(segments[b.seg], b.t);
      chords.push({ x0: p[0], y0: p[1], x1: q[0], y1: q[1], curved: !ops(segments[a.seg]).straight });
    }
  }
  const curvedLens = chords.filter((c) => c.curved).map((c) => Math.hypot(c.x1 - c.x0, c.y1 - c.y0)).sort((a, b) => a - b);
  if (curvedLens.length === 0) return [];
  const cell = Math.max(curvedLens[curvedLens.length >> 1], 1e-300);
  const grid = new Grid<Chord>(cell);
  for (const c of chords) grid.add(c, Math.min(c.x0, c.x1), Math.min(c.y0, c.y1), Math.max(c.x0, c.x1), Math.max(c.y0, c.y1));
  const kept = new Grid<[number, number, number]>(cell);
  const out: [number, number][] = [];
  for (const c of chords) {
    if (!c.curved) continue;
    const dx = c.x1 - c.x0, dy = c.y1 - c.y0;
    const L = Math.hypot(dx, dy);
    const h = 0.8 * L;
    const mx = (c.x0 + c.x1) / 2, my = (c.y0 + c.y1) / 2;
    const qx = mx - dy / L * h, qy = my + dx / L * h;
    const clear = 0.7 * h;
    const blocked = grid.query(qx - clear, qy - clear, qx + clear, qy + clear, (e) => {
      if (pointSegDist(qx, qy, e.x0, e.y0, e.x1, e.y1) < clear) return true;
      // the stem from the chord's midpoint to the point must cross no other chord
      if (e !== c && segmentsCross(mx, my, qx, qy, e)) return true;
      return false;
    });
    if (blocked) continue;
    const near = kept.query(qx - clear, qy - clear, qx + clear, qy + clear, (k) => Math.hypot(k[0] - qx, k[1] - qy) < 0.6 * Math.min(h, k[2]));
    if (near) continue;
    kept.add([qx, qy, h], qx, qy, qx, qy);
    out.push([qx, qy]);
  }
  return out;
}

function segmentsCross(ax: number, ay: number, bx: number, by: number, e: { x0: number; y0: number; x1: number; y1: number }): boolean {
  const o = (px: number, py: number, qx: number, qy: number, rx: number, ry: number) => (qx - px) * (ry - py) - (qy - py) * (rx - px);
  const d1 = o(ax, ay, bx, by, e.x0, e.y0), d2 = o(ax, ay, bx, by, e.x1, e.y1);
  const d3 = o(e.x0, e.y0, e.x1, e.y1, ax, ay), d4 = o(e.x0, e.y0, e.x1, e.y1, bx, by);
  return d1 * d2 <= 0 && d3 * d4 <= 0;
}

function triangulate(loops: BVert[][], segments: Segment[], origin: [number, number], mode: 'delaunay' | 'sweep', extra: [number, number][] = []): Mesh {
  const pts: [number, number][] = [];
  const edges: [number, number][] = [];
  // chord table keyed by the vertex pair
  const chordOf = new Map<number, { seg: number; s0: number; s1: number; from: number }>();
  let total = 0;
  for (const v of loops) total += v.length;
  for (const verts of loops) {
    const base = pts.length;
    for (const v of verts) pts.push(v.t === 0 ? segmentStart(segments[v.seg]) : segmentPoint(segments[v.seg], v.t));
    for (let i = 0; i < verts.length; i++) {
      const a = base + i, b = base + (i + 1) % verts.length;
      edges.push([a, b]);
      const va = verts[i], vb = verts[(i + 1) % verts.length];
      if (!ops(segments[va.seg]).straight) {
        const s1 = vb.seg === va.seg ? vb.t : 1;
        chordOf.set(Math.min(a, b) * total + Math.max(a, b), { seg: va.seg, s0: va.t, s1, from: a });
      }
    }
  }
  for (const p of extra) pts.push(p);
  const tris = cdt2d(pts, edges, { exterior: false, delaunay: mode === 'delaunay' });
  const n = pts.length, m = tris.length;
  const coords = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) { coords[2 * i] = pts[i][0]; coords[2 * i + 1] = pts[i][1]; }
  const triangles = new Uint32Array(3 * m);
  const edgeCurve = new Int32Array(3 * m).fill(-1);
  const curveSeg: number[] = [], curveS0: number[] = [], curveS1: number[] = [];
  for (let t = 0; t < m; t++) {
    let [a, b, c] = tris[t];
    const det = (pts[b][0] - pts[a][0]) * (pts[c][1] - pts[a][1]) - (pts[c][0] - pts[a][0]) * (pts[b][1] - pts[a][1]);
    if (det < 0) [b, c] = [c, b];
    triangles[3 * t] = a; triangles[3 * t + 1] = b; triangles[3 * t + 2] = c;
    const vs = [a, b, c];
    for (let k = 0; k < 3; k++) {
      const p = vs[k], q = vs[(k + 1) % 3];
      const ch = chordOf.get(Math.min(p, q) * total + Math.max(p, q));
      if (!ch) continue;
      edgeCurve[3 * t + k] = curveSeg.length;
      curveSeg.push(ch.seg);
      if (ch.from === p) { curveS0.push(ch.s0); curveS1.push(ch.s1); } else { curveS0.push(ch.s1); curveS1.push(ch.s0); }
    }
  }
  return {
    origin, coords, triangles, edgeCurve,
    curveSeg: Uint32Array.from(curveSeg), curveS0: Float64Array.from(curveS0), curveS1: Float64Array.from(curveS1),
    segments, level: 0,
  };
}

/**
 * Keys (`seg:t` of the chord's first vertex) of chords whose curved triangle is not safely valid:
 *  - a curved edge bulges more than `maxBulge` × the triangle's height over it, or
 *  - at a vertex, curves turning into the triangle eat more than half of the corner angle, or
 *  - the map's Jacobian is not positive on a grid of probe points and near the corners.
 */
function badCurvedEdges(m: Mesh, maxBulge: number): Set<string> {
  const bad = new Set<string>();
  const map = new TriangleMap();
  // probe points: a barycentric grid (step 1/16, strictly inside) and points near the corners and edges
  const probe: [number, number][] = [[0.01, 0.01], [0.98, 0.01], [0.01, 0.98], [0.495, 0.495], [0.495, 0.01], [0.01, 0.495]];
  for (let i = 1; i < 16; i++) for (let j = 1; i + j < 16; j++) probe.push([i / 16, j / 16]);
  const d: [number, number] = [0, 0];
  const c = m.coords;
  for (let t = 0; t < m.triangles.length / 3; t++) {
    if (m.edgeCurve[3 * t] < 0 && m.edgeCurve[3 * t + 1] < 0 && m.edgeCurve[3 * t + 2] < 0) continue;
    let ok = curvedEdgeRatio(m, t) <= maxBulge;
    if (ok) {
      // corner angles: straight angle at each vertex minus the inward turn of curved edges meeting there
      const v = [m.triangles[3 * t], m.triangles[3 * t + 1], m.triangles[3 * t + 2]];
      const eat = [0, 0, 0];
      for (let k = 0; k < 3 && ok; k++) {
        const rec = m.edgeCurve[3 * t + k];
        if (rec < 0) continue;
        const a = v[k], b = v[(k + 1) % 3];
        const cx = c[2 * b] - c[2 * a], cy = c[2 * b + 1] - c[2 * a + 1];
        const s = m.segments[m.curveSeg[rec]];
        const s0 = m.curveS0[rec], s1 = m.curveS1[rec];
        const sgn = Math.sign(s1 - s0);
        // tangent at a (direction a→b) and at b (direction b→a); angle from the chord, positive = into the triangle (left of a→b)
        ops(s).derivative(s, s0, d);
        eat[k] += Math.atan2(cx * d[1] * sgn - cy * d[0] * sgn, cx * d[0] * sgn + cy * d[1] * sgn);
        ops(s).derivative(s, s1, d);
        eat[(k + 1) % 3] += -Math.atan2(cx * d[1] * sgn - cy * d[0] * sgn, cx * d[0] * sgn + cy * d[1] * sgn);
      }
      for (let k = 0; k < 3 && ok; k++) {
        const p = v[k], q = v[(k + 1) % 3], r = v[(k + 2) % 3];
        const ang = Math.abs(Math.atan2(
          (c[2 * q] - c[2 * p]) * (c[2 * r + 1] - c[2 * p + 1]) - (c[2 * q + 1] - c[2 * p + 1]) * (c[2 * r] - c[2 * p]),
          (c[2 * q] - c[2 * p]) * (c[2 * r] - c[2 * p]) + (c[2 * q + 1] - c[2 * p + 1]) * (c[2 * r + 1] - c[2 * p + 1])));
        if (eat[k] > 0.5 * ang) ok = false;
      }
    }
    if (ok) {
      map.load(m, t);
      for (const [u, w] of probe) { map.at(u, w); if (!(map.jac > 0)) { ok = false; break; } }
    }
    if (ok) continue;
    for (let k = 0; k < 3; k++) {
      const rec = m.edgeCurve[3 * t + k];
      if (rec < 0) continue;
      const s0 = Math.min(m.curveS0[rec], m.curveS1[rec]);
      bad.add(`${m.curveSeg[rec]}:${s0}`);
    }
  }
  return bad;
}
