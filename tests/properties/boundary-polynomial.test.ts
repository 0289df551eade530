/**
 * Polynomial integrands from the boundary (src/properties/boundaryPolynomial.ts and each kind's
 * `greenNodes`): the rules of every kind against high-order Gauss–Legendre of the same line integrals;
 * closed forms from sympy (tests/reference/polyRefs.py → data/poly-refs.json: polar integration over
 * discs, annuli and ellipses, Green's theorem with another field on Bézier regions, iterated integrals on a
 * plate with a hole), each within its estimate; the boundary path against the mesh path on random curved
 * plates with holes (integrate and mass with a polynomial thickness), agreeing within both estimates.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzePart } from '../../src/analysis/analyze.js';
import { integrateExpression } from '../../src/analysis/plate.js';
import type { Part } from '../../src/geometry/part.js';
import { type Segment, ops } from '../../src/geometry/segments.js';
import { singleLayerModel } from '../../src/model/plate.js';
import { gaussLegendre } from '../../src/numeric/gaussLegendre.js';
import { readModels } from '../../src/read/models.js';
import { rng } from '../helpers.js';
import { fullCircle, fullEllipse, part, randomCurvedPlate } from './curvedPlates.js';

/** A random polynomial of total degree D in local (x, y), as coefficients c[i][j] of x^i y^j. */
function randomPoly(D: number, rand: () => number): number[][] {
  const c: number[][] = [];
  for (let i = 0; i <= D; i++) { c.push([]); for (let j = 0; j + i <= D; j++) c[i].push(rand() * 2 - 1); }
  return c;
}
const evalPoly = (c: number[][], x: number, y: number) => c.reduce((s, row, i) => s + row.reduce((t, a, j) => t + a * x ** i * y ** j, 0), 0);
const absPoly = (c: number[][], x: number, y: number) => c.reduce((s, row, i) => s + row.reduce((t, a, j) => t + Math.abs(a) * Math.abs(x) ** i * Math.abs(y) ** j, 0), 0);

describe('greenNodes of every kind: exact for polynomials of the degree asked', () => {
  const rand = rng(1407);
  const u = (a: number, b: number) => a + (b - a) * rand();
  const segs: Segment[] = [];
  for (let i = 0; i < 12; i++) {
    const a0 = u(-10, 10), sweep = u(-2 * Math.PI, 2 * Math.PI) * (i % 4 === 0 ? 1e-3 : 1);
    segs.push({ kind: 'line', x0: u(-3, 3), y0: u(-3, 3), x1: u(-3, 3), y1: u(-3, 3) });
    segs.push({ kind: 'arc', cx: u(-2, 2), cy: u(-2, 2), r: u(0.2, 3), a0, a1: a0 + sweep });
    segs.push({ kind: 'ellipticalArc', cx: u(-2, 2), cy: u(-2, 2), rx: u(0.2, 3), ry: u(0.2, 3), phi: u(-3, 3), t0: a0, t1: a0 + sweep });
    segs.push({ kind: 'quadratic', x0: u(-3, 3), y0: u(-3, 3), x1: u(-3, 3), y1: u(-3, 3), x2: u(-3, 3), y2: u(-3, 3) });
    segs.push({ kind: 'cubic', x0: u(-3, 3), y0: u(-3, 3), x1: u(-3, 3), y1: u(-3, 3), x2: u(-3, 3), y2: u(-3, 3), x3: u(-3, 3), y3: u(-3, 3) });
  }
  it('matches 40-point Gauss–Legendre on 16 pieces of ∫ P·(x y′ − y x′) dt, degrees 0 to 9, to 1e-13 of the magnitude', () => {
    const g = gaussLegendre(40);
    const p: [number, number] = [0, 0], d: [number, number] = [0, 0];
    let worst = 0;
    for (const s of segs) {
      for (let D = 0; D <= 9; D++) {
        const c = randomPoly(D, rand);
        const ox = u(-1, 1), oy = u(-1, 1);
        let ref = 0, mag = 0;
        for (let piece = 0; piece < 16; piece++) {
          for (let i = 0; i < 40; i++) {
            const t = (piece + (1 + g.x[i]) / 2) / 16, w = g.w[i] / 32;
            ops(s).evaluate(s, t, p, d);
            const x = p[0] - ox, y = p[1] - oy;
            ref += w * evalPoly(c, x, y) * (x * d[1] - y * d[0]);
            mag += w * absPoly(c, x, y) * (Math.abs(x * d[1]) + Math.abs(y * d[0]));
          }
        }
        // the arcs' samples go round the whole ellipse: their rounding is relative to the integrand there too
        let got = 0, nodes = 0, nodeMag = 0;
        ops(s).greenNodes(s, ox, oy, D, (x, y, w, wMag) => { got += w * evalPoly(c, x, y); nodeMag += wMag * absPoly(c, x, y); nodes++; });
        const diff = Math.abs(got - ref) / Math.max(mag, nodeMag, 1e-300);
        worst = Math.max(worst, diff);
        expect(diff, `${s.kind} degree ${D} (${nodes} nodes)`).toBeLessThan(1e-13);
      }
    }
    console.log(`greenNodes vs Gauss–Legendre 40 × 16: worst difference ${worst.toExponential(2)} of the integrand magnitude`);
  });
  it('a rule asked for degree 4 is not exact for degree 8 on a curve (the check above can fail)', () => {
    for (const s of segs.slice(1, 5)) {
      const c = randomPoly(8, rand);
      let lo = 0, hi = 0;
      ops(s).greenNodes(s, 0, 0, 4, (x, y, w) => { lo += w * evalPoly(c, x, y); });
      ops(s).greenNodes(s, 0, 0, 8, (x, y, w) => { hi += w * evalPoly(c, x, y); });
      expect(Math.abs(lo - hi), s.kind).toBeGreaterThan(1e-10 * Math.abs(hi));
    }
  });
});

// ---------------------------------------------------------------- closed forms (sympy)

interface Ref { name: string; part: Record<string, unknown>; expr: string; exact: string; value: number }
const refs = JSON.parse(readFileSync(join(import.meta.dirname, '..', 'reference', 'data', 'poly-refs.json'), 'utf8')) as Ref[];
const bez = JSON.parse(readFileSync(join(import.meta.dirname, '..', 'reference', 'data', 'bezier-refs.json'), 'utf8')) as Record<string, { loops: number[][][][] }>;
const bseg = (c: number[][]): Segment => c.length === 2
  ? { kind: 'line', x0: c[0][0], y0: c[0][1], x1: c[1][0], y1: c[1][1] }
  : c.length === 3
    ? { kind: 'quadratic', x0: c[0][0], y0: c[0][1], x1: c[1][0], y1: c[1][1], x2: c[2][0], y2: c[2][1] }
    : { kind: 'cubic', x0: c[0][0], y0: c[0][1], x1: c[1][0], y1: c[1][1], x2: c[2][0], y2: c[2][1], x3: c[3][0], y3: c[3][1] };
const rectangle = (W: number, H: number): Segment[] => [
  { kind: 'line', x0: 0, y0: 0, x1: W, y1: 0 }, { kind: 'line', x0: W, y0: 0, x1: W, y1: H },
  { kind: 'line', x0: W, y0: H, x1: 0, y1: H }, { kind: 'line', x0: 0, y0: H, x1: 0, y1: 0 },
];

function refPart(spec: Record<string, unknown>): Part {
  const [k, v] = Object.entries(spec)[0] as [string, number[] & string];
  switch (k) {
    case 'disc': return part([fullCircle(v[0], v[1], v[2], 0.4)]);
    case 'annulus': return part([fullCircle(v[0], v[1], v[3]), fullCircle(v[0], v[1], v[2], 1)]);
    case 'ellipse': return part([fullEllipse(v[0], v[1], v[2], v[3], v[4] * Math.PI / 180, 0.7)]);
    case 'quarter': {
      const [px, py, R] = v;
      return part([[{ kind: 'line', x0: px, y0: py, x1: px + R, y1: py }, { kind: 'arc', cx: px, cy: py, r: R, a0: 0, a1: Math.PI / 2 }, { kind: 'line', x0: px, y0: py + R, x1: px, y1: py }]]);
    }
    case 'bezier': return part(bez[v].loops.map((l) => l.map(bseg)));
    case 'plateWithHole': return part([rectangle(v[0], v[1]), fullCircle(v[2], v[3], v[4])]);
    default: throw new Error(k);
  }
}

describe('closed forms from sympy (tests/reference/polyRefs.py): integrate on the boundary path', () => {
  for (const ref of refs) {
    it(`${ref.name} = ${ref.exact}`, () => {
      const r = integrateExpression(refPart(ref.part), ref.expr);
      expect(r.method.estimator).toBe('exact boundary integrals');
      expect(r.method.triangles).toBe(0);
      const err = Math.abs(r.integral.value - ref.value);
      expect(r.integral.error, `estimate ${r.integral.error} below the true error ${err}`).toBeGreaterThanOrEqual(err);
      // the site case: (x − 10⁶)² near x = 10⁶ carries the rounding of x (ε·10⁶) through the square
      const site = ref.name.includes('site');
      // (at site coordinates the points themselves are rounded at ε·2·10⁶ mm, about 1e-11 of the radius)
      expect(err / Math.abs(ref.value), 'true error').toBeLessThan(site ? 1e-11 : 1e-13);
      console.log(`${ref.name}: true error ${(err / Math.abs(ref.value)).toExponential(1)}, estimate ${(r.integral.error / Math.abs(ref.value)).toExponential(1)} relative`);
      expect(r.integral.error / Math.abs(ref.value), 'estimate').toBeLessThan(site ? 1e-8 : 1e-9);
    });
  }

  it('mass of the plate with a hole and thickness 8 + 0.001x + 0.00002y² (steel 7850 kg/m³), no mesh', () => {
    const [model] = readModels(JSON.stringify({
      part: 'plate with a hole (invented)', units: 'mm', outline: { rectangle: { corner: [0, 0], size: [300, 200] } },
      cutouts: [{ circle: { center: [150, 100], diameter: 50 } }], thickness: '8 + 0.001*x + 0.00002*y^2', density: 7850,
    }), 'p.json');
    const r = analyzePart(model, { mass: 'required' });
    const V = refs.find((c) => c.name.startsWith('plate 300x200'))!.value;
    const Mx = refs.find((c) => c.name.startsWith('same plate: first moment'))!.value;
    const Z = refs.find((c) => c.name.startsWith('same plate: integral of thickness^2'))!.value;
    const q = r.mass!.quantities;
    expect(r.mass!.method.estimator).toBe('exact boundary integrals');
    const check = (k: 'mass' | 'massCentreX' | 'massCentreZ', exact: number) => {
      const err = Math.abs(q[k].value - exact);
      expect(q[k].error, `${k}: estimate ${q[k].error} below the true error ${err}`).toBeGreaterThanOrEqual(err);
      expect(err / exact, k).toBeLessThan(1e-13);
    };
    check('mass', 7850e-9 * V);
    check('massCentreX', Mx / V);
    check('massCentreZ', Z / V);
  });
});

// ---------------------------------------------------------------- both paths on random curved plates

const polyText = (c: number[][], ox: number, oy: number) =>
  c.map((row, i) => row.map((a, j) => `${a.toPrecision(6)}*(x - ${ox})^${i}*(y - ${oy})^${j}`).join(' + ')).join(' + ');

describe('boundary path against mesh path on random curved plates with holes', () => {
  const rand = rng(2214);
  for (let c = 0; c < 8; c++) {
    const plate = randomCurvedPlate(rand);
    const D = 1 + (c % 4);
    const coeffs = randomPoly(D, rand).map((row) => row.map((a) => a * 10 ** (-2 * row.length + 2)));
    const expr = polyText(coeffs, 20, -10);
    it(`plate ${c}: integrate of a degree-${D} polynomial agrees within both estimates`, () => {
      const fast = integrateExpression(plate, expr);
      const mesh = integrateExpression(plate, expr, { method: 'mesh' });
      expect(fast.method.estimator).toBe('exact boundary integrals');
      expect(mesh.method.triangles).toBeGreaterThan(0);
      for (const k of ['integral', 'momentX', 'momentY'] as const) {
        const a = fast[k], b = mesh[k];
        expect(Math.abs(a.value - b.value), `${k}: ${a.value} ± ${a.error} vs ${b.value} ± ${b.error}`).toBeLessThanOrEqual(a.error + b.error);
      }
    });
    it(`plate ${c}: mass with a thickness of degree ${Math.min(D, 2)} agrees within both estimates`, () => {
      const model = { ...singleLayerModel(plate), name: 'random curved plate (invented)' };
      const thickness = { text: D === 1 ? '6 + 0.002*x' : '6 + 0.002*x + 0.00001*(y + 30)^2', where: 'thickness' };
      const fast = analyzePart(model, { mass: 'required', given: { thickness, density: { text: '7850', where: 'density' } } });
      const mesh = analyzePart(model, { mass: 'required', given: { thickness, density: { text: '7850', where: 'density' } }, section: { method: 'mesh' } });
      expect(fast.mass!.method.estimator).toBe('exact boundary integrals');
      expect(mesh.mass!.method.triangles).toBeGreaterThan(0);
      for (const k of ['mass', 'massCentreX', 'massCentreY', 'massCentreZ', 'massMomentX', 'massMomentY', 'massMomentZ', 'massProductXY'] as const) {
        const a = fast.mass!.quantities[k], b = mesh.mass!.quantities[k];
        expect(Math.abs(a.value - b.value), `${k}: ${a.value} ± ${a.error} vs ${b.value} ± ${b.error}`).toBeLessThanOrEqual(a.error + b.error);
      }
    });
  }

  it('a thickness that interval arithmetic cannot prove positive on the box takes the mesh, which finds the bad point', () => {
    const model = singleLayerModel(randomCurvedPlate(rng(3)));
    const given = { thickness: { text: '1 - 0.1*x', where: 'thickness' }, density: { text: '7850', where: 'density' } };
    expect(() => analyzePart(model, { mass: 'required', given })).toThrow(/thickness/);
  });
});
