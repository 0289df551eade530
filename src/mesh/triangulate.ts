/**
 * Constrained triangulation of the chorded boundary (plus interior points), keeping only the material:
 * triangles inside an odd number of loops. Two back ends:
 *  - 'delaunator' (default): Delaunator's Delaunay triangulation, constraint edges restored by
 *    @kninnug/constrainautor (which re-establishes the Delaunay property away from constraints), and a
 *    flood fill over the half-edge structure that flips inside/outside at every constrained edge.
 *  - 'cdt2d' / 'sweep': cdt2d with Delaunay flips, or its monotone sweep alone.
 * See DEVELOPERS.md for the measured comparison.
 */

import { createRequire } from 'node:module';
import type Cdt2d from 'cdt2d';
import Delaunator from 'delaunator';
import { MethodError } from '../base/errors.js';

/** The package ships TypeScript source as its types, read as CommonJS under NodeNext; its ESM build has a default export. */
interface ConstrainautorLike { constrainOne(a: number, b: number): unknown; isConstrained(edge: number): boolean }
type ConstrainautorCtor = new (del: { triangles: Uint32Array; halfedges: Int32Array; coords: ArrayLike<number> }) => ConstrainautorLike;
// the package's single-file CommonJS build (robust predicates compiled in) loads faster than its ES modules
let constrainautorCtor: ConstrainautorCtor | undefined;
function Constrainautor(): ConstrainautorCtor {
  return (constrainautorCtor ??= createRequire(import.meta.url)('@kninnug/constrainautor/min') as ConstrainautorCtor);
}

export type Triangulator = 'delaunator' | 'cdt2d' | 'sweep';
export const TRIANGULATORS: readonly Triangulator[] = ['delaunator', 'cdt2d', 'sweep'];

/**
 * @param coords x0, y0, x1, y1, … (no two points equal)
 * @param edges  constraint edges as index pairs (closed, non-crossing loops)
 * @returns triangle vertex indices, three per triangle, counter-clockwise, material only
 */
export function triangulateConstrained(coords: Float64Array, edges: Uint32Array, mode: Triangulator = 'delaunator'): Uint32Array {
  const tris = mode === 'delaunator' ? viaDelaunator(coords, edges) : viaCdt2d(coords, edges, mode === 'cdt2d');
  // counter-clockwise
  for (let t = 0; t < tris.length; t += 3) {
    const a = tris[t], b = tris[t + 1], c = tris[t + 2];
    const det = (coords[2 * b] - coords[2 * a]) * (coords[2 * c + 1] - coords[2 * a + 1]) - (coords[2 * c] - coords[2 * a]) * (coords[2 * b + 1] - coords[2 * a + 1]);
    if (det < 0) { tris[t + 1] = c; tris[t + 2] = b; }
  }
  return tris;
}

function viaCdt2d(coords: Float64Array, edges: Uint32Array, delaunay: boolean): Uint32Array {
  const pts: [number, number][] = [];
  for (let i = 0; i < coords.length; i += 2) pts.push([coords[i], coords[i + 1]]);
  const e: [number, number][] = [];
  for (let i = 0; i < edges.length; i += 2) e.push([edges[i], edges[i + 1]]);
  // loaded only when asked for (it is not the default back end)
  const cdt2d = createRequire(import.meta.url)('cdt2d') as typeof Cdt2d;
  const tris = cdt2d(pts, e, { exterior: false, delaunay });
  const out = new Uint32Array(tris.length * 3);
  tris.forEach((t, i) => out.set(t, 3 * i));
  return out;
}

function viaDelaunator(coords: Float64Array, edges: Uint32Array): Uint32Array {
  const del = new Delaunator(coords);
  const con = new (Constrainautor())(del);
  try {
    for (let i = 0; i < edges.length; i += 2) con.constrainOne(edges[i], edges[i + 1]);
  } catch (e) {
    throw new MethodError('triangulation', `Delaunator with Constrainautor could not restore a boundary edge (${(e as Error).message})`, 'try another triangulation (cdt2d)');
  }
  const T = del.triangles, H = del.halfedges;
  const nT = T.length / 3;
  // parity: 0 outside, 1 inside; −1 unknown
  const state = new Int8Array(nT).fill(-1);
  const queue = new Int32Array(nT);
  let head = 0, tail = 0;
  // seeds: triangles on the convex hull; a hull edge that is a constraint has material on its inner side
  for (let e = 0; e < H.length; e++) {
    if (H[e] !== -1) continue;
    const t = (e / 3) | 0;
    const s = con.isConstrained(e) ? 1 : 0;
    if (state[t] === -1) { state[t] = s; queue[tail++] = t; }
  }
  while (head < tail) {
    const t = queue[head++];
    for (let k = 0; k < 3; k++) {
      const e = 3 * t + k;
      const o = H[e];
      if (o === -1) continue;
      const u = (o / 3) | 0;
      if (state[u] !== -1) continue;
      state[u] = con.isConstrained(e) ? 1 - state[t] : state[t];
      queue[tail++] = u;
    }
  }
  let n = 0;
  for (let t = 0; t < nT; t++) if (state[t] === 1) n++;
  const out = new Uint32Array(3 * n);
  let j = 0;
  for (let t = 0; t < nT; t++) {
    if (state[t] !== 1) continue;
    out[j++] = T[3 * t]; out[j++] = T[3 * t + 1]; out[j++] = T[3 * t + 2];
  }
  return out;
}
