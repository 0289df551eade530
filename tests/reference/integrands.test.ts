/**
 * Honest adaptive integration against outside references (issue 13, items 4, 5 and 7).
 *
 * References: tests/reference/integrands/references.json, written by tests/reference/integrands/generate.py
 * (run with /usr/bin/python3; Debian's python3-sympy, python3-scipy, python3-mpmath). Each case names its
 * source there: "sympy" (exact symbolic integration), "mpmath" (closed forms at 40 digits: the error function
 * for the Gaussian bump, an antiderivative checked by sympy for the near-singular case, Bessel J1/I1 for
 * discs in the panel), with scipy.integrate.quad agreeing on the kink cases.
 *
 * Before figures (commit 453840a, the same cases) are quoted beside each item's test.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEFAULT_INTEGRAL_TOLERANCE, integrateExpression } from '../../src/analysis/plate.js';
import { partFromObject } from '../../src/read/partJson.js';
import { judge } from '../../src/qa/verdict.js';
import { integralJson, integralText } from '../../src/output/massText.js';
import type { Part } from '../../src/geometry/part.js';

interface Ref { value: number; source: string; note: string }
const REF = JSON.parse(readFileSync(new URL('./integrands/references.json', import.meta.url), 'utf8')).cases as Record<string, Ref>;
const ref = (key: string): number => {
  const r = REF[key];
  if (!r) throw new Error(`no reference "${key}"`);
  return r.value;
};

const rect = (x: number, y: number, w: number, h: number) => ({ rectangle: { corner: [x, y], size: [w, h] } });
const circleHole = () => partFromObject({ outline: rect(0, 0, 300, 100), cutouts: [{ circle: { center: [100, 50], diameter: 40 } }] });
const rectHole = () => partFromObject({ outline: rect(0, 0, 300, 100), cutouts: [rect(150, 20, 50, 60)] });
const squareHole = () => partFromObject({ outline: rect(0, 0, 100, 100), cutouts: [{ circle: { center: [50, 50], diameter: 30 } }] });
const disc = (d: number) => partFromObject({ outline: { circle: { center: [0, 0], diameter: d } } });
const gaussPart = () => partFromObject({ outline: rect(0, 0, 300, 200) });
const gaussExpr = (s: number) => `exp(-((x-120)^2 + (y-90)^2)/${2 * s * s})`;
let panelPart: Part | undefined;
const panel = () => {
  if (panelPart) return panelPart;
  const holes = [];
  for (let i = 0; i < 50; i++) for (let j = 0; j < 25; j++) holes.push({ circle: { center: [(i + 0.5) * 40, (j + 0.5) * 40], diameter: 20 } });
  return (panelPart = partFromObject({ outline: rect(0, 0, 2000, 1000), cutouts: holes }));
};

interface Case { name: string; part: () => Part; expr: string; exact: number; bounded: boolean }

/** The integrands the tolerance target names: smooth, kinked, near-singular, boundary-singular, defined only inside. */
const CASES: Case[] = [
  { name: 'smooth: Gaussian bump', part: gaussPart, expr: gaussExpr(12), exact: ref('gauss'), bounded: true },
  ...['0', '60', '85.5', '92.25', '100', '107.7', '116.3', '300'].map((c) => ({
    name: `kink |x − ${c}|, Ø40 hole at x = 80…120`, part: circleHole, expr: `abs(x - ${c})`, exact: ref(`kink-circle-hole c=${c}`), bounded: true,
  })),
  // a kink line tangent to the hole leaves a pinch point no mesher takes: not cut, not proved smooth
  ...['80', '120'].map((c) => ({
    name: `kink |x − ${c}| tangent to the hole`, part: circleHole, expr: `abs(x - ${c})`, exact: ref(`kink-circle-hole c=${c}`), bounded: false,
  })),
  ...['150', '170', '200'].flatMap((c) => [
    { name: `kink |x − ${c}|, square hole x = 150…200`, part: rectHole, expr: `abs(x - ${c})`, exact: ref(`kink-rect-hole abs c=${c}`), bounded: true },
    { name: `kink 2·max(x − ${c}, 0), square hole`, part: rectHole, expr: `2*max(x - ${c}, 0)`, exact: ref(`kink-rect-hole max c=${c}`), bounded: true },
  ]),
  // kink lines through the corners of the outline (and through the hole), alone and two at once
  ...[['|x − y|', 'abs(x - y)', 'diagonal abs'], ['|x − y|·|x + y − 100|', 'abs(x-y)*abs(x+y-100)', 'diagonal product']].map(([n, e, key]) => ({
    name: `kink ${n} through the square's corners`, part: squareHole, expr: e, exact: ref(key), bounded: true,
  })),
  { name: 'near-singular 1/√(r² + 1e-6)', part: () => partFromObject({ outline: rect(0, 0, 100, 60) }), expr: '1/sqrt((x-37.3)^2 + (y-21.7)^2 + 1e-6)', exact: ref('near-singular'), bounded: true },
  { name: 'boundary-singular punch 1/√(R² − r²)', part: () => disc(200), expr: '1/sqrt(10000 - x^2 - y^2)', exact: ref('punch R=100'), bounded: false },
  { name: 'only inside √(R² − r²)', part: () => disc(80), expr: 'sqrt(1600 - x^2 - y^2)', exact: ref('hemisphere R=40'), bounded: false },
];

const CAP = 60_000;

describe('integrate --tolerance T reports "tolerance" only when the true error is ≤ T (references: sympy, mpmath, scipy)', () => {
  for (const k of CASES) {
    it(k.name, () => {
      for (const T of [1e-6, 1e-9, 1e-12]) {
        const r = integrateExpression(k.part(), k.expr, { tolerance: T, maxTriangles: CAP });
        const trueErr = Math.abs(r.integral.value - k.exact);
        console.log(`${k.name} | T ${T} | true ${trueErr.toExponential(2)} | estimate ${r.integral.error.toExponential(2)} | ${r.method.stopped} | bound ${r.method.errorIsBound} | cuts ${r.method.kinkCuts} | ${r.method.triangles} triangles`);
        if (r.method.stopped === 'tolerance') expect(trueErr).toBeLessThanOrEqual(T * Math.abs(k.exact));
        expect(r.method.errorIsBound).toBe(k.bounded);
        if (k.bounded) {
          expect(r.integral.error).toBeGreaterThanOrEqual(trueErr);
          expect(r.integral.errorIsBound).toBeUndefined();
        } else {
          expect(r.method.stopped).not.toBe('tolerance');
          expect(r.integral.errorIsBound).toBe(false);
          expect(r.pointX === null || r.pointX.errorIsBound === false).toBe(true);
        }
      }
    });
  }
});

describe('item 4: kink lines through a hole are cut exactly', () => {
  // before (453840a), T = 1e-9: "tolerance" at every position with true errors 3.6e-3 … 0.39 (1.4e-9 … 1.5e-7
  // relative, up to 146 T) and estimates 0.006–0.55 of them; T = 1e-12: triangle cap, estimates 1e-4 … 1.2e-2
  // of the true error.
  for (const c of ['85.5', '92.25', '100', '107.7', '116.3']) {
    it(`|x − ${c}|: cut along x = ${c}, tolerance met at 1e-9 and 1e-12 and true`, () => {
      const exact = ref(`kink-circle-hole c=${c}`);
      for (const T of [1e-9, 1e-12]) {
        const r = integrateExpression(circleHole(), `abs(x - ${c})`, { tolerance: T });
        const trueErr = Math.abs(r.integral.value - exact);
        expect(r.method.kinkCuts).toBe(1);
        expect(r.method.stopped).toBe('tolerance');
        expect(trueErr).toBeLessThanOrEqual(T * exact);
        expect(r.integral.error).toBeGreaterThanOrEqual(trueErr);
      }
    });
  }
  it('a kink that is not a straight line (|x² + y² − 2500| on a Ø160 disc) is never claimed', () => {
    // ∫|r² − 2500| over r ≤ 80 = 2π[∫0^50 (2500 − r²) r dr + ∫50^80 (r² − 2500) r dr] (elementary)
    const exact = 2 * Math.PI * ((2500 * 2500 / 2 - 50 ** 4 / 4) + ((80 ** 4 - 50 ** 4) / 4 - 2500 * (80 * 80 - 2500) / 2));
    const r = integrateExpression(disc(160), 'abs(x^2 + y^2 - 2500)', { tolerance: 1e-6, maxTriangles: CAP });
    expect(r.method.kinkCuts).toBe(0);
    expect(r.method.stopped).not.toBe('tolerance');
    expect(r.method.errorIsBound).toBe(false);
    expect(Number.isFinite(exact)).toBe(true);
  });
});

describe('a kink line tangent to a hole: never claimed, "not a bound" in every output (issue 13, item 3)', () => {
  // The line touches the hole at one point, so the part cannot be cut along it (the piece on the hole's side
  // would pinch there) and the triangles across it are never shown smooth. Measured before this test (x = 80,
  // T = 1e-9 / 1e-12): estimate 0.88× / 0.07× the true error, so the ± cannot be promised; it must be
  // marked, and 'tolerance' must never be claimed. Exact values (elementary): the hole lies on one side of
  // the line, where the integrand is linear, so ∫ = ∫ over the rectangle − area of the hole × |value at its
  // centre|; over the rectangle ∫|t − c| dt = ((c − t0)² + (t1 − c)²)/2 along the line's normal.
  const holed = (cx: number, cy: number, d: number, w: number, h: number) =>
    partFromObject({ outline: rect(0, 0, w, h), cutouts: [{ circle: { center: [cx, cy], diameter: d } }] });
  const exact = (along: 'x' | 'y', c: number, cx: number, cy: number, d: number, w: number, h: number) => {
    const [t1, other, centre] = along === 'x' ? [w, h, cx] : [h, w, cy];
    return other * ((c * c + (t1 - c) ** 2) / 2) - Math.PI * (d / 2) ** 2 * Math.abs(centre - c);
  };
  const positions: [string, 'x' | 'y', number, number, number, number, number, number][] = [
    ['Ø40 hole, x = 80 (left)', 'x', 80, 100, 50, 40, 300, 100],
    ['Ø40 hole, x = 120 (right)', 'x', 120, 100, 50, 40, 300, 100],
    ['Ø40 hole, y = 30 (below)', 'y', 30, 100, 50, 40, 300, 100],
    ['Ø40 hole, y = 70 (above)', 'y', 70, 100, 50, 40, 300, 100],
    ['Ø30 hole off centre, x = 42.5', 'x', 42.5, 57.5, 40, 30, 100, 100],
  ];
  for (const [label, along, c, cx, cy, d, w, h] of positions) {
    it(label, () => {
      const ref = exact(along, c, cx, cy, d, w, h);
      const expr = `abs(${along} - ${c})`;
      for (const T of [undefined, 1e-6, 1e-9, 1e-12]) {
        const r = integrateExpression(holed(cx, cy, d, w, h), expr, { tolerance: T, maxTriangles: 20_000 });
        const trueErr = Math.abs(r.integral.value - ref);
        console.log(`tangent ${label} | T ${T} | true ${trueErr.toExponential(2)} | estimate ${r.integral.error.toExponential(2)} | ${r.method.stopped}`);
        expect(r.method.stopped, 'never claimed').not.toBe('tolerance');
        expect(r.method.errorIsBound).toBe(false);
        for (const q of [r.integral, r.momentX, r.momentY]) expect(q.errorIsBound).toBe(false);
        const j = JSON.parse(JSON.stringify(integralJson(r)));
        expect(j.method.errorIsBound).toBe(false);
        expect(j.quantities.integral.errorIsBound).toBe(false);
        expect(integralText(r)).toMatch(/not bounds/);
        expect(integralText(r)).not.toMatch(/tolerance met/);
        expect(judge(r.integral.value, { kind: 'absolute', value: 1e6 * (r.integral.error + trueErr) }, r.integral).verdict).toBe('inconclusive');
      }
    });
  }
});

describe('item 5: a rim singularity is marked "not a bound" everywhere', () => {
  // before (453840a): estimates 0.82 (no tolerance) and 0.94 (triangle cap) of the true error, presented as bounds
  it('library result, JSON and text say so; a verdict on it is inconclusive', () => {
    const r = integrateExpression(disc(200), '1/sqrt(10000 - x^2 - y^2)', {});
    const trueErr = Math.abs(r.integral.value - ref('punch R=100'));
    expect(r.method.errorIsBound).toBe(false);
    expect(r.integral.errorIsBound).toBe(false);
    // widened: the estimate covers the truth here, though it is not promised
    expect(r.integral.error).toBeGreaterThanOrEqual(trueErr);
    const j = JSON.parse(JSON.stringify(integralJson(r)));
    expect(j.quantities.integral.errorIsBound).toBe(false);
    expect(j.method.errorIsBound).toBe(false);
    expect(integralText(r)).toMatch(/not bounds/);
    // the same numbers with a bounding error pass; with errorIsBound false the verdict cannot decide
    const stated = r.integral.value;
    const tol = { kind: 'absolute' as const, value: 10 * r.integral.error };
    expect(judge(stated, tol, { value: r.integral.value, error: r.integral.error }).verdict).toBe('pass');
    expect(judge(stated, tol, r.integral).verdict).toBe('inconclusive');
  });
  it('a smooth integrand keeps its bound (negative control)', () => {
    const r = integrateExpression(gaussPart(), gaussExpr(12), {});
    expect(r.method.errorIsBound).toBe(true);
    expect(r.integral.errorIsBound).toBeUndefined();
    expect(integralText(r)).not.toMatch(/not bounds/);
  });
});

describe('item 7: useful estimates from the two levels, and at default settings', () => {
  // before (453840a), two levels (then the default): Gaussian s = 12, 30, 60: estimate/true 49, 6.9e3, 1.6e6;
  // panel 2 + cos((x+y)/20): true error 2.2e3 (6.8e-4 relative, from slivers along the long outline edges).
  for (const s of [12, 30, 60]) {
    it(`Gaussian bump of width ${s}, two levels (tolerance null): 1 ≤ estimate / true error ≤ 1000`, () => {
      const exact = ref(s === 12 ? 'gauss' : `gauss s=${s}`);
      const r = integrateExpression(gaussPart(), gaussExpr(s), { tolerance: null });
      const trueErr = Math.abs(r.integral.value - exact);
      console.log(`gauss s=${s} default: true ${trueErr.toExponential(2)} estimate ${r.integral.error.toExponential(2)} ratio ${(r.integral.error / trueErr).toFixed(1)}`);
      expect(trueErr).toBeGreaterThan(1e-13 * exact); // above round-off, so the ratio means something
      expect(r.integral.error / trueErr).toBeGreaterThanOrEqual(1);
      expect(r.integral.error / trueErr).toBeLessThanOrEqual(1000);
    });
  }
  for (const s of [12, 30, 60]) {
    it(`Gaussian bump of width ${s}, default settings: refined to ${DEFAULT_INTEGRAL_TOLERANCE}, true error ≤ 1e-13 relative and covered`, () => {
      const exact = ref(s === 12 ? 'gauss' : `gauss s=${s}`);
      const r = integrateExpression(gaussPart(), gaussExpr(s), {});
      const trueErr = Math.abs(r.integral.value - exact);
      console.log(`gauss s=${s} default: true ${trueErr.toExponential(2)} estimate ${r.integral.error.toExponential(2)}`);
      expect(r.method.stopped).toBe('tolerance');
      expect(trueErr).toBeLessThanOrEqual(1e-13 * exact);
      expect(r.integral.error).toBeGreaterThanOrEqual(trueErr);
      expect(r.integral.error).toBeLessThanOrEqual(DEFAULT_INTEGRAL_TOLERANCE * exact);
    });
  }
  it('the 1,250-hole panel: long outline edges are split, the error falls to round-off and stays covered', () => {
    const exact = 2 * ref('panel area') + ref('panel cos20');
    const r = integrateExpression(panel(), '2 + cos((x+y)/20)', {});
    const trueErr = Math.abs(r.integral.value - exact);
    console.log(`panel 2 + cos((x+y)/20) default: true ${trueErr.toExponential(2)} estimate ${r.integral.error.toExponential(2)}`);
    expect(trueErr).toBeLessThanOrEqual(1e-13 * exact);
    expect(r.integral.error).toBeGreaterThanOrEqual(trueErr);
    expect(r.integral.error).toBeLessThanOrEqual(1e-12 * exact);
  });
});

describe('no estimate below the true error at any safe degree, with and without a tolerance', () => {
  // Guards the asymptotic estimate (src/analysis/adaptive.ts): an estimate from the companion rule's contraction
  // alone understated the near-singular case up to 12 times at degrees 8 and 12 (and claimed 1e-4 and 1e-7 falsely).
  const sweep: Case[] = [CASES[0], CASES.find((k) => k.name.startsWith('near-singular'))!,
    { name: 'Gaussian bump, width 60', part: gaussPart, expr: gaussExpr(60), exact: ref('gauss s=60'), bounded: true },
    CASES.find((k) => k.name.includes('|x − y|·|x + y − 100|'))!];
  for (const k of sweep) {
    it(k.name, () => {
      let runs = 0;
      for (const degree of [1, 2, 4, 5, 6, 8, 9, 10, 12, 13, 14, 17, 19]) for (const T of [undefined, 1e-4, 1e-7]) {
        const r = integrateExpression(k.part(), k.expr, { degree, tolerance: T, maxTriangles: 40_000 });
        const trueErr = Math.abs(r.integral.value - k.exact);
        expect(r.method.errorIsBound).toBe(true);
        expect(r.integral.error, `degree ${degree}, T ${T}`).toBeGreaterThanOrEqual(trueErr);
        if (T !== undefined && r.method.stopped === 'tolerance') expect(trueErr, `degree ${degree}, T ${T}`).toBeLessThanOrEqual(T * Math.abs(k.exact));
        runs++;
      }
      expect(runs).toBe(39);
    });
  }
});
