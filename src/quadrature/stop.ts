/**
 * Why a numerical result stopped where it did: one fact code, carried by every result that has an error
 * estimate. The words for each code are chosen in src/output (stopText in src/output/stopText.ts).
 *
 *   'exact'         the method is exact for these integrands (the boundary formula; a rule exact for the
 *                   polynomial degree): nothing to refine, the estimate is the round-off allowance
 *   'levels'        a fixed number of uniform refinement levels; the estimate is the difference of the last two
 *   'tolerance'     adaptive refinement met the requested tolerance, on leaves where the integrand is proved smooth
 *   'unverified'    the estimate met the requested tolerance, but smoothness of the integrand (no kink, jump or
 *                   singularity) could not be proved on every triangle: the estimate is not a bound and the
 *                   tolerance is not claimed (the result also carries errorIsBound: false)
 *   'triangle-cap'  adaptive refinement stopped at the cap on triangles before the tolerance was met
 *   'time-cap'      adaptive refinement stopped at the cap on time before the tolerance was met
 *
 * The type lives in the quadrature layer (above properties and analysis) so that every layer that makes a
 * result with an estimate can name it.
 */
export const STOP_REASONS = ['exact', 'levels', 'tolerance', 'unverified', 'triangle-cap', 'time-cap'] as const;
export type StopReason = typeof STOP_REASONS[number];

/** Did refinement stop for a cap, before the tolerance was met? */
export const isCap = (s: StopReason): boolean => s === 'triangle-cap' || s === 'time-cap';

// what a combination can still claim: a cap (time before triangles), then unverified, fixed levels, tolerance, exact
const WEAKNESS: Record<StopReason, number> = { exact: 0, tolerance: 1, levels: 2, unverified: 3, 'triangle-cap': 4, 'time-cap': 5 };

/**
 * The stop reason of results added together (layers of a plate, parts of a sheet): the weakest claim among
 * them, so a sum never says "tolerance" when one of its terms stopped at a cap.
 */
export function combineStops(stops: readonly StopReason[]): StopReason {
  let worst: StopReason = 'exact';
  for (const s of stops) if (WEAKNESS[s] > WEAKNESS[worst]) worst = s;
  return worst;
}
