/**
 * Exact SVG path data for boundary segments (SVG 1.1, chapter 8 path grammar; arcs per the endpoint
 * parametrisation of Appendix F.6). Curves become their own path command, never a polyline:
 * circular arcs `A rx=ry`, elliptical arcs `A` with the x-axis rotation, quadratic Béziers `Q`, cubic `C`.
 *
 * The drawing map is a similarity with a y flip: X = ox + k·x, Y = oy − k·y (k > 0), so lines stay
 * lines, Béziers keep their degree (affine maps move control points), and arcs keep their radii times k.
 * The flip reverses the turning sense: a counter-clockwise arc in the part (y up) is drawn with
 * sweep-flag 0 in SVG's y-down coordinates.
 */
import type { Loop } from '../geometry/part.js';
import { type PathCommand, type Segment, ops, segmentStart } from '../geometry/segments.js';

/** Part → drawing coordinates: X = ox + k·x, Y = oy − k·y. */
export interface DrawingMap { k: number; ox: number; oy: number }

export const mapX = (m: DrawingMap, x: number) => m.ox + m.k * x;
export const mapY = (m: DrawingMap, y: number) => m.oy - m.k * y;

/** Drawing → part coordinates (inverse of the map). */
export function unmap(m: DrawingMap, X: number, Y: number): [number, number] {
  return [(X - m.ox) / m.k, (m.oy - Y) / m.k];
}

/** Numbers in path data: shortest round-trip text, so the drawing keeps every digit of the geometry. */
export function num(v: number): string {
  return Object.is(v, -0) ? '0' : String(v);
}

function pt(m: DrawingMap, x: number, y: number): string {
  return `${num(mapX(m, x))} ${num(mapY(m, y))}`;
}

/**
 * One exact command (from the segment's kind, in part coordinates) as drawing text: points go through the
 * map after the shift (dx, dy); arc radii scale by k; the map's y flip negates the rotation and reverses
 * the sweep.
 */
function commandText(c: PathCommand, m: DrawingMap, dx: number, dy: number): string {
  if (c.cmd === 'A') {
    const [rx, ry, rot, large, sweep, x, y] = c.args;
    return `A${num(m.k * rx)} ${num(m.k * ry)} ${num(-rot)} ${large} ${1 - sweep} ${pt(m, x + dx, y + dy)}`;
  }
  // L, Q, C: a list of points
  const pts: string[] = [];
  for (let i = 0; i + 1 < c.args.length; i += 2) pts.push(pt(m, c.args[i] + dx, c.args[i + 1] + dy));
  return `${c.cmd}${pts.join(' ')}`;
}

/**
 * Path commands that draw segment `s` from parameter s0 to s1 (either order), starting where the pen
 * already is (at the point for s0). `dx, dy` shift the segment first (mesh segments use local coordinates).
 */
export function segmentCommands(s: Segment, s0: number, s1: number, m: DrawingMap, dx = 0, dy = 0): string {
  let out = '';
  for (const c of ops(s).pathCommands(s, s0, s1)) out += commandText(c, m, dx, dy);
  return out;
}

/** Closed sub-path for a loop: M start, one command run per segment, Z. */
export function loopPathData(loop: Loop, m: DrawingMap): string {
  const segs = loop.segments;
  if (segs.length === 0) return '';
  const [x, y] = segmentStart(segs[0]);
  let d = `M${pt(m, x, y)}`;
  for (const s of segs) d += segmentCommands(s, 0, 1, m);
  return d + 'Z';
}

/** Path data of an open or closed chain of segments (no closing command): marking and ignored lines. */
export function chainPathData(segs: readonly Segment[], m: DrawingMap): string {
  if (segs.length === 0) return '';
  const [x, y] = segmentStart(segs[0]);
  let d = `M${pt(m, x, y)}`;
  for (const s of segs) d += segmentCommands(s, 0, 1, m);
  return d;
}

