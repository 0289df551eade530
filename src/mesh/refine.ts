/**
 * Subdivision: the one routine that splits a triangle into four through its edge midpoints
 * (`splitTriangle`), used both by uniform refinement (`refineUniform`: every triangle, shared edge
 * midpoints) and by adaptive refinement (src/analysis/adaptive.ts: marked triangles only, appended to a
 * `GrowingMesh`, hanging nodes allowed). A curved edge is split at its parameter midpoint, on the curve, so
 * the children cover exactly the same exact region as their parent.
 *
 * Children of triangle t, written at triangle indices c … c + 3 (c = 4t in uniform refinement):
 *   c     (v0, m01, m20)  corner at v0: first half of edge 0, second half of edge 2
 *   c + 1 (m01, v1, m12)  corner at v1: second half of edge 0, first half of edge 1
 *   c + 2 (m20, m12, v2)  corner at v2: second half of edge 1, first half of edge 2
 *   c + 3 (m01, m12, m20) middle, straight
 */
import { ops } from '../geometry/segments.js';
import type { Segment } from '../geometry/segments.js';
import type { Mesh, MeshView } from './mesh.js';

/**
 * A mesh under construction: typed arrays with spare room after the parts in use, grown by doubling.
 * It is a MeshView as it stands (TriangleMap and the integration kernel read it directly); `toMesh`
 * copies out a finished Mesh.
 */
export class GrowingMesh implements MeshView {
  coords: Float64Array;
  triangles: Uint32Array;
  edgeCurve: Int32Array;
  curveSeg: Uint32Array;
  curveS0: Float64Array;
  curveS1: Float64Array;
  /** Triangles, vertices and curve records in use. */
  count = 0;
  vertices = 0;
  curves = 0;

  constructor(
    readonly origin: [number, number],
    readonly segments: Segment[],
    readonly level: number,
    capacity: { vertices: number; triangles: number; curves: number },
  ) {
    this.coords = new Float64Array(2 * Math.max(1, capacity.vertices));
    this.triangles = new Uint32Array(3 * Math.max(1, capacity.triangles));
    this.edgeCurve = new Int32Array(3 * Math.max(1, capacity.triangles)).fill(-1);
    this.curveSeg = new Uint32Array(Math.max(1, capacity.curves));
    this.curveS0 = new Float64Array(Math.max(1, capacity.curves));
    this.curveS1 = new Float64Array(Math.max(1, capacity.curves));
  }

  /** A growing copy of `m` (same vertex, triangle and curve-record indices), with `spare` times its room. */
  static copyOf(m: Mesh, spare = 2): GrowingMesh {
    const nV = m.coords.length / 2, nC = m.curveSeg.length;
    const g = new GrowingMesh(m.origin, m.segments, m.level, {
      vertices: Math.ceil(nV * spare), triangles: Math.ceil(m.count * spare), curves: Math.ceil(nC * spare),
    });
    g.coords.set(m.coords); g.vertices = nV;
    g.triangles.set(m.triangles.subarray(0, 3 * m.count)); g.edgeCurve.set(m.edgeCurve.subarray(0, 3 * m.count)); g.count = m.count;
    g.curveSeg.set(m.curveSeg); g.curveS0.set(m.curveS0); g.curveS1.set(m.curveS1); g.curves = nC;
    return g;
  }

  /** Make room for `v` more vertices, triangles up to index `tEnd` (exclusive) and `c` more curve records. */
  reserve(v: number, tEnd: number, c: number): void {
    if (2 * (this.vertices + v) > this.coords.length) this.coords = grow(this.coords, 2 * (this.vertices + v));
    if (3 * tEnd > this.triangles.length) {
      const old = this.edgeCurve.length;
      this.triangles = grow(this.triangles, 3 * tEnd);
      this.edgeCurve = grow(this.edgeCurve, 3 * tEnd);
      this.edgeCurve.fill(-1, old);
    }
    if (this.curves + c > this.curveSeg.length) {
      this.curveSeg = grow(this.curveSeg, this.curves + c);
      this.curveS0 = grow(this.curveS0, this.curves + c);
      this.curveS1 = grow(this.curveS1, this.curves + c);
    }
  }

  /** Append a vertex (room must be reserved); returns its index. */
  addVertex(x: number, y: number): number {
    const i = this.vertices++;
    this.coords[2 * i] = x; this.coords[2 * i + 1] = y;
    return i;
  }

  /** Append a curve record (room must be reserved); returns its index. */
  addCurve(seg: number, s0: number, s1: number): number {
    const i = this.curves++;
    this.curveSeg[i] = seg; this.curveS0[i] = s0; this.curveS1[i] = s1;
    return i;
  }

  /** A finished mesh holding exactly the parts in use (arrays already of that size are not copied). */
  toMesh(): Mesh {
    return {
      origin: this.origin,
      coords: fit(this.coords, 2 * this.vertices),
      triangles: fit(this.triangles, 3 * this.count),
      edgeCurve: fit(this.edgeCurve, 3 * this.count),
      curveSeg: fit(this.curveSeg, this.curves), curveS0: fit(this.curveS0, this.curves), curveS1: fit(this.curveS1, this.curves),
      segments: this.segments,
      count: this.count,
      level: this.level,
    };
  }
}

type Growable = Float64Array | Uint32Array | Int32Array;

function grow<T extends Growable>(a: T, atLeast: number): T {
  const b = new (a.constructor as { new(n: number): T })(Math.max(atLeast, 2 * a.length));
  b.set(a);
  return b;
}

function fit<T extends Growable>(a: T, n: number): T {
  return (a.length === n ? a : a.slice(0, n)) as T;
}

/**
 * Midpoints already made, by edge, so that neighbours share them (uniform refinement). Keys combine the
 * two end vertices of the source mesh (at most 2^26 vertices keeps the key below 2^53, exact).
 */
export class EdgeMidpoints {
  private readonly map = new Map<number, number>();
  constructor(private readonly sourceVertices: number) {}
  key(a: number, b: number): number { return a < b ? a * this.sourceVertices + b : b * this.sourceVertices + a; }
  get(key: number): number | undefined { return this.map.get(key); }
  set(key: number, v: number): void { this.map.set(key, v); }
}

const P: [number, number] = [0, 0]; // module scratch for curve points

function midpoint(src: MeshView, a: number, b: number, rec: number, dst: GrowingMesh, shared: EdgeMidpoints | null): number {
  let key = 0;
  if (shared) {
    key = shared.key(a, b);
    const hit = shared.get(key);
    if (hit !== undefined) return hit;
  }
  let idx: number;
  if (rec >= 0) {
    const s = src.segments[src.curveSeg[rec]];
    ops(s).point(s, (src.curveS0[rec] + src.curveS1[rec]) / 2, P);
    idx = dst.addVertex(P[0], P[1]);
  } else {
    const c = src.coords;
    idx = dst.addVertex((c[2 * a] + c[2 * b]) / 2, (c[2 * a + 1] + c[2 * b + 1]) / 2);
  }
  if (shared) shared.set(key, idx);
  return idx;
}

/** Record for one half of curve record `rec` of src (first: from s0 to the parameter midpoint). */
function half(src: MeshView, rec: number, first: boolean, dst: GrowingMesh): number {
  if (rec < 0) return -1;
  const a = src.curveS0[rec], b = src.curveS1[rec], c = (a + b) / 2;
  return dst.addCurve(src.curveSeg[rec], first ? a : c, first ? c : b);
}

/**
 * Split triangle t of `src` into four, writing the children to `dst` at triangle indices first … first + 3
 * (see the file comment for their order) and raising dst.count to first + 4 if it was lower.
 * Precondition: dst's vertex i is src's vertex i for every vertex of t (dst is src itself, or began as a
 * copy of src's vertices). `shared` reuses midpoints made for a neighbour (null: always new vertices,
 * hanging nodes allowed, as adaptive refinement wants). Allocates only when dst must grow.
 */
export function splitTriangle(src: MeshView, t: number, dst: GrowingMesh, first: number, shared: EdgeMidpoints | null): void {
  const v0 = src.triangles[3 * t], v1 = src.triangles[3 * t + 1], v2 = src.triangles[3 * t + 2];
  const r0 = src.edgeCurve[3 * t], r1 = src.edgeCurve[3 * t + 1], r2 = src.edgeCurve[3 * t + 2];
  dst.reserve(3, first + 4, 6);
  // (when dst is src, reserve may have replaced its arrays; src reads below see the new, equal copies)
  const m01 = midpoint(src, v0, v1, r0, dst, shared);
  const m12 = midpoint(src, v1, v2, r1, dst, shared);
  const m20 = midpoint(src, v2, v0, r2, dst, shared);
  const T = dst.triangles, E = dst.edgeCurve, o = 3 * first;
  T[o] = v0; T[o + 1] = m01; T[o + 2] = m20;
  T[o + 3] = m01; T[o + 4] = v1; T[o + 5] = m12;
  T[o + 6] = m20; T[o + 7] = m12; T[o + 8] = v2;
  T[o + 9] = m01; T[o + 10] = m12; T[o + 11] = m20;
  // corner children keep half of each curved edge; the middle one is straight (records made in this order)
  E[o] = half(src, r0, true, dst); E[o + 1] = -1; E[o + 2] = half(src, r2, false, dst);
  E[o + 3] = half(src, r0, false, dst); E[o + 4] = half(src, r1, true, dst); E[o + 5] = -1;
  E[o + 6] = -1; E[o + 7] = half(src, r1, false, dst); E[o + 8] = half(src, r2, true, dst);
  E[o + 9] = -1; E[o + 10] = -1; E[o + 11] = -1;
  if (dst.count < first + 4) dst.count = first + 4;
}

/** Refine every triangle (1 → 4): the children of triangle t are 4t … 4t + 3. */
export function refineUniform(m: Mesh): Mesh {
  const nT = m.count;
  let nV = 0;
  for (let i = 0; i < 3 * nT; i++) if (m.triangles[i] + 1 > nV) nV = m.triangles[i] + 1;
  let nc = 0;
  for (let k = 0; k < 3 * nT; k++) if (m.edgeCurve[k] >= 0) nc++;
  // at most one new vertex per triangle edge; two half records per curved edge: no growth needed
  const g = new GrowingMesh(m.origin, m.segments, m.level + 1, { vertices: nV + 3 * nT, triangles: 4 * nT, curves: 2 * nc });
  g.coords.set(m.coords.subarray(0, 2 * nV));
  g.vertices = nV;
  const shared = new EdgeMidpoints(nV);
  for (let t = 0; t < nT; t++) splitTriangle(m, t, g, 4 * t, shared);
  return g.toMesh();
}

/** A mesh made of some of another mesh's triangles (coordinates and curve records are shared). */
export function selectTriangles(m: Mesh, which: ArrayLike<number>): Mesh {
  const n = which.length;
  const triangles = new Uint32Array(3 * n);
  const edgeCurve = new Int32Array(3 * n);
  for (let i = 0; i < n; i++) {
    const t = which[i];
    triangles[3 * i] = m.triangles[3 * t]; triangles[3 * i + 1] = m.triangles[3 * t + 1]; triangles[3 * i + 2] = m.triangles[3 * t + 2];
    edgeCurve[3 * i] = m.edgeCurve[3 * t]; edgeCurve[3 * i + 1] = m.edgeCurve[3 * t + 1]; edgeCurve[3 * i + 2] = m.edgeCurve[3 * t + 2];
  }
  return { ...m, triangles, edgeCurve, count: n };
}

/** Indices of the triangles with at least one curved edge, and of the straight ones. */
export function splitByCurvature(m: MeshView): { curved: Uint32Array; straight: Uint32Array } {
  const nT = m.count;
  let nc = 0;
  for (let t = 0; t < nT; t++) if (m.edgeCurve[3 * t] >= 0 || m.edgeCurve[3 * t + 1] >= 0 || m.edgeCurve[3 * t + 2] >= 0) nc++;
  const curved = new Uint32Array(nc), straight = new Uint32Array(nT - nc);
  let i = 0, j = 0;
  for (let t = 0; t < nT; t++) {
    if (m.edgeCurve[3 * t] >= 0 || m.edgeCurve[3 * t + 1] >= 0 || m.edgeCurve[3 * t + 2] >= 0) curved[i++] = t; else straight[j++] = t;
  }
  return { curved, straight };
}
