/**
 * Curved parts for the boundary-path tests (invented): parts from loops of segments, full circles and
 * ellipses, and random curved plates with holes using every segment kind (lines, circular and elliptical
 * arcs, quadratic and cubic Béziers), holes drawn either way round.
 */
import type { Loop, Part } from '../../src/geometry/part.js';
import { reverseLoop } from '../../src/geometry/part.js';
import { type Segment, ops } from '../../src/geometry/segments.js';

export const part = (loops: Segment[][], name = 'test part (invented)'): Part =>
  ({ name, units: 'mm', regions: [{ outer: { segments: loops[0] }, holes: loops.slice(1).map((segments) => ({ segments })) }] });
export const fullCircle = (cx: number, cy: number, r: number, a = 0): Segment[] =>
  [{ kind: 'arc', cx, cy, r, a0: a, a1: a + Math.PI }, { kind: 'arc', cx, cy, r, a0: a + Math.PI, a1: a + 2 * Math.PI }];
export const fullEllipse = (cx: number, cy: number, rx: number, ry: number, phi: number, a = 0): Segment[] =>
  [{ kind: 'ellipticalArc', cx, cy, rx, ry, phi, t0: a, t1: a + Math.PI }, { kind: 'ellipticalArc', cx, cy, rx, ry, phi, t0: a + Math.PI, t1: a + 2 * Math.PI }];

/** Side from P to Q of a counter-clockwise outline, bulging outwards (right of the direction) by up to 12 % of its length. */
function side(P: [number, number], Q: [number, number], kind: number, rand: () => number): Segment {
  const L = Math.hypot(Q[0] - P[0], Q[1] - P[1]);
  const ux = (Q[0] - P[0]) / L, uy = (Q[1] - P[1]) / L, nx = -uy, ny = ux; // n: left normal (inwards)
  const Mx = (P[0] + Q[0]) / 2, My = (P[1] + Q[1]) / 2;
  const s = L * (0.02 + 0.1 * rand());
  switch (kind) {
    case 0: return { kind: 'line', x0: P[0], y0: P[1], x1: Q[0], y1: Q[1] };
    case 1: {
      const r = (L * L / 4 + s * s) / (2 * s), cx = Mx + (r - s) * nx, cy = My + (r - s) * ny;
      const am = Math.atan2(-ny, -nx), b = Math.asin(L / (2 * r));
      return { kind: 'arc', cx, cy, r, a0: am - b, a1: am + b };
    }
    case 2: return { kind: 'ellipticalArc', cx: Mx, cy: My, rx: L / 2, ry: s, phi: Math.atan2(uy, ux), t0: -Math.PI, t1: 0 };
    case 3: return { kind: 'quadratic', x0: P[0], y0: P[1], x1: Mx - 2 * s * nx, y1: My - 2 * s * ny, x2: Q[0], y2: Q[1] };
    default: return {
      kind: 'cubic', x0: P[0], y0: P[1], x1: P[0] + L / 3 * ux - s * nx * (0.5 + rand()), y1: P[1] + L / 3 * uy - s * ny * (0.5 + rand()),
      x2: Q[0] - L / 3 * ux - s * nx * (0.5 + rand()), y2: Q[1] - L / 3 * uy - s * ny * (0.5 + rand()), x3: Q[0], y3: Q[1],
    };
  }
}

/** A hole of radius ≤ ρ about (cx, cy), one of six shapes, counter-clockwise. */
function holeLoop(cx: number, cy: number, rho: number, kind: number, rand: () => number): Segment[] {
  const turn = rand() * 2 * Math.PI;
  switch (kind) {
    case 0: return fullCircle(cx, cy, rho * (0.4 + 0.6 * rand()), turn);
    case 1: return fullEllipse(cx, cy, rho * (0.5 + 0.5 * rand()), rho * (0.2 + 0.3 * rand()), turn, rand() * 6);
    case 2: { // D shape: a chord and a half circle
      const r = rho * (0.5 + 0.5 * rand()), c = Math.cos(turn), s = Math.sin(turn);
      return [{ kind: 'arc', cx, cy, r, a0: turn, a1: turn + Math.PI }, { kind: 'line', x0: cx - r * c, y0: cy - r * s, x1: cx + r * c, y1: cy + r * s }];
    }
    case 3: { // four quadratics round a circle (controls on the tangent lines' corners, pulled in a little)
      const r = rho * 0.6, segs: Segment[] = [];
      for (let i = 0; i < 4; i++) {
        const a = turn + i * Math.PI / 2, b = a + Math.PI / 2, m = (a + b) / 2, k = r * Math.SQRT2 * (0.8 + 0.2 * rand());
        segs.push({ kind: 'quadratic', x0: cx + r * Math.cos(a), y0: cy + r * Math.sin(a), x1: cx + k * Math.cos(m), y1: cy + k * Math.sin(m), x2: cx + r * Math.cos(b), y2: cy + r * Math.sin(b) });
      }
      return segs;
    }
    case 4: { // four cubics round a circle, control lengths jittered
      const r = rho * 0.7, segs: Segment[] = [];
      for (let i = 0; i < 4; i++) {
        const a = turn + i * Math.PI / 2, b = a + Math.PI / 2, h = r * 0.5523 * (0.7 + 0.6 * rand()), h2 = r * 0.5523 * (0.7 + 0.6 * rand());
        segs.push({
          kind: 'cubic', x0: cx + r * Math.cos(a), y0: cy + r * Math.sin(a), x1: cx + r * Math.cos(a) - h * Math.sin(a), y1: cy + r * Math.sin(a) + h * Math.cos(a),
          x2: cx + r * Math.cos(b) + h2 * Math.sin(b), y2: cy + r * Math.sin(b) - h2 * Math.cos(b), x3: cx + r * Math.cos(b), y3: cy + r * Math.sin(b),
        });
      }
      return segs;
    }
    default: { // half ellipse and its axis
      const a = rho * 0.9, b = rho * (0.3 + 0.5 * rand()), c = Math.cos(turn), s = Math.sin(turn);
      return [{ kind: 'ellipticalArc', cx, cy, rx: a, ry: b, phi: turn, t0: 0, t1: Math.PI }, { kind: 'line', x0: cx - a * c, y0: cy - a * s, x1: cx + a * c, y1: cy + a * s }];
    }
  }
}

export function randomCurvedPlate(rand: () => number, shift: [number, number] = [0, 0]): Part {
  const W = 100 + 300 * rand(), H = 80 + 200 * rand(), x0 = (rand() - 0.5) * 500, y0 = (rand() - 0.5) * 500;
  const corners: [number, number][] = [[x0, y0], [x0 + W, y0], [x0 + W, y0 + H], [x0, y0 + H]];
  const outline = corners.map((P, i) => side(P, corners[(i + 1) % 4], Math.floor(rand() * 5), rand));
  const nx = 2 + Math.floor(rand() * 3), ny = 1 + Math.floor(rand() * 3), cw = W / nx, ch = H / ny;
  const holes: Segment[][] = [];
  for (let i = 0; i < nx; i++) {
    for (let j = 0; j < ny; j++) {
      if (rand() < 0.2) continue;
      const h = holeLoop(x0 + (i + 0.5) * cw, y0 + (j + 0.5) * ch, 0.38 * Math.min(cw, ch), Math.floor(rand() * 6), rand);
      holes.push(rand() < 0.5 ? h : reverseLoop({ segments: h }).segments); // drawn either way
    }
  }
  const move = (s: Segment) => ops(s).translate(s, shift[0], shift[1]) as Segment;
  const loops: Loop[] = [outline, ...holes].map((segments) => ({ segments: segments.map(move) }));
  return { name: 'random curved plate (invented)', units: 'mm', regions: [{ outer: loops[0], holes: loops.slice(1) }] };
}

