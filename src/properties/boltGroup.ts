/**
 * The circular holes of a part as a fastener group.
 *
 * Convention: every bolt counts as a unit area at its hole's centre (the usual elastic method for bolt
 * groups; the hole size does not weight it). Sums are about the group's centroid:
 *   Σx² = Σ(xi − x̄)², Σy², Σxy, Σr² = Σx² + Σy² (the group's polar sum),
 * principal directions from the 2 × 2 tensor [[Σx², Σxy], [Σxy, Σy²]]: `principalAngle` is the direction
 * along which the bolts spread most (the larger principal sum), from +x, degrees in (−90, 90].
 * Units: the sums are length² per unit bolt area (multiply by a bolt's area for the group's moments).
 * Selection: all circular holes, or those whose diameter is within `tolerance` of one of `diameters`.
 */
import { type Part, loopSignedArea } from '../geometry/part.js';
import { ops } from '../geometry/segments.js';

export interface Bolt { x: number; y: number; diameter: number; where?: string }

export interface BoltGroup {
  count: number;
  centroid: [number, number];
  sumXX: number; sumYY: number; sumXY: number; sumRR: number;
  /** larger and smaller principal sums, and the direction of the larger, degrees in (−90, 90] */
  principal: [number, number];
  principalAngle: number;
  bolts: (Bolt & { distance: number })[];
  /** round-off allowance on the sums (64 ε × summed magnitudes) */
  error: number;
}

/**
 * Centres of the circular holes. Kind-agnostic (no branch on a segment's kind): a hole is circular when
 * none of its segments is straight, the circle through three of its points passes within 1e-10·r of nine
 * points on every segment, and its enclosed area is πr² within 1e-10 relative (which an inscribed or
 * bulging curve through the sampled points cannot match).
 */
export function circularHoles(part: Part): Bolt[] {
  const out: Bolt[] = [];
  const p: [number, number] = [0, 0];
  for (const r of part.regions) {
    for (const h of r.holes) {
      if (h.segments.some((s) => ops(s).straight)) continue;
      const pts: [number, number][] = [];
      for (const s of h.segments) for (let k = 0; k < 9; k++) { ops(s).point(s, k / 8, p); pts.push([p[0], p[1]]); }
      const a = pts[0], b = pts[Math.floor(pts.length / 3)], c = pts[Math.floor((2 * pts.length) / 3)];
      const d = 2 * (a[0] * (b[1] - c[1]) + b[0] * (c[1] - a[1]) + c[0] * (a[1] - b[1]));
      if (d === 0) continue;
      const a2 = a[0] ** 2 + a[1] ** 2, b2 = b[0] ** 2 + b[1] ** 2, c2 = c[0] ** 2 + c[1] ** 2;
      const cx = (a2 * (b[1] - c[1]) + b2 * (c[1] - a[1]) + c2 * (a[1] - b[1])) / d;
      const cy = (a2 * (c[0] - b[0]) + b2 * (a[0] - c[0]) + c2 * (b[0] - a[0])) / d;
      const rad = Math.hypot(a[0] - cx, a[1] - cy);
      const tol = 1e-10 * (rad + Math.abs(cx) + Math.abs(cy));
      if (!pts.every((q) => Math.abs(Math.hypot(q[0] - cx, q[1] - cy) - rad) <= tol)) continue;
      if (Math.abs(Math.abs(loopSignedArea(h)) - Math.PI * rad * rad) > 1e-10 * Math.PI * rad * rad) continue;
      out.push({ x: cx, y: cy, diameter: 2 * rad, where: h.where });
    }
  }
  return out;
}

export function boltGroup(bolts: readonly Bolt[]): BoltGroup {
  const n = bolts.length;
  let sx = 0, sy = 0;
  for (const b of bolts) { sx += b.x; sy += b.y; }
  const cx = n ? sx / n : 0, cy = n ? sy / n : 0;
  let xx = 0, yy = 0, xy = 0, mag = 0;
  for (const b of bolts) {
    const dx = b.x - cx, dy = b.y - cy;
    xx += dx * dx; yy += dy * dy; xy += dx * dy;
    mag += (Math.abs(b.x) + Math.abs(cx)) ** 2 + (Math.abs(b.y) + Math.abs(cy)) ** 2;
  }
  const m = (xx + yy) / 2, d = Math.hypot((xx - yy) / 2, xy);
  let ang = 0.5 * Math.atan2(2 * xy, xx - yy) * 180 / Math.PI;
  if (ang <= -90) ang += 180;
  return {
    count: n, centroid: [cx, cy], sumXX: xx, sumYY: yy, sumXY: xy, sumRR: xx + yy,
    principal: [m + d, m - d], principalAngle: ang,
    bolts: bolts.map((b) => ({ ...b, distance: Math.hypot(b.x - cx, b.y - cy) })),
    error: 64 * Number.EPSILON * mag,
  };
}

/** The holes selected by diameter (within `tolerance`, default 1e-9 relative), or all when none is given. */
export function selectBolts(all: readonly Bolt[], diameters?: readonly number[], tolerance?: number): Bolt[] {
  if (!diameters || diameters.length === 0) return [...all];
  return all.filter((b) => diameters.some((d) => Math.abs(b.diameter - d) <= (tolerance ?? 1e-9 * d)));
}
