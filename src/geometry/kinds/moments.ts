/**
 * Boundary moments: the pieces every segment kind's `moments` operation is built from.
 *
 * One vector field for every kind: the polygon formula's. For an integrand f that is homogeneous of
 * degree k in the local coordinates (x, y) = (X − ox, Y − oy), Euler's relation x f_x + y f_y = k f gives
 * div(f·(x, y)) = (k + 2) f, so by Green's theorem
 *
 *   ∫∫ f dA = ∮ f·(x dy − y dx) / (k + 2),
 *
 * for f = 1, x, y, x², xy, y² (k = 0, 1, 1, 2, 2, 2). On a straight segment x dy − y dx = (x0 y1 − x1 y0) dt,
 * and the integral of f along it gives the classical polygon formulas of src/properties/boundary.ts
 * (A = Σc/2, ∫x = Σ(x0 + x1)c/6, …): the polygon formula *is* this field. Every kind integrates this same
 * field over its own exact parametrisation, so the contributions of any loop — lines, arcs and Béziers
 * mixed — add up to the region's moments. (A different field per kind, e.g. Q = ∫f dx with P = 0 on arcs,
 * differs from this one by an exact differential that cancels only over a whole loop of that kind: on a
 * loop mixing kinds it leaves a wrong answer.)
 *
 * Output layout (a Float64Array of MOMENT_SLOTS): [A, ∫x, ∫y, ∫x², ∫xy, ∫y²] are ADDED to out[0..5], and
 * bounds on each contribution's round-off in units of ε are added to out[6..11]: the size of what was
 * computed, ∫|f|·(|x||y'| + |y||x'|) dt / (k + 2) (on arcs with the rounding of their stored angles), times
 * the kind's count of roundings relative to it (LINE_ROUNDOFF, ARC_ROUNDOFF, BEZIER_ROUNDOFF).
 */
import { gaussLegendre } from '../../numeric/gaussLegendre.js';

/** Slots of a moments output: six moments, then six round-off magnitudes. */
export const MOMENT_SLOTS = 12;
/** Roundings per contribution, relative to its size bound (counted at each formula, with a margin). */
const LINE_ROUNDOFF = 16, ARC_ROUNDOFF = 64, BEZIER_ROUNDOFF = 32;
/** 1/(k + 2) for the six integrands 1, x, y, x², xy, y². */
const INV = [1 / 2, 1 / 3, 1 / 3, 1 / 4, 1 / 4, 1 / 4];

/**
 * Straight segment from (x0, y0) to (x1, y1), local coordinates: the polygon formulas (exact).
 */
export function lineMoments(x0: number, y0: number, x1: number, y1: number, out: Float64Array): void {
  // x0·y1 − x1·y0 written as x0·Δy − y0·Δx: the same number, rounded relative to |x0||Δy| + |y0||Δx|
  // rather than to |x0 y1| (a short edge far from the origin keeps its digits)
  const c = x0 * (y1 - y0) - y0 * (x1 - x0);
  out[0] += c / 2;
  out[1] += (x0 + x1) * c / 6;
  out[2] += (y0 + y1) * c / 6;
  out[3] += (x0 * x0 + x0 * x1 + x1 * x1) * c / 12;
  out[4] += (2 * x0 * y0 + x0 * y1 + x1 * y0 + 2 * x1 * y1) * c / 24;
  out[5] += (y0 * y0 + y0 * y1 + y1 * y1) * c / 12;
  const R = Math.max(Math.abs(x0), Math.abs(x1), Math.abs(y0), Math.abs(y1));
  // ≥ ∫(|x||y'| + |y||x'|) dt, times LINE_ROUNDOFF (c carries 3 roundings relative to it, each polynomial
  // factor at most 4 relative to 6R², the products and the division 3 more: 10 in all, 16 kept)
  const g = LINE_ROUNDOFF * R * (Math.abs(x1 - x0) + Math.abs(y1 - y0));
  out[6] += g / 2; out[7] += g * R / 3; out[8] += g * R / 3;
  out[9] += g * R * R / 4; out[10] += g * R * R / 4; out[11] += g * R * R / 4;
}

// Polynomials in C = cos θ, S = sin θ of total degree ≤ 3, as 10 coefficients:
// [1, C, S, C², CS, S², C³, C²S, CS², S³] (index of C^i S^j: d(d+1)/2 + j with d = i + j).

/** p (degree ≤ dp, given as coefficients) times the linear form l0 + l1 C + l2 S, written to r. */
function mulLinear(p: Float64Array, dp: number, l0: number, l1: number, l2: number, r: Float64Array): void {
  r.fill(0);
  for (let d = 0; d <= dp; d++) {
    const base = (d * (d + 1)) / 2, up = ((d + 1) * (d + 2)) / 2;
    for (let j = 0; j <= d; j++) {
      const c = p[base + j];
      if (c === 0) continue;
      r[base + j] += c * l0;
      r[up + j] += c * l1; // one more C
      r[up + j + 1] += c * l2; // one more S
    }
  }
}

const P1 = new Float64Array(10), P2 = new Float64Array(10), P3 = new Float64Array(10), Q = new Float64Array(10), I = new Float64Array(10);

/**
 * Moments of the trigonometric arc x = cx + a cos θ + b sin θ, y = cy + d cos θ + e sin θ (local
 * coordinates), θ from th0 to th1 (either order): circular arcs (a = e = r, b = d = 0) and elliptical arcs
 * (the columns of R(φ)·diag(rx, ry)).
 *
 * Derivation. x' = −a S + b C, y' = −d S + e C, so
 *   x y' − y x' = (ae − bd)(C² + S²) + (cx e − cy b) C + (cy a − cx d) S = w0 + w1 C + w2 S,
 * the C², CS, S² terms cancelling. Each integrand f·(x y' − y x')/(k + 2) is then a polynomial of degree ≤ 3
 * in C, S (f is a product of at most two of the linear forms x, y), integrated term by term. With the
 * mid-angle m = (th0 + th1)/2 and half-sweep h = (th1 − th0)/2 the differences of antiderivatives become
 * products (no cancellation on short arcs):
 *   ∫1 = 2h, ∫C = 2 cos m sin h, ∫S = 2 sin m sin h,
 *   ∫C² = h + cos 2m sin 2h / 2, ∫S² = h − cos 2m sin 2h / 2, ∫CS = sin 2m sin 2h / 2,
 *   and with J_c = ∫cos 3θ = (2/3) cos 3m sin 3h, J_s = ∫sin 3θ = (2/3) sin 3m sin 3h and the triple-angle
 *   identities C³ = (3C + cos 3θ)/4, S³ = (3S − sin 3θ)/4, C²S = (S + sin 3θ)/4, CS² = (C − cos 3θ)/4:
 *   ∫C³ = (3∫C + J_c)/4, ∫S³ = (3∫S − J_s)/4, ∫C²S = (∫S + J_s)/4, ∫CS² = (∫C − J_c)/4.
 * (sin a − sin b = 2 cos((a+b)/2) sin((a−b)/2) and its kin, from memory; tests check every formula
 * against high-order Gauss–Legendre.)
 */
export function trigArcMoments(cx: number, cy: number, a: number, b: number, d: number, e: number, th0: number, th1: number, out: Float64Array): void {
  const h = (th1 - th0) / 2, m = (th0 + th1) / 2;
  const sh = Math.sin(h), s2h = Math.sin(2 * h), s3h = Math.sin(3 * h);
  const iC = 2 * Math.cos(m) * sh, iS = 2 * Math.sin(m) * sh;
  const c2 = Math.cos(2 * m) * s2h / 2;
  const jc = (2 / 3) * Math.cos(3 * m) * s3h, js = (2 / 3) * Math.sin(3 * m) * s3h;
  I[0] = 2 * h; I[1] = iC; I[2] = iS;
  I[3] = h + c2; I[4] = Math.sin(2 * m) * s2h / 2; I[5] = h - c2;
  I[6] = (3 * iC + jc) / 4; I[7] = (iS + js) / 4; I[8] = (iC - jc) / 4; I[9] = (3 * iS - js) / 4;
  // Round-off, in units of ε. Each integral of a C^i S^j is within a few ε·|Δθ| of the exact one for the
  // rounded m and h; the rounding of m (≤ ε|m|) moves cos 3m by up to 3ε|m|, times |sin 3h| ≤ 3|h|, and the
  // rounding of h (≤ ε(|th0| + |th1|)) moves 2h by twice that. The coefficients are products of at most
  // three of |x| ≤ X̄, |y| ≤ Ȳ and |w| ≤ W̄ (absolute sums, so cancellation inside them is covered too).
  const ta = Math.abs(th0) + Math.abs(th1), dth = Math.abs(th1 - th0);
  const sweep = ARC_ROUNDOFF * dth * (1 + ta) + 8 * ta;
  const X = Math.abs(cx) + Math.abs(a) + Math.abs(b), Y = Math.abs(cy) + Math.abs(d) + Math.abs(e);
  const W = (Math.abs(a * e) + Math.abs(b * d) + Math.abs(cx * e) + Math.abs(cy * b) + Math.abs(cy * a) + Math.abs(cx * d)) * sweep;
  out[6] += W / 2; out[7] += W * X / 3; out[8] += W * Y / 3;
  out[9] += W * X * X / 4; out[10] += W * X * Y / 4; out[11] += W * Y * Y / 4;
  const w0 = a * e - b * d, w1 = cx * e - cy * b, w2 = cy * a - cx * d;
  // k = 0: the weight itself
  P1.fill(0); P1[0] = w0; P1[1] = w1; P1[2] = w2;
  accumulate(P1, 1, 0, out);
  // k = 1: x·w and y·w
  mulLinear(P1, 1, cx, a, b, P2); accumulate(P2, 2, 1, out);
  mulLinear(P1, 1, cy, d, e, P3); accumulate(P3, 2, 2, out);
  // k = 2: x·x·w, x·y·w, y·y·w (P2 = x·w, P3 = y·w)
  mulLinear(P2, 2, cx, a, b, Q); accumulate(Q, 3, 3, out);
  mulLinear(P2, 2, cy, d, e, Q); accumulate(Q, 3, 4, out);
  mulLinear(P3, 2, cy, d, e, Q); accumulate(Q, 3, 5, out);
}

function accumulate(p: Float64Array, deg: number, k: number, out: Float64Array): void {
  const n = ((deg + 1) * (deg + 2)) / 2;
  let v = 0;
  for (let i = 0; i < n; i++) v += p[i] * I[i];
  out[k] += v * INV[k];
}

const GL_CACHE = new Map<number, { t: Float64Array; w: Float64Array }>();
/** n-point Gauss–Legendre rule on [0, 1] (nodes t, weights w summing to 1). */
export function unitGaussLegendre(n: number): { t: Float64Array; w: Float64Array } {
  let r = GL_CACHE.get(n);
  if (!r) {
    const g = gaussLegendre(n);
    const t = new Float64Array(n), w = new Float64Array(n);
    for (let i = 0; i < n; i++) { t[i] = (1 + g.x[i]) / 2; w[i] = g.w[i] / 2; }
    r = { t, w };
    GL_CACHE.set(n, r);
  }
  return r;
}

/**
 * Moments of a Bézier curve of degree n = xs.length − 1 (control points in local coordinates) by
 * Gauss–Legendre with 2n points. x y' − y x' has degree ≤ 2n − 2 in t (the t^(2n−1) terms cancel) and f
 * degree ≤ 2 in x, y, i.e. ≤ 2n in t, so every integrand is a polynomial of degree ≤ 4n − 2, and the
 * 2n-point rule (exact to degree 4n − 1) is exact: 4 points for quadratics (degree 6), 6 for cubics
 * (degree 10). Every point of the curve lies in the control points' hull, so R = their largest |coordinate|
 * bounds |x| and |y| and the evaluation's rounding.
 */
export function bezierMoments(xs: ArrayLike<number>, ys: ArrayLike<number>, out: Float64Array): void {
  const n = xs.length - 1;
  const { t, w } = unitGaussLegendre(2 * n);
  let R = 0;
  for (let i = 0; i <= n; i++) R = Math.max(R, Math.abs(xs[i]), Math.abs(ys[i]));
  for (let i = 0; i < 2 * n; i++) {
    // de Casteljau: the last two points of the scheme give the point and the derivative/n
    const u = t[i], v = 1 - u;
    for (let j = 0; j <= n; j++) { BX[j] = xs[j]; BY[j] = ys[j]; }
    for (let r = n; r > 1; r--) for (let j = 0; j < r; j++) { BX[j] = v * BX[j] + u * BX[j + 1]; BY[j] = v * BY[j] + u * BY[j + 1]; }
    const dx = n * (BX[1] - BX[0]), dy = n * (BY[1] - BY[0]);
    const x = v * BX[0] + u * BX[1], y = v * BY[0] + u * BY[1];
    const cw = w[i] * (x * dy - y * dx);
    const gw = BEZIER_ROUNDOFF * w[i] * R * (Math.abs(dx) + Math.abs(dy));
    out[0] += cw / 2; out[1] += cw * x / 3; out[2] += cw * y / 3;
    out[3] += cw * x * x / 4; out[4] += cw * x * y / 4; out[5] += cw * y * y / 4;
    out[6] += gw / 2; out[7] += gw * R / 3; out[8] += gw * R / 3;
    out[9] += gw * R * R / 4; out[10] += gw * R * R / 4; out[11] += gw * R * R / 4;
  }
}
const BX = new Float64Array(8), BY = new Float64Array(8);

// ---------------------------------------------------------------- exact rules for polynomial integrands

/**
 * What an exact boundary rule hands out, node by node (SegmentOps.greenNodes): the node (lx, ly) in local
 * coordinates, its weight w, a magnitude wMag ≥ |w| such that the rounding of w is at most NODE_ULPS·ε·wMag,
 * and posErr ≥ the rounding of the node's position (absolute, in each coordinate).
 */
export type GreenVisitor = (lx: number, ly: number, w: number, wMag: number, posErr: number) => void;
/** Roundings of a node's weight relative to its wMag (see GreenVisitor). */
export const NODE_ULPS = 32;
const EPS = Number.EPSILON;

/**
 * Straight segment (local coordinates): Gauss–Legendre with ⌈(D + 1)/2⌉ points. Along the segment
 * x y' − y x' = c = x0·Δy − y0·Δx is constant and P(x(t), y(t)) has degree ≤ D in t, so the rule is exact
 * for every P of degree ≤ D. c is rounded relative to |x0||Δy| + |y0||Δx| (3 roundings), a node relative to
 * the largest coordinate R (the node t itself carries a few ε).
 */
export function lineNodes(x0: number, y0: number, x1: number, y1: number, degree: number, visit: GreenVisitor): void {
  const { t, w } = unitGaussLegendre(Math.max(1, Math.ceil((degree + 1) / 2)));
  const dx = x1 - x0, dy = y1 - y0;
  const c = x0 * dy - y0 * dx, cm = Math.abs(x0) * Math.abs(dy) + Math.abs(y0) * Math.abs(dx);
  const posErr = 16 * EPS * Math.max(Math.abs(x0), Math.abs(x1), Math.abs(y0), Math.abs(y1));
  for (let i = 0; i < t.length; i++) visit(x0 + t[i] * dx, y0 + t[i] * dy, w[i] * c, w[i] * cm, posErr);
}

/**
 * Bézier curve of degree n (control points in local coordinates): Gauss–Legendre with ⌈(nD + 2n − 1)/2⌉
 * points. P(x(t), y(t)) has degree ≤ nD and x y' − y x' degree ≤ 2n − 2, so the product (degree ≤
 * nD + 2n − 2) is integrated exactly. The point comes from de Casteljau on the control points (rounded
 * relative to their largest coordinate R, about 2ε per level), the derivative from de Casteljau on the
 * control differences (the hodograph; rounded relative to their largest size), so the weight's rounding is
 * relative to R·((n + 1)(|x'| + |y'|) + n²(ΔX + ΔY)).
 */
export function bezierNodes(xs: ArrayLike<number>, ys: ArrayLike<number>, degree: number, visit: GreenVisitor): void {
  const n = xs.length - 1;
  const { t, w } = unitGaussLegendre(Math.max(1, Math.ceil((n * degree + 2 * n - 1) / 2)));
  let R = 0, DX = 0, DY = 0;
  for (let i = 0; i <= n; i++) R = Math.max(R, Math.abs(xs[i]), Math.abs(ys[i]));
  for (let i = 0; i < n; i++) { DX = Math.max(DX, Math.abs(xs[i + 1] - xs[i])); DY = Math.max(DY, Math.abs(ys[i + 1] - ys[i])); }
  const posErr = 16 * n * EPS * R;
  for (let i = 0; i < t.length; i++) {
    const u = t[i], v = 1 - u;
    for (let j = 0; j <= n; j++) { BX[j] = xs[j]; BY[j] = ys[j]; }
    for (let j = 0; j < n; j++) { HX[j] = xs[j + 1] - xs[j]; HY[j] = ys[j + 1] - ys[j]; }
    for (let r = n; r > 0; r--) for (let j = 0; j < r; j++) { BX[j] = v * BX[j] + u * BX[j + 1]; BY[j] = v * BY[j] + u * BY[j + 1]; }
    for (let r = n - 1; r > 0; r--) for (let j = 0; j < r; j++) { HX[j] = v * HX[j] + u * HX[j + 1]; HY[j] = v * HY[j] + u * HY[j + 1]; }
    const x = BX[0], y = BY[0], dx = n * HX[0], dy = n * HY[0];
    const mag = R * ((n + 1) * (Math.abs(dx) + Math.abs(dy)) + n * n * (DX + DY));
    visit(x, y, w[i] * (x * dy - y * dx), w[i] * mag, posErr);
  }
}
const HX = new Float64Array(8), HY = new Float64Array(8);

/** cos(2πk/N), k = 0 … N − 1, per N. */
const COS_TABLES = new Map<number, Float64Array>();
function cosTable(N: number): Float64Array {
  let c = COS_TABLES.get(N);
  if (!c) {
    c = new Float64Array(N);
    for (let k = 0; k < N; k++) c[k] = Math.cos((2 * Math.PI * k) / N);
    COS_TABLES.set(N, c);
  }
  return c;
}
let SJ = new Float64Array(64);

/**
 * Trigonometric arc x = cx + a cos θ + b sin θ, y = cy + d cos θ + e sin θ (local coordinates), θ from th0 to
 * th1: an exact rule for ∫ P(x, y)·(x y' − y x') dθ, P of degree ≤ D.
 *
 * Derivation. P(x(θ), y(θ)) is a trigonometric polynomial of degree ≤ D in θ and x y' − y x' =
 * w0 + w1 cos θ + w2 sin θ (kinds/moments.ts, trigArcMoments), so the integrand T(θ) has degree ≤ M = D + 1.
 * N = 2M + 1 equally spaced samples θ_i = m + 2πi/N (m the mid-angle) give its Fourier coefficients exactly
 * (no aliasing below N/2): a_0 = ΣT_i/N, a_j = 2ΣT_i cos jθ_i/N, b_j = 2ΣT_i sin jθ_i/N; and with the
 * half-sweep h, ∫cos jθ = (2/j) cos jm sin jh, ∫sin jθ = (2/j) sin jm sin jh over [th0, th1]. Collecting the
 * samples:
 *   ∫T dθ = Σ_i T_i ω_i,  ω_i = (1/N)·[2h + 4 Σ_{j=1..M} (sin jh / j) cos(2πij/N)]
 * (the discrete Fourier transform of a trigonometric polynomial, and the integrals of cos and sin: common
 * practice, no source). The samples go round the whole ellipse, not only the arc: P is evaluated on it.
 *
 * Rounding: with Ω = (2|h| + 4Σ|sin jh|/j)/N ≥ |ω_i|, ω_i is within ε·[(M + 3)Ω + (4/N)(M|h| + 1 + ln M) +
 * ((2 + 4M)/N)·T] (the sums; sin jh with jh rounded; |∂ω_i/∂h| ≤ (2 + 4M)/N times the rounding of h, at most
 * ε·T/2 with T = |th0| + |th1|). The sample angle is within ε(|m| + 8) of m + 2πi/N (m itself within ε·T/2),
 * which moves the point by at most that times |a| + |b| (|d| + |e|) and the factor w0 + w1 cos + w2 sin by
 * that times its magnitude W = |ae| + |bd| + |cx·e| + |cy·b| + |cy·a| + |cx·d|, which also bounds the factor's
 * own rounding (6ε). So |δw_i| ≤ ε·W·[(M + 17 + |m|)Ω + (4/N)(M|h| + 1 + ln M) + ((2 + 4M)/N)·T], and
 * wMag = W·(Ω + [ … ]/NODE_ULPS) is both ≥ |w_i| and ≥ |δw_i|/(NODE_ULPS·ε).
 */
export function trigArcNodes(cx: number, cy: number, a: number, b: number, d: number, e: number, th0: number, th1: number, degree: number, visit: GreenVisitor): void {
  const M = degree + 1, N = 2 * M + 1;
  const h = (th1 - th0) / 2, m = (th0 + th1) / 2;
  if (SJ.length < M + 1) SJ = new Float64Array(2 * M + 2);
  let sAbs = 0;
  for (let j = 1; j <= M; j++) { SJ[j] = Math.sin(j * h) / j; sAbs += Math.abs(SJ[j]); }
  const cos = cosTable(N);
  const w0 = a * e - b * d, w1 = cx * e - cy * b, w2 = cy * a - cx * d;
  const T = Math.abs(th0) + Math.abs(th1);
  const W = Math.abs(a * e) + Math.abs(b * d) + Math.abs(cx * e) + Math.abs(cy * b) + Math.abs(cy * a) + Math.abs(cx * d);
  const omega = (2 * Math.abs(h) + 4 * sAbs) / N;
  const wMag = W * (omega + ((M + 17 + Math.abs(m)) * omega + (4 * (M * Math.abs(h) + 1 + Math.log(M)) + (2 + 4 * M) * T) / N) / NODE_ULPS);
  const posErr = 4 * EPS * (Math.abs(cx) + Math.abs(cy) + Math.abs(a) + Math.abs(b) + Math.abs(d) + Math.abs(e)) * (4 + T);
  for (let i = 0; i < N; i++) {
    let s = 2 * h;
    for (let j = 1; j <= M; j++) s += 4 * SJ[j] * cos[(i * j) % N];
    const th = m + (2 * Math.PI * i) / N;
    const C = Math.cos(th), S = Math.sin(th);
    visit(cx + a * C + b * S, cy + d * C + e * S, (s / N) * (w0 + w1 * C + w2 * S), wMag, posErr);
  }
}
