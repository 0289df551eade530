/**
 * Affine maps of segments, for SVG `transform` attributes and the SVG viewport mapping.
 * A map m = [a, b, c, d, e, f] sends (x, y) to (a x + c y + e, b x + d y + f), the SVG matrix order
 * (SVG 1.1, section 7.4 "The 'transform' attribute").
 */
import { isIdentity } from './kinds/affine.js';
import { type Segment, ops } from './kinds/index.js';
import type { Affine } from './kinds/types.js';

export type { Affine } from './kinds/types.js';
export { IDENTITY, applyAffine, composeAffine } from './kinds/affine.js';

/**
 * Image of a segment under an affine map (each kind's `affine`). Lines stay lines, Béziers stay Béziers
 * (control points map), a circular arc stays an `arc` under a similarity (rotation, uniform scale,
 * reflection, translation) and becomes an `ellipticalArc` otherwise; elliptical arcs stay elliptical arcs.
 * The traversal direction follows the points, so a reflection reverses the sense of rotation as it should.
 */
export function transformSegment(seg: Segment, m: Affine): Segment {
  if (isIdentity(m)) return seg;
  return ops(seg).affine(seg, m);
}

/**
 * The map m with its translation carried from the origin to `at` and then taken about `origin`: for points
 * p read about `at` (p = P − at), m(P) − origin = L·p + (m(at) − origin), with L the linear part. A reader
 * that builds shapes about a point near them (see LocalFrame in ./part.ts) maps them with this, so only the
 * translation m(at) − origin is rounded at the size of the coordinates, once, alike for the whole shape.
 */
export function carriedTo(m: Affine, at: readonly [number, number], origin: readonly [number, number]): Affine {
  return [m[0], m[1], m[2], m[3], (m[0] * at[0] + m[2] * at[1] + m[4]) - origin[0], (m[1] * at[0] + m[3] * at[1] + m[5]) - origin[1]];
}
