import { describe, it, expect } from 'vitest';
import { type Segment, type Out2, OPS, ops, segmentPoint } from '../../src/geometry/segments.js';
import { loopSignedArea } from '../../src/geometry/part.js';
import { transformSegment, type Affine } from '../../src/geometry/transform.js';

// ---- independent numerical tools for the checks (not the library's code) ----
// 5-point Gauss–Legendre nodes and weights, Abramowitz & Stegun, Handbook of Mathematical Functions, table 25.4.
const GX = [0, -0.5384693101056831, 0.5384693101056831, -0.906179845938664, 0.906179845938664];
const GW = [0.5688888888888889, 0.4786286704993665, 0.4786286704993665, 0.2369268850561891, 0.2369268850561891];
function composite(f: (t: number) => number, a: number, b: number, n = 400): number {
  let s = 0;
  const h = (b - a) / n;
  for (let k = 0; k < n; k++) {
    const m = a + (k + 0.5) * h;
    for (let i = 0; i < 5; i++) s += GW[i] * f(m + (h / 2) * GX[i]);
  }
  return (s * h) / 2;
}
/** ∫ g(x, y, x', y') dt over the segment, using only point and derivative. */
function lineIntegral(s: Segment, g: (x: number, y: number, dx: number, dy: number) => number, n = 400): number {
  const p: Out2 = [0, 0], d: Out2 = [0, 0];
  return composite((t) => { ops(s).point(s, t, p); ops(s).derivative(s, t, d); return g(p[0], p[1], d[0], d[1]); }, 0, 1, n);
}

// deterministic pseudo-random numbers (common practice, no source)
let seed = 12345;
const rnd = () => { seed = (seed * 1103515245 + 12345) % 2147483648; return seed / 2147483648; };
const R = (lo: number, hi: number) => lo + (hi - lo) * rnd();

function randomSegments(): Segment[] {
  const out: Segment[] = [];
  for (let i = 0; i < 12; i++) {
    out.push({ kind: 'ellipticalArc', cx: R(-5, 5), cy: R(-5, 5), rx: R(0.5, 4), ry: R(0.5, 4), phi: R(-3, 3), t0: R(-4, 4), t1: R(-4, 4) });
    out.push({ kind: 'quadratic', x0: R(-5, 5), y0: R(-5, 5), x1: R(-5, 5), y1: R(-5, 5), x2: R(-5, 5), y2: R(-5, 5) });
    out.push({ kind: 'cubic', x0: R(-5, 5), y0: R(-5, 5), x1: R(-5, 5), y1: R(-5, 5), x2: R(-5, 5), y2: R(-5, 5), x3: R(-5, 5), y3: R(-5, 5) });
  }
  return out;
}
const SEGS = randomSegments();

describe('new segment kinds: point and derivative', () => {
  it('derivative matches a central finite difference (common practice, no source)', () => {
    const d: Out2 = [0, 0];
    for (const s of SEGS) {
      for (const t of [0.013, 0.3, 0.5, 0.77, 0.99]) {
        const h = 1e-5;
        const a = segmentPoint(s, t - h), b = segmentPoint(s, t + h);
        ops(s).derivative(s, t, d);
        const scale = Math.max(1, Math.hypot(d[0], d[1]));
        expect(Math.abs((b[0] - a[0]) / (2 * h) - d[0]) / scale).toBeLessThan(1e-8);
        expect(Math.abs((b[1] - a[1]) / (2 * h) - d[1]) / scale).toBeLessThan(1e-8);
      }
    }
  });
  it('reverse traverses the same points backwards; translate shifts them', () => {
    for (const s of SEGS) {
      const r = ops(s).reverse(s), m = ops(s).translate(s, 3, -2);
      for (const t of [0, 0.25, 0.6, 1]) {
        const p = segmentPoint(s, t), q = segmentPoint(r, 1 - t), u = segmentPoint(m, t);
        expect(Math.hypot(p[0] - q[0], p[1] - q[1])).toBeLessThan(1e-12);
        expect(Math.hypot(p[0] + 3 - u[0], p[1] - 2 - u[1])).toBeLessThan(1e-12);
      }
    }
  });
});

describe('areaTerm', () => {
  it('equals a composite Gauss–Legendre line integral of (x dy − y dx)/2 (Green\'s theorem)', () => {
    let worst = 0;
    for (const s of SEGS) {
      const ref = lineIntegral(s, (x, y, dx, dy) => (x * dy - y * dx) / 2);
      const got = ops(s).areaTerm(s);
      const scale = Math.max(1, Math.abs(ref));
      worst = Math.max(worst, Math.abs(got - ref) / scale);
    }
    expect(worst).toBeLessThan(1e-12);
  });

  // Exact reference: expand x(t), y(t) in the power basis with integer (BigInt) coefficients and integrate
  // x y' − y x' term by term as a rational number. Independent of the library's Bernstein weights.
  function exactBezierTwiceArea(xs: bigint[], ys: bigint[]): [bigint, bigint] {
    const n = xs.length - 1;
    const binom = (a: number, b: number): bigint => { let r = 1n; for (let i = 1; i <= b; i++) r = (r * BigInt(a - b + i)) / BigInt(i); return r; };
    const power = (ps: bigint[]): bigint[] => {
      // B_i^n(t) = C(n,i) t^i (1−t)^(n−i) = C(n,i) Σ_k C(n−i,k) (−1)^k t^(i+k)
      const c = new Array<bigint>(n + 1).fill(0n);
      for (let i = 0; i <= n; i++) for (let k = 0; k <= n - i; k++) c[i + k] += ps[i] * binom(n, i) * binom(n - i, k) * (k % 2 ? -1n : 1n);
      return c;
    };
    const X = power(xs), Y = power(ys);
    const d = (c: bigint[]) => c.slice(1).map((v, i) => v * BigInt(i + 1));
    const mul = (a: bigint[], b: bigint[]) => { const r = new Array<bigint>(a.length + b.length - 1).fill(0n); a.forEach((u, i) => b.forEach((v, j) => { r[i + j] += u * v; })); return r; };
    const p1 = mul(X, d(Y)), p2 = mul(Y, d(X));
    let num = 0n, den = 1n;
    for (let k = 0; k < p1.length; k++) {
      const c = p1[k] - p2[k];
      const kk = BigInt(k + 1);
      num = num * kk + c * den; den *= kk; // num/den + c/(k+1)
    }
    return [num, den];
  }
  it('Bézier areaTerm equals exact rational integration of x y\' − y x\' (BigInt polynomial expansion)', () => {
    const cases: number[][] = [
      [0, 0, 3, 7, 10, -2],
      [-40, 13, 25, 90, 101, -7],
      [0, 0, 10, 20, 30, 20, 40, 0],
      [5, -3, -17, 44, 61, 29, 12, -80],
      [1000003, 2000011, 1000050, 2000090, 1000100, 1999990, 1000001, 2000033],
    ];
    for (const c of cases) {
      const xs = c.filter((_, i) => i % 2 === 0), ys = c.filter((_, i) => i % 2 === 1);
      const seg: Segment = xs.length === 3
        ? { kind: 'quadratic', x0: xs[0], y0: ys[0], x1: xs[1], y1: ys[1], x2: xs[2], y2: ys[2] }
        : { kind: 'cubic', x0: xs[0], y0: ys[0], x1: xs[1], y1: ys[1], x2: xs[2], y2: ys[2], x3: xs[3], y3: ys[3] };
      const [num, den] = exactBezierTwiceArea(xs.map(BigInt), ys.map(BigInt));
      const ref = Number(num) / Number(den) / 2;
      const got = ops(seg).areaTerm(seg);
      const big = Math.max(...c.map(Math.abs));
      expect(Math.abs(got - ref)).toBeLessThanOrEqual(1e-15 * Math.max(big * big, Math.abs(ref)));
    }
  });
  it('a closed cubic-bounded lens has the exact polynomial area', () => {
    // region between the cubic (0,0)(1,3)(3,3)(4,0) and the straight base: area = 3/4 · 4 · 3 · ... computed by the rational routine
    const seg: Segment = { kind: 'cubic', x0: 4, y0: 0, x1: 3, y1: 3, x2: 1, y2: 3, x3: 0, y3: 0 };
    const area = loopSignedArea({ segments: [{ kind: 'line', x0: 0, y0: 0, x1: 4, y1: 0 }, seg] });
    const [num, den] = exactBezierTwiceArea([4n, 3n, 1n, 0n], [0n, 3n, 3n, 0n]);
    expect(area).toBeCloseTo(Number(num) / Number(den) / 2, 14);
    // by hand: forwards x(t) = 3t + 3t² − 2t³, y(t) = 9t − 9t², area = ∫ y x' dt
    // = ∫ (27t + 27t² − 108t³ + 54t⁴) dt = 27/2 + 9 − 27 + 54/5 = 6.3
    expect(Math.abs(area - 6.3)).toBeLessThan(1e-14);
  });
});

describe('ellipse closed forms', () => {
  // Ellipse with semi-axes a, b: area πab, Ix about its own axis πab³/4, Iy = πa³b/4
  // (Roark's Formulas for Stress and Strain, table A.1 "ellipse"; from memory).
  const a = 7, b = 3;
  function ellipseLoop(phi: number, cx = 0, cy = 0): Segment[] {
    return [
      { kind: 'ellipticalArc', cx, cy, rx: a, ry: b, phi, t0: 0, t1: Math.PI },
      { kind: 'ellipticalArc', cx, cy, rx: a, ry: b, phi, t0: Math.PI, t1: 2 * Math.PI },
    ];
  }
  it('area πab via areaTerm, for any rotation and position', () => {
    for (const phi of [0, 0.3, 2.1]) {
      const A = loopSignedArea({ segments: ellipseLoop(phi, 1e3, -2e3) });
      expect(Math.abs(A - Math.PI * a * b) / (Math.PI * a * b)).toBeLessThan(1e-13);
    }
  });
  it('centroid and second moments from boundary integrals of point/derivative', () => {
    for (const phi of [0, 0.4]) {
      const cx = 2, cy = -1;
      const segs = ellipseLoop(phi, cx, cy);
      const sum = (g: (x: number, y: number, dx: number, dy: number) => number) => segs.reduce((s, seg) => s + lineIntegral(seg, g), 0);
      const A = sum((x, y, dx, dy) => (x * dy - y * dx) / 2);
      const Sx = sum((_x, y, dx) => -(y * y) / 2 * dx); // ∫ y dA = −∮ y²/2 dx
      const Sy = sum((x, _y, _dx, dy) => (x * x) / 2 * dy);
      const Ixx = sum((x, y, dx) => -((y - cy) ** 3) / 3 * dx); // ∫ (y−cy)² dA
      expect(Sx / A).toBeCloseTo(cy, 12);
      expect(Sy / A).toBeCloseTo(cx, 12);
      // rotated ellipse: Ix = πab/4 (a² sin²φ + b² cos²φ) (rotation of axes; common practice, no source)
      const ref = (Math.PI * a * b / 4) * (a * a * Math.sin(phi) ** 2 + b * b * Math.cos(phi) ** 2);
      expect(Math.abs(Ixx - ref) / ref).toBeLessThan(1e-12);
    }
  });
  it('elliptical sector (parameter angles θ0..θ1) has area ab(θ1 − θ0)/2 (affine image of a circular sector)', () => {
    const th0 = 0.4, th1 = 2.3;
    const arc: Segment = { kind: 'ellipticalArc', cx: 5, cy: 8, rx: a, ry: b, phi: 0.7, t0: th0, t1: th1 };
    const p0 = segmentPoint(arc, 0), p1 = segmentPoint(arc, 1);
    const closing: Segment = { kind: 'line', x0: p1[0], y0: p1[1], x1: 5, y1: 8 };
    const A2 = loopSignedArea({ segments: [{ kind: 'line', x0: 5, y0: 8, x1: p0[0], y1: p0[1] }, arc, closing] });
    expect(Math.abs(A2 - (a * b * (th1 - th0)) / 2)).toBeLessThan(1e-13 * a * b);
  });
  it('perimeter agrees with the Gauss–Kummer series π(a+b) Σ C(1/2,n)² hⁿ (from memory)', () => {
    const h = ((a - b) / (a + b)) ** 2;
    let term = 1, sum = 1;
    for (let n = 1; n < 200; n++) {
      const c = (0.5 - n + 1) / n; // C(1/2, n) / C(1/2, n−1)
      term *= c * c * h;
      sum += term;
    }
    const ref = Math.PI * (a + b) * sum;
    const got = ellipseLoop(0.3).reduce((s, seg) => s + ops(seg).length(seg), 0);
    expect(Math.abs(got - ref) / ref).toBeLessThan(1e-13);
  });
});

describe('Bézier lengths', () => {
  it('the quadratic (0,0)(X/2,0)(X,X²) is the parabola y = x²: length x√(1+4x²)/2 + asinh(2x)/4 (calculus, from memory)', () => {
    for (const X of [0.5, 2, 10]) {
      const s: Segment = { kind: 'quadratic', x0: 0, y0: 0, x1: X / 2, y1: 0, x2: X, y2: X * X };
      const ref = (X * Math.sqrt(1 + 4 * X * X)) / 2 + Math.asinh(2 * X) / 4;
      expect(Math.abs(OPS.quadratic.length(s as never) - ref) / ref).toBeLessThan(1e-13);
    }
  });
  it('a cubic with collinear evenly spaced control points has the chord as length', () => {
    const s: Segment = { kind: 'cubic', x0: 0, y0: 0, x1: 1, y1: 2, x2: 2, y2: 4, x3: 3, y3: 6 };
    expect(Math.abs(ops(s).length(s) - Math.hypot(3, 6))).toBeLessThan(1e-13);
  });
});

describe('bbox, yTurns, turning, deviation', () => {
  function sample(s: Segment, n = 4000): [number, number][] {
    const out: [number, number][] = [];
    for (let i = 0; i <= n; i++) out.push(segmentPoint(s, i / n));
    return out;
  }
  it('bbox contains every sampled point and is attained (within sampling resolution)', () => {
    for (const s of SEGS) {
      const [x0, y0, x1, y1] = ops(s).bbox(s);
      const pts = sample(s);
      const eps = 1e-12 * (1 + Math.abs(x0) + Math.abs(x1) + Math.abs(y0) + Math.abs(y1));
      let sx0 = Infinity, sy0 = Infinity, sx1 = -Infinity, sy1 = -Infinity;
      for (const [x, y] of pts) { sx0 = Math.min(sx0, x); sy0 = Math.min(sy0, y); sx1 = Math.max(sx1, x); sy1 = Math.max(sy1, y); }
      expect(sx0).toBeGreaterThanOrEqual(x0 - eps); expect(sx1).toBeLessThanOrEqual(x1 + eps);
      expect(sy0).toBeGreaterThanOrEqual(y0 - eps); expect(sy1).toBeLessThanOrEqual(y1 + eps);
      expect(sx0 - x0).toBeLessThan(1e-4); expect(x1 - sx1).toBeLessThan(1e-4);
      expect(sy0 - y0).toBeLessThan(1e-4); expect(y1 - sy1).toBeLessThan(1e-4);
    }
  });
  it('yTurns are zeros of y\' and y is monotone between them', () => {
    const d: Out2 = [0, 0];
    for (const s of SEGS) {
      const turns = ops(s).yTurns(s);
      const scale = Math.hypot(...(() => { ops(s).derivative(s, 0.5, d); return [d[0], d[1], 1]; })());
      for (const t of turns) { ops(s).derivative(s, t, d); expect(Math.abs(d[1]) / scale).toBeLessThan(1e-9); }
      const cuts = [0, ...turns, 1];
      for (let k = 0; k + 1 < cuts.length; k++) {
        let sign = 0;
        for (let i = 1; i < 50; i++) {
          ops(s).derivative(s, cuts[k] + ((cuts[k + 1] - cuts[k]) * i) / 50, d);
          const sg = Math.sign(d[1]);
          if (sign === 0) sign = sg; else if (sg !== 0) expect(sg).toBe(sign);
        }
      }
    }
  });
  it('turning and deviation never understate the densely sampled values and are tight', () => {
    const d: Out2 = [0, 0];
    for (const s of SEGS) {
      for (const [ta, tb] of [[0, 1], [0.2, 0.45], [0.6, 0.61]]) {
        const n = 20000;
        let turn = 0, dev = 0, devSeg = 0;
        let px = NaN, py = NaN;
        const a = segmentPoint(s, ta), b = segmentPoint(s, tb);
        const L = Math.hypot(b[0] - a[0], b[1] - a[1]);
        for (let i = 0; i <= n; i++) {
          const t = ta + ((tb - ta) * i) / n;
          ops(s).derivative(s, t, d);
          if (i > 0) turn += Math.abs(Math.atan2(px * d[1] - py * d[0], px * d[0] + py * d[1]));
          px = d[0]; py = d[1];
          const p = segmentPoint(s, t);
          dev = Math.max(dev, Math.abs((b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0])) / L);
          const pr = Math.min(Math.max(((b[0] - a[0]) * (p[0] - a[0]) + (b[1] - a[1]) * (p[1] - a[1])) / (L * L), 0), 1);
          devSeg = Math.max(devSeg, Math.hypot(p[0] - a[0] - pr * (b[0] - a[0]), p[1] - a[1] - pr * (b[1] - a[1])));
        }
        const T = ops(s).turning(s, ta, tb), D = ops(s).deviation(s, ta, tb);
        expect(T).toBeGreaterThanOrEqual(turn * (1 - 1e-12) - 1e-13);
        expect(T).toBeLessThanOrEqual(turn * 1.001 + 1e-9);
        expect(D).toBeGreaterThanOrEqual(dev - 1e-12);
        // deviation may use the hull bound when the curve bulges past the chord's ends
        if (s.kind === 'ellipticalArc') expect(D).toBeLessThanOrEqual(dev * 1.0001 + 1e-12);
        else expect(D).toBeLessThanOrEqual(3 * devSeg + 1e-12);
      }
    }
  });
  it('cusp: the cubic (0,0)(1,1)(0,1)(1,0) turns by π at its cusp plus its smooth turning', () => {
    // symmetric cusp at t = 1/2 (x'(1/2) = y'(1/2) = 0): the tangent reverses there
    const s: Segment = { kind: 'cubic', x0: 0, y0: 0, x1: 1, y1: 1, x2: 0, y2: 1, x3: 1, y3: 0 };
    const d: Out2 = [0, 0];
    ops(s).derivative(s, 0.5, d);
    expect(Math.hypot(d[0], d[1])).toBeLessThan(1e-15);
    // directions: start (1,1), just before the cusp (−1,0)·..., after the cusp (+1,0), end (1,−1)
    const T = ops(s).turning(s, 0, 1);
    expect(T).toBeGreaterThan(Math.PI);
  });
});

describe('transformSegment', () => {
  const maps: Affine[] = [
    [2, 0, 0, 2, 5, -1], // uniform scale
    [Math.cos(0.7), Math.sin(0.7), -Math.sin(0.7), Math.cos(0.7), 1, 2], // rotation
    [1, 0, 0, -1, 0, 10], // y flip (reflection)
    [3, 0, 0, 0.5, 0, 0], // non-uniform scale
    [1, 0, Math.tan(0.5), 1, 0, 0], // skewX(0.5 rad)
    [0.3, -1.2, 0.8, 0.4, -3, 7], // general, det > 0
    [0.3, 1.2, 0.8, -0.4, -3, 7], // general, det < 0
  ];
  const segs: Segment[] = [
    ...SEGS.slice(0, 9),
    { kind: 'arc', cx: 1, cy: 2, r: 3, a0: 0.2, a1: 2.5 },
    { kind: 'arc', cx: -1, cy: 0, r: 1.5, a0: 1, a1: -2 },
    { kind: 'line', x0: 0, y0: 1, x1: 4, y1: -3 },
  ];
  it('maps every point: point(T(s), t) = m(point(s, t)) for the same t', () => {
    for (const m of maps) {
      for (const s of segs) {
        const u = transformSegment(s, m);
        for (const t of [0, 0.1, 0.5, 0.93, 1]) {
          const p = segmentPoint(s, t), q = segmentPoint(u, t);
          const ex = m[0] * p[0] + m[2] * p[1] + m[4], ey = m[1] * p[0] + m[3] * p[1] + m[5];
          expect(Math.hypot(q[0] - ex, q[1] - ey)).toBeLessThan(1e-12 * (1 + Math.hypot(ex, ey)));
        }
      }
    }
  });
  it('a circular arc stays an arc under similarities (including reflections) and becomes elliptical otherwise', () => {
    const arc: Segment = { kind: 'arc', cx: 1, cy: 2, r: 3, a0: 0.2, a1: 2.5 };
    expect(transformSegment(arc, maps[0]).kind).toBe('arc');
    expect(transformSegment(arc, maps[1]).kind).toBe('arc');
    expect(transformSegment(arc, maps[2]).kind).toBe('arc');
    expect(transformSegment(arc, maps[3]).kind).toBe('ellipticalArc');
    expect(transformSegment(arc, maps[4]).kind).toBe('ellipticalArc');
  });
  it('areaTerm of a closed loop scales by the determinant (signed: reflections flip the sign)', () => {
    const loop = { segments: [
      { kind: 'arc', cx: 0, cy: 0, r: 2, a0: 0, a1: Math.PI } as Segment,
      { kind: 'arc', cx: 0, cy: 0, r: 2, a0: Math.PI, a1: 2 * Math.PI } as Segment,
    ] };
    const A = loopSignedArea(loop);
    for (const m of maps) {
      const det = m[0] * m[3] - m[1] * m[2];
      const B = loopSignedArea({ segments: loop.segments.map((s) => transformSegment(s, m)) });
      expect(Math.abs(B - det * A)).toBeLessThan(1e-12 * Math.abs(det * A));
    }
  });
});
