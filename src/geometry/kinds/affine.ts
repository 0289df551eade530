/**
 * Affine maps m = [a, b, c, d, e, f], sending (x, y) to (a x + c y + e, b x + d y + f), the SVG matrix
 * order (SVG 1.1, section 7.4 "The 'transform' attribute").
 */
import type { Affine } from './types.js';

export const IDENTITY: Affine = [1, 0, 0, 1, 0, 0];

/** The map "first n, then m" (matrix product m·n). */
export function composeAffine(m: Affine, n: Affine): Affine {
  return [
    m[0] * n[0] + m[2] * n[1],
    m[1] * n[0] + m[3] * n[1],
    m[0] * n[2] + m[2] * n[3],
    m[1] * n[2] + m[3] * n[3],
    m[0] * n[4] + m[2] * n[5] + m[4],
    m[1] * n[4] + m[3] * n[5] + m[5],
  ];
}

export function applyAffine(m: Affine, x: number, y: number): [number, number] {
  return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
}

export function isIdentity(m: Affine): boolean {
  return m[0] === 1 && m[1] === 0 && m[2] === 0 && m[3] === 1 && m[4] === 0 && m[5] === 0;
}
