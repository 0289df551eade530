/**
 * Outside reference: d3-polygon (npm, general-purpose geometry library) polygonArea and polygonCentroid
 * on random simple polygons, compared with platewise's mesh-and-quadrature results.
 */
import { polygonArea, polygonCentroid } from 'd3-polygon';
import { describe, expect, it } from 'vitest';
import { measureObj, rng } from '../helpers.js';

/** A random polygon star-shaped about (cx, cy) (one vertex per angular sector, so every gap < π): simple. */
function starPolygon(rand: () => number, n: number, cx: number, cy: number, R: number): [number, number][] {
  const angles = Array.from({ length: n }, (_, i) => (i + 0.1 + 0.8 * rand()) / n * 2 * Math.PI);
  return angles.map((t) => {
    const r = R * (0.3 + 0.7 * rand());
    return [cx + r * Math.cos(t), cy + r * Math.sin(t)];
  });
}

describe('random simple polygons against d3-polygon', () => {
  const rand = rng(20261202);
  for (let k = 0; k < 25; k++) {
    const n = 3 + Math.floor(rand() * 40);
    const cx = (rand() - 0.5) * 2000, cy = (rand() - 0.5) * 2000;
    const pts = starPolygon(rand, n, cx, cy, 10 + rand() * 500);
    it(`polygon ${k} (${n} vertices)`, () => {
      const r = measureObj({ outline: { polygon: pts } });
      const area = Math.abs(polygonArea(pts));
      const [gx, gy] = polygonCentroid(pts);
      const R = Math.max(...pts.map((p) => Math.hypot(p[0] - cx, p[1] - cy)));
      expect(Math.abs(r.quantities.area.value - area) / area).toBeLessThan(1e-12);
      expect(Math.abs(r.quantities.centroidX.value - gx) / R).toBeLessThan(1e-11);
      expect(Math.abs(r.quantities.centroidY.value - gy) / R).toBeLessThan(1e-11);
    });
  }
});
