/**
 * Circular arc: centre (cx, cy), radius r, from angle a0 to a1 in radians; a1 > a0 runs counter-clockwise.
 * Stored exactly, never as a polyline. Every operation is a closed form.
 */
import { applyAffine } from './affine.js';
import { angleInClosedSweep, angleInSweep, sweepParam } from './angles.js';
import { type EllipticalArcSegment, transformEllipse } from './ellipticalArc.js';
import type { LineSegment } from './line.js';
import { trigArcMoments, trigArcNodes } from './moments.js';
import { MAX_ARC_COMMAND_SWEEP, type Crossing, type Out2, type PathCommand, type SegmentOps } from './types.js';

export interface ArcSegment {
  kind: 'arc';
  cx: number; cy: number;
  r: number;
  a0: number; a1: number;
}

const arcParam = (s: ArcSegment, ang: number, slack: number): number => sweepParam(ang, s.a0, s.a1, slack);

/** Crossings of a line (ta) and an arc (tb) within `tol`; a tangent within tol counts once. */
export function lineArcCrossings(a: LineSegment, c: ArcSegment, tol: number): Crossing[] {
  const dx = a.x1 - a.x0, dy = a.y1 - a.y0;
  const L = Math.hypot(dx, dy);
  const ux = dx / L, uy = dy / L;
  // foot of the perpendicular from the centre
  const s0 = (c.cx - a.x0) * ux + (c.cy - a.y0) * uy;
  const fx = a.x0 + ux * s0, fy = a.y0 + uy * s0;
  const h = Math.hypot(c.cx - fx, c.cy - fy);
  if (h > c.r + tol) return [];
  const half = h >= c.r - tol ? 0 : Math.sqrt(c.r * c.r - h * h);
  const out: Crossing[] = [];
  const slack = tol / c.r;
  for (const s of half === 0 ? [s0] : [s0 - half, s0 + half]) {
    if (s < -tol || s > L + tol) continue;
    const x = a.x0 + ux * s, y = a.y0 + uy * s;
    const tb = arcParam(c, Math.atan2(y - c.cy, x - c.cx), slack);
    if (Number.isNaN(tb)) continue;
    out.push({ x, y, ta: s / L, tb });
  }
  return out;
}

/** Crossings of two arcs within `tol`; arcs on the same circle touch where their sweeps overlap. */
export function arcArcCrossings(a: ArcSegment, b: ArcSegment, tol: number): Crossing[] {
  const dx = b.cx - a.cx, dy = b.cy - a.cy;
  const d = Math.hypot(dx, dy);
  if (d > a.r + b.r + tol) return [];
  if (d < Math.abs(a.r - b.r) - tol) return [];
  const out: Crossing[] = [];
  const p: Out2 = [0, 0];
  if (d <= tol && Math.abs(a.r - b.r) <= tol) {
    for (const t of [0, 0.5, 1]) {
      arcOps.point(b, t, p);
      const ta = arcParam(a, Math.atan2(p[1] - a.cy, p[0] - a.cx), tol / a.r);
      if (!Number.isNaN(ta)) out.push({ x: p[0], y: p[1], ta, tb: t });
    }
    for (const t of [0, 0.5, 1]) {
      arcOps.point(a, t, p);
      const tb = arcParam(b, Math.atan2(p[1] - b.cy, p[0] - b.cx), tol / b.r);
      if (!Number.isNaN(tb)) out.push({ x: p[0], y: p[1], ta: t, tb });
    }
    return out;
  }
  const along = (a.r * a.r - b.r * b.r + d * d) / (2 * d);
  const h2 = a.r * a.r - along * along;
  const h = h2 > 0 ? Math.sqrt(h2) : 0;
  const mx = a.cx + dx * along / d, my = a.cy + dy * along / d;
  const pts = h <= tol ? [[mx, my]] : [[mx - dy * h / d, my + dx * h / d], [mx + dy * h / d, my - dx * h / d]];
  for (const [x, y] of pts) {
    const ta = arcParam(a, Math.atan2(y - a.cy, x - a.cx), tol / a.r);
    const tb = arcParam(b, Math.atan2(y - b.cy, x - b.cx), tol / b.r);
    if (!Number.isNaN(ta) && !Number.isNaN(tb)) out.push({ x, y, ta, tb });
  }
  return out;
}

const swapped = (h: Crossing): Crossing => ({ ...h, ta: h.tb, tb: h.ta });

export const arcOps: SegmentOps<ArcSegment, ArcSegment | EllipticalArcSegment> = {
  kind: 'arc',
  straight: false,
  point(s, t, out) {
    const a = s.a0 + (s.a1 - s.a0) * t;
    out[0] = s.cx + s.r * Math.cos(a);
    out[1] = s.cy + s.r * Math.sin(a);
  },
  derivative(s, t, out) {
    const d = s.a1 - s.a0;
    const a = s.a0 + d * t;
    out[0] = -s.r * d * Math.sin(a);
    out[1] = s.r * d * Math.cos(a);
  },
  // one cos/sin pair for point and derivative (the curved-triangle map calls this at every quadrature point)
  evaluate(s, t, p, dv) {
    const d = s.a1 - s.a0, ang = s.a0 + d * t;
    const c = Math.cos(ang), sn = Math.sin(ang);
    p[0] = s.cx + s.r * c; p[1] = s.cy + s.r * sn;
    dv[0] = -s.r * d * sn; dv[1] = s.r * d * c;
  },
  start(s, out) { arcOps.point(s, 0, out); },
  end(s, out) { arcOps.point(s, 1, out); },
  reverse: (s) => ({ kind: 'arc', cx: s.cx, cy: s.cy, r: s.r, a0: s.a1, a1: s.a0 }),
  translate: (s, dx, dy) => ({ kind: 'arc', cx: s.cx + dx, cy: s.cy + dy, r: s.r, a0: s.a0, a1: s.a1 }),
  sub(s, a, b) {
    const d = s.a1 - s.a0;
    return { ...s, a0: a === 0 ? s.a0 : s.a0 + d * a, a1: b === 1 ? s.a1 : s.a0 + d * b };
  },
  // A similarity keeps a circle: rotation (or mirror) with uniform scale. A mirror sends angle α to ψ − α,
  // which reverses the sweep, as the mirrored points do. Any other map gives an elliptical arc.
  affine(s, m) {
    const [a, b, c, d] = m;
    const scale = Math.max(Math.abs(a), Math.abs(b), Math.abs(c), Math.abs(d));
    const tol = 1e-14 * scale;
    const [cx, cy] = applyAffine(m, s.cx, s.cy);
    if (Math.abs(a - d) <= tol && Math.abs(b + c) <= tol) {
      // rotation by psi and uniform scale: angle α goes to α + psi
      const psi = Math.atan2(b, a);
      return { kind: 'arc', cx, cy, r: s.r * Math.hypot(a, b), a0: s.a0 + psi, a1: s.a1 + psi };
    }
    if (Math.abs(a + d) <= tol && Math.abs(b - c) <= tol) {
      // reflection across the line at angle psi/2, with uniform scale: angle α goes to psi − α
      const psi = Math.atan2(b, a);
      return { kind: 'arc', cx, cy, r: s.r * Math.hypot(a, b), a0: psi - s.a0, a1: psi - s.a1 };
    }
    return transformEllipse({ kind: 'ellipticalArc', cx: s.cx, cy: s.cy, rx: s.r, ry: s.r, phi: 0, t0: s.a0, t1: s.a1 }, m);
  },
  // the radius stays exact; the angles shift by the turn
  rotate: (s, c, sn, angle, x, y) => ({ kind: 'arc', cx: x + c * s.cx - sn * s.cy, cy: y + sn * s.cx + c * s.cy, r: s.r, a0: s.a0 + angle, a1: s.a1 + angle }),
  moveStart: () => null,
  moveEnd: () => null,
  length: (s) => s.r * Math.abs(s.a1 - s.a0),
  bbox(s) {
    const p: Out2 = [0, 0];
    arcOps.point(s, 0, p);
    let xMin = p[0], xMax = p[0], yMin = p[1], yMax = p[1];
    arcOps.point(s, 1, p);
    xMin = Math.min(xMin, p[0]); xMax = Math.max(xMax, p[0]);
    yMin = Math.min(yMin, p[1]); yMax = Math.max(yMax, p[1]);
    if (angleInSweep(0, s.a0, s.a1)) xMax = s.cx + s.r;
    if (angleInSweep(Math.PI, s.a0, s.a1)) xMin = s.cx - s.r;
    if (angleInSweep(Math.PI / 2, s.a0, s.a1)) yMax = s.cy + s.r;
    if (angleInSweep(-Math.PI / 2, s.a0, s.a1)) yMin = s.cy - s.r;
    return [xMin, yMin, xMax, yMax];
  },
  // ∫(x dy − y dx)/2 with x = cx + r cos a, y = cy + r sin a:
  // x dy − y dx = (r² + cx r cos a + cy r sin a) da, so the integral is
  // [r² (a1 − a0) + cx r (sin a1 − sin a0) + cy r (cos a0 − cos a1)] / 2.
  // the circle x = cx + r cos θ, y = cy + r sin θ as a trigonometric arc (closed form, kinds/moments.ts)
  moments: (s, ox, oy, out) => trigArcMoments(s.cx - ox, s.cy - oy, s.r, 0, 0, s.r, s.a0, s.a1, out),
  greenNodes: (s, ox, oy, degree, visit) => trigArcNodes(s.cx - ox, s.cy - oy, s.r, 0, 0, s.r, s.a0, s.a1, degree, visit),
  areaTerm(s) {
    const { cx, cy, r, a0, a1 } = s;
    return (r * r * (a1 - a0) + cx * r * (Math.sin(a1) - Math.sin(a0)) + cy * r * (Math.cos(a0) - Math.cos(a1))) / 2;
  },
  turning: (s, t0, t1) => Math.abs((s.a1 - s.a0) * (t1 - t0)),
  deviation: (s, t0, t1) => s.r * (1 - Math.cos(Math.abs((s.a1 - s.a0) * (t1 - t0)) / 2)),
  yTurns(s) {
    const out: number[] = [];
    const d = s.a1 - s.a0;
    if (d === 0) return out;
    // extrema of sin(a) at a = π/2 + kπ
    const lo = Math.min(s.a0, s.a1), hi = Math.max(s.a0, s.a1);
    for (let k = Math.ceil((lo - Math.PI / 2) / Math.PI); Math.PI / 2 + k * Math.PI < hi; k++) {
      const a = Math.PI / 2 + k * Math.PI;
      if (a > lo) out.push((a - s.a0) / d);
    }
    return out.sort((a, b) => a - b);
  },
  crossingX(s, ta, tb, y) {
    // the piece lies on one side of the vertical through the centre: take the sign of cos at its middle
    const am = s.a0 + (s.a1 - s.a0) * ((ta + tb) / 2);
    const dy = y - s.cy;
    const h = Math.sqrt(Math.max(0, s.r * s.r - dy * dy));
    return s.cx + (Math.cos(am) >= 0 ? h : -h);
  },
  // end points, plus the circle's support point when its angle lies in the sweep
  support(s, ux, uy) {
    const { cx, cy, r, a0, a1 } = s;
    if (angleInClosedSweep(Math.atan2(uy, ux), a0, a1)) return cx * ux + cy * uy + r;
    const p0 = cx * ux + cy * uy + r * (Math.cos(a0) * ux + Math.sin(a0) * uy);
    const p1 = cx * ux + cy * uy + r * (Math.cos(a1) * ux + Math.sin(a1) * uy);
    return Math.max(p0, p1);
  },
  overlap: { arc: arcOverlap },
  merge: { arc: arcMerge },
  crossings: {
    line: (a: ArcSegment, b: LineSegment, tol: number) => lineArcCrossings(b, a, tol).map(swapped),
    arc: arcArcCrossings,
  },
  pathCommands(s, t0, t1) {
    const b0 = s.a0 + (s.a1 - s.a0) * t0, b1 = s.a0 + (s.a1 - s.a0) * t1;
    const n = Math.max(1, Math.ceil(Math.abs(b1 - b0) / MAX_ARC_COMMAND_SWEEP - 1e-12));
    const sweep = b1 > b0 ? 1 : 0;
    const out: PathCommand[] = [];
    for (let i = 1; i <= n; i++) {
      const a = i === n ? b1 : b0 + ((b1 - b0) * i) / n;
      out.push({ cmd: 'A', args: [s.r, s.r, 0, 0, sweep, s.cx + s.r * Math.cos(a), s.cy + s.r * Math.sin(a)] });
    }
    return out;
  },
};

/** Shared stretch of two arcs of one circle (within tol): [x, y of its middle, length], or undefined. */
function arcOverlap(s: ArcSegment, t: ArcSegment, tol: number): [number, number, number] | undefined {
  if (Math.hypot(s.cx - t.cx, s.cy - t.cy) > tol || Math.abs(s.r - t.r) > tol) return undefined;
  const TWO_PI = 2 * Math.PI;
  let aLo = Math.min(s.a0, s.a1); const aLen = Math.abs(s.a1 - s.a0);
  let bLo = Math.min(t.a0, t.a1); const bLen = Math.abs(t.a1 - t.a0);
  aLo -= TWO_PI * Math.floor(aLo / TWO_PI); bLo -= TWO_PI * Math.floor(bLo / TWO_PI);
  let best = 0, bestMid = 0;
  for (let k = -1; k <= 1; k++) {
    const lo = Math.max(aLo, bLo + k * TWO_PI), hi = Math.min(aLo + aLen, bLo + k * TWO_PI + bLen);
    if (hi - lo > best) { best = hi - lo; bestMid = (lo + hi) / 2; }
  }
  if (best * s.r <= tol) return undefined;
  return [s.cx + s.r * Math.cos(bestMid), s.cy + s.r * Math.sin(bestMid), best * s.r];
}

/** a then b as one arc, when both lie on one circle (within tol) and turn the same way, together at most a full turn. */
function arcMerge(a: ArcSegment, b: ArcSegment, tol: number): ArcSegment | null {
  if (Math.abs(a.cx - b.cx) > tol || Math.abs(a.cy - b.cy) > tol || Math.abs(a.r - b.r) > tol) return null;
  const da = a.a1 - a.a0, db = b.a1 - b.a0;
  if (da * db <= 0) return null;
  // b's start angle, moved by whole turns to meet a's end
  const start = b.a0 + 2 * Math.PI * Math.round((a.a1 - b.a0) / (2 * Math.PI));
  if (Math.abs(start - a.a1) * a.r > tol) return null;
  const sweep = da + db;
  if (Math.abs(sweep) > 2 * Math.PI + tol / a.r) return null;
  return { kind: 'arc', cx: a.cx, cy: a.cy, r: a.r, a0: a.a0, a1: a.a0 + sweep };
}
