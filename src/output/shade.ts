/**
 * Per-triangle values for shaded drawings: the refinement error indicator, or a user function
 * (density, thickness, …) evaluated at each triangle's centre; and the colour ramp that shows them.
 */
import { InputError } from '../base/errors.js';
import { compileExpression } from '../expr/index.js';
import { type Mesh, type MeshView, TriangleMap, triangleCount } from '../mesh/mesh.js';
import { refineUniform } from '../mesh/refine.js';
import { M_AREA, M_XX, M_XY, M_YY, MOMENT_COUNT, integrate } from '../quadrature/integrate.js';

export interface TriangleValues {
  /** One value per triangle of the mesh. */
  values: Float64Array;
  /** Legend title. */
  title: string;
  /** 'log' for indicators spanning decades, 'linear' for functions. */
  scale: 'log' | 'linear';
}

/**
 * Error indicator of each triangle t of `mesh`: integrate on the mesh and on its uniform refinement
 * (children of t are 4t..4t+3) and take |Σ children − parent| of the area and of the three second moments
 * (about the mesh's local origin), scaled by the part's total area and total polar moment:
 *   η_t = max( |ΔA_t| / A,  (|ΔIxx_t| + |ΔIxy_t| + |ΔIyy_t|) / (Ixx + Iyy) ).
 */
export function errorIndicator(mesh: Mesh, degree: number): TriangleValues {
  const K = MOMENT_COUNT;
  const coarse = integrate(mesh, { degree, perTriangle: true });
  const fine = integrate(refineUniform(mesh), { degree, perTriangle: true });
  const pc = coarse.perTriangle!, pf = fine.perTriangle!;
  const n = triangleCount(mesh);
  const A = Math.abs(coarse.sums[M_AREA]);
  const J = Math.abs(coarse.sums[M_XX] + coarse.sums[M_YY]);
  const values = new Float64Array(n);
  for (let t = 0; t < n; t++) {
    const child = (j: number) => pf[(4 * t) * K + j] + pf[(4 * t + 1) * K + j] + pf[(4 * t + 2) * K + j] + pf[(4 * t + 3) * K + j];
    const dA = Math.abs(child(M_AREA) - pc[t * K + M_AREA]) / A;
    const dI = (Math.abs(child(M_XX) - pc[t * K + M_XX]) + Math.abs(child(M_XY) - pc[t * K + M_XY]) + Math.abs(child(M_YY) - pc[t * K + M_YY])) / J;
    values[t] = Math.max(dA, dI);
  }
  return { values, title: 'error indicator η (relative)', scale: 'log' };
}

/**
 * A function of x and y (part coordinates) at each triangle's centre: the image of barycentric
 * (1/3, 1/3, 1/3) under the triangle's exact (possibly curved) map. Non-finite values are refused.
 */
export function functionValues(mesh: MeshView, text: string, where = '--shade'): TriangleValues {
  const f = compileExpression(text, where);
  const map = new TriangleMap();
  const [ox, oy] = mesh.origin;
  const n = triangleCount(mesh);
  const values = new Float64Array(n);
  for (let t = 0; t < n; t++) {
    map.load(mesh, t);
    map.at(1 / 3, 1 / 3);
    const x = map.x + ox, y = map.y + oy;
    const v = f.evaluate(x, y);
    if (!Number.isFinite(v)) throw new InputError(where, `"${text}" is ${v} at (${x}, ${y}); expected a finite number everywhere on the part`);
    values[t] = v;
  }
  return { values, title: text, scale: 'linear' };
}

/** Number of colour steps in a shading ramp. */
export const RAMP_STEPS = 7;

/**
 * Our sequential single-hue ramp (hue 210°, blue): lightness falls evenly from light to dark, so the order
 * survives grey printing and every common colour-vision deficiency (one hue, monotone lightness).
 */
export function rampColour(i: number, steps = RAMP_STEPS): string {
  const f = steps === 1 ? 0.5 : i / (steps - 1);
  const light = 93 - f * 70; // 93 % … 23 %
  const sat = 35 + f * 35;
  return hslToHex(210, sat / 100, light / 100);
}

function hslToHex(h: number, s: number, l: number): string {
  const a = s * Math.min(l, 1 - l);
  const f = (n: number) => {
    const k = (n + h / 30) % 12;
    const c = l - a * Math.max(-1, Math.min(k - 3, 9 - k, 1));
    return Math.round(255 * c).toString(16).padStart(2, '0');
  };
  return `#${f(0)}${f(8)}${f(4)}`;
}

/** WCAG 2.x relative luminance of a #rrggbb colour. */
export function relativeLuminance(hex: string): number {
  const ch = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255)
    .map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * ch[0] + 0.7152 * ch[1] + 0.0722 * ch[2];
}

/** WCAG 2.x contrast ratio between two colours. */
export function contrastRatio(a: string, b: string): number {
  const la = relativeLuminance(a), lb = relativeLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}

export interface Binning {
  /** Step index of each triangle. */
  bins: Uint8Array;
  /** Step boundaries in the value's own units (steps + 1 numbers, low to high). */
  edges: number[];
  scale: 'log' | 'linear';
  /** Values at or below edges[0] (log scale) are drawn in the lightest step. */
  floored: boolean;
}

/** Sort values into RAMP_STEPS equal steps (of log10 value for the log scale). */
export function binValues(tv: TriangleValues, steps = RAMP_STEPS): Binning {
  const v = tv.values;
  let hi = -Infinity, lo = Infinity, minPos = Infinity;
  for (const x of v) { hi = Math.max(hi, x); lo = Math.min(lo, x); if (x > 0) minPos = Math.min(minPos, x); }
  const bins = new Uint8Array(v.length);
  if (tv.scale === 'log') {
    if (!(hi > 0)) return { bins, edges: [0, 0], scale: 'log', floored: true };
    // at most 12 decades below the largest value; smaller ones are round-off
    const l0 = Math.log10(Math.max(minPos, hi * 1e-12)), l1 = Math.log10(hi);
    const span = l1 - l0 || 1;
    const edges: number[] = [];
    for (let i = 0; i <= steps; i++) edges.push(10 ** (l0 + (span * i) / steps));
    for (let t = 0; t < v.length; t++) {
      const x = v[t] > 0 ? Math.log10(v[t]) : -Infinity;
      bins[t] = Math.max(0, Math.min(steps - 1, Math.floor(((x - l0) / span) * steps)));
    }
    return { bins, edges, scale: 'log', floored: minPos < hi * 1e-12 || lo <= 0 };
  }
  const span = hi - lo;
  const edges: number[] = [];
  for (let i = 0; i <= steps; i++) edges.push(span === 0 ? lo : lo + (span * i) / steps);
  for (let t = 0; t < v.length; t++) bins[t] = span === 0 ? Math.floor(steps / 2) : Math.max(0, Math.min(steps - 1, Math.floor(((v[t] - lo) / span) * steps)));
  return { bins, edges, scale: 'linear', floored: false };
}
