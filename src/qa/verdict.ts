/**
 * Verdicts: is a stated value confirmed by the computed one?
 *
 * Rule. d = |computed − stated| (for angles, the difference taken modulo 180° into [−90°, 90°]),
 * e = our own error estimate of the computed value, T = the tolerance (absolute, in the computed value's unit):
 *   pass          when d + e ≤ T   (even in the worst case allowed by our estimate the value is within T)
 *   fail          when d − e > T   (even in the best case it is outside T)
 *   inconclusive  otherwise        (our own uncertainty is too large to decide), and whenever the computed
 *                                  value or its error is not a finite number, the error is not a bound
 *                                  (errorIsBound: false), or the quantity was not computed.
 * A relative tolerance f means T = f·|stated| (the stated value is the reference), so a relative tolerance
 * on a stated zero is zero; the defaults below avoid that where zero is a normal value.
 *
 * Default tolerances (used where the reference gives none). Common practice, no source; chosen so that a
 * value printed to the usual number of digits passes when it is right and fails when it is not:
 * - lengths (centroid, perimeter, cut length, radii of gyration, box, blank sides): 0.01 mm + 0.01 % of the
 *   part size (its bounding-box diagonal), in the part's unit. 0.01 mm is below what drawings state for
 *   plate work; the size term keeps rounding of large coordinates (site coordinates) from failing.
 * - areas, first and second moments, section moduli (L², L³, L⁴): 0.1 % relative. A value printed to
 *   4 significant figures is off by at most 0.05 % from rounding, so it passes; 3 figures (up to 0.5 %) may not,
 *   and then the reference should say its tolerance. Product moments (Ixy, IxyOrigin) are often zero for
 *   symmetric parts: their 0.1 % is taken of Ix + Iy (IxOrigin + IyOrigin), computed.
 * - angles (principal angle, blank angle): 0.05°, half the last digit of an angle printed to 0.1°.
 * - counts (pierces): exact (T = 0).
 * - ratios (scrap fraction): 0.001 absolute (0.1 percentage point).
 * - masses, mass moments, forces: 0.5 % relative: masses are usually stated to 3 significant figures.
 *
 * Tolerance from the stated digits (optional, `toleranceFromDigits`): a value without a tolerance of its own
 * is taken to be right to half a unit in its last written digit (0.588 m → ± 0.0005 m, 7 → ± 0.5, 1.20e3 → ± 5),
 * converted to the computed value's unit. Common practice, no source: the rounding a value stated to that
 * many digits can carry. A tolerance written in the reference still wins.
 */
import type { LengthUnit } from '../base/units.js';
import { type Dimension, type Quantity, quantityInfo, unitText } from '../properties/quantities.js';
import type { Reference, StatedValue } from './reference.js';
import { factorToReport } from './units.js';
import { type RowHint, hintFor } from './hints.js';

export type Verdict = 'pass' | 'fail' | 'inconclusive';

export type Tolerance =
  | { kind: 'absolute'; value: number }
  | { kind: 'relative'; fraction: number };

export interface JudgeOptions {
  /** Compare modulo 180° (axis directions in degrees). */
  angle?: boolean;
  /** Base of a relative tolerance instead of |stated|. */
  relativeBase?: number;
}

export interface Judgement {
  verdict: Verdict;
  /** computed − stated (wrapped into [−90, 90] for angles); NaN if not computable. */
  difference: number;
  /** The absolute tolerance T used. */
  tolerance: number;
  /** Our error estimate e used. */
  error: number;
}

/** Signed difference of two axis angles in degrees, in [−90, 90]. */
export function angleDifference(computed: number, stated: number): number {
  const d = computed - stated;
  return d - 180 * Math.round(d / 180);
}

export function toleranceValue(tol: Tolerance, stated: number, base?: number): number {
  return tol.kind === 'absolute' ? tol.value : tol.fraction * Math.abs(base ?? stated);
}

export function judge(stated: number, tolerance: Tolerance, computed: Quantity, options: JudgeOptions = {}): Judgement {
  const T = toleranceValue(tolerance, stated, options.relativeBase);
  const e = computed.error;
  const diff = options.angle ? angleDifference(computed.value, stated) : computed.value - stated;
  // an error that is not a bound (computed.errorIsBound === false) cannot decide anything
  if (!Number.isFinite(diff) || !Number.isFinite(e) || !(e >= 0) || !(T >= 0) || computed.errorIsBound === false) {
    return { verdict: 'inconclusive', difference: diff, tolerance: T, error: e };
  }
  const d = Math.abs(diff);
  const verdict: Verdict = d + e <= T ? 'pass' : d - e > T ? 'fail' : 'inconclusive';
  return { verdict, difference: diff, tolerance: T, error: e };
}

export interface CompareContext {
  /** The part's length unit: computed quantities are in it. */
  lengthUnit: LengthUnit;
  /** Bounding-box diagonal of the part, in its unit (for the default length tolerance). */
  partSize: number;
  /** Values without a tolerance of their own: half a unit in the last stated digit instead of the defaults. */
  toleranceFromDigits?: boolean;
  /** The one constant thickness the masses were computed with (part's unit), for the thickness-slip hint. */
  thickness?: number;
}

const PRODUCT_SCALE: Record<string, [string, string]> = {
  Ixy: ['Ix', 'Iy'],
  IxyOrigin: ['IxOrigin', 'IyOrigin'],
};

const MM: Record<LengthUnit, number> = { mm: 1, cm: 10, m: 1000, in: 25.4, ft: 304.8 };

export interface DefaultTolerance {
  tolerance: Tolerance;
  /** Base of a relative tolerance when it is not |stated|. */
  relativeBase?: number;
  text: string;
}

/** The default tolerance for a quantity (see the module comment). */
export function defaultTolerance(
  key: string, dim: Dimension, context: CompareContext, quantities: Readonly<Record<string, Quantity | undefined>> = {},
): DefaultTolerance {
  switch (dim) {
    case 'length': {
      const t = 0.01 / MM[context.lengthUnit] + 1e-4 * context.partSize;
      return { tolerance: { kind: 'absolute', value: t }, text: 'default: 0.01 mm + 0.01% of part size' };
    }
    case 'area': case 'length3': case 'length4': case 'length6': case 'perLength3': {
      const pair = PRODUCT_SCALE[key];
      if (pair) {
        const a = quantities[pair[0]], b = quantities[pair[1]];
        const base = a && b ? Math.abs(a.value) + Math.abs(b.value) : undefined;
        return { tolerance: { kind: 'relative', fraction: 1e-3 }, relativeBase: base, text: base !== undefined ? `default: 0.1% of ${pair[0]} + ${pair[1]}` : 'default: 0.1%' };
      }
      return { tolerance: { kind: 'relative', fraction: 1e-3 }, text: 'default: 0.1%' };
    }
    case 'angle': return { tolerance: { kind: 'absolute', value: 0.05 }, text: 'default: 0.05°' };
    case 'count': return { tolerance: { kind: 'absolute', value: 0 }, text: 'default: exact' };
    case 'ratio': return { tolerance: { kind: 'absolute', value: 1e-3 }, text: 'default: 0.001' };
    case 'mass': case 'massMoment': case 'force':
      return { tolerance: { kind: 'relative', fraction: 5e-3 }, text: 'default: 0.5%' };
  }
}

export interface ComparisonRow {
  quantity: string;
  /** The stated value converted to the computed value's unit. */
  stated: number;
  /** The stated value and unit as written. */
  statedAsWritten: number;
  statedUnit: string;
  /** Unit of stated/computed/difference/tolerance (the part's units, °, kg, ...). */
  unit: string;
  computed: number | null;
  error: number | null;
  difference: number | null;
  /** Absolute tolerance used, in `unit`. */
  tolerance: number;
  toleranceText: string;
  /** Where the tolerance came from: the reference, the stated digits (toleranceFromDigits), or a default. */
  toleranceSource: 'reference' | 'digits' | 'default';
  verdict: Verdict;
  /** Why a row is inconclusive when that is not the error estimate (not computed, not finite). */
  note?: string;
  /** The reference's own note on this value, as written. */
  statedNote?: string;
  /** A failed row whose difference matches a common slip (src/qa/hints.ts). */
  hint?: RowHint;
  where: string;
}

export interface Comparison {
  rows: ComparisonRow[];
  /** fail if any row fails; else inconclusive if any row is; else pass. */
  verdict: Verdict;
  counts: Record<Verdict, number>;
  /** Always present: what a verdict does and does not establish. */
  caution: string;
}

export const COMPARE_CAUTION =
  'A pass means the computed value agrees with the stated one within the tolerance; it is not a structural, ' +
  'lifting or fitness-for-purpose check. Those rest with competent, qualified people under local codes.';

function rowFor(sv: StatedValue, quantities: Readonly<Record<string, Quantity | undefined>>, context: CompareContext): ComparisonRow {
  const f = factorToReport(sv.unit, context.lengthUnit);
  const stated = sv.value * f;
  const info = quantityInfo(sv.quantity);
  const unit = unitText(sv.dimension, context.lengthUnit);
  let tol: Tolerance, base: number | undefined, text: string, source: ComparisonRow['toleranceSource'];
  if (sv.tolerance) {
    source = 'reference';
    text = sv.tolerance.text;
    tol = sv.tolerance.kind === 'relative'
      ? { kind: 'relative', fraction: sv.tolerance.fraction }
      : { kind: 'absolute', value: sv.tolerance.value * factorToReport(sv.tolerance.unit, context.lengthUnit) };
  } else if (context.toleranceFromDigits && sv.lastDigit > 0) {
    source = 'digits';
    const half = sv.lastDigit / 2;
    text = `half the last stated digit: ± ${Number(half.toPrecision(12))}${sv.unit.text ? ' ' + sv.unit.text : ''}`;
    tol = { kind: 'absolute', value: half * f };
  } else {
    source = 'default';
    const d = defaultTolerance(sv.quantity, sv.dimension, context, quantities);
    tol = d.tolerance; base = d.relativeBase; text = d.text;
  }
  const q = quantities[sv.quantity];
  const common = {
    quantity: sv.quantity, stated, statedAsWritten: sv.value, statedUnit: sv.unit.text, unit,
    toleranceText: text, toleranceSource: source, where: sv.where, ...(sv.note !== undefined ? { statedNote: sv.note } : {}),
  };
  if (!q) {
    return { ...common, computed: null, error: null, difference: null, tolerance: toleranceValue(tol, stated, base), verdict: 'inconclusive', note: 'not computed for this run' };
  }
  const j = judge(stated, tol, q, { angle: (info?.dimension ?? sv.dimension) === 'angle', relativeBase: base });
  const row: ComparisonRow = { ...common, computed: q.value, error: q.error, difference: j.difference, tolerance: j.tolerance, verdict: j.verdict };
  if (!Number.isFinite(q.value) || !Number.isFinite(q.error)) row.note = 'computed value or its error is not finite';
  else if (q.errorIsBound === false) row.note = 'the computed error is an estimate, not a bound';
  const hint = hintFor(row, sv.dimension, context.thickness, context.lengthUnit);
  if (hint) row.hint = hint;
  return row;
}

/** Judge every stated value of a reference against the computed quantities (in the part's units). */
export function compareAll(
  reference: Reference, quantities: Readonly<Record<string, Quantity | undefined>>, context: CompareContext,
): Comparison {
  const rows = reference.values.map((sv) => rowFor(sv, quantities, context));
  const counts: Record<Verdict, number> = { pass: 0, fail: 0, inconclusive: 0 };
  for (const r of rows) counts[r.verdict]++;
  const verdict: Verdict = counts.fail > 0 ? 'fail' : counts.inconclusive > 0 ? 'inconclusive' : 'pass';
  return { rows, verdict, counts, caution: COMPARE_CAUTION };
}
