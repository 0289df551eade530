/**
 * One subdivision routine (splitTriangle) for uniform and adaptive refinement, and the structural mesh view.
 *
 * Reference values: the part is a 300 × 200 rectangle with round holes Ø40 at (80, 60) and Ø55 at (200, 120);
 * its area is 300·200 − π(20² + 27.5²) and its first moment about the y axis is
 * 300·200·150 − π·20²·80 − π·27.5²·200 (rectangle minus disks, each disk's moment = area × centre;
 * elementary geometry). The meshed region is the exact region (curved edges follow the circles), so these
 * hold to round-off.
 */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { preparePart } from '../../src/analysis/measure.js';
import { buildMesh } from '../../src/mesh/build.js';
import type { Mesh, MeshView } from '../../src/mesh/mesh.js';
import { GrowingMesh, refineUniform, splitTriangle } from '../../src/mesh/refine.js';
import { MOMENT_COUNT, integrate } from '../../src/quadrature/integrate.js';
import { partFromObject } from '../../src/read/partJson.js';

const part = preparePart(partFromObject({
  outline: { rectangle: { corner: [0, 0], size: [300, 200] } },
  cutouts: [{ circle: { center: [80, 60], diameter: 40 } }, { circle: { center: [200, 120], diameter: 55 } }],
}));
const AREA = 300 * 200 - Math.PI * (20 ** 2 + 27.5 ** 2);
const MX = 300 * 200 * 150 - Math.PI * 20 ** 2 * 80 - Math.PI * 27.5 ** 2 * 200;
const mesh: Mesh = buildMesh(part).mesh;
const fn = (x: number, y: number) => Math.exp(x / 150) * Math.cos(y / 40);
const opts = { degree: 10, perTriangle: true, functions: [fn], polynomialDegree: null };
const K = MOMENT_COUNT + 1;

/** Curved triangles and every third straight one. */
function markedSet(m: MeshView): number[] {
  const out: number[] = [];
  for (let t = 0; t < m.count; t++) {
    const curved = m.edgeCurve[3 * t] >= 0 || m.edgeCurve[3 * t + 1] >= 0 || m.edgeCurve[3 * t + 2] >= 0;
    if (curved || t % 3 === 0) out.push(t);
  }
  return out;
}

/** Split the marked triangles the adaptive way (appended, no shared midpoints); returns each one's first child. */
function splitAdaptively(g: GrowingMesh, marked: number[]): number[] {
  return marked.map((t) => { const c = g.count; splitTriangle(g, t, g, c, null); return c; });
}

describe('uniform and adaptive refinement share one subdivision', () => {
  const uniform = refineUniform(mesh);
  const perU = integrate(uniform, opts).perTriangle!;
  const marked = markedSet(mesh);

  for (const spare of [8, 1]) {
    it(`identical children, to the bit, on the same marked set (growing mesh with ${spare === 1 ? 'no spare room: it must grow' : 'spare room'})`, () => {
      const g = GrowingMesh.copyOf(mesh, spare);
      const first = splitAdaptively(g, marked);
      const children = Uint32Array.from(first.flatMap((c) => [c, c + 1, c + 2, c + 3]));
      const perG = integrate(g, { ...opts, only: children }).perTriangle!;
      expect(marked.length).toBeGreaterThan(20);
      expect(g.count).toBe(mesh.count + 4 * marked.length);
      let sumU = 0, sumG = 0;
      marked.forEach((t, i) => {
        for (let j = 0; j < 4; j++) {
          const a = (first[i] + j) * K, b = (4 * t + j) * K;
          for (let k = 0; k < K; k++) expect(perG[a + k]).toBe(perU[b + k]);
          sumG += perG[a + 6]; sumU += perU[b + 6];
          // the same vertices, in the same order
          for (let v = 0; v < 3; v++) {
            const p = g.triangles[3 * (first[i] + j) + v], q = uniform.triangles[3 * (4 * t + j) + v];
            expect([g.coords[2 * p], g.coords[2 * p + 1]]).toEqual([uniform.coords[2 * q], uniform.coords[2 * q + 1]]);
          }
        }
      });
      expect(sumG).toBe(sumU);
    });
  }

  it('leaves of a partial refinement (hanging nodes) cover the exact region: area and first moment to round-off', () => {
    const g = GrowingMesh.copyOf(mesh);
    const first = splitAdaptively(g, marked);
    const isMarked = new Set(marked);
    const leaves: number[] = [];
    for (let t = 0; t < mesh.count; t++) if (!isMarked.has(t)) leaves.push(t);
    for (const c of first) leaves.push(c, c + 1, c + 2, c + 3);
    const r = integrate(g, { degree: 10, only: Uint32Array.from(leaves) });
    const area = r.sums[0], mx = r.sums[1] + g.origin[0] * r.sums[0];
    expect(Math.abs(area - AREA) / AREA).toBeLessThan(1e-13);
    expect(Math.abs(mx - MX) / MX).toBeLessThan(1e-13);
    // uniform refinement of everything gives the same region
    const u = integrate(uniform, { degree: 10 });
    expect(Math.abs(u.sums[0] - AREA) / AREA).toBeLessThan(1e-13);
  });

  it('curved edges are split on the curve: every curved-edge end of the children lies on its circle', () => {
    const g = GrowingMesh.copyOf(mesh);
    splitAdaptively(g, marked);
    const circles = [[80, 60, 20], [200, 120, 27.5]].map(([x, y, r]) => [x - g.origin[0], y - g.origin[1], r]);
    let checked = 0;
    for (let t = mesh.count; t < g.count; t++) {
      for (let k = 0; k < 3; k++) {
        if (g.edgeCurve[3 * t + k] < 0) continue;
        for (const v of [g.triangles[3 * t + k], g.triangles[3 * t + (k + 1) % 3]]) {
          const d = Math.min(...circles.map(([cx, cy, r]) => Math.abs(Math.hypot(g.coords[2 * v] - cx, g.coords[2 * v + 1] - cy) - r)));
          expect(d).toBeLessThan(1e-12);
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(40);
  });

  it('toMesh() of a growing mesh is a finished Mesh with exactly its triangles', () => {
    const g = GrowingMesh.copyOf(mesh);
    splitAdaptively(g, marked.slice(0, 10));
    const m = g.toMesh();
    expect(m.count).toBe(g.count);
    expect(m.triangles.length).toBe(3 * g.count);
    expect(m.coords.length).toBe(2 * g.vertices);
  });
});

describe('the structural mesh view', () => {
  it('no "as unknown as" in src/ (every mesh satisfies MeshView without a cast)', () => {
    const hits: string[] = [];
    const walk = (dir: string) => {
      for (const name of readdirSync(dir)) {
        const p = join(dir, name);
        if (statSync(p).isDirectory()) walk(p);
        else if (name.endsWith('.ts') && readFileSync(p, 'utf8').includes('as unknown as')) hits.push(p);
      }
    };
    walk(join(__dirname, '..', '..', 'src'));
    expect(hits).toEqual([]);
  });
});
