/**
 * Invariances any correct section-property code must show (mechanics of materials, common practice, no
 * source): translation leaves centroidal quantities unchanged; rotation leaves I1, I2, Ip and area unchanged
 * and turns the principal axis with the part; the parallel-axis theorem links origin and centroidal moments.
 */
import { describe, expect, it } from 'vitest';
import { buildMesh } from '../../src/mesh/build.js';
import { refineUniform } from '../../src/mesh/refine.js';
import { integrate } from '../../src/quadrature/integrate.js';
import { preparePart } from '../../src/analysis/measure.js';
import { partFromObject } from '../../src/read/partJson.js';
import { measureObj, rel } from '../helpers.js';

function plate(dx: number, dy: number, rot = 0) {
  const c = Math.cos(rot), s = Math.sin(rot);
  const P = (x: number, y: number) => [dx + c * x - s * y, dy + s * x + c * y];
  return {
    outline: { polygon: [P(0, 0), P(300, 0), P(300, 80), P(120, 200), P(0, 200)] },
    cutouts: [
      { circle: { center: P(60, 60), diameter: 30 } },
      { circle: { center: P(220, 40), diameter: 18 } },
      { slot: { from: P(40, 150), to: P(100, 150), width: 16 } },
    ],
  };
}

describe('translation', () => {
  const base = measureObj(plate(0, 0));
  for (const off of [1e3, 1e6, 1e7]) {
    it(`a plate moved by ${off} mm keeps centroidal results to 1e-9 relative`, () => {
      const r = measureObj(plate(off, -off));
      for (const k of ['area', 'Ix', 'Iy', 'Ixy', 'I1', 'I2', 'principalAngle'] as const) {
        expect(rel(r.quantities[k].value, base.quantities[k].value), k).toBeLessThan(1e-9);
      }
      expect(Math.abs(r.quantities.centroidX.value - off - base.quantities.centroidX.value)).toBeLessThan(1e-9 * 300);
    });
  }
});

describe('rotation', () => {
  const base = measureObj(plate(0, 0));
  for (const deg of [17, 90, 133]) {
    it(`rotating by ${deg}° keeps area, I1, I2, Ip and turns the principal axis by ${deg}°`, () => {
      const r = measureObj(plate(10, 20, deg * Math.PI / 180));
      for (const k of ['area', 'I1', 'I2', 'Ip', 'perimeter'] as const) expect(rel(r.quantities[k].value, base.quantities[k].value), k).toBeLessThan(1e-12);
      let d = (r.quantities.principalAngle.value - base.quantities.principalAngle.value - deg) % 180;
      if (d > 90) d -= 180;
      if (d < -90) d += 180;
      expect(Math.abs(d)).toBeLessThan(1e-9);
    });
  }
});

describe('parallel-axis theorem for a plate with holes', () => {
  it('origin moments integrated directly (y², x², xy in part coordinates) equal centroidal + A·d²', () => {
    const obj = plate(500, 250);
    const r = measureObj(obj);
    // direct integration of y², x², xy about the true origin, on a twice-refined mesh
    const part = preparePart(partFromObject(obj));
    const mesh = refineUniform(refineUniform(buildMesh(part).mesh));
    const direct = integrate(mesh, { degree: 12, functions: [(x, y) => y * y, (x, y) => x * x, (x, y) => x * y] }).sums;
    expect(rel(direct[6], r.quantities.IxOrigin.value)).toBeLessThan(1e-12);
    expect(rel(direct[7], r.quantities.IyOrigin.value)).toBeLessThan(1e-12);
    expect(rel(direct[8], r.quantities.IxyOrigin.value)).toBeLessThan(1e-12);
    const A = r.quantities.area.value, X = r.quantities.centroidX.value, Y = r.quantities.centroidY.value;
    expect(rel(r.quantities.Ix.value + A * Y * Y, direct[6])).toBeLessThan(1e-12);
  });
});
