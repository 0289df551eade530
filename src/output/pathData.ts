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
import { bezierSubCurve } from '../geometry/curves.js';
import type { Loop } from '../geometry/part.js';
import { type Segment, segmentPoint, segmentStart } from '../geometry/segments.js';

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

/** Largest sweep of one `A` command; keeping it below π makes the large-arc flag always 0. */
const MAX_ARC_PIECE = (2 * Math.PI) / 3;

function pt(m: DrawingMap, x: number, y: number): string {
  return `${num(mapX(m, x))} ${num(mapY(m, y))}`;
}

/**
 * Path commands that draw segment `s` from parameter s0 to s1 (either order), starting where the pen
 * already is (at the point for s0). `dx, dy` shift the segment first (mesh segments use local coordinates).
 */
export function segmentCommands(s: Segment, s0: number, s1: number, m: DrawingMap, dx = 0, dy = 0): string {
  switch (s.kind) {
    case 'line': {
      const p = segmentPoint(s, s1);
      return `L${pt(m, p[0] + dx, p[1] + dy)}`;
    }
    case 'arc': {
      const b0 = s.a0 + (s.a1 - s.a0) * s0, b1 = s.a0 + (s.a1 - s.a0) * s1;
      const n = Math.max(1, Math.ceil(Math.abs(b1 - b0) / MAX_ARC_PIECE - 1e-12));
      const r = num(m.k * s.r);
      const sweep = b1 > b0 ? 0 : 1;
      let out = '';
      for (let i = 1; i <= n; i++) {
        const a = i === n ? b1 : b0 + ((b1 - b0) * i) / n;
        out += `A${r} ${r} 0 0 ${sweep} ${pt(m, s.cx + s.r * Math.cos(a) + dx, s.cy + s.r * Math.sin(a) + dy)}`;
      }
      return out;
    }
    case 'ellipticalArc': {
      const b0 = s.t0 + (s.t1 - s.t0) * s0, b1 = s.t0 + (s.t1 - s.t0) * s1;
      const n = Math.max(1, Math.ceil(Math.abs(b1 - b0) / MAX_ARC_PIECE - 1e-12));
      const rx = num(m.k * Math.abs(s.rx)), ry = num(m.k * Math.abs(s.ry));
      // counter-clockwise in the part when the parameter grows and rx·ry > 0; the y flip reverses it
      const ccw = (b1 - b0) * s.rx * s.ry > 0;
      const sweep = ccw ? 0 : 1;
      // rotation of the x semi-axis: +phi in the part, −phi after the flip (degrees, as SVG wants)
      const rot = num(-(s.phi * 180) / Math.PI);
      const c = Math.cos(s.phi), sn = Math.sin(s.phi);
      let out = '';
      for (let i = 1; i <= n; i++) {
        const t = i === n ? b1 : b0 + ((b1 - b0) * i) / n;
        const ex = s.rx * Math.cos(t), ey = s.ry * Math.sin(t);
        out += `A${rx} ${ry} ${rot} 0 ${sweep} ${pt(m, s.cx + c * ex - sn * ey + dx, s.cy + sn * ex + c * ey + dy)}`;
      }
      return out;
    }
    case 'quadratic':
    case 'cubic': {
      const xs = s.kind === 'quadratic' ? [s.x0, s.x1, s.x2] : [s.x0, s.x1, s.x2, s.x3];
      const ys = s.kind === 'quadratic' ? [s.y0, s.y1, s.y2] : [s.y0, s.y1, s.y2, s.y3];
      let [px, py] = s0 === 0 && s1 === 1 ? [xs, ys] : bezierSubCurve(xs, ys, Math.min(s0, s1), Math.max(s0, s1));
      if (s0 > s1) { px = px.slice().reverse(); py = py.slice().reverse(); }
      const cmd = s.kind === 'quadratic' ? 'Q' : 'C';
      const pts: string[] = [];
      for (let i = 1; i < px.length; i++) pts.push(pt(m, px[i] + dx, py[i] + dy));
      return `${cmd}${pts.join(' ')}`;
    }
  }
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
