/**
 * Uniform refinement: every triangle into four through its edge midpoints. A curved edge is split at its
 * parameter midpoint, on the curve, so the refined mesh covers exactly the same exact region.
 */
import { ops } from '../geometry/segments.js';
import type { Mesh } from './mesh.js';

/** Refine every triangle (1 → 4). */
export function refineUniform(m: Mesh): Mesh {
  const nT = m.triangles.length / 3;
  const nV = m.coords.length / 2;
  const mid = new Map<number, number>();
  // at most one new vertex per triangle edge
  const coords = new Float64Array(2 * (nV + 3 * nT));
  coords.set(m.coords);
  let nv = nV;
  const tri = new Uint32Array(12 * nT);
  const edgeCurve = new Int32Array(12 * nT).fill(-1);
  let nc = 0;
  for (let k = 0; k < m.edgeCurve.length; k++) if (m.edgeCurve[k] >= 0) nc++;
  const curveSeg = new Uint32Array(2 * nc), curveS0 = new Float64Array(2 * nc), curveS1 = new Float64Array(2 * nc);
  let cc = 0;
  const p: [number, number] = [0, 0];

  const midpoint = (a: number, b: number, rec: number): number => {
    const key = a < b ? a * nV + b : b * nV + a;
    const hit = mid.get(key);
    if (hit !== undefined) return hit;
    const idx = nv++;
    if (rec >= 0) {
      const s = m.segments[m.curveSeg[rec]];
      ops(s).point(s, (m.curveS0[rec] + m.curveS1[rec]) / 2, p);
      coords[2 * idx] = p[0]; coords[2 * idx + 1] = p[1];
    } else {
      coords[2 * idx] = (m.coords[2 * a] + m.coords[2 * b]) / 2;
      coords[2 * idx + 1] = (m.coords[2 * a + 1] + m.coords[2 * b + 1]) / 2;
    }
    mid.set(key, idx);
    return idx;
  };
  const half = (rec: number, first: boolean): number => {
    const a = m.curveS0[rec], b = m.curveS1[rec], c = (a + b) / 2;
    curveSeg[cc] = m.curveSeg[rec];
    curveS0[cc] = first ? a : c;
    curveS1[cc] = first ? c : b;
    return cc++;
  };

  for (let t = 0; t < nT; t++) {
    const v0 = m.triangles[3 * t], v1 = m.triangles[3 * t + 1], v2 = m.triangles[3 * t + 2];
    const r0 = m.edgeCurve[3 * t], r1 = m.edgeCurve[3 * t + 1], r2 = m.edgeCurve[3 * t + 2];
    const m01 = midpoint(v0, v1, r0), m12 = midpoint(v1, v2, r1), m20 = midpoint(v2, v0, r2);
    const o = 12 * t;
    // corner triangles keep half of each curved edge; the middle one is straight
    tri[o] = v0; tri[o + 1] = m01; tri[o + 2] = m20;
    tri[o + 3] = m01; tri[o + 4] = v1; tri[o + 5] = m12;
    tri[o + 6] = m20; tri[o + 7] = m12; tri[o + 8] = v2;
    tri[o + 9] = m01; tri[o + 10] = m12; tri[o + 11] = m20;
    // triangle (v0, m01, m20): edge 0 = v0→m01 (first half of edge 0), edge 2 = m20→v0 (second half of edge 2)
    if (r0 >= 0) edgeCurve[o + 0] = half(r0, true);
    if (r2 >= 0) edgeCurve[o + 2] = half(r2, false);
    // triangle (m01, v1, m12): edge 0 = m01→v1 (second half of edge 0), edge 1 = v1→m12 (first half of edge 1)
    if (r0 >= 0) edgeCurve[o + 3] = half(r0, false);
    if (r1 >= 0) edgeCurve[o + 4] = half(r1, true);
    // triangle (m20, m12, v2): edge 1 = m12→v2 (second half of edge 1), edge 2 = v2→m20 (first half of edge 2)
    if (r1 >= 0) edgeCurve[o + 7] = half(r1, false);
    if (r2 >= 0) edgeCurve[o + 8] = half(r2, true);
  }
  return {
    origin: m.origin,
    coords: coords.slice(0, 2 * nv),
    triangles: tri,
    edgeCurve,
    curveSeg, curveS0, curveS1,
    segments: m.segments,
    level: m.level + 1,
  };
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
  return { ...m, triangles, edgeCurve };
}

/** Indices of the triangles with at least one curved edge, and of the straight ones. */
export function splitByCurvature(m: Mesh): { curved: Uint32Array; straight: Uint32Array } {
  const nT = m.triangles.length / 3;
  let nc = 0;
  for (let t = 0; t < nT; t++) if (m.edgeCurve[3 * t] >= 0 || m.edgeCurve[3 * t + 1] >= 0 || m.edgeCurve[3 * t + 2] >= 0) nc++;
  const curved = new Uint32Array(nc), straight = new Uint32Array(nT - nc);
  let i = 0, j = 0;
  for (let t = 0; t < nT; t++) {
    if (m.edgeCurve[3 * t] >= 0 || m.edgeCurve[3 * t + 1] >= 0 || m.edgeCurve[3 * t + 2] >= 0) curved[i++] = t; else straight[j++] = t;
  }
  return { curved, straight };
}
