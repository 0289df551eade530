import { describe, expect, it } from 'vitest';
import { adaptiveGaussLegendre, gaussLegendre, gaussLegendreOn } from '../../src/numeric/gaussLegendre.js';

/** Positive nodes and their weights, Abramowitz & Stegun, Handbook of Mathematical Functions, table 25.4 (from memory). */
const TABLE_25_4: Record<number, [number, number][]> = {
  2: [[0.577350269189626, 1.0]],
  3: [[0, 0.888888888888889], [0.774596669241483, 0.555555555555556]],
  4: [[0.339981043584856, 0.652145154862546], [0.861136311594053, 0.347854845137454]],
  5: [[0, 0.568888888888889], [0.538469310105683, 0.478628670499366], [0.906179845938664, 0.236926885056189]],
  6: [[0.238619186083197, 0.467913934572691], [0.661209386466265, 0.360761573048139], [0.932469514203152, 0.171324492379170]],
};

/** The rule's nodes ≥ 0 with their weights, ascending. */
function positive(n: number): [number, number][] {
  const r = gaussLegendre(n);
  const out: [number, number][] = [];
  for (let i = 0; i < n; i++) if (r.x[i] >= -1e-15) out.push([Math.abs(r.x[i]), r.w[i]]);
  return out.sort((a, b) => a[0] - b[0]);
}

describe('Gauss–Legendre nodes and weights', () => {
  it('match Abramowitz & Stegun table 25.4 to the 15 digits printed', () => {
    for (const [n, rows] of Object.entries(TABLE_25_4)) {
      const got = positive(Number(n));
      expect(got.length).toBe(rows.length);
      rows.forEach(([x, w], i) => {
        expect(Math.abs(got[i][0] - x)).toBeLessThan(1e-15);
        expect(Math.abs(got[i][1] - w)).toBeLessThan(1e-15);
      });
    }
  });

  it('match the closed forms for 4 and 5 points', () => {
    // n = 4: x = √(3/7 ∓ (2/7)√(6/5)), w = (18 ± √30)/36; n = 5: x = (1/3)√(5 ∓ 2√(10/7)), w = (322 ± 13√70)/900, 128/225
    const four = positive(4);
    expect(four[0][0]).toBeCloseTo(Math.sqrt(3 / 7 - (2 / 7) * Math.sqrt(6 / 5)), 15);
    expect(four[1][0]).toBeCloseTo(Math.sqrt(3 / 7 + (2 / 7) * Math.sqrt(6 / 5)), 15);
    expect(four[0][1]).toBeCloseTo((18 + Math.sqrt(30)) / 36, 15);
    expect(four[1][1]).toBeCloseTo((18 - Math.sqrt(30)) / 36, 15);
    const five = positive(5);
    expect(five[0]).toEqual([0, expect.closeTo(128 / 225, 15)]);
    expect(five[1][0]).toBeCloseTo(Math.sqrt(5 - 2 * Math.sqrt(10 / 7)) / 3, 15);
    expect(five[2][0]).toBeCloseTo(Math.sqrt(5 + 2 * Math.sqrt(10 / 7)) / 3, 15);
    expect(five[1][1]).toBeCloseTo((322 + 13 * Math.sqrt(70)) / 900, 15);
    expect(five[2][1]).toBeCloseTo((322 - 13 * Math.sqrt(70)) / 900, 15);
  });

  it('the n-point rule integrates every monomial up to degree 2n − 1 exactly on [−1, 1]', () => {
    for (let n = 1; n <= 20; n++) {
      const r = gaussLegendre(n);
      for (let k = 0; k <= 2 * n - 1; k++) {
        const exact = k % 2 === 1 ? 0 : 2 / (k + 1);
        expect(Math.abs(gaussLegendreOn((t) => t ** k, -1, 1, r) - exact)).toBeLessThan(1e-14);
      }
    }
  });

  it('misses x^(2n) by exactly the classical error 2^(2n+1)(n!)⁴ / ((2n+1)((2n)!)²) (A&S 25.4.30, from memory)', () => {
    const fact = (m: number) => { let f = 1; for (let i = 2; i <= m; i++) f *= i; return f; };
    for (let n = 1; n <= 8; n++) {
      const got = 2 / (2 * n + 1) - gaussLegendreOn((t) => t ** (2 * n), -1, 1, gaussLegendre(n));
      const err = (2 ** (2 * n + 1) * fact(n) ** 4) / ((2 * n + 1) * fact(2 * n) ** 2);
      expect(got / err).toBeCloseTo(1, 10);
    }
  });

  it('refuses a number of points that is not a whole number ≥ 1', () => {
    expect(() => gaussLegendre(0)).toThrow(RangeError);
    expect(() => gaussLegendre(2.5)).toThrow(RangeError);
  });
});

describe('adaptive Gauss–Legendre', () => {
  it('reaches closed forms, also with an end singularity and an interior kink', () => {
    expect(adaptiveGaussLegendre(Math.sin, 0, Math.PI)).toBeCloseTo(2, 14);
    expect(adaptiveGaussLegendre((x) => 4 / (1 + x * x), 0, 1)).toBeCloseTo(Math.PI, 14);
    expect(Math.abs(adaptiveGaussLegendre(Math.sqrt, 0, 1) - 2 / 3)).toBeLessThan(1e-13);
    expect(Math.abs(adaptiveGaussLegendre((x) => Math.abs(x - 0.7), 0, 2) - (0.7 ** 2 + 1.3 ** 2) / 2)).toBeLessThan(1e-13);
  });
  it('a single 20-point rule is not enough for the kink (so the adaptive splitting is what the test measures)', () => {
    const once = gaussLegendreOn((x) => Math.abs(x - 0.7), 0, 2, gaussLegendre(20));
    expect(Math.abs(once - (0.7 ** 2 + 1.3 ** 2) / 2)).toBeGreaterThan(1e-6);
  });
});
