/**
 * Mass properties from raw mass moments, and the catalogue of their JSON keys.
 *
 * Raw sums for a layer (or a stack of layers), over the plan area, with density ρ (kg/m³), thickness t and
 * underside height z0 (part length unit L), x and y relative to a reference point (xr, yr):
 *   S0 = ∫ρt dA,  S1 = ∫ρt·x dA,  S2 = ∫ρt·y dA,  S3 = ∫ρt·x² dA,  S4 = ∫ρt·xy dA,  S5 = ∫ρt·y² dA,
 *   S6 = ∫ρ·(z0·t + t²/2) dA   (= ∫∫ z dz dA over the layer's height),
 *   S7 = ∫ρ·x·(z0·t + t²/2) dA,  S8 = ∫ρ·y·(z0·t + t²/2) dA,
 *   S9 = ∫ρ·((z0 + t)³ − z0³)/3 dA  (= ∫∫ z² dz dA).
 * S0 is in kg/m³·L³, so mass (kg) = S0·f³ with f the length unit in metres; second moments (kg/m³·L⁵)
 * become kg·m² with f⁵. For a flat layer of constant thickness the z terms give the familiar m·t²/12 about
 * the mid-plane; for variable thickness the exact ∫ z² dm about the centre of mass (which contains ∫ρ·t³/12
 * plus the spread of the mid-planes).
 */
import { STANDARD_GRAVITY } from '../model/massUnits.js';
import { LENGTH_UNITS, type LengthUnit } from '../base/units.js';
import { MASS_QUANTITIES, type MassKey } from './quantities.js';

/** Number of raw mass sums per integrand vector. */
export const MASS_SUMS = 10;

export { STANDARD_GRAVITY };

/** Mass quantities in print order: key, dimension, description (registered in the catalogue). */
export { MASS_QUANTITIES };

export type { MassKey };

/** Mass values in SI (kg, N, kg·m²) except centres, in the part's length unit. */
export type MassValues = Record<MassKey, number>;

export const MASS_KEYS: readonly MassKey[] = MASS_QUANTITIES.map((q) => q.key);

/**
 * Move raw sums from one reference point to another: x_new = x_old + dx, where (dx, dy) = old reference − new
 * reference. Returns a new array.
 */
export function shiftMassSums(s: ArrayLike<number>, dx: number, dy: number): Float64Array {
  const r = Float64Array.from(s as ArrayLike<number>);
  const [S0, S1, S2, , , , S6] = [s[0], s[1], s[2], s[3], s[4], s[5], s[6]];
  r[1] = S1 + dx * S0;
  r[2] = S2 + dy * S0;
  r[3] = s[3] + 2 * dx * S1 + dx * dx * S0;
  r[4] = s[4] + dx * S2 + dy * S1 + dx * dy * S0;
  r[5] = s[5] + 2 * dy * S2 + dy * dy * S0;
  r[7] = s[7] + dx * S6;
  r[8] = s[8] + dy * S6;
  return r;
}

/** Mass properties from raw sums about the reference point `ref` (part coordinates) in length unit `unit`. */
export function massFromSums(s: ArrayLike<number>, ref: readonly [number, number], unit: LengthUnit): MassValues {
  const f = LENGTH_UNITS[unit];
  const f3 = f * f * f, f5 = f3 * f * f;
  const S0 = s[0];
  const cx = s[1] / S0, cy = s[2] / S0, cz = s[6] / S0;
  const xx = s[3] - s[1] * cx, yy = s[5] - s[2] * cy, zz = s[9] - s[6] * cz;
  const xy = s[4] - s[1] * cy, xz = s[7] - s[1] * cz, yz = s[8] - s[2] * cz;
  const mass = S0 * f3;
  return {
    mass,
    weight: mass * STANDARD_GRAVITY,
    massCentreX: ref[0] + cx,
    massCentreY: ref[1] + cy,
    massCentreZ: cz,
    massMomentX: (yy + zz) * f5,
    massMomentY: (xx + zz) * f5,
    massMomentZ: (xx + yy) * f5,
    massProductXY: xy * f5,
    massProductXZ: xz * f5,
    massProductYZ: yz * f5,
  };
}

/**
 * Error of each derived quantity, in the manner of src/analysis/measure.ts: the difference between the
 * quantity computed from the fine and from the coarse sums, plus its first-order sensitivity to each raw
 * sum's own estimate (so errors that cancel between the two levels are not lost), plus a round-off floor
 * (64 ε times the size of the terms that were added).
 */
/** The round-off allowance `propagateErrors` adds: this times (|value| + Σ|terms|) of each sum. */
export const PROPAGATION_ROUNDOFF = 64 * Number.EPSILON;

export function propagateErrors<K extends string>(
  derive: (s: Float64Array) => Record<K, number>,
  fine: Float64Array, coarse: Float64Array, estimate: ArrayLike<number>, scale: ArrayLike<number>,
): { values: Record<K, number>; errors: Record<K, number> } {
  const k = PROPAGATION_ROUNDOFF;
  const values = derive(fine);
  const low = derive(coarse);
  const errors = {} as Record<K, number>;
  const keys = Object.keys(values) as K[];
  for (const key of keys) errors[key] = Math.abs(values[key] - low[key]) + k * Math.abs(values[key]);
  const bump = Float64Array.from(fine);
  for (let i = 0; i < fine.length; i++) {
    for (const [delta, weight] of [[estimate[i], 1], [k * scale[i], 1]] as const) {
      if (!(delta > 0)) continue;
      bump[i] = fine[i] + delta;
      const v = derive(bump);
      for (const key of keys) {
        const d = Math.abs(v[key] - values[key]) * weight;
        if (Number.isFinite(d)) errors[key] += d;
      }
      bump[i] = fine[i];
    }
  }
  return { values, errors };
}
