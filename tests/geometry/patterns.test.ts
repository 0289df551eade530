import { describe, it, expect } from 'vitest';
import { expectSectionClose, measureObj } from '../helpers.js';
import { partFromObject } from '../../src/read/partJson.js';


describe('grid of holes', () => {
  it('nx × ny holes of diameter d: area W·H − n·πd²/4, Ix by the parallel-axis sum', () => {
    // Plate W × H from the origin; holes at (x0 + i·px, y0 + j·py). Disc about its own centre: πd⁴/64
    // (handbook, from memory); parallel-axis theorem I = I_c + A·e² (common practice, no source).
    const W = 300, H = 160, d = 14, x0 = 40, y0 = 30, px = 55, py = 33, nx = 5, ny = 4;
    const res = measureObj({
      units: 'mm', outline: { rectangle: { corner: [0, 0], size: [W, H] } },
      cutouts: [{ grid: { start: [x0, y0], pitch: [px, py], count: [nx, ny], shape: { circle: { center: [0, 0], diameter: d } } } }],
    });
    const a = (Math.PI * d * d) / 4, Ic = (Math.PI * d ** 4) / 64;
    let A = W * H, Sx = (W * H * H) / 2, Sy = (H * W * W) / 2, Ixx = (W * H ** 3) / 3, Iyy = (H * W ** 3) / 3, Ixy = (W * W * H * H) / 4;
    for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) {
      const x = x0 + i * px, y = y0 + j * py;
      A -= a; Sx -= a * y; Sy -= a * x; Ixx -= Ic + a * y * y; Iyy -= Ic + a * x * x; Ixy -= a * x * y;
    }
    const xc = Sy / A, yc = Sx / A;
    expect(Math.abs(A - (W * H - nx * ny * a)) / A).toBeLessThan(1e-14);
    expectSectionClose(res, { area: A, centroidX: xc, centroidY: yc, Ix: Ixx - A * yc * yc, Iy: Iyy - A * xc * xc, Ixy: Ixy - A * xc * yc }, W, 'grid 5×4');
    expect(res.geometry.part.regions[0].holes.length).toBe(nx * ny);
  });
  it('a grid whose last column runs off the edge makes notches (booleans)', () => {
    const res = measureObj({
      units: 'mm', outline: { rectangle: { corner: [0, 0], size: [100, 60] } },
      cutouts: [{ grid: { start: [20, 15], pitch: [40, 30], count: [3, 2], shape: { rectangle: { corner: [-5, -5], size: [10, 10] } } } }],
    });
    // column 3 is centred at x = 100: half of each 10 × 10 square is outside
    const A = 100 * 60 - 4 * 100 - 2 * 50;
    expect(Math.abs(res.quantities.area.value - A) / A).toBeLessThan(1e-14);
    expect(res.geometry.part.regions[0].holes.length).toBe(4);
  });
});

describe('ring of holes', () => {
  // n holes of diameter d on a pitch circle of diameter D about the plate centre: for n ≥ 3 equally spaced,
  // Σ cos²θk = Σ sin²θk = n/2 and Σ sin θk cos θk = 0 (common practice, no source), so the holes remove
  // n(πd⁴/64) + (πd²/4)(D/2)²(n/2) from both Ix and Iy about the centre, whatever the start angle.
  for (const [n, start] of [[6, 0], [7, 12.5], [3, 90]]) {
    it(`${n} holes starting at ${start}° in a round flange`, () => {
      const R0 = 80, D = 110, d = 12, c: [number, number] = [200, -40];
      const res = measureObj({
        units: 'mm', outline: { circle: { center: c, diameter: 2 * R0 } },
        cutouts: [{ ring: { center: c, diameter: D, count: n, startAngle: start, shape: { circle: { center: [0, 0], diameter: d } } } }],
      });
      const a = (Math.PI * d * d) / 4;
      const I = (Math.PI * R0 ** 4) / 4 - n * ((Math.PI * d ** 4) / 64 + a * (D / 2) ** 2 / 2);
      expectSectionClose(res, { area: Math.PI * R0 * R0 - n * a, centroidX: c[0], centroidY: c[1], Ix: I, Iy: I, Ixy: 0 }, 2 * R0, `ring n=${n}`);
    });
  }
  it('rotate turns each copy with its point: radial slots, Ix = Iy by symmetry and equal to the rotated sum', () => {
    // slot drawn for angle 0 pointing along +x; with rotate every slot points at the centre.
    // Slot = rectangle L × w plus two half discs; its centroidal moments along/across its axis (closed forms,
    // from memory): I_along = wL³/12 + πw⁴/64·… computed here as rectangle + disc split at the centre line:
    // I_across(axis) = L w³/12 + π w⁴/64; I_along = w L³/12 + [π w⁴/64 + (π w²/4)(L/2)²] + 2·(cross term of half discs)
    const n = 4, D = 100, L = 20, w = 6;
    const r = w / 2;
    const res = measureObj({
      units: 'mm', outline: { rectangle: { corner: [-80, -80], size: [160, 160] } },
      cutouts: [{ ring: { center: [0, 0], diameter: D, count: n, rotate: true, shape: { slot: { from: [-L / 2, 0], to: [L / 2, 0], width: w } } } }],
    });
    // half disc of radius r on a diameter, about the diameter: πr⁴/8; its centroid 4r/(3π) from it (from memory).
    // Along the slot axis u, the two half discs sit with their diameters at u = ±L/2 facing outwards:
    // ∫u² over one half disc = πr⁴/8 + (πr²/2)(L/2)² + 2·(L/2)·(πr²/2)·4r/(3π).
    const halfU2 = (Math.PI * r ** 4) / 8 + ((Math.PI * r * r) / 2) * (L / 2) ** 2 + 2 * (L / 2) * ((Math.PI * r * r) / 2) * ((4 * r) / (3 * Math.PI));
    const Iuu = (w * L ** 3) / 12 + 2 * halfU2; // ∫u² over the slot about its centre
    const Ivv = (L * w ** 3) / 12 + (Math.PI * w ** 4) / 64; // ∫v²: rectangle + the two halves making one disc
    const As = L * w + Math.PI * r * r;
    // slots at 0°, 90°, 180°, 270°, centres at distance D/2: two radial (u along x) and two tangential
    const Islots = 2 * (Iuu + As * (D / 2) ** 2) + 2 * Ivv;
    const I = 160 ** 4 / 12 - Islots;
    expectSectionClose(res, { area: 160 * 160 - n * As, centroidX: 0, centroidY: 0, Ix: I, Iy: I, Ixy: 0 }, 160, 'radial slots');
  });
});

describe('pattern input errors name the JSON path', () => {
  const bad = (cut: object) => () => partFromObject({ outline: { rectangle: { corner: [0, 0], size: [100, 100] } }, cutouts: [{ circle: { center: [50, 50], diameter: 5 } }, cut] });
  const circle = { circle: { center: [0, 0], diameter: 4 } };
  const cases: [string, object, RegExp][] = [
    ['count not whole', { grid: { start: [10, 10], pitch: [10, 10], count: [2.5, 2], shape: circle } }, /^cutouts\[1\]\.grid\.count\[0\]: expected a whole number of at least 1, got 2\.5$/],
    ['count of one', { grid: { start: [10, 10], pitch: [10, 10], count: [3], shape: circle } }, /^cutouts\[1\]\.grid\.count: expected \[columns, rows\]/],
    ['zero pitch', { grid: { start: [10, 10], pitch: [0, 10], count: [2, 2], shape: circle } }, /^cutouts\[1\]\.grid\.pitch\[0\]: expected a non-zero pitch/],
    ['missing shape', { grid: { start: [10, 10], pitch: [10, 10], count: [2, 2] } }, /^cutouts\[1\]\.grid\.shape: expected the shape to repeat \(missing\)$/],
    ['bad inner shape', { ring: { center: [50, 50], diameter: 60, count: 4, shape: { circle: { center: [0, 0], diameter: -1 } } } }, /^cutouts\[1\]\.ring\.shape\.circle\.diameter: expected a positive number/],
    ['ring count', { ring: { center: [50, 50], diameter: 60, count: 0, shape: circle } }, /^cutouts\[1\]\.ring\.count: expected a whole number of at least 1, got 0$/],
    ['ring step too big', { ring: { center: [50, 50], diameter: 60, count: 5, step: 90, shape: circle } }, /^cutouts\[1\]\.ring\.step: expected a non-zero angle/],
    ['rotate not boolean', { ring: { center: [50, 50], diameter: 60, count: 4, rotate: 'yes', shape: circle } }, /^cutouts\[1\]\.ring\.rotate: expected true or false/],
    ['unknown key', { ring: { center: [50, 50], diameter: 60, count: 4, spin: 1, shape: circle } }, /^cutouts\[1\]\.ring\.spin: unknown key/],
    ['neither shape nor pattern', { hexagon: {} }, /^cutouts\[1\]: expected exactly one of rectangle, circle, slot, polygon, path, grid, ring, got "hexagon"$/],
    ['copy outside the plate', { grid: { start: [10, 10], pitch: [200, 10], count: [2, 1], shape: circle } }, /^cutouts\[1\]\.grid\[1, 0\]: lies outside outline\.rectangle: it removes no material/],
  ];
  for (const [name, cut, re] of cases) it(name, () => expect(bad(cut)).toThrow(re));
});
