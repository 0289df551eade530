/**
 * Closed-form section properties, as tabulated in handbook tables of plane-area properties
 * (e.g. Roark's Formulas for Stress and Strain, table of properties of sections; written here from memory).
 * Every value is checked to 1e-12 relative, and the tool's own estimate must cover the true error.
 */
import { describe, expect, it } from 'vitest';
import type { SectionResult } from '../../src/analysis/measure.js';
import { measureObj, rel } from '../helpers.js';

function expectClose(r: SectionResult, key: keyof SectionResult['quantities'], exact: number, tol = 1e-12, scale = Math.abs(exact)) {
  const q = r.quantities[key];
  const err = Math.abs(q.value - exact);
  expect(err / scale, `${key}: ${q.value} vs ${exact}`).toBeLessThan(tol);
  // the estimate must not understate the true error
  expect(q.error, `${key}: estimate ${q.error} < true error ${err}`).toBeGreaterThanOrEqual(err);
}

describe('rectangle b × h (handbook, from memory: A = bh, Ix = bh³/12, S = bh²/6)', () => {
  const b = 120, h = 30;
  const r = measureObj({ outline: { rectangle: { corner: [10, 20], size: [b, h] } } });
  it('area, centroid, second moments, moduli, radii of gyration', () => {
    expectClose(r, 'area', b * h);
    expectClose(r, 'centroidX', 10 + b / 2);
    expectClose(r, 'centroidY', 20 + h / 2);
    expectClose(r, 'Ix', b * h ** 3 / 12);
    expectClose(r, 'Iy', h * b ** 3 / 12);
    expectClose(r, 'Ixy', 0, 1e-12, b * h * b * h);
    expectClose(r, 'SxTop', b * h * h / 6);
    expectClose(r, 'SxBottom', b * h * h / 6);
    expectClose(r, 'SyLeft', h * b * b / 6);
    expectClose(r, 'rx', h / Math.sqrt(12));
    expectClose(r, 'I1', h * b ** 3 / 12);
    expectClose(r, 'I2', b * h ** 3 / 12);
    expectClose(r, 'principalAngle', 90, 1e-12, 90);
    expectClose(r, 'IxOrigin', b * h ** 3 / 12 + b * h * (20 + h / 2) ** 2);
    expectClose(r, 'perimeter', 2 * (b + h));
  });
  it('estimates of an exact (straight-edged) result fall to round-off level', () => {
    for (const [k, q] of Object.entries(r.quantities)) {
      if (k === 'principalAngle') continue;
      const scale = Math.max(Math.abs(q.value), k.startsWith('I') ? b * h * b * b : b);
      expect(q.error / scale, k).toBeLessThan(1e-12);
    }
  });
});

describe('solid circle of diameter d (handbook, from memory: A = πd²/4, I = πd⁴/64, S = πd³/32)', () => {
  const d = 50;
  const r = measureObj({ outline: { circle: { center: [-7, 3], diameter: d } } });
  it('to 1e-12 at default settings', () => {
    expectClose(r, 'area', Math.PI * d * d / 4);
    expectClose(r, 'centroidX', -7, 1e-12, d);
    expectClose(r, 'centroidY', 3, 1e-12, d);
    expectClose(r, 'Ix', Math.PI * d ** 4 / 64);
    expectClose(r, 'Iy', Math.PI * d ** 4 / 64);
    expectClose(r, 'Ixy', 0, 1e-12, d ** 4);
    expectClose(r, 'SxTop', Math.PI * d ** 3 / 32);
    expectClose(r, 'Ip', Math.PI * d ** 4 / 32);
    expectClose(r, 'rx', d / 4);
    expectClose(r, 'perimeter', Math.PI * d);
  });
  it('uses few chords (8 on a circle) and says the principal angle is undefined', () => {
    const m = r.geometry.mesh;
    let onCircle = 0;
    for (let i = 0; i < m.coords.length / 2; i++) if (Math.abs(Math.hypot(m.coords[2 * i], m.coords[2 * i + 1]) - d / 2) < 1e-9) onCircle++;
    expect(onCircle).toBe(8);
    expect(r.quantities.principalAngle.error).toBe(90);
    expect(r.warnings.map((w) => w.code)).toContain('principal-axes-undefined');
  });
});

describe('hollow circle D, d (handbook, from memory: A = π(D² − d²)/4, I = π(D⁴ − d⁴)/64)', () => {
  const D = 200, d = 160;
  const r = measureObj({ outline: { circle: { center: [0, 0], diameter: D } }, cutouts: [{ circle: { center: [0, 0], diameter: d } }] });
  it('to 1e-12', () => {
    expectClose(r, 'area', Math.PI * (D * D - d * d) / 4);
    expectClose(r, 'Ix', Math.PI * (D ** 4 - d ** 4) / 64);
    expectClose(r, 'SxTop', Math.PI * (D ** 4 - d ** 4) / (32 * D));
    expectClose(r, 'perimeter', Math.PI * (D + d));
  });
});

describe('right triangle with legs b, h at the origin (handbook, from memory: centroid (b/3, h/3), Ix = bh³/36, Ixy = −b²h²/72)', () => {
  const b = 90, h = 60;
  const r = measureObj({ outline: { polygon: [[0, 0], [b, 0], [0, h]] } });
  it('to 1e-12', () => {
    expectClose(r, 'area', b * h / 2);
    expectClose(r, 'centroidX', b / 3);
    expectClose(r, 'centroidY', h / 3);
    expectClose(r, 'Ix', b * h ** 3 / 36);
    expectClose(r, 'Iy', h * b ** 3 / 36);
    expectClose(r, 'Ixy', -(b * b * h * h) / 72);
    expectClose(r, 'IxOrigin', b * h ** 3 / 12);
    expectClose(r, 'IxyOrigin', b * b * h * h / 24);
  });
});

describe('semicircle of radius R on the x axis (handbook, from memory: ȳ = 4R/3π, Ix = (π/8 − 8/9π)R⁴, Iy = πR⁴/8)', () => {
  const R = 40;
  const r = measureObj({ outline: { path: { start: [R, 0], segments: [{ to: [-R, 0], center: [0, 0], turn: 'ccw' }] } } });
  it('to 1e-12', () => {
    expectClose(r, 'area', Math.PI * R * R / 2);
    expectClose(r, 'centroidY', 4 * R / (3 * Math.PI));
    expectClose(r, 'centroidX', 0, 1e-12, R);
    expectClose(r, 'Ix', (Math.PI / 8 - 8 / (9 * Math.PI)) * R ** 4);
    expectClose(r, 'Iy', Math.PI * R ** 4 / 8);
    expectClose(r, 'IxOrigin', Math.PI * R ** 4 / 8);
    expectClose(r, 'perimeter', Math.PI * R + 2 * R);
    expectClose(r, 'SxTop', (Math.PI / 8 - 8 / (9 * Math.PI)) * R ** 4 / (R - 4 * R / (3 * Math.PI)));
  });
});

describe('composite plates (closed forms by superposition of the handbook shapes above)', () => {
  it('annulus with six bolt holes on a pitch circle', () => {
    const D = 400, d = 200, bolt = 22, pcd = 300;
    const holes = Array.from({ length: 6 }, (_, i) => ({ circle: { center: [pcd / 2 * Math.cos(i * Math.PI / 3), pcd / 2 * Math.sin(i * Math.PI / 3)], diameter: bolt } }));
    const r = measureObj({ outline: { circle: { center: [0, 0], diameter: D } }, cutouts: [{ circle: { center: [0, 0], diameter: d } }, ...holes] });
    const a = Math.PI * bolt * bolt / 4;
    const area = Math.PI * (D * D - d * d) / 4 - 6 * a;
    // each bolt hole about the x axis: own πd⁴/64 + a·y²; Σ y² over 6 holes at 60° = 6·(pcd/2)²/2
    const Ix = Math.PI * (D ** 4 - d ** 4) / 64 - 6 * Math.PI * bolt ** 4 / 64 - a * 3 * (pcd / 2) ** 2;
    expectClose(r, 'area', area);
    expectClose(r, 'Ix', Ix);
    expectClose(r, 'Iy', Ix);
    expectClose(r, 'centroidX', 0, 1e-12, D);
  });

  it('slotted plate: rectangle minus a straight slot (rectangle + two half discs)', () => {
    const W = 300, H = 120, L = 100, w = 24, x0 = 100, y0 = 60;
    const r = measureObj({ outline: { rectangle: { corner: [0, 0], size: [W, H] } }, cutouts: [{ slot: { from: [x0, y0], to: [x0 + L, y0], width: w } }] });
    const rr = w / 2;
    const slotA = L * w + Math.PI * rr * rr;
    const area = W * H - slotA;
    // slot about its own horizontal centre line: rectangle L w³/12 + full circle π r⁴/4
    const IxSlot = L * w ** 3 / 12 + Math.PI * rr ** 4 / 4;
    // about the vertical centre line of the slot: rectangle w L³/12 + two half discs: each πr⁴/8 + (πr²/2)(L/2 + 4r/3π)² − (πr²/2)(4r/3π)²
    const half = Math.PI * rr * rr / 2, c = 4 * rr / (3 * Math.PI);
    const IySlot = w * L ** 3 / 12 + 2 * (Math.PI * rr ** 4 / 8 - half * c * c + half * (L / 2 + c) ** 2);
    const cx = (W * H * W / 2 - slotA * (x0 + L / 2)) / area;
    const Iy = H * W ** 3 / 12 + W * H * (W / 2 - cx) ** 2 - (IySlot + slotA * (x0 + L / 2 - cx) ** 2);
    const Ix = W * H ** 3 / 12 - IxSlot;
    expectClose(r, 'area', area);
    expectClose(r, 'centroidX', cx);
    expectClose(r, 'Ix', Ix);
    expectClose(r, 'Iy', Iy);
    expectClose(r, 'perimeter', 2 * (W + H) + 2 * L + Math.PI * w);
  });

  it('rounded rectangle (cornerRadius): area bh − (4 − π)r²', () => {
    const r = measureObj({ outline: { rectangle: { corner: [0, 0], size: [100, 50], cornerRadius: 8 } } });
    expectClose(r, 'area', 100 * 50 - (4 - Math.PI) * 64);
    expect(rel(r.quantities.perimeter.value, 2 * (100 + 50) - 8 * 8 + 2 * Math.PI * 8)).toBeLessThan(1e-14);
  });
});
