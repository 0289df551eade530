import { describe, expect, it } from 'vitest';
import { CompensatedSum, addCompensated, compensatedSum } from '../../src/numeric/sum.js';

describe('compensated summation (Neumaier)', () => {
  it('recovers the small terms lost next to a huge one: 1 + 1e100 + 1 − 1e100 = 2 (Neumaier 1974, from memory)', () => {
    const v = [1, 1e100, 1, -1e100];
    expect(v.reduce((a, b) => a + b, 0)).toBe(0); // the plain sum loses them: the case the method exists for
    expect(compensatedSum(v)).toBe(2);
  });

  it('sums n copies of the double nearest 0.1 to the correctly rounded exact value (exact rational reference)', () => {
    // 0.1 as a double is 3602879701896397 / 2^55 (IEEE 754 binary64); n copies sum exactly to n·that
    expect(0.1).toBe(3602879701896397 / 2 ** 55);
    for (const n of [10, 1000, 123457]) {
      const exact = Number(BigInt(n) * 3602879701896397n) / 2 ** 55; // BigInt → Number rounds to nearest
      const acc = new CompensatedSum();
      let plain = 0;
      for (let i = 0; i < n; i++) { acc.add(0.1); plain += 0.1; }
      expect(acc.value).toBe(exact);
      if (n >= 1000) expect(plain).not.toBe(exact); // negative control: the plain sum drifts
    }
  });

  it('addCompensated on typed arrays gives the same result as the scalar accumulator, slot by slot', () => {
    const sum = new Float64Array(2), comp = new Float64Array(2);
    const a = new CompensatedSum(), b = new CompensatedSum();
    let x = 777;
    for (let i = 0; i < 5000; i++) {
      x = (x * 1103515245 + 12345) % 2147483648; // linear congruential numbers (common practice, no source)
      const v = (x / 2147483648 - 0.5) * 10 ** ((i % 17) - 8);
      addCompensated(sum, comp, 0, v); a.add(v);
      addCompensated(sum, comp, 1, -2 * v); b.add(-2 * v);
    }
    expect(sum[0] + comp[0]).toBe(a.value);
    expect(sum[1] + comp[1]).toBe(b.value);
    expect(a.value).toBe(-b.value / 2);
  });
});
