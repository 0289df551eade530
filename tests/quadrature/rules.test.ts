import { describe, expect, it } from 'vitest';
import { MAX_DEGREE, SAFE_DEGREES, getRule, listRules } from '../../src/quadrature/rules.js';

// Exact integral of x^i y^j over the triangle (0,0), (1,0), (0,1): i! j! / (i + j + 2)!
// (the classical beta-function formula for monomials on the unit simplex; common practice, no source).
function fact(n: number): number { let f = 1; for (let k = 2; k <= n; k++) f *= k; return f; }
const exact = (i: number, j: number) => fact(i) * fact(j) / fact(i + j + 2);

function quad(degree: number, i: number, j: number): number {
  const r = getRule(degree);
  let s = 0;
  // reference triangle: x = l1, y = l2, area 1/2
  for (let q = 0; q < r.n; q++) s += r.w[q] * r.l1[q] ** i * r.l2[q] ** j;
  return s / 2;
}

describe('Dunavant rules (D. A. Dunavant, Int. J. Numer. Meth. Eng. 21 (1985) 1129-1148)', () => {
  // Point counts as published in Dunavant (1985), table of rules, degrees 1..20.
  const published = [1, 3, 4, 6, 7, 12, 13, 16, 19, 25, 27, 33, 37, 42, 48, 52, 61, 70, 73, 79];

  for (let d = 1; d <= MAX_DEGREE; d++) {
    it(`degree ${d} has the published ${published[d - 1]} points and integrates every monomial of degree <= ${d} to 1e-14 absolute`, () => {
      const r = getRule(d);
      expect(r.n).toBe(published[d - 1]);
      let worst = 0;
      for (let i = 0; i <= d; i++) for (let j = 0; i + j <= d; j++) {
        worst = Math.max(worst, Math.abs(quad(d, i, j) - exact(i, j)));
      }
      expect(worst).toBeLessThan(1e-14);
    });
    it(`degree ${d} misses some monomial of degree ${d + 1} by more than 1e-12 relative (the table is not mislabelled)`, () => {
      let worst = 0;
      for (let i = 0; i <= d + 1; i++) worst = Math.max(worst, Math.abs(quad(d, i, d + 1 - i) / exact(i, d + 1 - i) - 1));
      expect(worst).toBeGreaterThan(1e-12);
    });
  }

  it('marks rules with a negative weight or points outside the triangle, as the published data says', () => {
    for (const r of listRules()) {
      const rule = getRule(r.degree);
      const neg = Array.from(rule.w).some((w) => w < 0);
      const out = Array.from(rule.l1).some((l1, q) => l1 < 0 || rule.l2[q] < 0 || l1 + rule.l2[q] > 1);
      expect(r.negativeWeight).toBe(neg);
      expect(r.pointsOutside).toBe(out);
      expect(r.safe).toBe(!neg && !out);
      expect(SAFE_DEGREES.includes(r.degree)).toBe(!neg && !out);
    }
  });

  it('rejects a degree outside 1..20 with a clear message', () => {
    expect(() => getRule(21)).toThrow(/degree: expected a whole number from 1 to 20, got 21/);
    expect(() => getRule(2.5)).toThrow(/degree/);
  });
});
