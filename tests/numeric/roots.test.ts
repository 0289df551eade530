import { describe, expect, it } from 'vitest';
import { quadraticRoots } from '../../src/numeric/roots.js';

describe('quadraticRoots', () => {
  it('returns the roots of (t − 2)(t − 3) exactly, ascending', () => {
    expect(quadraticRoots(1, -5, 6)).toEqual([2, 3]);
    expect(quadraticRoots(-2, 10, -12)).toEqual([2, 3]);
  });
  it('keeps the tiny root next to a huge one: t² − 1e8 t + 1 (Vieta: product 1, sum 1e8)', () => {
    const [small, big] = quadraticRoots(1, -1e8, 1);
    // closed form of the small root: 2 / (1e8 + √(1e16 − 4)) = 1e-8 (1 + 1e-16 + …)
    expect(Math.abs(small - 1e-8) / 1e-8).toBeLessThan(4e-16);
    expect(big).toBe(1e8);
    // the textbook formula (−b − √disc)/2a loses the small root entirely: the negative control
    const naive = (1e8 - Math.sqrt(1e16 - 4)) / 2;
    expect(Math.abs(naive - 1e-8) / 1e-8).toBeGreaterThan(0.1);
  });
  it('falls back to the linear root when a vanishes, and to none when nothing is left', () => {
    expect(quadraticRoots(0, 2, -3)).toEqual([1.5]);
    expect(quadraticRoots(0, 0, 1)).toEqual([]);
    expect(quadraticRoots(0, 0, 0)).toEqual([]);
  });
  it('reports a double root (t − 1.5)² and no real roots for t² + 1', () => {
    expect(quadraticRoots(1, -3, 2.25)).toEqual([1.5, 1.5]);
    expect(quadraticRoots(1, 0, 1)).toEqual([]);
  });
  it('recovers random pairs of roots from their coefficients (Vieta)', () => {
    let x = 12345;
    const rnd = () => { x = (x * 1103515245 + 12345) % 2147483648; return x / 2147483648; }; // common practice, no source
    for (let i = 0; i < 200; i++) {
      // distinct roots (at least 0.01 apart); nearly double roots are the previous test's business
      const r1 = (rnd() - 0.5) * 100, r2 = r1 + (rnd() < 0.5 ? -1 : 1) * (0.01 + rnd() * 50), a = 0.1 + rnd() * 10;
      const got = quadraticRoots(a, -a * (r1 + r2), a * r1 * r2);
      const want = [Math.min(r1, r2), Math.max(r1, r2)];
      expect(got.length).toBe(2);
      for (let k = 0; k < 2; k++) expect(Math.abs(got[k] - want[k])).toBeLessThan(1e-12 * (1 + Math.abs(r1) + Math.abs(r2)) ** 2 / Math.abs(r1 - r2));
    }
  });
});
