/**
 * Area properties derived from raw moments about the mesh's local origin, plus the exact boundary
 * figures (perimeter, bounding box). All centroidal quantities are formed in local coordinates, so a part
 * far from the origin loses no digits; origin-based moments use the parallel-axis theorem.
 */
import type { Box } from '../geometry/segments.js';
import { M_AREA, M_X, M_XX, M_XY, M_Y, M_YY } from '../quadrature/integrate.js';
import type { SectionKey, SectionValues } from './quantities.js';

export interface ExactFigures {
  perimeter: number;
  box: Box;
  /** How far the stored boundary may lie from the one the input describes (see RepresentationFigures). */
  representation?: RepresentationFigures;
}

/**
 * Representation allowance, as facts about the boundary. Every point the readers and shape builders hold
 * went through at least one rounding to a double: the input's decimal numbers, and the points they
 * construct (tangent points of a slot, arc ends and centres, points under a unit scale or transform,
 * rotated pattern copies). A segment whose coordinates reach magnitude m is taken to lie within
 * δ = REPRESENTATION_ULPS·ε·m of the segment the input describes (see exactFigures in
 * src/analysis/measure.ts). Each quantity's allowance is its first-order sensitivity to a boundary moved by
 * at most δ: a quantity Q = ∫f dA changes by ∮ f·(δ·n) ds, at most δ·L·max|f| over the part.
 */
export interface RepresentationFigures {
  /** Σ δ_s·length_s over every segment: the area's allowance (length unit squared). */
  shiftLength: number;
  /** The largest δ_s (the bounding box's allowance). */
  maxShift: number;
  /** Σ δ_s·(2 + turning_s): the perimeter's allowance (each end moves by δ, a curve's length by δ per radian). */
  perimeter: number;
}

/**
 * Rounding steps a stored point may carry, in units of ε·|coordinate| (a half-ulp is at most ε·|x|):
 * the decimal input (1), a construction from it (a tangent point, a centre or an arc end: 2) and an affine
 * map of the drawing (a·x + c·y + e: 3, with both coordinates' magnitude as m).
 */
export const REPRESENTATION_ULPS = 6;

const DEG = 180 / Math.PI;

export function sectionFromMoments(m: ArrayLike<number>, origin: readonly [number, number], exact: ExactFigures): SectionValues {
  const A = m[M_AREA];
  const cxl = m[M_X] / A, cyl = m[M_Y] / A;
  const Ix = m[M_YY] - A * cyl * cyl;
  const Iy = m[M_XX] - A * cxl * cxl;
  const Ixy = m[M_XY] - A * cxl * cyl;
  const X = origin[0] + cxl, Y = origin[1] + cyl;
  const avg = (Ix + Iy) / 2;
  const R = Math.hypot((Ix - Iy) / 2, Ixy);
  let angle = 0.5 * Math.atan2(-2 * Ixy, Ix - Iy) * DEG;
  if (angle <= -90) angle += 180;
  const [xMin, yMin, xMax, yMax] = exact.box;
  return {
    area: A,
    perimeter: exact.perimeter,
    centroidX: X,
    centroidY: Y,
    Ix, Iy, Ixy,
    IxOrigin: Ix + A * Y * Y,
    IyOrigin: Iy + A * X * X,
    IxyOrigin: Ixy + A * X * Y,
    I1: avg + R,
    I2: avg - R,
    principalAngle: angle,
    Ip: Ix + Iy,
    rx: Math.sqrt(Ix / A),
    ry: Math.sqrt(Iy / A),
    SxTop: Ix / (yMax - Y),
    SxBottom: Ix / (Y - yMin),
    SyRight: Iy / (xMax - X),
    SyLeft: Iy / (X - xMin),
    xMin, yMin, xMax, yMax,
    width: xMax - xMin,
    height: yMax - yMin,
  };
}

const EPS = Number.EPSILON;
/** Multiple of machine epsilon allowed for round-off in every sum (meshes of up to ~10^7 triangles). */
export const ROUNDOFF_FACTOR = 64;
/** Roundings in one bounding-box edge (a centre plus a radius, or a stored end, and the unit step). */
const BOX_ROUNDOFF = 4;

/**
 * Round-off floor for each quantity: the size of the terms that were actually added, times
 * ROUNDOFF_FACTOR·ε, plus the representation allowance of the boundary (when `exact` carries one).
 * Added to every refinement estimate so that an exact result never claims zero error. `sumBound`, when
 * given, bounds each raw moment's round-off absolutely (the boundary path's segment-by-segment bound: its
 * terms may be far larger than the moments they sum to); it is carried through the centroid and the
 * centroidal moments to first order.
 */
export function roundoffFloor(m: ArrayLike<number>, origin: readonly [number, number], v: SectionValues, exact?: ExactFigures, sumBound?: ArrayLike<number>): Record<SectionKey, number> {
  const k = ROUNDOFF_FACTOR * EPS;
  const A = Math.abs(m[M_AREA]);
  const sxx = Math.abs(m[M_XX]), syy = Math.abs(m[M_YY]);
  const size = Math.max(v.width, v.height);
  const pos = (p: number) => k * (Math.abs(p) + size);
  // the bounding box is no sum: each edge is one evaluation of a segment (an end, or a centre plus a radius)
  const boxPos = (p: number) => BOX_ROUNDOFF * EPS * (Math.abs(p) + size);
  const rep = exact?.representation ?? { shiftLength: 0, maxShift: 0, perimeter: 0 };
  // distances from the centroid and from the coordinate axes to the farthest point of the part
  const hx = Math.max(v.xMax - v.centroidX, v.centroidX - v.xMin, 0), hy = Math.max(v.yMax - v.centroidY, v.centroidY - v.yMin, 0);
  const ax = Math.max(Math.abs(v.xMax), Math.abs(v.xMin)), ay = Math.max(Math.abs(v.yMax), Math.abs(v.yMin));
  const dA = rep.shiftLength;
  // the boundary path's own bound on the raw moments' round-off: Ix = M_yy − M_y²/A etc. to first order
  const E = sumBound ?? [0, 0, 0, 0, 0, 0];
  const lx = Math.abs(v.centroidX - origin[0]), ly = Math.abs(v.centroidY - origin[1]);
  const eA = E[M_AREA], eX = E[M_X] + lx * eA, eY = E[M_Y] + ly * eA; // centroid numerators (times A)
  const rIx = k * (syy + A * ly ** 2) + E[M_YY] + 2 * ly * E[M_Y] + ly * ly * eA;
  const rIy = k * (sxx + A * lx ** 2) + E[M_XX] + 2 * lx * E[M_X] + lx * lx * eA;
  const rIxy = k * (Math.abs(m[M_XY]) + Math.sqrt(sxx * syy)) + E[M_XY] + lx * E[M_Y] + ly * E[M_X] + lx * ly * eA;
  const fIx = rIx + dA * hy * hy;
  const fIy = rIy + dA * hx * hx;
  const fIxy = rIxy + dA * hx * hy;
  const fA = k * A + eA + dA;
  // θ = ½·atan2(−2Ixy, Ix − Iy) and |(Ix − Iy, 2Ixy)| = I1 − I2 = spread, so |Δθ| ≤ |Δ(Ix − Iy, 2Ixy)| / (2·spread);
  // independent round-offs give ΔIx + ΔIy + 2ΔIxy, and a boundary moved by δ gives ∮ρ²·δ ds ≤ δ·L·(hx² + hy²)
  // (ρ the distance from the centroid: the pair ((y−ȳ)² − (x−x̄)², 2(x−x̄)(y−ȳ)) has length ρ²)
  const spread = v.I1 - v.I2;
  const fAngle = spread > 0 ? Math.min(90, DEG * (rIx + rIy + 2 * rIxy + dA * (hx * hx + hy * hy)) / (2 * spread)) : 90;
  const sFloor = (S: number, I: number, fI: number, dist: number, a: number, b: number) =>
    Math.abs(S) * (fI / Math.abs(I) + k * (Math.abs(a) + Math.abs(b) + size) / Math.abs(dist));
  const fBox = (p: number) => boxPos(p) + rep.maxShift;
  return {
    area: fA,
    perimeter: k * v.perimeter + rep.perimeter,
    centroidX: pos(v.centroidX) + (dA * hx + eX) / A,
    centroidY: pos(v.centroidY) + (dA * hy + eY) / A,
    Ix: fIx, Iy: fIy, Ixy: fIxy,
    // ∫y² dA about the axes moves by at most δ·L·max y² (the representation part)
    IxOrigin: fIx + k * A * v.centroidY ** 2 + dA * ay * ay + eA * v.centroidY ** 2 + 2 * Math.abs(v.centroidY) * eY,
    IyOrigin: fIy + k * A * v.centroidX ** 2 + dA * ax * ax + eA * v.centroidX ** 2 + 2 * Math.abs(v.centroidX) * eX,
    IxyOrigin: fIxy + k * A * Math.abs(v.centroidX * v.centroidY) + dA * ax * ay + eA * Math.abs(v.centroidX * v.centroidY) + Math.abs(v.centroidX) * eY + Math.abs(v.centroidY) * eX,
    I1: fIx + fIy + fIxy,
    I2: fIx + fIy + fIxy,
    principalAngle: fAngle,
    Ip: fIx + fIy,
    rx: v.rx * (fIx / Math.abs(v.Ix) + fA / A) / 2,
    ry: v.ry * (fIy / Math.abs(v.Iy) + fA / A) / 2,
    SxTop: sFloor(v.SxTop, v.Ix, fIx, v.yMax - v.centroidY, v.yMax, v.centroidY),
    SxBottom: sFloor(v.SxBottom, v.Ix, fIx, v.centroidY - v.yMin, v.yMin, v.centroidY),
    SyRight: sFloor(v.SyRight, v.Iy, fIy, v.xMax - v.centroidX, v.xMax, v.centroidX),
    SyLeft: sFloor(v.SyLeft, v.Iy, fIy, v.centroidX - v.xMin, v.xMin, v.centroidX),
    xMin: fBox(v.xMin), yMin: fBox(v.yMin), xMax: fBox(v.xMax), yMax: fBox(v.yMax),
    // the subtraction's own rounding (exact by Sterbenz when the edges are close, as far from the origin)
    width: fBox(v.xMax) + fBox(v.xMin) + EPS * v.width,
    height: fBox(v.yMax) + fBox(v.yMin) + EPS * v.height,
  };
}

/**
 * Estimates of derived quantities taken from their ingredients' estimates (their own refinement
 * difference is kept when larger): width from xMax and xMin, height from yMax and yMin, and each section
 * modulus S = I/d from I and the fibre distance d = edge − centroid, to first order
 * |ΔS| ≤ |S|·(ΔI/|I| + (Δedge + Δcentroid)/|d|). Changes `errors` in place.
 */
export function propagateDerived(v: SectionValues, errors: Record<SectionKey, number>): void {
  const e = errors;
  e.width = Math.max(e.width, e.xMax + e.xMin + EPS * v.width);
  e.height = Math.max(e.height, e.yMax + e.yMin + EPS * v.height);
  const mod = (S: number, I: number, eI: number, d: number, eD: number) =>
    Math.abs(S) * (eI / Math.abs(I) + eD / Math.abs(d) + 2 * EPS);
  e.SxTop = Math.max(e.SxTop, mod(v.SxTop, v.Ix, e.Ix, v.yMax - v.centroidY, e.yMax + e.centroidY));
  e.SxBottom = Math.max(e.SxBottom, mod(v.SxBottom, v.Ix, e.Ix, v.centroidY - v.yMin, e.yMin + e.centroidY));
  e.SyRight = Math.max(e.SyRight, mod(v.SyRight, v.Iy, e.Iy, v.xMax - v.centroidX, e.xMax + e.centroidX));
  e.SyLeft = Math.max(e.SyLeft, mod(v.SyLeft, v.Iy, e.Iy, v.centroidX - v.xMin, e.xMin + e.centroidX));
}
