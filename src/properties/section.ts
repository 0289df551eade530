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
}

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

/**
 * Round-off floor for each quantity: the size of the terms that were actually added, times
 * ROUNDOFF_FACTOR·ε. Added to every refinement estimate so that an exact result never claims zero error.
 */
export function roundoffFloor(m: ArrayLike<number>, origin: readonly [number, number], v: SectionValues): Record<SectionKey, number> {
  const k = ROUNDOFF_FACTOR * EPS;
  const A = Math.abs(m[M_AREA]);
  const sxx = Math.abs(m[M_XX]), syy = Math.abs(m[M_YY]);
  const size = Math.max(v.width, v.height);
  const pos = (p: number) => k * (Math.abs(p) + size);
  const fIx = k * (syy + A * (v.centroidY - origin[1]) ** 2);
  const fIy = k * (sxx + A * (v.centroidX - origin[0]) ** 2);
  const fIxy = k * (Math.abs(m[M_XY]) + Math.sqrt(sxx * syy));
  const fA = k * A;
  const spread = v.I1 - v.I2;
  const fAngle = spread > 0 ? Math.min(90, DEG * (fIx + fIy + fIxy) / spread) : 90;
  const sFloor = (S: number, I: number, fI: number, dist: number, a: number, b: number) =>
    Math.abs(S) * (fI / Math.abs(I) + k * (Math.abs(a) + Math.abs(b) + size) / Math.abs(dist));
  return {
    area: fA,
    perimeter: k * v.perimeter,
    centroidX: pos(v.centroidX),
    centroidY: pos(v.centroidY),
    Ix: fIx, Iy: fIy, Ixy: fIxy,
    IxOrigin: fIx + k * A * v.centroidY ** 2,
    IyOrigin: fIy + k * A * v.centroidX ** 2,
    IxyOrigin: fIxy + k * A * Math.abs(v.centroidX * v.centroidY),
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
    xMin: pos(v.xMin), yMin: pos(v.yMin), xMax: pos(v.xMax), yMax: pos(v.yMax),
    width: pos(v.width), height: pos(v.height),
  };
}
