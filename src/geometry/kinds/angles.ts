/** Angle helpers shared by the arc kinds. */

const TWO_PI = 2 * Math.PI;

/** Is angle `a` inside the sweep from a0 to a1 (either direction), ends excluded? */
export function angleInSweep(a: number, a0: number, a1: number): boolean {
  const lo = Math.min(a0, a1);
  const hi = Math.max(a0, a1);
  // smallest a + 2πk that is > lo
  const k = Math.ceil((lo - a) / TWO_PI);
  let b = a + k * TWO_PI;
  if (b <= lo) b += TWO_PI;
  return b < hi;
}
