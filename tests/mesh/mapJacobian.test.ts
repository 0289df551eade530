import { describe, expect, it } from 'vitest';
import { preparePart } from '../../src/analysis/measure.js';
import { buildMesh } from '../../src/mesh/build.js';
import { TriangleMap, isCurved } from '../../src/mesh/mesh.js';
import { partFromObject } from '../../src/read/partJson.js';

describe('curved map with its Jacobian matrix', () => {
  it('its matrix gives the determinant and matches finite differences of the map', () => {
    const p = preparePart(partFromObject({ outline: { circle: { center: [3, 1], diameter: 20 } }, cutouts: [{ slot: { from: [0, 0], to: [5, 2], width: 3 } }] }));
    const m = buildMesh(p).mesh;
    const b = new TriangleMap();
    let curved = 0;
    for (let t = 0; t < m.count; t++) {
      if (!isCurved(m, t)) continue;
      curved++;
      b.load(m, t);
      for (const [u, v] of [[0.2, 0.3], [0.6, 0.1], [0.05, 0.9], [1 / 3, 1 / 3]]) {
        b.at(u, v);
        expect(b.jac).toBe(b.xu * b.yv - b.xv * b.yu);
        const h = 1e-6;
        b.at(u + h, v); const xp = b.x, yp = b.y; b.at(u - h, v); const xm = b.x, ym = b.y;
        b.at(u, v + h); const xq = b.x, yq = b.y; b.at(u, v - h); const xr = b.x, yr = b.y;
        b.at(u, v);
        const s = Math.abs(b.xu) + Math.abs(b.xv) + Math.abs(b.yu) + Math.abs(b.yv);
        expect(Math.abs((xp - xm) / (2 * h) - b.xu) / s).toBeLessThan(1e-7);
        expect(Math.abs((yp - ym) / (2 * h) - b.yu) / s).toBeLessThan(1e-7);
        expect(Math.abs((xq - xr) / (2 * h) - b.xv) / s).toBeLessThan(1e-7);
        expect(Math.abs((yq - yr) / (2 * h) - b.yv) / s).toBeLessThan(1e-7);
      }
    }
    expect(curved).toBeGreaterThan(4);
  });
});
