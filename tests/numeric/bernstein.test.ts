import { describe, expect, it } from 'vitest';
import { bernstein, bernsteinProductIntegral, bernsteinRestrict, binom } from '../../src/numeric/bernstein.js';

describe('binomials and Bernstein polynomials', () => {
  it('binom agrees with Pascal\'s triangle up to n = 30', () => {
    let row = [1];
    for (let n = 0; n <= 30; n++) {
      for (let k = 0; k <= n; k++) expect(binom(n, k)).toBe(row[k]);
      row = [1, ...row.slice(1).map((v, i) => v + row[i]), 1];
    }
  });
  it('Bernstein polynomials of each degree sum to 1 (a partition of unity)', () => {
    for (let n = 0; n <= 6; n++) for (const t of [0, 0.13, 0.5, 0.91, 1]) {
      let s = 0;
      for (let i = 0; i <= n; i++) s += bernstein(n, i, t);
      expect(s).toBeCloseTo(1, 14);
    }
  });
  it('∫ B_i^m B_k^p equals C(m,i) C(p,k) · Euler\'s Beta integral (i+k)!(m+p−i−k)!/(m+p+1)!', () => {
    const fact = (m: number) => { let f = 1; for (let i = 2; i <= m; i++) f *= i; return f; };
    for (let m = 0; m <= 4; m++) for (let p = 0; p <= 4; p++) for (let i = 0; i <= m; i++) for (let k = 0; k <= p; k++) {
      const beta = (fact(i + k) * fact(m + p - i - k)) / fact(m + p + 1);
      expect(bernsteinProductIntegral(m, i, p, k)).toBeCloseTo(binom(m, i) * binom(p, k) * beta, 15);
    }
    expect(bernsteinProductIntegral(2, 3, 2, 0)).toBe(0);
    expect(bernsteinProductIntegral(2, 0, 2, -1)).toBe(0);
  });
  it('bernsteinRestrict gives the same polynomial on [ta, tb] reparametrised over [0, 1]', () => {
    const c = [3, -1, 4, 1.5, -9];
    const n = c.length - 1;
    const value = (cs: number[], t: number) => cs.reduce((s, v, i) => s + v * bernstein(n, i, t), 0);
    for (const [ta, tb] of [[0, 1], [0, 0.4], [0.3, 1], [0.25, 0.8], [0.5, 0.5]]) {
      const r = bernsteinRestrict(c, ta, tb);
      for (const u of [0, 0.2, 0.7, 1]) expect(value(r, u)).toBeCloseTo(value(c, ta + (tb - ta) * u), 12);
    }
  });
});
