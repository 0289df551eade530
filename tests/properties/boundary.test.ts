/**
 * The fast path (exact boundary formula, Green's theorem) against the mesh path on random straight-edged
 * plates with holes: two independent computations of the same exact integrals must agree to round-off.
 */
import { describe, expect, it } from 'vitest';
import { SECTION_QUANTITIES } from '../../src/properties/quantities.js';
import { measureObj, rng } from '../helpers.js';

function randomPlate(rand: () => number) {
  const n = 5 + Math.floor(rand() * 30);
  const R = 100 + rand() * 900, cx = (rand() - 0.5) * 1e4, cy = (rand() - 0.5) * 1e4;
  // star-shaped outline with radii in [0.7R, R]: the disc of radius 0.6R around the centre is material
  const outline = Array.from({ length: n }, (_, i) => {
    const t = (i + 0.1 + 0.8 * rand()) / n * 2 * Math.PI, r = R * (0.7 + 0.3 * rand());
    return [cx + r * Math.cos(t), cy + r * Math.sin(t)];
  });
  // holes: small triangles and squares on a ring of radius 0.35R, apart from each other
  const k = Math.floor(rand() * 6);
  const cutouts = Array.from({ length: k }, (_, i) => {
    const t = i / Math.max(k, 1) * 2 * Math.PI, hx = cx + 0.35 * R * Math.cos(t), hy = cy + 0.35 * R * Math.sin(t), s = 0.08 * R * (0.5 + rand());
    return rand() < 0.5
      ? { polygon: [[hx - s, hy - s], [hx + s, hy - s * rand()], [hx, hy + s]] }
      : { rectangle: { corner: [hx - s, hy - s], size: [2 * s, 1.5 * s] } };
  });
  return { outline: { polygon: outline }, cutouts };
}

describe('boundary formula vs mesh on random straight-edged plates with holes', () => {
  const rand = rng(7);
  for (let c = 0; c < 30; c++) {
    const plate = randomPlate(rand);
    it(`plate ${c}: every quantity agrees to 1e-12 of its scale`, () => {
      const fast = measureObj(plate);
      const mesh = measureObj(plate, { method: 'mesh' });
      expect(fast.method.path).toBe('boundary');
      expect(mesh.method.path).toBe('mesh');
      const A = mesh.quantities.area.value, L = Math.max(mesh.quantities.width.value, mesh.quantities.height.value);
      const P = Math.max(Math.abs(mesh.quantities.centroidX.value), Math.abs(mesh.quantities.centroidY.value)) + L;
      for (const info of SECTION_QUANTITIES) {
        const k = info.key as keyof typeof fast.quantities;
        if (k === 'principalAngle') continue;
        const scale = info.dimension === 'length4' ? A * P * P : info.dimension === 'length3' ? A * P : info.dimension === 'area' ? A : P;
        const diff = Math.abs(fast.quantities[k].value - mesh.quantities[k].value);
        expect(diff / scale, k).toBeLessThan(1e-12);
        // each path's own estimate covers the difference between the two exact computations
        expect(diff, k).toBeLessThanOrEqual(fast.quantities[k].error + mesh.quantities[k].error);
      }
    });
  }

  it('a part with an arc takes the boundary path too, and --method mesh still forces the mesh', () => {
    const r = measureObj({ outline: { rectangle: { corner: [0, 0], size: [10, 10], cornerRadius: 1 } } });
    expect(r.method.path).toBe('boundary');
    expect(measureObj({ outline: { rectangle: { corner: [0, 0], size: [10, 10], cornerRadius: 1 } } }, { method: 'mesh' }).method.path).toBe('mesh');
  });
});

describe('loop direction does not matter to the boundary formula', () => {
  it('an outline drawn clockwise with holes drawn counter-clockwise gives the same moments as the reverse', () => {
    const outline = [[0, 0], [300, 0], [300, 80], [120, 200], [0, 200]];
    const hole = [[40, 40], [80, 40], [60, 90]];
    const a = measureObj({ outline: { polygon: outline }, cutouts: [{ polygon: hole }] });
    const b = measureObj({ outline: { polygon: [...outline].reverse() }, cutouts: [{ polygon: [...hole].reverse() }] });
    expect(a.method.path).toBe('boundary');
    // closed form by the shoelace formula (common practice): outline 300·80 + trapezoid-ish top, minus the triangle
    const shoelace = (p: number[][]) => Math.abs(p.reduce((s, q, i) => s + q[0] * p[(i + 1) % p.length][1] - p[(i + 1) % p.length][0] * q[1], 0)) / 2;
    const area = shoelace(outline) - shoelace(hole);
    for (const r of [a, b]) expect(Math.abs(r.quantities.area.value - area) / area).toBeLessThan(1e-14);
    for (const k of ['centroidX', 'centroidY', 'Ix', 'Iy', 'Ixy'] as const) {
      expect(Math.abs(a.quantities[k].value - b.quantities[k].value)).toBeLessThanOrEqual(a.quantities[k].error + b.quantities[k].error);
    }
  });
});
