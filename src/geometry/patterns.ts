/**
 * Hole patterns: copies of one shape placed at the points of a rectangular grid or of a circle.
 *
 * The shape is written in its own coordinates, which are offsets from the pattern point: a circle
 * centred at [0, 0] lands centred on each point. In a circular pattern the shape may also turn with the
 * pattern (`rotate`): each copy is rotated about its pattern point by that point's angle, so a shape
 * drawn for the point on the +x side (angle 0) keeps the same attitude to the centre everywhere.
 *
 * Grid points: (x0 + i·px, y0 + j·py) for i = 0..nx−1, j = 0..ny−1 (row by row, i fastest).
 * Circle points: centre + (D/2)(cos θk, sin θk), θk = start + k·step for k = 0..n−1, step = 360°/n unless
 * given (a partial pattern). Angles in degrees, counter-clockwise from +x.
 */
import type { Loop } from './part.js';
import { type Segment, ops } from './segments.js';

export interface GridPattern {
  start: [number, number];
  pitch: [number, number];
  count: [number, number];
}

export interface RingPattern {
  center: [number, number];
  /** Diameter of the circle through the pattern points. */
  diameter: number;
  count: number;
  /** Angle of the first point, degrees (default 0). */
  startAngle?: number;
  /** Angle between neighbouring points, degrees (default 360/count). */
  step?: number;
  /** Turn each copy with its point's angle (default false: every copy keeps the shape's attitude). */
  rotate?: boolean;
}

/** Largest number of copies one pattern may make. */
export const MAX_PATTERN_COPIES = 100000;

export interface PatternPoint { x: number; y: number; angle: number; label: string }

export function gridPoints(g: GridPattern): PatternPoint[] {
  const out: PatternPoint[] = [];
  for (let j = 0; j < g.count[1]; j++) {
    for (let i = 0; i < g.count[0]; i++) {
      out.push({ x: g.start[0] + i * g.pitch[0], y: g.start[1] + j * g.pitch[1], angle: 0, label: `[${i}, ${j}]` });
    }
  }
  return out;
}

/** Sine and cosine of an angle in degrees, exact at multiples of 90°. */
export function sinCosDeg(deg: number): [number, number] {
  const r = ((deg % 360) + 360) % 360;
  if (r === 0) return [0, 1];
  if (r === 90) return [1, 0];
  if (r === 180) return [0, -1];
  if (r === 270) return [-1, 0];
  const a = (deg * Math.PI) / 180;
  return [Math.sin(a), Math.cos(a)];
}

export function ringPoints(r: RingPattern): PatternPoint[] {
  const out: PatternPoint[] = [];
  const step = r.step ?? 360 / r.count;
  const R = r.diameter / 2;
  for (let k = 0; k < r.count; k++) {
    const deg = (r.startAngle ?? 0) + k * step;
    const [s, c] = sinCosDeg(deg);
    out.push({ x: r.center[0] + R * c, y: r.center[1] + R * s, angle: deg, label: `[${k}]` });
  }
  return out;
}

/** The shape (in offset coordinates) moved to a point, optionally turned by `deg` about it. */
export function placeLoop(loop: Loop, x: number, y: number, deg = 0, where?: string): Loop {
  const [s, c] = sinCosDeg(deg);
  const turn = deg !== 0;
  const segs = loop.segments.map((seg): Segment => {
    if (!turn) return ops(seg).translate(seg, x, y);
    return ops(seg).rotate(seg, c, s, (deg * Math.PI) / 180, x, y);
  });
  return { segments: segs, where: where ?? loop.where };
}

/** Copies of `loop` at every point of the pattern; each copy's `where` is `${where}${point label}`. */
export function expandPattern(loop: Loop, points: PatternPoint[], rotate: boolean, where: string): Loop[] {
  return points.map((p) => placeLoop(loop, p.x, p.y, rotate ? p.angle : 0, `${where}${p.label}`));
}
