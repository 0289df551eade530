/**
 * End-to-end accuracy of every curve kind through the whole pipeline (reader → validate → mesh →
 * quadrature → properties → estimate) at default settings, against closed forms computed independently
 * of the segment operations. Promise checked: relative error ≤ 1e-12 on area, centroid and second
 * moments, and the reported estimate is never below the true error.
 */
import { describe, it, expect } from 'vitest';
import { readParts } from '../../src/read/read.js';
import { measureSection } from '../../src/analysis/measure.js';
import { type SectionRef, expectSectionClose } from '../helpers.js';

type Ref = SectionRef;

describe('rotated ellipse (SVG <ellipse> with rotate transform → elliptical arcs)', () => {
  // Ellipse with semi-axes a (along u), b (along v): A = πab, I_u = ∫v² dA = πab³/4, I_v = ∫u² dA = πa³b/4
  // (handbook closed form, from memory). Axes rotated by φ: x = u cos φ − v sin φ, y = u sin φ + v cos φ, so
  // Ix = ∫y² = I_v sin²φ + I_u cos²φ, Iy = ∫x² = I_v cos²φ + I_u sin²φ, Ixy = (I_v − I_u) sin φ cos φ
  // (Mohr transformation of second moments, from memory).
  for (const [a, b, deg, cx, cy] of [[40, 15, 30, 100, 60], [7, 3, -71, -5000, 2500], [25, 24, 10, 0, 0], [60, 6, 135, 3, 4]]) {
    it(`a=${a} b=${b} rotated ${deg}° about (${cx}, ${cy})`, () => {
      const svg = `<svg xmlns="http://www.w3.org/2000/svg"><ellipse cx="${cx}" cy="${cy}" rx="${a}" ry="${b}" transform="rotate(${deg} ${cx} ${cy})"/></svg>`;
      const [p] = readParts(svg, 'ellipse.svg', { units: 'mm' });
      expect(p.regions[0].outer.segments.every((s) => s.kind === 'ellipticalArc')).toBe(true);
      const r = measureSection(p);
      // The reader maps SVG y (down) to part y (up): (x, y) → (x, −y), so the major axis is at −deg.
      const phi = (-deg * Math.PI) / 180;
      const Iu = (Math.PI * a * b ** 3) / 4, Iv = (Math.PI * a ** 3 * b) / 4;
      const s = Math.sin(phi), c = Math.cos(phi);
      const ref: Ref = { area: Math.PI * a * b, centroidX: cx, centroidY: -cy, Ix: Iv * s * s + Iu * c * c, Iy: Iv * c * c + Iu * s * s, Ixy: (Iv - Iu) * s * c };
      expectSectionClose(r, ref, 2 * a, `ellipse ${a}×${b} @${deg}°`);
    });
  }
});

describe('circle built from two SVG elliptical-arc commands with rx = ry (→ circular arcs)', () => {
  // Circle of radius R: A = πR², I = πR⁴/4 about any centroidal axis, Ixy = 0 (handbook, from memory).
  for (const [R, cx, cy, sweep] of [[10, 20, 20, 1], [0.375, 1e4, -3e3, 0], [0.35, 1e4, -3e3, 0], [125, -40, 7, 1]]) {
    it(`R=${R} at (${cx}, ${cy}), sweep flag ${sweep}`, () => {
      const d = `M ${cx + R} ${cy} A ${R} ${R} 0 1 ${sweep} ${cx - R} ${cy} A ${R} ${R} 0 1 ${sweep} ${cx + R} ${cy} Z`;
      const svg = `<svg xmlns="http://www.w3.org/2000/svg"><path d="${d}"/></svg>`;
      const [p] = readParts(svg, 'circle.svg', { units: 'mm' });
      expect(p.regions[0].outer.segments.some((s) => s.kind === 'arc')).toBe(true);
      const r = measureSection(p);
      // The circle the file describes has the endpoints as stored in binary: xr = fl(cx + R), xl = fl(cx − R).
      // Its radius is (xr − xl)/2 (the subtraction is exact: Sterbenz lemma). For R = 0.35 at 1e4 this
      // differs from 0.35 by ~1e-12 relative, a property of the input, not of the pipeline.
      const xr = cx + R, xl = cx - R;
      const Rf = (xr - xl) / 2, cf = xl + Rf;
      const I = (Math.PI * Rf ** 4) / 4;
      expectSectionClose(r, { area: Math.PI * Rf * Rf, centroidX: cf, centroidY: -cy, Ix: I, Iy: I, Ixy: 0 }, 2 * R, `circle R=${R}`);
    });
  }
});

// ---- exact moments of a region bounded by lines and Bézier curves with integer control points ----
// Green's theorem (common practice, no source): for a counter-clockwise boundary,
//   A = ∮ x dy, ∫x dA = ∮ x²/2 dy, ∫y dA = −∮ y²/2 dx, ∫x² dA = ∮ x³/3 dy, ∫xy dA = ∮ x²y/2 dy, ∫y² dA = −∮ y³/3 dx.
// Every piece is a polynomial x(t), y(t) with integer coefficients (Bernstein → power basis with BigInt),
// so each integral is an exact rational; nothing here uses the library's segment operations.
class Q {
  constructor(readonly n: bigint, readonly d: bigint = 1n) {}
  static norm(n: bigint, d: bigint): Q {
    if (d < 0n) { n = -n; d = -d; }
    const g = gcd(n < 0n ? -n : n, d);
    return new Q(n / g, d / g);
  }
  add(o: Q): Q { return Q.norm(this.n * o.d + o.n * this.d, this.d * o.d); }
  sub(o: Q): Q { return Q.norm(this.n * o.d - o.n * this.d, this.d * o.d); }
  mul(o: Q): Q { return Q.norm(this.n * o.n, this.d * o.d); }
  div(o: Q): Q { return Q.norm(this.n * o.d, this.d * o.n); }
  /** Correctly rounded enough: scale to 60 significant bits before converting. */
  toNumber(): number {
    const neg = this.n < 0n;
    const n = neg ? -this.n : this.n;
    if (n === 0n) return 0;
    const shift = BigInt(Math.max(0, 80 - (n.toString(2).length - this.d.toString(2).length)));
    const v = Number((n << shift) / this.d) / 2 ** Number(shift);
    return neg ? -v : v;
  }
}
function gcd(a: bigint, b: bigint): bigint { while (b) { [a, b] = [b, a % b]; } return a === 0n ? 1n : a; }

type Poly = bigint[]; // power basis, integer coefficients
const binom = (a: number, b: number): bigint => { let r = 1n; for (let i = 1; i <= b; i++) r = (r * BigInt(a - b + i)) / BigInt(i); return r; };
function bernsteinToPower(ps: number[]): Poly {
  const n = ps.length - 1;
  const c = new Array<bigint>(n + 1).fill(0n);
  for (let i = 0; i <= n; i++) for (let k = 0; k <= n - i; k++) c[i + k] += BigInt(ps[i]) * binom(n, i) * binom(n - i, k) * (k % 2 ? -1n : 1n);
  return c;
}
const pmul = (a: Poly, b: Poly): Poly => { const r = new Array<bigint>(a.length + b.length - 1).fill(0n); a.forEach((u, i) => b.forEach((v, j) => { r[i + j] += u * v; })); return r; };
const pder = (c: Poly): Poly => (c.length > 1 ? c.slice(1).map((v, i) => v * BigInt(i + 1)) : [0n]);
const pint01 = (c: Poly): Q => c.reduce((s, v, k) => s.add(new Q(v, BigInt(k + 1))), new Q(0n));

/** Pieces as control-point lists [[x0,y0],[x1,y1],...] (2 points: line, 3: quadratic, 4: cubic). */
function exactMoments(loops: number[][][][]): Ref {
  let A = new Q(0n), Sx = new Q(0n), Sy = new Q(0n), Ixx = new Q(0n), Ixy = new Q(0n), Iyy = new Q(0n);
  for (const loop of loops) {
    for (const piece of loop) {
      const X = bernsteinToPower(piece.map((p) => p[0])), Y = bernsteinToPower(piece.map((p) => p[1]));
      const dX = pder(X), dY = pder(Y);
      const X2 = pmul(X, X), Y2 = pmul(Y, Y);
      A = A.add(pint01(pmul(X, dY)));
      Sy = Sy.add(pint01(pmul(X2, dY)).div(new Q(2n)));
      Sx = Sx.sub(pint01(pmul(Y2, dX)).div(new Q(2n)));
      Iyy = Iyy.add(pint01(pmul(pmul(X2, X), dY)).div(new Q(3n)));
      Ixy = Ixy.add(pint01(pmul(pmul(X2, Y), dY)).div(new Q(2n)));
      Ixx = Ixx.sub(pint01(pmul(pmul(Y2, Y), dX)).div(new Q(3n)));
    }
  }
  const xc = Sy.div(A), yc = Sx.div(A);
  return {
    area: A.toNumber(), centroidX: xc.toNumber(), centroidY: yc.toNumber(),
    Ix: Ixx.sub(A.mul(yc).mul(yc)).toNumber(), Iy: Iyy.sub(A.mul(xc).mul(xc)).toNumber(), Ixy: Ixy.sub(A.mul(xc).mul(yc)).toNumber(),
  };
}

describe('Bézier-bounded bracket (SVG path with cubic and quadratic commands, and a Bézier hole)', () => {
  // Invented shape (test data): an L-like bracket whose inner corner is a cubic and a quadratic, with a
  // lens-shaped hole of two cubics. SVG coordinates; the reader flips y, so part y = −(SVG y).
  const outline: number[][][] = [
    [[0, 0], [120, 0]], [[120, 0], [120, 20]],
    [[120, 20], [60, 25], [40, 60]],
    [[40, 60], [30, 80], [30, 90], [30, 100]],
    [[30, 100], [0, 100]], [[0, 100], [0, 0]],
  ];
  const hole: number[][][] = [
    [[12, 20], [12, 12], [28, 12], [28, 20]],
    [[28, 20], [28, 28], [12, 28], [12, 20]],
  ];
  const d = (loop: number[][][]) => `M ${loop[0][0].join(' ')} ` + loop.map((p) => (p.length === 2 ? 'L' : p.length === 3 ? 'Q' : 'C') + ' ' + p.slice(1).map((q) => q.join(' ')).join(' ')).join(' ') + ' Z';
  const variants: [string, (p: number[]) => number[]][] = [
    ['as drawn', (p) => p],
    ['moved far and scaled', (p) => [3 * p[0] + 600000, 3 * p[1] - 240000]],
  ];
  for (const [label, f] of variants) {
    it(label, () => {
      const ol = outline.map((piece) => piece.map(f)), hl = hole.map((piece) => piece.map(f));
      const svg = `<svg xmlns="http://www.w3.org/2000/svg"><path d="${d(ol)}"/><path d="${d(hl)}"/></svg>`;
      const [p] = readParts(svg, 'bracket.svg', { units: 'mm' });
      expect(p.regions[0].holes.length).toBe(1);
      const kinds = new Set(p.regions.flatMap((r) => [r.outer, ...r.holes]).flatMap((l) => l.segments.map((s) => s.kind)));
      expect(kinds.has('cubic') && kinds.has('quadratic')).toBe(true);
      const r = measureSection(p);
      // flip y for the part frame; an SVG-clockwise outline becomes counter-clockwise, holes are subtracted
      const flip = (loop: number[][][]) => loop.map((piece) => piece.map((q) => [q[0], -q[1]]));
      const outer = exactMoments([flip(ol)]), h = exactMoments([flip(hl)]);
      const sgnO = Math.sign(outer.area), sgnH = Math.sign(h.area);
      const ref = exactMoments([sgnO > 0 ? flip(ol) : flip(ol).reverse().map((q) => q.slice().reverse()), sgnH < 0 ? flip(hl) : flip(hl).reverse().map((q) => q.slice().reverse())]);
      expectSectionClose(r, ref, 120 * (label === 'as drawn' ? 1 : 3), `bracket ${label}`);
    });
  }
});
