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

/** Is angle `a` in the closed sweep from a0 to a1 (either direction), ends included? */
export function angleInClosedSweep(a: number, a0: number, a1: number): boolean {
  const lo = Math.min(a0, a1), hi = Math.max(a0, a1);
  let b = a + Math.ceil((lo - a) / TWO_PI) * TWO_PI; // smallest a + 2πk ≥ lo
  if (b < lo) b += TWO_PI;
  return b <= hi;
}

/**
 * Parameter in [0, 1] of angle `ang` on the sweep from a0 to a1 (either direction), or NaN when outside
 * it by more than the angular slack (within the slack beyond an end: a parameter just outside [0, 1]).
 */
export function sweepParam(ang: number, a0: number, a1: number, slack: number): number {
  const d = a1 - a0;
  let rel = (ang - a0) * Math.sign(d);
  rel = ((rel % TWO_PI) + TWO_PI) % TWO_PI;
  const span = Math.abs(d);
  if (rel <= span + slack) return rel / span;
  if (rel >= TWO_PI - slack) return (rel - TWO_PI) / span;
  return NaN;
}
