/**
 * Primitive builders: each returns an exact Loop (lines and circular arcs).
 * They check geometric sense (positive sizes, consistent arcs) and report problems as InputError
 * naming `where`; the readers check types before calling them.
 */
import { InputError } from '../base/errors.js';
import type { Loop } from './part.js';
import type { ArcSegment, LineSegment, Segment } from './segments.js';

export type Pt = readonly [number, number];

function line(a: Pt, b: Pt): LineSegment {
  return { kind: 'line', x0: a[0], y0: a[1], x1: b[0], y1: b[1] };
}

function arc(cx: number, cy: number, r: number, a0: number, a1: number): ArcSegment {
  return { kind: 'arc', cx, cy, r, a0, a1 };
}

export function circleLoop(center: Pt, diameter: number, where = 'circle'): Loop {
  if (!(diameter > 0) || !Number.isFinite(diameter)) {
    throw new InputError(`${where}.diameter`, `expected a positive number, got ${diameter}`);
  }
  const r = diameter / 2;
  const [cx, cy] = center;
  return { where, segments: [arc(cx, cy, r, 0, Math.PI), arc(cx, cy, r, Math.PI, 2 * Math.PI)] };
}

export function rectangleLoop(corner: Pt, size: Pt, cornerRadius = 0, where = 'rectangle'): Loop {
  const [x, y] = corner;
  const [w, h] = size;
  if (!(w > 0) || !(h > 0)) {
    throw new InputError(`${where}.size`, `expected a positive width and height, got [${w}, ${h}]`);
  }
  const r = cornerRadius;
  if (!(r >= 0) || r > Math.min(w, h) / 2) {
    throw new InputError(`${where}.cornerRadius`, `expected a number from 0 to half the shorter side (${Math.min(w, h) / 2}), got ${r}`);
  }
  if (r === 0) {
    return polygonLoop([[x, y], [x + w, y], [x + w, y + h], [x, y + h]], where);
  }
  const segs: Segment[] = [];
  const x0 = x, x1 = x + w, y0 = y, y1 = y + h;
  const H = Math.PI / 2;
  // counter-clockwise from the bottom edge; sides of zero length (r = half a side) are left out
  if (x1 - r > x0 + r) segs.push(line([x0 + r, y0], [x1 - r, y0]));
  segs.push(arc(x1 - r, y0 + r, r, -H, 0));
  if (y1 - r > y0 + r) segs.push(line([x1, y0 + r], [x1, y1 - r]));
  segs.push(arc(x1 - r, y1 - r, r, 0, H));
  if (x1 - r > x0 + r) segs.push(line([x1 - r, y1], [x0 + r, y1]));
  segs.push(arc(x0 + r, y1 - r, r, H, 2 * H));
  if (y1 - r > y0 + r) segs.push(line([x0, y1 - r], [x0, y0 + r]));
  segs.push(arc(x0 + r, y0 + r, r, 2 * H, 3 * H));
  return { where, segments: segs };
}

/** Straight slot with round ends: the set of points within width/2 of the segment from→to. */
export function slotLoop(from: Pt, to: Pt, width: number, where = 'slot'): Loop {
  if (!(width > 0)) throw new InputError(`${where}.width`, `expected a positive number, got ${width}`);
  const dx = to[0] - from[0], dy = to[1] - from[1];
  const len = Math.hypot(dx, dy);
  if (!(len > 0)) throw new InputError(`${where}.to`, 'expected a point different from "from" (use a circle for a round hole)');
  const r = width / 2;
  const nx = -dy / len * r, ny = dx / len * r; // left normal scaled to r
  const th = Math.atan2(dy, dx);
  const H = Math.PI / 2;
  return {
    where,
    segments: [
      line([from[0] - nx, from[1] - ny], [to[0] - nx, to[1] - ny]),
      arc(to[0], to[1], r, th - H, th + H),
      line([to[0] + nx, to[1] + ny], [from[0] + nx, from[1] + ny]),
      arc(from[0], from[1], r, th + H, th + 3 * H),
    ],
  };
}

export function polygonLoop(points: readonly Pt[], where = 'polygon'): Loop {
  const pts = points.slice();
  // a closing point equal to the first is accepted and dropped
  if (pts.length > 1) {
    const a = pts[0], b = pts[pts.length - 1];
    if (a[0] === b[0] && a[1] === b[1]) pts.pop();
  }
  if (pts.length < 3) throw new InputError(where, `expected at least 3 distinct points, got ${pts.length}`);
  const segs: Segment[] = [];
  for (let i = 0; i < pts.length; i++) {
    const a = pts[i], b = pts[(i + 1) % pts.length];
    if (a[0] === b[0] && a[1] === b[1]) {
      throw new InputError(`${where}[${(i + 1) % pts.length}]`, `repeats the point before it [${a[0]}, ${a[1]}]`);
    }
    segs.push(line(a, b));
  }
  return { where, segments: segs };
}

export interface PathStep {
  to: Pt;
  /** Present for a circular arc: its centre and turning direction. */
  center?: Pt;
  turn?: 'ccw' | 'cw';
}

/**
 * A closed path of lines and arcs starting at `start`. The last step may end at `start`; if it does not,
 * a closing line is added. An arc's start and end must be the same distance from its centre
 * (to 1e-9 relative, plus the round-off of the coordinates); an arc that ends where it starts is a full circle.
 */
export function pathLoop(start: Pt, steps: readonly PathStep[], where = 'path'): Loop {
  if (steps.length === 0) throw new InputError(`${where}.segments`, 'expected at least one segment');
  const segs: Segment[] = [];
  let cur: Pt = start;
  steps.forEach((st, i) => {
    const w = `${where}.segments[${i}]`;
    const to = st.to;
    if (st.center === undefined) {
      if (to[0] === cur[0] && to[1] === cur[1]) throw new InputError(`${w}.to`, `ends where it starts [${to[0]}, ${to[1]}] (zero-length line)`);
      segs.push(line(cur, to));
    } else {
      const [cx, cy] = st.center;
      const r0 = Math.hypot(cur[0] - cx, cur[1] - cy);
      const r1 = Math.hypot(to[0] - cx, to[1] - cy);
      if (!(r0 > 0)) throw new InputError(`${w}.center`, 'is the arc\'s start point; expected a centre away from it');
      // 1e-9 relative, plus the round-off of the coordinates themselves (a 1 mm fillet drawn at site
      // coordinates of 10^7 mm cannot be written closer than about 1e-9 mm)
      const roundoff = 8 * Number.EPSILON * Math.max(Math.abs(cx), Math.abs(cy), Math.abs(cur[0]), Math.abs(cur[1]), Math.abs(to[0]), Math.abs(to[1]));
      if (Math.abs(r0 - r1) > 1e-9 * Math.max(r0, r1) + roundoff) {
        throw new InputError(`${w}.to`, `expected a point at the arc's radius ${r0} from the centre, got one at ${r1}`);
      }
      const ccw = st.turn !== 'cw';
      const a0 = Math.atan2(cur[1] - cy, cur[0] - cx);
      let a1 = Math.atan2(to[1] - cy, to[0] - cx);
      if (ccw) { while (a1 <= a0) a1 += 2 * Math.PI; } else { while (a1 >= a0) a1 -= 2 * Math.PI; }
      const r = (r0 + r1) / 2;
      const full = to[0] === cur[0] && to[1] === cur[1];
      if (full) {
        const mid = (a0 + a1) / 2;
        segs.push(arc(cx, cy, r, a0, mid), arc(cx, cy, r, mid, a1));
      } else if (Math.abs(a1 - a0) > Math.PI) {
        const mid = (a0 + a1) / 2; // keep each arc within a half turn
        segs.push(arc(cx, cy, r, a0, mid), arc(cx, cy, r, mid, a1));
      } else {
        segs.push(arc(cx, cy, r, a0, a1));
      }
    }
    cur = to;
  });
  if (cur[0] !== start[0] || cur[1] !== start[1]) segs.push(line(cur, start));
  return { where, segments: segs };
}
