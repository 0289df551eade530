/**
 * Segment kinds and their operations live in src/geometry/kinds/ (one file per kind, the registry in
 * kinds/index.ts); this module re-exports them under the name the rest of the code has always imported.
 */
import type { Segment } from './kinds/index.js';
import type { SegmentOps as KindOps } from './kinds/types.js';

export * from './kinds/index.js';

/** A kind's operations; with no argument, the operations of any segment (as `ops(s)` returns them). */
export type SegmentOps<S extends Segment = Segment> = KindOps<S, Segment>;
