/**
 * Geometric grading toward chosen vertices (corners where a solution is singular): in each round every
 * triangle that has one of the vertices is split into four through its edge midpoints (`splitTriangle`,
 * src/mesh/refine.ts), and the mesh is made conforming again. A neighbour with a new midpoint on one edge
 * is bisected from its opposite vertex to that midpoint; one with midpoints on two or more edges is split
 * into four as well (repeated until none is left). After r rounds the triangles at the vertex are 2^−r of
 * their first size, and each ring of triangles around it is about twice the size of the ring inside it.
 *
 * Why bisected neighbours never degrade further: after a round the triangles at the vertex are corner
 * children, whose neighbours are their siblings (the middle children) and corner children of the next
 * parent around the vertex; so the next round bisects middle children only, never a triangle bisected before
 * (unless two graded vertices are so close that their patches meet, when the closure splits it into four).
 *
 * Vertex and curve-record indices of the input are kept; curved edges are split on the curve, so the graded
 * mesh covers the same exact region.
 */
import type { Mesh } from './mesh.js';
import { EdgeMidpoints, GrowingMesh, splitTriangle } from './refine.js';

/** Grade `m` toward the vertices listed (indices into m's vertices), vertex i over rounds[i] rounds. */
export function gradeTowardVertices(m: Mesh, vertices: readonly number[], rounds: readonly number[]): Mesh {
  let mesh = m;
  const nV0 = m.coords.length / 2;
  const most = Math.max(0, ...rounds);
  for (let r = 0; r < most; r++) {
    const isTarget = new Uint8Array(nV0);
    for (let i = 0; i < vertices.length; i++) if (rounds[i] > r) isTarget[vertices[i]] = 1;
    mesh = oneRound(mesh, isTarget);
  }
  return mesh;
}

function oneRound(src: Mesh, isTarget: Uint8Array): Mesh {
  const nT = src.count, T = src.triangles;
  const nV = src.coords.length / 2;
  // edge → the (at most two) triangles on it, by the key of its two vertices
  const edges = new EdgeMidpoints(nV);
  const owners = new Map<number, number[]>();
  for (let t = 0; t < nT; t++) for (let e = 0; e < 3; e++) {
    const k = edges.key(T[3 * t + e], T[3 * t + (e + 1) % 3]);
    const o = owners.get(k);
    if (o) o.push(t); else owners.set(k, [t]);
  }
  const red = new Uint8Array(nT);
  const stack: number[] = [];
  for (let t = 0; t < nT; t++) {
    if (isTarget[T[3 * t]] || isTarget[T[3 * t + 1]] || isTarget[T[3 * t + 2]]) { red[t] = 1; stack.push(t); }
  }
  // closure: a triangle with two or more split edges is split into four too
  const splitEdges = new Uint8Array(nT);
  while (stack.length > 0) {
    const t = stack.pop()!;
    for (let e = 0; e < 3; e++) {
      for (const u of owners.get(edges.key(T[3 * t + e], T[3 * t + (e + 1) % 3]))!) {
        if (u === t || red[u]) continue;
        if (++splitEdges[u] >= 2) { red[u] = 1; stack.push(u); }
      }
    }
  }
  let reds = 0;
  for (let t = 0; t < nT; t++) reds += red[t];
  const dst = GrowingMesh.copyOf(src, 1);
  dst.count = 0;
  dst.reserve(3 * reds, nT + 3 * reds + nT, 6 * reds + 2 * nT);
  const shared = new EdgeMidpoints(nV);
  for (let t = 0; t < nT; t++) if (red[t]) splitTriangle(src, t, dst, dst.count, shared);
  for (let t = 0; t < nT; t++) {
    if (red[t]) continue;
    const v = [T[3 * t], T[3 * t + 1], T[3 * t + 2]];
    const rec = [src.edgeCurve[3 * t], src.edgeCurve[3 * t + 1], src.edgeCurve[3 * t + 2]];
    let e = -1;
    for (let k = 0; k < 3 && splitEdges[t] === 1; k++) if (shared.get(shared.key(v[k], v[(k + 1) % 3])) !== undefined) e = k;
    dst.reserve(0, dst.count + 2, 2);
    const o = 3 * dst.count;
    if (e < 0) {
      for (let k = 0; k < 3; k++) { dst.triangles[o + k] = v[k]; dst.edgeCurve[o + k] = rec[k]; }
      dst.count++;
      continue;
    }
    // bisect edge e (va → vb) at its midpoint m toward the opposite vertex vc: (va, m, vc), (m, vb, vc)
    const va = v[e], vb = v[(e + 1) % 3], vc = v[(e + 2) % 3];
    const mid = shared.get(shared.key(va, vb))!;
    const re = rec[e];
    const h0 = re < 0 ? -1 : dst.addCurve(src.curveSeg[re], src.curveS0[re], (src.curveS0[re] + src.curveS1[re]) / 2);
    const h1 = re < 0 ? -1 : dst.addCurve(src.curveSeg[re], (src.curveS0[re] + src.curveS1[re]) / 2, src.curveS1[re]);
    const A = dst.triangles, B = dst.edgeCurve;
    A[o] = va; A[o + 1] = mid; A[o + 2] = vc; B[o] = h0; B[o + 1] = -1; B[o + 2] = rec[(e + 2) % 3];
    A[o + 3] = mid; A[o + 4] = vb; A[o + 5] = vc; B[o + 3] = h1; B[o + 4] = rec[(e + 1) % 3]; B[o + 5] = -1;
    dst.count += 2;
  }
  return dst.toMesh();
}
