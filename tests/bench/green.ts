/**
 * Peer for straight-edged parts: a plain, direct O(n) boundary computation (Green's theorem) of area,
 * centroid and second moments, written independently of src/ as the physical limit to compare against.
 */
import type { Part } from '../../src/geometry/part.js';

export function greenMoments(part: Part): number[] {
  let a = 0, sx = 0, sy = 0, xx = 0, xy = 0, yy = 0;
  for (const r of part.regions) {
    for (const loop of [r.outer, ...r.holes]) {
      for (const s of loop.segments) {
        if (s.kind !== 'line') throw new Error('green: straight edges only');
        const c = s.x0 * s.y1 - s.x1 * s.y0;
        a += c;
        sx += (s.x0 + s.x1) * c;
        sy += (s.y0 + s.y1) * c;
        xx += (s.x0 * s.x0 + s.x0 * s.x1 + s.x1 * s.x1) * c;
        yy += (s.y0 * s.y0 + s.y0 * s.y1 + s.y1 * s.y1) * c;
        xy += (2 * s.x0 * s.y0 + s.x0 * s.y1 + s.x1 * s.y0 + 2 * s.x1 * s.y1) * c;
      }
    }
  }
  return [a / 2, sx / 6, sy / 6, xx / 12, xy / 24, yy / 12];
}
