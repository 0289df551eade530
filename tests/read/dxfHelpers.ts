/** Shared measuring tools for the DXF tests: signed area from the segment ops, centroid and second moments by a
 * boundary integral (Green's theorem, 20-point Gauss–Legendre on 16 sub-intervals per segment), extents. */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { DrawnContour } from '../../src/read/drawing.js';
import { type Segment, ops } from '../../src/geometry/segments.js';

export const FIXTURES = join(import.meta.dirname, '..', 'fixtures', 'dxf');

export function fixture(name: string): string {
  return readFileSync(join(FIXTURES, `${name}.dxf`), 'utf8');
}

export interface RefRegion { label: string; area: number; cx: number; cy: number; bbox: [number, number, number, number] }
export function reference(name: string): { regions: RefRegion[]; [k: string]: unknown } {
  return JSON.parse(readFileSync(join(FIXTURES, `${name}.json`), 'utf8'));
}

/** Signed area: Σ ops(s).areaTerm(s). */
export function signedArea(segs: Segment[]): number {
  let a = 0;
  for (const s of segs) a += ops(s).areaTerm(s);
  return a;
}

// Gauss–Legendre 20 nodes (Golub–Welsch by Newton on P_n, as in any numerical text)
const GL = (() => {
  const n = 20, x: number[] = [], w: number[] = [];
  for (let i = 0; i < n; i++) {
    let z = Math.cos(Math.PI * (i + 0.75) / (n + 0.5)), dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1, p1 = z;
      for (let k = 2; k <= n; k++) { const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k; p0 = p1; p1 = p2; }
      dp = n * (z * p1 - p0) / (z * z - 1);
      const dz = p1 / dp; z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x.push(z); w.push(2 / ((1 - z * z) * dp * dp));
  }
  return { x, w };
})();

/** ∫∫ dA, ∫∫ x dA, ∫∫ y dA, ∫∫ x² dA, ∫∫ y² dA over the region the closed chain encloses (signed). */
export function moments(segs: Segment[]): { A: number; Sx: number; Sy: number; Ixx: number; Iyy: number } {
  let A = 0, Sx = 0, Sy = 0, Ixx = 0, Iyy = 0;
  const p: [number, number] = [0, 0], d: [number, number] = [0, 0];
  const parts = 16;
  for (const s of segs) {
    const o = ops(s);
    for (let q = 0; q < parts; q++) {
      const a = q / parts, h = 1 / parts;
      for (let i = 0; i < GL.x.length; i++) {
        const t = a + h * (GL.x[i] + 1) / 2, w = GL.w[i] * h / 2;
        o.point(s, t, p); o.derivative(s, t, d);
        const [x, y] = p, [dx, dy] = d;
        A += w * (x * dy - y * dx) / 2;
        Sx += w * (x * x * dy) / 2; // ∫∫ x dA = ∮ x²/2 dy
        Sy += -w * (y * y * dx) / 2; // ∫∫ y dA = −∮ y²/2 dx
        Iyy += w * (x * x * x * dy) / 3; // ∫∫ x² dA = ∮ x³/3 dy
        Ixx += -w * (y * y * y * dx) / 3; // ∫∫ y² dA = −∮ y³/3 dx
      }
    }
  }
  return { A, Sx, Sy, Ixx, Iyy };
}

export function centroid(segs: Segment[]): [number, number] {
  const m = moments(segs);
  return [m.Sx / m.A, m.Sy / m.A];
}

export function extents(segs: Segment[]): [number, number, number, number] {
  let b: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const s of segs) {
    const e = ops(s).bbox(s);
    b = [Math.min(b[0], e[0]), Math.min(b[1], e[1]), Math.max(b[2], e[2]), Math.max(b[3], e[3])];
  }
  return b;
}

/** The visible closed contour whose |area| and centroid match (relative area tol, absolute centroid tol). */
export function findContour(cs: DrawnContour[], area: number, cx: number, cy: number, relA = 1e-6, absC = 1e-4): DrawnContour | undefined {
  return cs.find((c) => {
    if (!c.closed || c.hidden) return false;
    const a = Math.abs(signedArea(c.segments));
    if (Math.abs(a - area) > relA * area) return false;
    const [x, y] = centroid(c.segments);
    return Math.hypot(x - cx, y - cy) <= absC;
  });
}
