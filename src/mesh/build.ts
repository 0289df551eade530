/**
 * From an exact part to a typed-array mesh: chord the boundary (curve-tagged), triangulate constrained to
 * the chords (Delaunator + Constrainautor by default, cdt2d on request), tag every triangle edge that lies on a curve, and split chords until every
 * curved triangle's map is safely valid.
 */
import { MethodError } from '../base/errors.js';
import { type Part, localFrame, partAbout, partBox } from '../geometry/part.js';
import { type Segment, ops, piecesForTurning, segmentStart } from '../geometry/segments.js';
import { type Mesh, TriangleMap, curvedEdgeRatio } from './mesh.js';
import { type Triangulator, triangulateConstrained } from './triangulate.js';
import { type BVert, chordEnd, collectChords, crowdedChords, interiorPoints } from './chords.js';

export interface MeshOptions {
  /** Largest tangent turning per chord on a curve, radians (default π/4: 8 chords on a circle). */
  maxTurn?: number;
  /** Triangulation back end (see triangulate.ts); default 'delaunator'. */
  triangulation?: Triangulator;
  /** Largest allowed ratio of a curved edge's deviation from its chord to the triangle's height over it. */
  maxBulge?: number;
  /**
   * Longest straight chord, in the part's unit (default: no limit, a straight segment is one chord). Set for
   * integrands that are not polynomials (see `integrandChordLength`): a long straight outline edge left whole
   * becomes the base of sliver fans, whose quadrature error dominates.
   */
  maxStraight?: number;
  /** Local origin (part coordinates); default the bounding-box centre. Meshes that are joined share one. */
  origin?: [number, number];
}

export const DEFAULT_MAX_TURN = Math.PI / 4;
export const DEFAULT_MAX_BULGE = 0.25;


/** Chosen local origin: the point the part is held about (its local frame), else the centre of its bounding box. */
export function localOrigin(part: Part): [number, number] {
  const f = localFrame(part);
  if (f !== undefined) return [f.origin[0], f.origin[1]];
  const b = partBox(part);
  return [(b[0] + b[2]) / 2, (b[1] + b[3]) / 2];
}

export interface MeshReport { mesh: Mesh; chordSplits: number; passes: number }

/** Segments of all loops (regions' outer loops then holes) and their initial chord vertices. */
function initialChords(local: Part, maxTurn: number, maxStraight = Infinity): { segments: Segment[]; loops: BVert[][] } {
  const segments: Segment[] = [];
  const loops: BVert[][] = [];
  for (const r of local.regions) {
    for (const loop of [r.outer, ...r.holes]) {
      const verts: BVert[] = [];
      for (const s of loop.segments) {
        const si = segments.length;
        segments.push(s);
        const o = ops(s);
        const n = o.straight ? Math.max(1, Math.ceil(o.length(s) / maxStraight)) : piecesForTurning(s, maxTurn);
        for (let i = 0; i < n; i++) verts.push({ seg: si, t: i / n });
      }
      loops.push(verts);
    }
  }
  return { segments, loops };
}

/**
 * The chorded boundary the mesher starts from (after separating crowded chords, before interior points),
 * in local coordinates: for benchmarks that give other triangulators exactly the same boundary.
 */
export function chordedBoundary(part: Part, options: MeshOptions = {}): { coords: Float64Array; loopStarts: number[] } {
  const origin = localOrigin(part);
  const { segments, loops } = initialChords(partAbout(part, origin), options.maxTurn ?? DEFAULT_MAX_TURN);
  separateChords(loops, segments);
  const c = collectChords(loops, segments);
  const coords = new Float64Array(2 * c.n);
  for (let i = 0; i < c.n; i++) { coords[2 * i] = c.x0[i]; coords[2 * i + 1] = c.y0[i]; }
  const loopStarts: number[] = [];
  let k = 0;
  for (const v of loops) { loopStarts.push(k); k += v.length; }
  return { coords, loopStarts };
}

/**
 * Mesh a validated, normalised part. Coordinates are moved to the local origin first.
 */
export function buildMesh(part: Part, options: MeshOptions = {}): MeshReport {
  const maxBulge = options.maxBulge ?? DEFAULT_MAX_BULGE;
  const origin = options.origin ?? localOrigin(part);
  const { segments, loops } = initialChords(partAbout(part, origin), options.maxTurn ?? DEFAULT_MAX_TURN, options.maxStraight);

  let splits = 0;
  splits += separateChords(loops, segments);
  for (let pass = 1; pass <= 12; pass++) {
    const extra = interiorPoints(collectChords(loops, segments));
    const mesh = triangulate(loops, segments, origin, options.triangulation ?? 'delaunator', extra);
    const bad = badCurvedEdges(mesh, maxBulge);
    if (bad.size === 0) return { mesh, chordSplits: splits, passes: pass };
    // split the offending chords at their parameter midpoint, on the curve
    for (const verts of loops) {
      for (let i = verts.length - 1; i >= 0; i--) {
        const key = chordKey(verts, i);
        if (!bad.has(key)) continue;
        const a = verts[i], b = verts[(i + 1) % verts.length];
        const t1 = chordEnd(a, b);
        verts.splice(i + 1, 0, { seg: a.seg, t: (a.t + t1) / 2 });
        splits++;
      }
    }
    splits += separateChords(loops, segments);
  }
  throw new MethodError('mesher', 'no valid curved triangles after 12 passes of chord splitting', 'try another triangulation (cdt2d), or a lower rule degree; a feature much thinner than its curvature radius can cause this');
}

function chordKey(verts: BVert[], i: number): string {
  const a = verts[i];
  return `${a.seg}:${a.t}`;
}

/** Split crowded curved chords (see crowdedChords) until none is left; returns the number of splits. */
function separateChords(loops: BVert[][], segments: Segment[]): number {
  let total = 0;
  let start = 0;
  for (const v of loops) start += v.length;
  for (let round = 0; round < 30; round++) {
    if (total > 20 * start + 10000) {
      throw new MethodError('mesher', `curved edges lie too close to other edges to be separated (${total} chord splits)`, 'try another triangulation (cdt2d); loops that almost touch need a finer drawing tolerance');
    }
    const crowded = crowdedChords(collectChords(loops, segments));
    if (crowded.length === 0) return total;
    // split from the back of each loop so earlier indices stay valid
    crowded.sort((p, q) => p[0] - q[0] || q[1] - p[1]);
    for (const [li, i] of crowded) {
      const verts = loops[li];
      const a = verts[i], b = verts[(i + 1) % verts.length];
      const t1 = chordEnd(a, b);
      verts.splice(i + 1, 0, { seg: a.seg, t: (a.t + t1) / 2 });
      total++;
    }
  }
  return total;
}

function triangulate(loops: BVert[][], segments: Segment[], origin: [number, number], mode: Triangulator, extra: Float64Array): Mesh {
  let total = 0;
  for (const v of loops) total += v.length;
  const n = total + extra.length / 2;
  const coords = new Float64Array(2 * n);
  const edges = new Uint32Array(2 * total);
  // chord table keyed by the vertex pair
  const chordOf = new Map<number, number>();
  const chSeg: number[] = [], chS0: number[] = [], chS1: number[] = [], chFrom: number[] = [];
  const p: [number, number] = [0, 0];
  let base = 0;
  for (const verts of loops) {
    for (let i = 0; i < verts.length; i++) {
      const v = verts[i];
      const s = segments[v.seg];
      if (v.t === 0) { const q = segmentStart(s); p[0] = q[0]; p[1] = q[1]; } else ops(s).point(s, v.t, p);
      coords[2 * (base + i)] = p[0]; coords[2 * (base + i) + 1] = p[1];
      const a = base + i, b = base + (i + 1) % verts.length;
      edges[2 * (base + i)] = a; edges[2 * (base + i) + 1] = b;
      if (!ops(s).straight) {
        const w = verts[(i + 1) % verts.length];
        chordOf.set(Math.min(a, b) * n + Math.max(a, b), chSeg.length);
        chSeg.push(v.seg); chS0.push(v.t); chS1.push(chordEnd(v, w)); chFrom.push(a);
      }
    }
    base += verts.length;
  }
  coords.set(extra, 2 * total);
  const triangles = triangulateConstrained(coords, edges, mode);
  const m = triangles.length / 3;
  const edgeCurve = new Int32Array(3 * m).fill(-1);
  const curveSeg: number[] = [], curveS0: number[] = [], curveS1: number[] = [];
  for (let t = 0; t < m; t++) {
    for (let k = 0; k < 3; k++) {
      const a = triangles[3 * t + k], b = triangles[3 * t + (k + 1) % 3];
      const ch = chordOf.get(Math.min(a, b) * n + Math.max(a, b));
      if (ch === undefined) continue;
      edgeCurve[3 * t + k] = curveSeg.length;
      curveSeg.push(chSeg[ch]);
      if (chFrom[ch] === a) { curveS0.push(chS0[ch]); curveS1.push(chS1[ch]); } else { curveS0.push(chS1[ch]); curveS1.push(chS0[ch]); }
    }
  }
  return {
    origin, coords, triangles, edgeCurve,
    curveSeg: Uint32Array.from(curveSeg), curveS0: Float64Array.from(curveS0), curveS1: Float64Array.from(curveS1),
    segments, count: m, level: 0,
  };
}

/**
 * Keys (`seg:t` of the chord's first vertex) of chords whose curved triangle is not safely valid:
 *  - a curved edge bulges more than `maxBulge` × the triangle's height over it, or
 *  - at a vertex, curves turning into the triangle eat more than half of the corner angle, or
 *  - the map's Jacobian is not positive on a barycentric grid of 10 interior points (step 1/6) and at 6 points
 *    near the corners and edges
 *    (integrate() also reports the smallest Jacobian met at the quadrature points actually used).
 */
function badCurvedEdges(m: Mesh, maxBulge: number): Set<string> {
  const bad = new Set<string>();
  const map = new TriangleMap();
  // probe points: a barycentric grid (step 1/6, strictly inside) and points near the corners and edges
  const probe: [number, number][] = [[0.01, 0.01], [0.98, 0.01], [0.01, 0.98], [0.495, 0.495], [0.495, 0.01], [0.01, 0.495]];
  for (let i = 1; i < 6; i++) for (let j = 1; i + j < 6; j++) probe.push([i / 6, j / 6]);
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

/**
 * Straight-chord length for integrands that are not polynomials: a quarter of the median chord of the
 * curves (the size the holes give the mesh), at most 1/16 of the part's box diagonal, so that no straight
 * outline edge is much longer than the triangles next to it. Measured on the 2000 × 1000 panel with 1,250
 * Ø20 holes and exp((x + y)/1000): see tests/analysis/meshShape.test.ts.
 */
export function integrandChordLength(part: Part, options: MeshOptions = {}): number {
  const b = partBox(part);
  const diag = Math.hypot(b[2] - b[0], b[3] - b[1]);
  const lens: number[] = [];
  const maxTurn = options.maxTurn ?? DEFAULT_MAX_TURN;
  for (const r of part.regions) for (const loop of [r.outer, ...r.holes]) for (const s of loop.segments) {
    const o = ops(s);
    if (!o.straight) lens.push(o.length(s) / piecesForTurning(s, maxTurn));
  }
  lens.sort((p, q) => p - q);
  const curved = lens.length > 0 ? 4 * lens[lens.length >> 1] : Infinity;
  return Math.min(diag / 16, curved);
}

/**
 * One mesh made of several meshes with the same origin (pieces of a part cut along lines): vertices,
 * triangles and curve records are appended; vertices on shared cuts are repeated (harmless for
 * integration: every triangle lies in one piece).
 */
export function joinMeshes(meshes: readonly Mesh[]): Mesh {
  if (meshes.length === 1) return meshes[0];
  const origin = meshes[0].origin;
  let nv = 0, nt = 0, nc = 0;
  for (const m of meshes) {
    if (m.origin[0] !== origin[0] || m.origin[1] !== origin[1]) throw new Error('joinMeshes: meshes with different origins');
    nv += m.coords.length / 2; nt += m.count; nc += m.curveSeg.length;
  }
  const coords = new Float64Array(2 * nv), triangles = new Uint32Array(3 * nt), edgeCurve = new Int32Array(3 * nt);
  const curveSeg = new Uint32Array(nc), curveS0 = new Float64Array(nc), curveS1 = new Float64Array(nc);
  const segments: Segment[] = [];
  let v = 0, t = 0, c = 0;
  for (const m of meshes) {
    coords.set(m.coords, 2 * v);
    for (let i = 0; i < 3 * m.count; i++) {
      triangles[3 * t + i] = m.triangles[i] + v;
      edgeCurve[3 * t + i] = m.edgeCurve[i] < 0 ? -1 : m.edgeCurve[i] + c;
    }
    for (let i = 0; i < m.curveSeg.length; i++) {
      curveSeg[c + i] = m.curveSeg[i] + segments.length;
      curveS0[c + i] = m.curveS0[i]; curveS1[c + i] = m.curveS1[i];
    }
    segments.push(...m.segments);
    v += m.coords.length / 2; t += m.count; c += m.curveSeg.length;
  }
  return { origin, coords, triangles, edgeCurve, curveSeg, curveS0, curveS1, segments, count: nt, level: 0 };
}
