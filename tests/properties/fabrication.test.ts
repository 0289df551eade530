import { describe, it, expect } from 'vitest';
import { polygonHull } from 'd3-polygon';
import {
  minAreaRectangle, fabricationFigures, supportByOps, segmentSupport, convexHull,
} from '../../src/properties/fabrication.js';
import { circleLoop, polygonLoop, rectangleLoop, slotLoop, type Pt } from '../../src/geometry/shapes.js';
import { normalizePart, type Part, type Loop } from '../../src/geometry/part.js';
import type { ArcSegment } from '../../src/geometry/segments.js';
import { quantityInfo } from '../../src/properties/quantities.js';
import { rng as mulberry32 } from '../helpers.js';


const part = (outer: Loop, holes: Loop[] = [], more: Loop[] = []): Part =>
  normalizePart({ name: 'test', units: 'mm', regions: [{ outer, holes }, ...more.map((o) => ({ outer: o, holes: [] }))] });

const rot = (p: Pt, a: number, c: Pt = [0, 0]): Pt =>
  [c[0] + p[0] * Math.cos(a) - p[1] * Math.sin(a), c[1] + p[0] * Math.sin(a) + p[1] * Math.cos(a)];

const mod = (x: number, m: number) => ((x % m) + m) % m;
/** Angular distance between two axis directions in degrees, modulo `period`. */
const angDist = (a: number, b: number, period: number) => { const d = mod(a - b, period); return Math.min(d, period - d); };

const REL = 1e-12;

describe('minimum-area rectangle: closed forms', () => {
  it('a rotated rectangle is its own minimum rectangle (closed form: itself)', () => {
    const rnd = mulberry32(11);
    for (let k = 0; k < 50; k++) {
      const w = 1 + rnd() * 100, h = 1 + rnd() * 100, a = rnd() * 2 * Math.PI;
      const c: Pt = [rnd() * 1000, rnd() * 1000];
      const pts = ([[0, 0], [w, 0], [w, h], [0, h]] as Pt[]).map((p) => rot(p, a, c));
      const r = minAreaRectangle(part(polygonLoop(pts)));
      expect(r.method).toBe('calipers');
      expect(r.area).toBeCloseTo(w * h, 8);
      expect(Math.abs(r.area - w * h) / (w * h)).toBeLessThan(1e-11);
      expect(r.width).toBeCloseTo(Math.max(w, h), 9);
      expect(r.height).toBeCloseTo(Math.min(w, h), 9);
      const longDir = (w >= h ? a : a + Math.PI / 2) * 180 / Math.PI;
      expect(angDist(r.angle, longDir, 180)).toBeLessThan(1e-8);
      // corners are the rectangle's own corners (as a set)
      for (const q of pts) expect(Math.min(...r.corners.map((p) => Math.hypot(p[0] - q[0], p[1] - q[1])))).toBeLessThan(1e-9);
    }
  });

  it('regular hexagon of circumradius R: 2R × √3R, area 2√3R² (elementary geometry, from memory)', () => {
    for (const a of [0, 0.1, 0.7, 2]) {
      const R = 25;
      const pts = Array.from({ length: 6 }, (_, i) => rot([R * Math.cos(i * Math.PI / 3), R * Math.sin(i * Math.PI / 3)], a));
      const r = minAreaRectangle(part(polygonLoop(pts)));
      expect(Math.abs(r.area / (2 * Math.sqrt(3) * R * R) - 1)).toBeLessThan(REL);
      expect(r.width).toBeCloseTo(2 * R, 10);
      expect(r.height).toBeCloseTo(Math.sqrt(3) * R, 10);
      // the rectangles flush with edges 60° apart are equal (six-fold symmetry): 60° mod 90° = 30° of spread
      expect(r.angleSpread).toBeCloseTo(30, 9);
    }
  });

  it('a square is its own minimum rectangle, and axis-aligned shapes give angle 0', () => {
    const r = minAreaRectangle(part(polygonLoop(Array.from({ length: 4 }, (_, i) => rot([10, 0], i * Math.PI / 2 + 0.3)))));
    expect(Math.abs(r.area / 200 - 1)).toBeLessThan(REL); // square of diagonal 20: side 10√2, area 200
    const s = minAreaRectangle(part(rectangleLoop([3, 4], [50, 20])));
    expect(s.angle).toBe(0);
    expect([s.width, s.height, s.area]).toEqual([50, 20, 1000]);
    expect(s.angleSpread).toBe(0);
    expect(r.angleSpread).toBeLessThan(1e-9);
  });

  it('equilateral triangle of side a: a × (√3/2)a (elementary geometry, from memory)', () => {
    const a = 12;
    const tri = ([[0, 0], [a, 0], [a / 2, a * Math.sqrt(3) / 2]] as Pt[]).map((p) => rot(p, 0.9, [5, -7]));
    const r = minAreaRectangle(part(polygonLoop(tri)));
    expect(Math.abs(r.area / (a * a * Math.sqrt(3) / 2) - 1)).toBeLessThan(REL);
    expect(r.width).toBeCloseTo(a, 10);
    expect(r.height).toBeCloseTo(a * Math.sqrt(3) / 2, 10);
  });

  it('circle of diameter d: d × d (its width is d in every direction)', () => {
    const d = 40;
    const r = minAreaRectangle(part(circleLoop([100, -50], d)));
    expect(r.method).toBe('certified-scan');
    expect(Math.abs(r.area / (d * d) - 1)).toBeLessThan(1e-12);
    expect(r.width).toBeCloseTo(d, 10);
    expect(r.angle).toBe(0); // ties broken toward the axes
    expect(r.angleSpread).toBeGreaterThan(44.9); // every angle gives d × d: the angle is undetermined
    expect(r.lowerBound).toBeLessThanOrEqual(r.area);
    // measured certificate: the branch-and-bound stops at its evaluation cap for a circle (A is constant)
    expect((r.area - r.lowerBound) / r.area).toBeLessThan(2e-4);
  });

  it('slot of centre distance L and width w at angle α: (L + w) × w at α (segment ⊕ disc: width L|cos| + w)', () => {
    const rnd = mulberry32(3);
    for (let k = 0; k < 10; k++) {
      const L = 10 + rnd() * 90, w = 1 + rnd() * 20, al = rnd() * Math.PI;
      const r = minAreaRectangle(part(slotLoop([1, 2], [1 + L * Math.cos(al), 2 + L * Math.sin(al)], w)));
      expect(Math.abs(r.area / ((L + w) * w) - 1)).toBeLessThan(1e-9);
      expect(r.width).toBeCloseTo(L + w, 7);
      expect(r.height).toBeCloseTo(w, 7);
      expect(angDist(r.angle, al * 180 / Math.PI, 180)).toBeLessThan(1e-6);
      expect(r.angleSpread).toBeLessThan(1e-4);
      expect(r.lowerBound).toBeLessThanOrEqual(r.area);
      expect((r.area - r.lowerBound) / r.area).toBeLessThan(1e-6);
    }
  });

  it('rounded rectangle: the bounding box (A(θ) − wh = (w′²+h′²)cs + 2r(w′+h′)(c+s−1) ≥ 0, elementary)', () => {
    const r = minAreaRectangle(part(rectangleLoop([0, 0], [80, 30], 6)));
    expect(Math.abs(r.area / 2400 - 1)).toBeLessThan(1e-12);
    expect(r.angle).toBe(0);
  });
});

/** Independent brute force: project every vertex at each of n angles over [0, π/2). */
function bruteRect(pts: Pt[], n: number): number {
  let best = Infinity;
  for (let k = 0; k < n; k++) {
    const t = (k / n) * Math.PI / 2, c = Math.cos(t), s = Math.sin(t);
    let a = Infinity, b = -Infinity, e = Infinity, f = -Infinity;
    for (const p of pts) {
      const u = p[0] * c + p[1] * s, v = -p[0] * s + p[1] * c;
      if (u < a) a = u; if (u > b) b = u; if (v < e) e = v; if (v > f) f = v;
    }
    best = Math.min(best, (b - a) * (f - e));
  }
  return best;
}

describe('minimum-area rectangle against a brute-force scan of 100,000 angles', () => {
  const N = 100000, dTh = Math.PI / 2 / N;
  it('random convex polygons (hull by d3-polygon) and random non-convex star polygons', () => {
    const rnd = mulberry32(99);
    for (let k = 0; k < 12; k++) {
      let pts: Pt[];
      if (k % 2 === 0) {
        const cloud = Array.from({ length: 40 }, () => [rnd() * 100 - 50, rnd() * 60 - 30] as [number, number]);
        pts = polygonHull(cloud)!;
      } else {
        const n = 7 + Math.floor(rnd() * 20);
        pts = Array.from({ length: n }, (_, i) => {
          const t = (i + 0.8 * rnd()) / n * 2 * Math.PI, rr = 10 + rnd() * 40;
          return [rr * Math.cos(t) * 1.7, rr * Math.sin(t)] as Pt;
        });
      }
      const r = minAreaRectangle(part(polygonLoop(pts)));
      const bf = bruteRect(pts, N);
      // no sampled angle beats the exact optimum; and the scan is within its Lipschitz slack of it
      const xs = pts.map((p) => p[0]), ys = pts.map((p) => p[1]);
      const R = Math.hypot(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)) / 2;
      expect(r.area).toBeLessThanOrEqual(bf * (1 + 1e-12));
      expect(bf - r.area).toBeLessThanOrEqual(8 * R * R * dTh / 2);
      // the reported corners enclose every vertex
      const [c0, c1, , c3] = r.corners;
      const ex = [c1[0] - c0[0], c1[1] - c0[1]], ey = [c3[0] - c0[0], c3[1] - c0[1]];
      for (const p of pts) {
        const a = ((p[0] - c0[0]) * ex[0] + (p[1] - c0[1]) * ex[1]) / (ex[0] ** 2 + ex[1] ** 2);
        const b = ((p[0] - c0[0]) * ey[0] + (p[1] - c0[1]) * ey[1]) / (ey[0] ** 2 + ey[1] ** 2);
        expect(a).toBeGreaterThan(-1e-12); expect(a).toBeLessThan(1 + 1e-12);
        expect(b).toBeGreaterThan(-1e-12); expect(b).toBeLessThan(1 + 1e-12);
      }
    }
  });

  it('parts made of several circles (curved path), against a direct brute-force scan', () => {
    const rnd = mulberry32(5);
    for (let k = 0; k < 6; k++) {
      const circles = Array.from({ length: 2 + (k % 3) }, (_, i) => ({
        c: [i * 40 + rnd() * 10, rnd() * 50] as Pt, r: 3 + rnd() * 12,
      }));
      const loops = circles.map((q) => circleLoop(q.c, 2 * q.r));
      const r = minAreaRectangle(part(loops[0], [], loops.slice(1)));
      let bf = Infinity;
      for (let j = 0; j < N; j++) {
        const t = j * dTh, c = Math.cos(t), s = Math.sin(t);
        const h = (ux: number, uy: number) => Math.max(...circles.map((q) => q.c[0] * ux + q.c[1] * uy + q.r));
        bf = Math.min(bf, (h(c, s) + h(-c, -s)) * (h(-s, c) + h(s, -c)));
      }
      expect(r.area).toBeLessThanOrEqual(bf * (1 + 1e-12));
      expect(r.lowerBound).toBeLessThanOrEqual(bf);
      // the scan can only be worse than the optimum, by at most its Lipschitz slack (|A′| ≤ 8R², R = half box diagonal)
      const xs = circles.flatMap((q) => [q.c[0] - q.r, q.c[0] + q.r]), ys = circles.flatMap((q) => [q.c[1] - q.r, q.c[1] + q.r]);
      const R = Math.hypot(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)) / 2;
      expect(bf - r.area).toBeLessThanOrEqual(8 * R * R * dTh / 2);
      expect((r.area - r.lowerBound) / r.area).toBeLessThan(1e-6);
    }
  });
});

describe('support function', () => {
  it('the ops-based search agrees with the exact arc formula (cos/sin of the support angle)', () => {
    const rnd = mulberry32(17);
    let worst = 0;
    for (let k = 0; k < 2000; k++) {
      const a0 = (rnd() - 0.5) * 10, sweep = (rnd() - 0.5) * 2 * Math.PI * 1.9;
      const s: ArcSegment = { kind: 'arc', cx: rnd() * 10, cy: rnd() * 10, r: 0.5 + rnd() * 5, a0, a1: a0 + sweep };
      const t = rnd() * 2 * Math.PI, ux = Math.cos(t), uy = Math.sin(t);
      worst = Math.max(worst, Math.abs(supportByOps(s, ux, uy) - segmentSupport(s, ux, uy)));
    }
    expect(worst).toBeLessThan(1e-12);
  });
  it('convexHull drops interior and collinear points', () => {
    expect(convexHull([[0, 0], [2, 0], [1, 0], [2, 2], [0, 2], [1, 1]])).toEqual([[0, 0], [2, 0], [2, 2], [0, 2]]);
  });
});

describe('cut length, pierces, masses', () => {
  // plate 200 × 100 with round holes Ø20, Ø30 and a slot hole (centres 40 apart, width 10)
  const plate = part(rectangleLoop([0, 0], [200, 100]), [
    circleLoop([30, 50], 20), circleLoop([170, 50], 30), slotLoop([80, 50], [120, 50], 10),
  ]);
  const holeArea = Math.PI * (100 + 225) + (40 * 10 + Math.PI * 25);
  const net = 200 * 100 - holeArea;

  it('cut length against closed-form perimeters (2πr, 2(w+h), slot 2L + πw)', () => {
    const f = fabricationFigures(plate, { area: { value: net, error: 0 } });
    const inner = Math.PI * 20 + Math.PI * 30 + (2 * 40 + Math.PI * 10);
    expect(f.quantities.cutLengthOuter.value).toBeCloseTo(600, 12);
    expect(Math.abs(f.quantities.cutLengthInner.value - inner)).toBeLessThan(1e-12 * inner);
    expect(Math.abs(f.quantities.cutLength.value - (600 + inner))).toBeLessThan(1e-12 * 800);
    expect(f.quantities.pierces.value).toBe(4);
    expect(f.box).toEqual({ xMin: 0, yMin: 0, xMax: 200, yMax: 100, width: 200, height: 100 });
    expect(f.quantities.blankArea.value).toBe(20000);
    expect(f.quantities.blankAngle.error).toBeLessThan(1e-6);
    expect(Math.abs(f.quantities.scrapFraction.value - holeArea / 20000)).toBeLessThan(1e-14);
    expect(f.quantities.netMass).toBeUndefined();
    expect(f.caution).toBeUndefined();
  });

  it('pierce count over several regions', () => {
    const p = part(rectangleLoop([0, 0], [10, 10]), [circleLoop([5, 5], 2)], [circleLoop([50, 0], 4), rectangleLoop([60, 0], [5, 5])]);
    expect(fabricationFigures(p, { area: { value: 1, error: 0 } }).quantities.pierces.value).toBe(4);
  });

  it('masses: area × thickness × density with the unit factor, and the caution', () => {
    // 1000 × 500 mm, 10 mm, 7850 kg/m³ → 0.5 m² × 0.01 m × 7850 kg/m³ = 39.25 kg (arithmetic)
    const p = part(rectangleLoop([0, 0], [1000, 500]));
    const f = fabricationFigures(p, { area: { value: 500000, error: 5 }, thickness: 10, density: 7850 });
    expect(f.quantities.netMass!.value).toBeCloseTo(39.25, 12);
    expect(f.quantities.blankMass!.value).toBeCloseTo(39.25, 12);
    expect(f.quantities.netMass!.error).toBeCloseTo(39.25 * 1e-5, 12); // relative error of the area carried over
    expect(f.caution).toBe('mass');
    // the same plate in inches: 1 in = 0.0254 m exactly (NIST SP 811)
    const q = normalizePart({ name: 'in', units: 'in', regions: [{ outer: rectangleLoop([0, 0], [10, 10]), holes: [] }] });
    const g = fabricationFigures(q, { area: { value: 100, error: 0 }, thickness: 1, density: 1000 });
    expect(g.quantities.netMass!.value).toBeCloseTo(100 * 0.0254 ** 3 * 1000, 12);
  });

  it('rejects a non-positive thickness or density, and registers its keys', () => {
    const p = part(rectangleLoop([0, 0], [1, 1]));
    expect(() => fabricationFigures(p, { area: { value: 1, error: 0 }, thickness: -1, density: 1 })).toThrow(/thickness/);
    expect(() => fabricationFigures(p, { area: { value: 1, error: 0 }, density: 0 })).toThrow(/density/);
    expect(quantityInfo('blankArea')?.dimension).toBe('area');
    expect(quantityInfo('pierces')?.dimension).toBe('count');
  });
});
