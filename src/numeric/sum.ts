/**
 * Compensated summation (Neumaier's improvement of Kahan's method): the rounding error of every addition
 * is kept in a separate term and added back at the end, so a long sum loses about one rounding instead of
 * one per term, whatever the order of magnitude of the terms. A. Neumaier, "Rundungsfehleranalyse einiger
 * Verfahren zur Summation endlicher Summen", ZAMM 54 (1974) 39–51 (from memory).
 *
 * Each step: t = s + v; the lost part is (s − t) + v when |s| ≥ |v|, else (v − t) + s (both exact in
 * binary floating point, Fast2Sum).
 */

/**
 * Add v to sum[k], keeping the rounding error in comp[k]. The result is sum[k] + comp[k] (add them only
 * at the end). Small enough to be inlined by V8 in hot loops; it allocates nothing.
 */
export function addCompensated(sum: Float64Array, comp: Float64Array, k: number, v: number): void {
  const s = sum[k], t = s + v;
  comp[k] += Math.abs(s) >= Math.abs(v) ? (s - t) + v : (v - t) + s;
  sum[k] = t;
}

/** A running compensated sum of scalars. */
export class CompensatedSum {
  private s = 0;
  private c = 0;

  add(v: number): void {
    const s = this.s, t = s + v;
    this.c += Math.abs(s) >= Math.abs(v) ? (s - t) + v : (v - t) + s;
    this.s = t;
  }

  /** The sum with its compensation applied. */
  get value(): number {
    return this.s + this.c;
  }
}

/** Compensated sum of a list of numbers. */
export function compensatedSum(values: Iterable<number>): number {
  const acc = new CompensatedSum();
  for (const v of values) acc.add(v);
  return acc.value;
}
