/**
 * Words for the stop reasons (src/quadrature/stop.ts): the library reports a code, the writers say it.
 */
import type { StopReason } from '../quadrature/stop.js';

/** What a writer may know about the run that stopped (all optional but the code). */
export interface StopFacts {
  stopped: StopReason;
  tolerance?: number | null;
  triangles?: number;
  millis?: number;
  /** Uniform refinements after the base mesh (default 1). */
  refinementLevels?: number;
}

/** Plain words for why a result stopped where it did. */
export function stopText(m: StopFacts): string {
  switch (m.stopped) {
    case 'exact': return 'exact for these integrands: nothing to refine, the estimate is the round-off allowance';
    case 'levels': {
      const n = m.refinementLevels ?? 1;
      return `no tolerance requested: mesh and ${n === 1 ? 'one uniform refinement' : `${n} uniform refinements`}`;
    }
    case 'tolerance': return `tolerance met (relative ${m.tolerance})`;
    case 'unverified': return `estimate below the tolerance ${m.tolerance}, but not verified: the integrand could not be shown smooth (no kink, jump or singularity) on every triangle, so the ± is not a bound and the tolerance is not claimed`;
    case 'triangle-cap': return `stopped at cap (triangle limit reached, ${m.triangles} triangles) before the tolerance ${m.tolerance} was met`;
    case 'time-cap': return `stopped at cap (time limit reached after ${((m.millis ?? 0) / 1000).toFixed(1)} s) before the tolerance ${m.tolerance} was met`;
  }
}

/** Words for a result whose ± is not a bound (errorIsBound: false on the method and on each quantity). */
export function notBoundText(m: { unverifiedTriangles?: number }): string {
  return `the ± values are estimates, not bounds: the integrand could not be shown smooth (no kink, jump or singularity) on ${m.unverifiedTriangles ?? 'some'} triangles; compare and batch verdicts on these values are inconclusive`;
}
