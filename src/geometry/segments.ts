/**
 * Segment kinds and their operations live in src/geometry/kinds/ (one file per kind, the registry in
 * kinds/index.ts); this module re-exports them under the name the rest of the code has always imported.
 */
export * from './kinds/index.js';
export type { SegmentOps } from './kinds/types.js';
