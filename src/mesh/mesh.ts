/**
 * The typed-array mesh and the map from the reference triangle onto each (possibly curved) triangle.
 *
 * Triangle t has vertices triangles[3t], [3t+1], [3t+2], counter-clockwise. Its local edge k runs from
 * vertex k to vertex (k+1) % 3. edgeCurve[3t+k] is −1 for a straight edge, otherwise the index c of a
 * curve record: the edge follows segments[curveSeg[c]] from parameter curveS0[c] (at vertex k) to
 * curveS1[c] (at vertex k+1).
 *
 * Curved map (blending, smooth everywhere): with barycentric (l0, l1, l2) and, for each curved edge
 * a→b with curve γ,
 *   x(l) = Σ li·Pi + Σ_edges la·lb·S(t),  t = (1 + lb − la)/2,
 *   S(t) = [γ(s0 + (s1 − s0)t) − ((1 − t)γ(s0) + tγ(s1))] / (t(1 − t)).
 * The bracket vanishes at both ends, so S is smooth and the Jacobian is smooth on the whole triangle.
 */
import { type Segment, type SegmentOps, ops } from '../geometry/segments.js';

/**
 * The shape every integration and subdivision routine reads: a structural type, not a class, so the
 * triangulated mesh, its uniform refinements, a selection of its triangles and the adaptive integrator's
 * growing mesh all satisfy it without conversion.
 *
 * Triangles 0 … count − 1 are in use; the arrays may hold spare room after them (a growing mesh), so
 * readers take the triangle count from `count`, never from `triangles.length`. Vertices and curve records
 * are reached only through the triangles that use them.
 */
export interface MeshView {
  /** Local origin: coordinates are stored relative to it (part coordinate = origin + local). */
  readonly origin: [number, number];
  readonly coords: Float64Array;
  readonly triangles: Uint32Array;
  readonly edgeCurve: Int32Array;
  readonly curveSeg: Uint32Array;
  readonly curveS0: Float64Array;
  readonly curveS1: Float64Array;
  /** Boundary segments in local coordinates. */
  readonly segments: readonly Segment[];
  /** Triangles in use. */
  readonly count: number;
}

/** A finished mesh: its arrays hold exactly its vertices and triangles (count = triangles.length / 3). */
export interface Mesh extends MeshView {
  readonly segments: Segment[];
  /** Refinement level relative to the base mesh (0 = as triangulated). */
  level: number;
}

export const vertexCount = (m: Mesh) => m.coords.length / 2;
export const triangleCount = (m: MeshView) => m.count;

export function isCurved(m: MeshView, t: number): boolean {
  return m.edgeCurve[3 * t] >= 0 || m.edgeCurve[3 * t + 1] >= 0 || m.edgeCurve[3 * t + 2] >= 0;
}

export function countCurved(m: MeshView): number {
  let n = 0;
  for (let t = 0; t < m.count; t++) if (isCurved(m, t)) n++;
  return n;
}

/**
 * Scratch state for evaluating curved maps without allocating. One per thread of work.
 */
export class TriangleMap {
  // vertex coordinates
  x0 = 0; y0 = 0; x1 = 0; y1 = 0; x2 = 0; y2 = 0;
  /** twice the straight triangle's signed area */
  det = 0;
  curved = false;
  // per local edge: segment, parameters, curve end points
  private readonly seg: (Segment | null)[] = [null, null, null];
  /** each curved edge's kind operations, looked up once per triangle (not per quadrature point) */
  private readonly segOps: (SegmentOps<Segment> | null)[] = [null, null, null];
  private readonly s0 = new Float64Array(3);
  private readonly s1 = new Float64Array(3);
  private readonly g0 = new Float64Array(6);
  private readonly g1 = new Float64Array(6);
  private readonly p: [number, number] = [0, 0];
  private readonly d: [number, number] = [0, 0];
  /**
   * results of `at`: point, Jacobian matrix [xu xv; yu yv] with respect to the reference (l1, l2) — finite
   * elements need it for gradients — and its determinant (the area factor)
   */
  x = 0; y = 0; xu = 0; xv = 0; yu = 0; yv = 0; jac = 0;

  load(m: MeshView, t: number): this {
    const tri = m.triangles, c = m.coords;
    const a = tri[3 * t], b = tri[3 * t + 1], d = tri[3 * t + 2];
    this.x0 = c[2 * a]; this.y0 = c[2 * a + 1];
    this.x1 = c[2 * b]; this.y1 = c[2 * b + 1];
    this.x2 = c[2 * d]; this.y2 = c[2 * d + 1];
    this.det = (this.x1 - this.x0) * (this.y2 - this.y0) - (this.x2 - this.x0) * (this.y1 - this.y0);
    this.curved = false;
    for (let k = 0; k < 3; k++) {
      const rec = m.edgeCurve[3 * t + k];
      if (rec < 0) { this.seg[k] = null; this.segOps[k] = null; continue; }
      this.curved = true;
      const s = m.segments[m.curveSeg[rec]];
      this.seg[k] = s;
      this.s0[k] = m.curveS0[rec];
      this.s1[k] = m.curveS1[rec];
      const o = ops(s);
      this.segOps[k] = o;
      o.point(s, this.s0[k], this.p); this.g0[2 * k] = this.p[0]; this.g0[2 * k + 1] = this.p[1];
      o.point(s, this.s1[k], this.p); this.g1[2 * k] = this.p[0]; this.g1[2 * k + 1] = this.p[1];
    }
    return this;
  }

  /** Evaluate the map at barycentric (1 − l1 − l2, l1, l2): sets x, y, jac. */
  at(l1: number, l2: number): void {
    const l0 = 1 - l1 - l2;
    let x = l0 * this.x0 + l1 * this.x1 + l2 * this.x2;
    let y = l0 * this.y0 + l1 * this.y1 + l2 * this.y2;
    // ∂x/∂l1, ∂x/∂l2 of the affine part
    let xu = this.x1 - this.x0, yu = this.y1 - this.y0;
    let xv = this.x2 - this.x0, yv = this.y2 - this.y0;
    if (this.curved) {
      for (let k = 0; k < 3; k++) {
        const s = this.seg[k];
        if (s === null) continue;
        // edge k runs from vertex k (barycentric la) to vertex k+1 (lb)
        const la = k === 0 ? l0 : k === 1 ? l1 : l2;
        const lb = k === 0 ? l1 : k === 1 ? l2 : l0;
        // derivatives of la, lb with respect to (l1, l2)
        const dau = k === 0 ? -1 : k === 1 ? 1 : 0, dav = k === 0 ? -1 : k === 1 ? 0 : 1;
        const dbu = k === 0 ? 1 : k === 1 ? 0 : -1, dbv = k === 0 ? 0 : k === 1 ? 1 : -1;
        const t = (1 + lb - la) / 2;
        const dtu = (dbu - dau) / 2, dtv = (dbv - dav) / 2;
        const s0 = this.s0[k], s1 = this.s1[k];
        this.segOps[k]!.evaluate(s, s0 + (s1 - s0) * t, this.p, this.d);
        const gx0 = this.g0[2 * k], gy0 = this.g0[2 * k + 1], gx1 = this.g1[2 * k], gy1 = this.g1[2 * k + 1];
        const nx = this.p[0] - ((1 - t) * gx0 + t * gx1);
        const ny = this.p[1] - ((1 - t) * gy0 + t * gy1);
        const dnx = this.d[0] * (s1 - s0) - (gx1 - gx0);
        const dny = this.d[1] * (s1 - s0) - (gy1 - gy0);
        const D = t * (1 - t), dD = 1 - 2 * t;
        const Sx = nx / D, Sy = ny / D;
        const dSx = (dnx * D - nx * dD) / (D * D), dSy = (dny * D - ny * dD) / (D * D);
        const ll = la * lb;
        x += ll * Sx; y += ll * Sy;
        const llu = dau * lb + la * dbu, llv = dav * lb + la * dbv;
        xu += llu * Sx + ll * dSx * dtu; yu += llu * Sy + ll * dSy * dtu;
        xv += llv * Sx + ll * dSx * dtv; yv += llv * Sy + ll * dSy * dtv;
      }
    }
    this.x = x; this.y = y;
    this.xu = xu; this.xv = xv; this.yu = yu; this.yv = yv;
    this.jac = xu * yv - xv * yu;
  }
}

/** Largest deviation of each curved edge from its chord divided by the triangle's height over that edge. */
export function curvedEdgeRatio(m: MeshView, t: number): number {
  let worst = 0;
  const tri = m.triangles, c = m.coords;
  const v = [tri[3 * t], tri[3 * t + 1], tri[3 * t + 2]];
  const area2 = Math.abs((c[2 * v[1]] - c[2 * v[0]]) * (c[2 * v[2] + 1] - c[2 * v[0] + 1]) - (c[2 * v[2]] - c[2 * v[0]]) * (c[2 * v[1] + 1] - c[2 * v[0] + 1]));
  for (let k = 0; k < 3; k++) {
    const rec = m.edgeCurve[3 * t + k];
    if (rec < 0) continue;
    const a = v[k], b = v[(k + 1) % 3];
    const len = Math.hypot(c[2 * b] - c[2 * a], c[2 * b + 1] - c[2 * a + 1]);
    const h = area2 / len;
    const s = m.segments[m.curveSeg[rec]];
    const dev = ops(s).deviation(s, Math.min(m.curveS0[rec], m.curveS1[rec]), Math.max(m.curveS0[rec], m.curveS1[rec]));
    worst = Math.max(worst, dev / h);
  }
  return worst;
}
