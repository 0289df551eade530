/**
 * Random valid plates for the hardening properties (fast-check arbitraries). Invented geometry, for tests.
 *
 * Outline: a star-shaped polygon about the origin (8–14 vertices, radii 140–200, angular gaps within ±20 %
 * of equal, so it contains the disc of radius 119 about the origin) or a rounded rectangle with half-sides
 * 110–250 and corner radius 5–60 (exact arcs). Holes: circles, regular polygons, slots and rounded
 * rectangles (exact arcs), each inside the disc of radius 88 and at least 2 apart from each other (by
 * bounding circles), so every part is valid by construction.
 */
import fc from 'fast-check';

export type P = [number, number];
export type Shape =
  | { circle: { center: P; diameter: number } }
  | { polygon: P[] }
  | { slot: { from: P; to: P; width: number } }
  | { path: { start: P; segments: { to: P; center?: P; turn?: 'ccw' | 'cw' }[] } };
export interface PlateObj { part: string; units: 'mm'; outline: Shape; cutouts: Shape[] }

/** rho (0–1) and theta place the hole's centre at distance rho·(88 − bounding radius) from the origin. */
export interface HoleSpec { kind: number; rho: number; theta: number; size: number; angle: number; aspect: number; sides: number }
export interface PlateSpec {
  star: boolean;
  n: number; gaps: number[]; radii: number[]; phase: number;
  a: number; b: number; r: number;
  holes: HoleSpec[];
}

const rot = (c: P, ang: number, x: number, y: number): P => [c[0] + Math.cos(ang) * x - Math.sin(ang) * y, c[1] + Math.sin(ang) * x + Math.cos(ang) * y];

/** A rounded rectangle (half-sides a, b, corner radius r) centred at c, turned by ang: a path of lines and arcs. */
export function roundedRect(c: P, a: number, b: number, r: number, ang: number): Shape {
  const q = (x: number, y: number) => rot(c, ang, x, y);
  return {
    path: {
      start: q(-a + r, -b),
      segments: [
        { to: q(a - r, -b) }, { to: q(a, -b + r), center: q(a - r, -b + r), turn: 'ccw' },
        { to: q(a, b - r) }, { to: q(a - r, b), center: q(a - r, b - r), turn: 'ccw' },
        { to: q(-a + r, b) }, { to: q(-a, b - r), center: q(-a + r, b - r), turn: 'ccw' },
        { to: q(-a, -b + r) }, { to: q(-a + r, -b), center: q(-a + r, -b + r), turn: 'ccw' },
      ],
    },
  };
}

/** Bounding radius of a hole about its centre. */
function boundingRadius(h: HoleSpec, kind: number): number {
  if (kind === 0 || kind === 1) return h.size / 2;
  if (kind === 2) return h.size / 2 + (h.size * h.aspect) / 2;
  return Math.hypot(h.size / 2, (h.size * h.aspect) / 2 + 1);
}

function hole(h: HoleSpec, straightOnly: boolean): { shape: Shape; rb: number; c: P } {
  const kind = straightOnly ? 1 : h.kind;
  const rho = h.rho * (88 - boundingRadius(h, kind));
  const c: P = [rho * Math.cos(h.theta), rho * Math.sin(h.theta)];
  const r = (v: { shape: Shape; rb: number }) => ({ ...v, c });
  return r(shapeOf(h, kind, c));
}

function shapeOf(h: HoleSpec, kind: number, c: P): { shape: Shape; rb: number } {
  switch (kind) {
    case 0: return { shape: { circle: { center: c, diameter: h.size } }, rb: h.size / 2 };
    case 1: {
      const pts: P[] = [];
      for (let i = 0; i < h.sides; i++) pts.push(rot(c, h.angle + (2 * Math.PI * i) / h.sides, h.size / 2, 0));
      return { shape: { polygon: pts }, rb: h.size / 2 };
    }
    case 2: {
      const w = h.size * h.aspect;
      return { shape: { slot: { from: rot(c, h.angle, -h.size / 2, 0), to: rot(c, h.angle, h.size / 2, 0), width: w } }, rb: h.size / 2 + w / 2 };
    }
    default: {
      const a = h.size / 2, b = (h.size * h.aspect) / 2 + 1;
      return { shape: roundedRect(c, a, b, 0.5 * Math.min(a, b), h.angle), rb: Math.hypot(a, b) };
    }
  }
}

export function buildPlate(s: PlateSpec, straightOnly = false): PlateObj {
  let outline: Shape;
  if (s.star || straightOnly) {
    const total = s.gaps.slice(0, s.n).reduce((u, v) => u + v, 0);
    let ang = s.phase;
    const pts: P[] = [];
    for (let i = 0; i < s.n; i++) {
      pts.push([s.radii[i] * Math.cos(ang), s.radii[i] * Math.sin(ang)]);
      ang += (2 * Math.PI * s.gaps[i]) / total;
    }
    outline = { polygon: pts };
  } else {
    outline = roundedRect([0, 0], s.a, s.b, s.r, 0);
  }
  const placed: { c: P; rb: number }[] = [];
  const cutouts: Shape[] = [];
  for (const h of s.holes) {
    const { shape, rb, c } = hole(h, straightOnly);
    if (placed.some((p) => Math.hypot(p.c[0] - c[0], p.c[1] - c[1]) < p.rb + rb + 2)) continue;
    placed.push({ c, rb });
    cutouts.push(shape);
  }
  return { part: 'random plate (invented)', units: 'mm', outline, cutouts };
}

/** A number in [min, max] on a grid of 10⁶ steps (fast-check's doubles crowd at the ends, which piles holes up). */
const d = (min: number, max: number) => fc.integer({ min: 0, max: 1_000_000 }).map((k) => min + ((max - min) * k) / 1_000_000);

export const holeSpec: fc.Arbitrary<HoleSpec> = fc.record({
  kind: fc.integer({ min: 0, max: 3 }), rho: d(0, 1), theta: d(0, 2 * Math.PI), size: d(4, 30), angle: d(0, 2 * Math.PI),
  aspect: d(0.2, 0.6), sides: fc.integer({ min: 3, max: 7 }),
});

export const plateSpec: fc.Arbitrary<PlateSpec> = fc.record({
  star: fc.boolean(),
  n: fc.integer({ min: 8, max: 14 }),
  gaps: fc.array(d(0.8, 1.2), { minLength: 14, maxLength: 14 }),
  radii: fc.array(d(140, 200), { minLength: 14, maxLength: 14 }),
  phase: d(0, 2 * Math.PI),
  a: d(110, 250), b: d(110, 250), r: d(5, 60),
  holes: fc.array(holeSpec, { minLength: 1, maxLength: 8, size: 'max' }),
});

/** Apply a point map to every point of a shape (only rigid motions and uniform scalings keep it valid). */
export function mapShape(s: Shape, f: (p: P) => P, k = 1): Shape {
  if ('circle' in s) return { circle: { center: f(s.circle.center), diameter: s.circle.diameter * k } };
  if ('polygon' in s) return { polygon: s.polygon.map(f) };
  if ('slot' in s) return { slot: { from: f(s.slot.from), to: f(s.slot.to), width: s.slot.width * k } };
  return { path: { start: f(s.path.start), segments: s.path.segments.map((g) => (g.center ? { to: f(g.to), center: f(g.center), turn: g.turn } : { to: f(g.to) })) } };
}

export function mapPlate(p: PlateObj, f: (p: P) => P, k = 1): PlateObj {
  return { ...p, outline: mapShape(p.outline, f, k), cutouts: p.cutouts.map((c) => mapShape(c, f, k)) };
}
