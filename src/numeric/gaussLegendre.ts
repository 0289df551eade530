/**
 * One-dimensional Gauss–Legendre quadrature on [−1, 1] and an adaptive integrator built on it.
 *
 * Nodes are the zeros of the Legendre polynomial P_n, found by Newton's method from the estimate
 * cos(π(i + 3/4)/(n + 1/2)); P_n and P_n' come from the three-term recurrence
 * k P_k = (2k − 1) x P_{k−1} − (k − 1) P_{k−2}, and the weights are w = 2 / ((1 − x²) P_n'(x)²)
 * (Abramowitz & Stegun, Handbook of Mathematical Functions, 25.4.29, from memory). The n-point rule is exact
 * for polynomials of degree 2n − 1.
 */
import { CompensatedSum } from './sum.js';

export interface GaussLegendreRule {
  /** Nodes in [−1, 1], from +1 down to −1. */
  readonly x: Float64Array;
  readonly w: Float64Array;
}

export function gaussLegendre(n: number): GaussLegendreRule {
  if (!Number.isInteger(n) || n < 1) throw new RangeError(`gaussLegendre: expected a whole number of points ≥ 1, got ${n}`);
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let z = Math.cos(Math.PI * (i + 0.75) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1, p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1; p1 = p2;
      }
      dp = n * (z * p1 - p0) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x[i] = z;
    w[i] = 2 / ((1 - z * z) * dp * dp);
  }
  return { x, w };
}

/** ∫_a^b f with one application of the rule (plain sum: at most a few dozen terms). */
export function gaussLegendreOn(f: (t: number) => number, a: number, b: number, rule: GaussLegendreRule): number {
  const h = (b - a) / 2, m = (a + b) / 2;
  let s = 0;
  for (let i = 0; i < rule.x.length; i++) s += rule.w[i] * f(m + h * rule.x[i]);
  return s * h;
}

const GL20 = gaussLegendre(20);

/**
 * Adaptive 20-point Gauss–Legendre: an interval is accepted when its estimate and the sum over its halves
 * agree to relTol of the whole integral (or at depth 40, or after 4000 intervals). Iterative (explicit
 * stack); accepted pieces are added with compensated summation.
 */
export function adaptiveGaussLegendre(f: (t: number) => number, a: number, b: number, relTol = 1e-14): number {
  const whole = gaussLegendreOn(f, a, b, GL20);
  const stack: [number, number, number, number][] = [[a, b, whole, 0]];
  const total = new CompensatedSum();
  let scale = Math.abs(whole);
  let count = 0;
  while (stack.length > 0) {
    const [lo, hi, est, depth] = stack.pop()!;
    const mid = (lo + hi) / 2;
    const left = gaussLegendreOn(f, lo, mid, GL20), right = gaussLegendreOn(f, mid, hi, GL20);
    const refined = left + right;
    scale = Math.max(scale, Math.abs(refined));
    count++;
    if (Math.abs(refined - est) <= relTol * scale || depth >= 40 || count > 4000) {
      total.add(refined);
    } else {
      stack.push([lo, mid, left, depth + 1], [mid, hi, right, depth + 1]);
    }
  }
  return total.value;
}
