/**
 * Exact integrals over the part of a section on one side of a straight line, and the plastic section
 * modulus about an axis of a given direction.
 *
 * Side integrals without clipping. For the half-plane H = {p : n·p ≥ c} (n a unit vector) let
 * d(p) = n·p − c. The fields F1 = d·n and F2 = (d²/2)·n have divergence 1 and d and both vanish on the line
 * d = 0, so by the divergence theorem
 *   A+ = ∫_{R∩H} dA  = ∮_{∂R ∩ H} d (n·ν) ds,      Q+ = ∫_{R∩H} d dA = ∮_{∂R ∩ H} (d²/2)(n·ν) ds,
 * with ν the outward normal: only the pieces of the part's own boundary inside H are needed, never the
 * cut itself, and the curves stay exact. With loops oriented (material on the left), ν ds = (dy, −dx).
 *
 * Pieces inside H: the roots of g(t) = n·γ(t) − c on each segment. A segment is cut into pieces of at most
 * π/8 turning; on such a piece g′ = n·γ′ changes sign at most once, so splitting at that extremum (found by
 * bisection on g′) leaves monotone pieces with at most one root each, found by bisection to the last bit.
 * Along each piece the integrand is integrated with Gauss–Legendre rules of 16 and 24 points; the
 * difference is the quadrature part of the estimate (exact to round-off for lines and Béziers, whose
 * integrands are polynomials of degree ≤ 3·3 − 1 in t, and spectrally accurate on arcs of ≤ π/8).
 *
 * Plastic modulus about the axis normal to n: Z = ∫|d| dA with the plastic neutral axis c* where
 * A+ = A/2. A+(c) is continuous and non-increasing; c* is found by bisection with a secant step. Since
 * dZ/dc = A− − A+ vanishes at c*, Z is stationary there: an error in c* changes Z only to second order.
 * Z = 2 Q+(c*) − (n·S − c*·A), where S = ∫p dA is the part's first moment.
 */
import { type Part, allLoops } from '../geometry/part.js';
import { ops, piecesForTurning, type Segment } from '../geometry/segments.js';
import { type GaussLegendreRule, gaussLegendre } from '../numeric/gaussLegendre.js';

const P: [number, number] = [0, 0];
const D: [number, number] = [0, 0];

function g(s: Segment, t: number, nx: number, ny: number, c: number): number {
  ops(s).point(s, t, P);
  return nx * P[0] + ny * P[1] - c;
}
function dg(s: Segment, t: number, nx: number, ny: number): number {
  ops(s).derivative(s, t, D);
  return nx * D[0] + ny * D[1];
}

function bisect(f: (t: number) => number, a: number, b: number): number {
  let fa = f(a);
  for (let i = 0; i < 200; i++) {
    const m = (a + b) / 2;
    if (m === a || m === b) return m;
    const fm = f(m);
    if (fm === 0) return m;
    if ((fm > 0) === (fa > 0)) { a = m; fa = fm; } else b = m;
  }
  return (a + b) / 2;
}

/** Parameter breakpoints of segment s where it crosses or touches the line n·p = c (sorted, with 0 and 1). */
function breakpoints(s: Segment, nx: number, ny: number, c: number): number[] {
  const o = ops(s);
  const pieces = o.straight ? 1 : Math.max(2, piecesForTurning(s, Math.PI / 8));
  const out = [0];
  for (let i = 0; i < pieces; i++) {
    const a = i / pieces, b = (i + 1) / pieces;
    const inner = [a];
    if (!o.straight) {
      const da = dg(s, a, nx, ny), db = dg(s, b, nx, ny);
      if ((da > 0) !== (db > 0) && da !== 0 && db !== 0) inner.push(bisect((t) => dg(s, t, nx, ny), a, b));
    }
    inner.push(b);
    for (let k = 0; k + 1 < inner.length; k++) {
      const u = inner[k], v = inner[k + 1];
      const gu = g(s, u, nx, ny, c), gv = g(s, v, nx, ny, c);
      if (gu !== 0 && gv !== 0 && (gu > 0) !== (gv > 0)) out.push(bisect((t) => g(s, t, nx, ny, c), u, v));
      if (v < 1) out.push(v);
    }
  }
  out.push(1);
  return out;
}

export interface SideIntegrals {
  /** area on the side n·p ≥ c */
  area: number;
  /** ∫ (n·p − c) dA over that side */
  moment: number;
  /** quadrature part of the estimate (difference of two Gauss orders) for area and moment */
  areaError: number;
  momentError: number;
  /** Σ |terms| summed (for round-off allowances) */
  magnitude: number;
}

const RULES: [GaussLegendreRule, GaussLegendreRule] = [gaussLegendre(16), gaussLegendre(24)];

/** Area and first moment (about the line) of the part's material on the side n·p ≥ c; |n| = 1. */
export function sideIntegrals(part: Part, nx: number, ny: number, c: number): SideIntegrals {
  const acc = [[0, 0], [0, 0]];
  let mag = 0;
  for (const loop of allLoops(part)) {
    for (const s of loop.segments) {
      const bp = breakpoints(s, nx, ny, c);
      for (let i = 0; i + 1 < bp.length; i++) {
        const a = bp[i], b = bp[i + 1];
        if (!(b > a)) continue;
        if (g(s, (a + b) / 2, nx, ny, c) <= 0) continue;
        for (let r = 0; r < 2; r++) {
          const rule = RULES[r];
          let sa = 0, sq = 0;
          const h = (b - a) / 2, m = (a + b) / 2;
          for (let k = 0; k < rule.x.length; k++) {
            const t = m + h * rule.x[k];
            ops(s).evaluate(s, t, P, D);
            const d = nx * P[0] + ny * P[1] - c;
            const nnu = nx * D[1] - ny * D[0]; // n · (dy/dt, −dx/dt)
            const w = rule.w[k] * h;
            sa += w * d * nnu; sq += w * 0.5 * d * d * nnu;
            if (r === 1) mag += Math.abs(w * d * nnu) * (1 + Math.abs(d));
          }
          acc[r][0] += sa; acc[r][1] += sq;
        }
      }
    }
  }
  return {
    area: acc[1][0], moment: acc[1][1],
    areaError: Math.abs(acc[1][0] - acc[0][0]), momentError: Math.abs(acc[1][1] - acc[0][1]),
    magnitude: mag,
  };
}

/** Largest and smallest n·p over the part's boundary (extreme fibres), exact where the kind has `support`. */
export function extent(part: Part, nx: number, ny: number): { max: number; min: number; exact: boolean } {
  let max = -Infinity, min = Infinity, exact = true;
  for (const loop of allLoops(part)) {
    for (const s of loop.segments) {
      const o = ops(s);
      if (o.support) {
        max = Math.max(max, o.support(s, nx, ny));
        min = Math.min(min, -o.support(s, -nx, -ny));
        continue;
      }
      // kinds without a closed form (elliptical arcs, Béziers): ends, and every interior extremum of n·γ
      // located by bisection on n·γ′ within pieces of at most π/8 turning (accurate to round-off)
      exact = false;
      const pieces = Math.max(2, piecesForTurning(s, Math.PI / 8));
      const cand = [0, 1];
      for (let i = 0; i < pieces; i++) {
        const a = i / pieces, b = (i + 1) / pieces;
        const da = dg(s, a, nx, ny), db = dg(s, b, nx, ny);
        if ((da > 0) !== (db > 0)) cand.push(bisect((t) => dg(s, t, nx, ny), a, b));
      }
      for (const t of cand) { const v = g(s, t, nx, ny, 0); max = Math.max(max, v); min = Math.min(min, v); }
    }
  }
  return { max, min, exact };
}

export interface PlasticAxis {
  /** plastic modulus ∫|d| dA about the plastic neutral axis */
  Z: number;
  ZError: number;
  /** plastic neutral axis: n·p = offset (n the unit normal of the axis) */
  offset: number;
  offsetError: number;
  /** bisection steps used */
  steps: number;
}

/**
 * Plastic modulus for bending about an axis with unit normal (nx, ny). `area` and the first moments
 * (Sx = ∫x dA, Sy = ∫y dA) are the part's own, exact (from the section result).
 */
export function plasticAxis(part: Part, nx: number, ny: number, area: number, Sx: number, Sy: number): PlasticAxis {
  const e = extent(part, nx, ny);
  let lo = e.min, hi = e.max;
  const half = area / 2;
  let steps = 0;
  // bisection with a secant guess: f(c) = A+(c) − A/2 decreases from A/2 to −A/2
  let flo = half, fhi = -half;
  while (steps < 200) {
    let c = lo + (hi - lo) * (flo / (flo - fhi));
    if (!(c > lo && c < hi) || steps % 3 === 2) c = (lo + hi) / 2;
    if (c === lo || c === hi) break;
    const f = sideIntegrals(part, nx, ny, c).area - half;
    steps++;
    if (f === 0) { lo = hi = c; break; }
    if (f > 0) { lo = c; flo = f; } else { hi = c; fhi = f; }
    if (hi - lo <= 4 * Number.EPSILON * (Math.abs(lo) + Math.abs(hi) + (e.max - e.min))) break;
  }
  const c = (lo + hi) / 2;
  const side = sideIntegrals(part, nx, ny, c);
  const nS = nx * Sx + ny * Sy;
  const Z = 2 * side.moment - (nS - c * area);
  const R = e.max - e.min;
  // round-off: the summed magnitudes, the first-moment term, and the stationary dependence on c (second
  // order: |dZ/dc| ≤ |A+ − A−| = 2|side.area − A/2| times the bracket width)
  const ZError = 2 * side.momentError + 64 * Number.EPSILON * (side.magnitude * R + Math.abs(nS) + Math.abs(c * area))
    + 2 * (Math.abs(side.area - half) + side.areaError) * (hi - lo + 64 * Number.EPSILON * R);
  return { Z, ZError, offset: c, offsetError: (hi - lo) + 64 * Number.EPSILON * (Math.abs(c) + R), steps };
}
