/**
 * Boundary moments of every segment kind (issue 14, item 1): each kind's `moments` operation against
 * high-order Gauss–Legendre of the same line integrals; closed forms (from memory: circle πr², πr⁴/4;
 * ellipse πab, πab³/4; semicircle centroid 4r/3π); Bézier regions against exact rational references
 * (tests/reference/bezierRefs.py, sympy, a different vector field); a loop mixing lines and arcs; the
 * boundary path against the mesh path on random curved plates with holes (circular and elliptical arcs,
 * quadratic and cubic Béziers, lines), near the origin and at site coordinates of 10⁶.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { type SectionResult, measureSection } from '../../src/analysis/measure.js';
import { reverseLoop } from '../../src/geometry/part.js';
import { type Segment, ops } from '../../src/geometry/segments.js';
import { gaussLegendre } from '../../src/numeric/gaussLegendre.js';
import { SECTION_QUANTITIES } from '../../src/properties/quantities.js';
import { rng } from '../helpers.js';
import { fullCircle, fullEllipse, part, randomCurvedPlate } from './curvedPlates.js';

const EPS = Number.EPSILON;
type Q = Record<string, { value: number; error: number }>;

/** ∫ f·(x y' − y x')/(k + 2) dt over [0, 1] by an n-point Gauss–Legendre rule on each of `pieces` equal pieces. */
function referenceMoments(s: Segment, ox: number, oy: number, n = 40, pieces = 8): { m: number[]; mag: number } {
  const g = gaussLegendre(n);
  const p: [number, number] = [0, 0], d: [number, number] = [0, 0];
  const m = [0, 0, 0, 0, 0, 0];
  let mag = 0;
  for (let j = 0; j < pieces; j++) {
    for (let i = 0; i < n; i++) {
      const t = (j + (1 + g.x[i]) / 2) / pieces, w = g.w[i] / 2 / pieces;
      ops(s).evaluate(s, t, p, d);
      const x = p[0] - ox, y = p[1] - oy;
      const c = w * (x * d[1] - y * d[0]);
      const f = [1 / 2, x / 3, y / 3, x * x / 4, x * y / 4, y * y / 4];
      for (let k = 0; k < 6; k++) m[k] += c * f[k];
      mag += w * (Math.abs(x * d[1]) + Math.abs(y * d[0])) * (1 + Math.abs(x) + Math.abs(y)) ** 2;
    }
  }
  return { m, mag };
}

function randomSegments(rand: () => number): Segment[] {
  const u = (a: number, b: number) => a + (b - a) * rand();
  const out: Segment[] = [];
  for (let i = 0; i < 40; i++) {
    const cx = u(-50, 50), cy = u(-50, 50);
    const a0 = u(-10, 10), sweep = u(-2 * Math.PI, 2 * Math.PI) * (i % 5 === 0 ? 1e-4 : 1);
    out.push({ kind: 'arc', cx, cy, r: u(0.5, 40), a0, a1: a0 + sweep });
    out.push({ kind: 'ellipticalArc', cx, cy, rx: u(0.5, 40), ry: u(0.5, 40), phi: u(-4, 4), t0: a0, t1: a0 + sweep });
    out.push({ kind: 'line', x0: u(-60, 60), y0: u(-60, 60), x1: u(-60, 60), y1: u(-60, 60) });
    out.push({ kind: 'quadratic', x0: u(-60, 60), y0: u(-60, 60), x1: u(-60, 60), y1: u(-60, 60), x2: u(-60, 60), y2: u(-60, 60) });
    out.push({ kind: 'cubic', x0: u(-60, 60), y0: u(-60, 60), x1: u(-60, 60), y1: u(-60, 60), x2: u(-60, 60), y2: u(-60, 60), x3: u(-60, 60), y3: u(-60, 60) });
  }
  return out;
}

describe('the moments operation of every kind', () => {
  const rand = rng(14);
  const segs = randomSegments(rand);
  it('equals high-order Gauss–Legendre of the same line integrals, within its own round-off bound', () => {
    let worst = 0;
    for (const s of segs) {
      const ox = (rand() - 0.5) * 20, oy = (rand() - 0.5) * 20;
      const out = new Float64Array(12);
      ops(s).moments(s, ox, oy, out);
      const ref = referenceMoments(s, ox, oy);
      for (let k = 0; k < 6; k++) {
        const diff = Math.abs(out[k] - ref.m[k]);
        // the reference's own rounding is a few ε of its magnitude
        expect(diff, `${s.kind} moment ${k}`).toBeLessThanOrEqual(EPS * out[6 + k] + 64 * EPS * ref.mag);
        worst = Math.max(worst, diff / (ref.mag || 1));
      }
    }
    console.log(`moments vs Gauss–Legendre (40 points × 8 pieces): worst difference ${worst.toExponential(2)} of the integrand magnitude`);
  });

  it('adds to what is already in out (the moments are sums over segments)', () => {
    const s = segs[1];
    const a = new Float64Array(12), b = new Float64Array(12);
    ops(s).moments(s, 0, 0, a);
    b.fill(1);
    ops(s).moments(s, 0, 0, b);
    for (let k = 0; k < 12; k++) expect(b[k] - 1).toBeCloseTo(a[k], 10);
  });

  it('a reversed segment gives the negated moments', () => {
    for (const s of segs.slice(0, 25)) {
      const a = new Float64Array(12), b = new Float64Array(12);
      ops(s).moments(s, 1, 2, a);
      const r = ops(s).reverse(s);
      ops(r).moments(r, 1, 2, b);
      for (let k = 0; k < 6; k++) expect(Math.abs(a[k] + b[k])).toBeLessThanOrEqual(EPS * (a[6 + k] + b[6 + k]));
    }
  });
});

// ---------------------------------------------------------------- parts built from segments

/** Each value within tol of its scale (its own size, or `scale` for quantities that vanish), and its estimate at least the true error. */
function expectClose(r: SectionResult, exact: Record<string, number>, tol = 1e-13, scale: Record<string, number> = {}): void {
  expect(r.method.path).toBe('boundary');
  for (const [k, v] of Object.entries(exact)) {
    const q = (r.quantities as Q)[k];
    const err = Math.abs(q.value - v);
    expect(err, `${k}: ${q.value} vs ${v}`).toBeLessThanOrEqual(tol * (scale[k] ?? Math.max(Math.abs(v), 1)));
    expect(q.error, `${k}: estimate ${q.error} below the true error ${err}`).toBeGreaterThanOrEqual(err);
  }
}

describe('closed forms on the boundary path', () => {
  it('circle r = 25 at (−7, 3): πr², πr⁴/4', () => {
    const r = 25;
    expectClose(measureSection(part([fullCircle(-7, 3, r, 0.3)])), { area: Math.PI * r * r, centroidX: -7, centroidY: 3, Ix: Math.PI * r ** 4 / 4, Iy: Math.PI * r ** 4 / 4, Ixy: 0 }, 1e-13, { Ixy: Math.PI * r ** 4 / 4 });
  });

  it('ellipse a = 40, b = 15 turned by 30°: πab, and Ix, Iy from πab³/4, πa³b/4 rotated', () => {
    const a = 40, b = 15, phi = Math.PI / 6;
    const Iu = Math.PI * a * b ** 3 / 4, Iv = Math.PI * a ** 3 * b / 4; // about the major (u) and minor (v) axes
    const c = Math.cos(phi), s = Math.sin(phi);
    // ∫y² = Iu cos² + Iv sin², ∫x² = Iu sin² + Iv cos², ∫xy = (Iv − Iu) sin cos (the product of inertia Ixy = ∫xy)
    expectClose(measureSection(part([fullEllipse(5, -2, a, b, phi, 1)])), {
      area: Math.PI * a * b, centroidX: 5, centroidY: -2, Ix: Iu * c * c + Iv * s * s, Iy: Iu * s * s + Iv * c * c, Ixy: (Iv - Iu) * s * c,
    });
  });

  it('annulus R = 50, r = 20, hole drawn either way: π(R² − r²), π(R⁴ − r⁴)/4', () => {
    for (const hole of [fullCircle(0, 0, 20), reverseLoop({ segments: fullCircle(0, 0, 20) }).segments]) {
      expectClose(measureSection(part([fullCircle(0, 0, 50), hole])), { area: Math.PI * (2500 - 400), Ix: Math.PI * (50 ** 4 - 20 ** 4) / 4, centroidY: 0 });
    }
  });

  it('semicircle R = 40: centroid 4R/3π above the diameter, Ix = (π/8 − 8/9π)R⁴', () => {
    const R = 40;
    const semi = part([[{ kind: 'arc', cx: 10, cy: 20, r: R, a0: 0, a1: Math.PI }, { kind: 'line', x0: 10 - R, y0: 20, x1: 10 + R, y1: 20 }]]);
    expectClose(measureSection(semi), { area: Math.PI * R * R / 2, centroidX: 10, centroidY: 20 + 4 * R / (3 * Math.PI), Ix: (Math.PI / 8 - 8 / (9 * Math.PI)) * R ** 4, Iy: Math.PI * R ** 4 / 8 });
  });

  const refs = JSON.parse(readFileSync(join(import.meta.dirname, '..', 'reference', 'data', 'bezier-refs.json'), 'utf8')) as
    Record<string, { loops: number[][][][]; float: Record<string, number> }>;
  const seg = (c: number[][]): Segment => c.length === 2
    ? { kind: 'line', x0: c[0][0], y0: c[0][1], x1: c[1][0], y1: c[1][1] }
    : c.length === 3
      ? { kind: 'quadratic', x0: c[0][0], y0: c[0][1], x1: c[1][0], y1: c[1][1], x2: c[2][0], y2: c[2][1] }
      : { kind: 'cubic', x0: c[0][0], y0: c[0][1], x1: c[1][0], y1: c[1][1], x2: c[2][0], y2: c[2][1], x3: c[3][0], y3: c[3][1] };
  for (const [name, ref] of Object.entries(refs)) {
    it(`Bézier region "${name}" against exact rational integration (sympy)`, () => {
      const r = measureSection(part(ref.loops.map((l) => l.map(seg))));
      const f = ref.float;
      const cx = f.Mx / f.A, cy = f.My / f.A;
      expectClose(r, { area: f.A, centroidX: cx, centroidY: cy, IyOrigin: f.Ixx, IxOrigin: f.Iyy, IxyOrigin: f.Ixy }, 1e-12);
      // and the mesh path agrees within both estimates
      const m = measureSection(part(ref.loops.map((l) => l.map(seg))), { method: 'mesh' });
      for (const k of ['area', 'centroidX', 'centroidY', 'Ix', 'Iy', 'Ixy']) {
        const a = (r.quantities as Q)[k], b = (m.quantities as Q)[k];
        expect(Math.abs(a.value - b.value), k).toBeLessThanOrEqual(a.error + b.error);
      }
    });
  }
});

describe('a loop mixing lines and arcs (the trap of a field per kind)', () => {
  // quarter disc R with its corner at (px, py): two lines and an arc. Closed forms (from memory):
  // A = πR²/4, centroid 4R/3π from each straight edge, ∫(x − px)² dA = πR⁴/16 = ∫(y − py)², ∫(x − px)(y − py) = R⁴/8
  const R = 30, px = 120, py = -45;
  const q = part([[
    { kind: 'line', x0: px, y0: py, x1: px + R, y1: py },
    { kind: 'arc', cx: px, cy: py, r: R, a0: 0, a1: Math.PI / 2 },
    { kind: 'line', x0: px, y0: py + R, x1: px, y1: py },
  ]]);
  const A = Math.PI * R * R / 4, c = 4 * R / (3 * Math.PI);
  it('matches the closed forms on the boundary path', () => {
    expectClose(measureSection(q), { area: A, centroidX: px + c, centroidY: py + c, Ix: Math.PI * R ** 4 / 16 - A * c * c, Ixy: R ** 4 / 8 - A * c * c });
  });
  it('the arc alone with another field (Q = x·y, P = 0 for ∫y) would give a different share: only the loop sum is field-free', () => {
    // the arc's share of ∫y with the polygon formula's field against the same share with F = (0, x·y)
    const arc = q.regions[0].outer.segments[1];
    const out = new Float64Array(12);
    ops(arc).moments(arc, 0, 0, out);
    const g = gaussLegendre(30), p: [number, number] = [0, 0], d: [number, number] = [0, 0];
    let other = 0;
    for (let i = 0; i < 30; i++) { const t = (1 + g.x[i]) / 2; ops(arc).evaluate(arc, t, p, d); other += g.w[i] / 2 * p[0] * p[1] * d[1]; }
    expect(Math.abs(out[2] - other) / Math.abs(A * (py + c))).toBeGreaterThan(0.03);
  });
});

// ---------------------------------------------------------------- random curved plates with holes

describe('boundary path against mesh path on random curved plates with holes', () => {
  const rand = rng(1414);
  const kinds = new Set<string>();
  for (let c = 0; c < 24; c++) {
    const plate = randomCurvedPlate(rand);
    for (const l of [plate.regions[0].outer, ...plate.regions[0].holes]) for (const s of l.segments) kinds.add(s.kind);
    it(`plate ${c}: every quantity agrees within both estimates, and to 1e-11 of its scale`, () => {
      const fast = measureSection(plate);
      const mesh = measureSection(plate, { method: 'mesh' });
      expect(fast.method.path).toBe('boundary');
      expect(mesh.method.path).toBe('mesh');
      const A = mesh.quantities.area.value, L = Math.max(mesh.quantities.width.value, mesh.quantities.height.value);
      const P = Math.max(Math.abs(mesh.quantities.centroidX.value), Math.abs(mesh.quantities.centroidY.value)) + L;
      for (const info of SECTION_QUANTITIES) {
        const k = info.key as keyof typeof fast.quantities;
        const a = fast.quantities[k], b = mesh.quantities[k];
        const diff = k === 'principalAngle' ? Math.min(Math.abs(a.value - b.value) % 180, 180 - Math.abs(a.value - b.value) % 180) : Math.abs(a.value - b.value);
        expect(diff, `${k}: ${a.value} ± ${a.error} vs ${b.value} ± ${b.error}`).toBeLessThanOrEqual(a.error + b.error);
        if (k === 'principalAngle') continue;
        const scale = info.dimension === 'length4' ? A * P * P : info.dimension === 'length3' ? A * P : info.dimension === 'area' ? A : P;
        expect(diff / scale, k).toBeLessThan(1e-11);
      }
    });
  }
  it('the plates use every segment kind', () => {
    expect([...kinds].sort()).toEqual(['arc', 'cubic', 'ellipticalArc', 'line', 'quadratic']);
  });
});

describe('site coordinates: the same random curved plates moved by 10⁶', () => {
  const rand = rng(6);
  for (let c = 0; c < 8; c++) {
    const seed = Math.floor(rand() * 2 ** 31);
    it(`plate ${c}: the far plate's estimates cover its difference from the near one`, () => {
      const near = measureSection(randomCurvedPlate(rng(seed)));
      const far = measureSection(randomCurvedPlate(rng(seed), [3.1e6, -1.2e6]));
      expect(far.method.path).toBe('boundary');
      // translation changes the centroid by the shift and nothing centroidal; the near plate is the truth
      // within its own (far smaller) estimate, up to the rounding of the shifted coordinates, which the far
      // plate's representation allowance covers
      const nq = near.quantities as Q, fq = far.quantities as Q;
      const shifted: Record<string, number> = { centroidX: nq.centroidX.value + 3.1e6, centroidY: nq.centroidY.value - 1.2e6 };
      for (const k of ['area', 'Ix', 'Iy', 'Ixy', 'I1', 'I2', 'centroidX', 'centroidY']) {
        const truth = shifted[k] ?? nq[k].value;
        expect(Math.abs(fq[k].value - truth), k).toBeLessThanOrEqual(fq[k].error + nq[k].error);
      }
      expect(Math.abs(fq.area.value - nq.area.value) / nq.area.value).toBeLessThan(1e-12);
    });
  }
});
