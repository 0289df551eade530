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
  const coords: number[] = Array.from(m.coords);
  const tri = new Uint32Array(12 * nT);
  const edgeCurve = new Int32Array(12 * nT).fill(-1);
  const curveSeg: number[] = [], curveS0: number[] = [], curveS1: number[] = [];
  const p: [number, number] = [0, 0];

  const midpoint = (a: number, b: number, rec: number): number => {
    const key = a < b ? a * nV + b : b * nV + a;
    const hit = mid.get(key);
    if (hit !== undefined) return hit;
    const idx = coords.length / 2;
    if (rec >= 0) {
      const s = m.segments[m.curveSeg[rec]];
      ops(s).point(s, (m.curveS0[rec] + m.curveS1[rec]) / 2, p);
      coords.push(p[0], p[1]);
    } else {
      coords.push((m.coords[2 * a] + m.coords[2 * b]) / 2, (m.coords[2 * a + 1] + m.coords[2 * b + 1]) / 2);
    }
    mid.set(key, idx);
    return idx;
  };
  const addCurve = (rec: number, s0: number, s1: number): number => {
    const id = curveSeg.length;
    curveSeg.push(m.curveSeg[rec]); curveS0.push(s0); curveS1.push(s1);
    return id;
  };

  for (let t = 0; t < nT; t++) {
    const v0 = m.triangles[3 * t], v1 = m.triangles[3 * t + 1], v2 = m.triangles[3 * t + 2];
    const r0 = m.edgeCurve[3 * t], r1 = m.edgeCurve[3 * t + 1], r2 = m.edgeCurve[3 * t + 2];
    const m01 = midpoint(v0, v1, r0), m12 = midpoint(v1, v2, r1), m20 = midpoint(v2, v0, r2);
    const o = 12 * t;
    // corner triangles keep half of each curved edge; the middle one is straight
    tri.set([v0, m01, m20, m01, v1, m12, m20, m12, v2, m01, m12, m20], o);
    const half = (rec: number, first: boolean) => {
      const a = m.curveS0[rec], b = m.curveS1[rec], c = (a + b) / 2;
      return first ? addCurve(rec, a, c) : addCurve(rec, c, b);
    };
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
    coords: Float64Array.from(coords),
    triangles: tri,
    edgeCurve,
    curveSeg: Uint32Array.from(curveSeg),
    curveS0: Float64Array.from(curveS0),
    curveS1: Float64Array.from(curveS1),
    segments: m.segments,
    level: m.level + 1,
  };
}
