/** Real roots of low-degree polynomials. */

/**
 * Real roots of a t² + b t + c, ascending (a may be 0: then the linear root, if any). Uses the
 * cancellation-free pair q = −(b + sign(b)·√disc)/2, roots q/a and c/q, so a tiny root next to a large one
 * keeps its relative accuracy. A double root may come back twice; a discriminant that is negative only by
 * round-off (above −1e-14·b²) counts as a double root.
 */
export function quadraticRoots(a: number, b: number, c: number): number[] {
  const scale = Math.max(Math.abs(a), Math.abs(b), Math.abs(c));
  if (scale === 0) return [];
  if (Math.abs(a) <= 1e-14 * scale) {
    return b !== 0 ? [-c / b] : [];
  }
  const disc = b * b - 4 * a * c;
  if (disc < 0) {
    if (disc > -1e-14 * b * b) return [-b / (2 * a)];
    return [];
  }
  const sq = Math.sqrt(disc);
  const q = -0.5 * (b + (b >= 0 ? sq : -sq));
  const r1 = q / a;
  const r2 = q !== 0 ? c / q : r1;
  return r1 <= r2 ? [r1, r2] : [r2, r1];
}
