/**
 * Binomial coefficients and Bernstein polynomials B_i^n(t) = C(n, i) tⁱ (1 − t)ⁿ⁻ⁱ on [0, 1].
 */

/** C(n, k) by the multiplicative formula (exact for the small n used here). */
export function binom(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return r;
}

/** B_i^n(t). */
export function bernstein(n: number, i: number, t: number): number {
  return binom(n, i) * t ** i * (1 - t) ** (n - i);
}

/** ∫0^1 B_i^m B_k^p dt = C(m,i) C(p,k) / (C(m+p, i+k) (m+p+1)); 0 when an index is out of range. */
export function bernsteinProductIntegral(m: number, i: number, p: number, k: number): number {
  if (i < 0 || i > m || k < 0 || k > p) return 0;
  return (binom(m, i) * binom(p, k)) / (binom(m + p, i + k) * (m + p + 1));
}

/**
 * Bernstein coefficients, on [0, 1], of the polynomial with coefficients `c` restricted to [ta, tb]
 * (0 ≤ ta ≤ tb ≤ 1), by de Casteljau subdivision: first at tb keeping the left part, then at ta/tb keeping
 * the right part.
 */
export function bernsteinRestrict(c: readonly number[], ta: number, tb: number): number[] {
  const split = (p: number[], t: number, keepLeft: boolean): number[] => {
    const n = p.length - 1;
    const left: number[] = [], right: number[] = [];
    const w = p.slice();
    for (let r = 0; r <= n; r++) {
      left.push(w[0]);
      right.push(w[n - r]);
      for (let i = 0; i < n - r; i++) w[i] = w[i] + (w[i + 1] - w[i]) * t;
    }
    return keepLeft ? left : right.reverse();
  };
  let p = c.slice();
  if (tb < 1) p = split(p, tb, true);
  if (ta > 0) p = split(p, tb > 0 ? ta / tb : 0, false);
  return p;
}
