/**
 * Batch output: one record per part, as CSV (RFC 4180, numbers that round-trip) or JSON Lines, and the
 * run's summary.
 *
 * CSV columns (lengths in the row's `units`, angles in degrees, masses in kg, density kg/m³; an empty
 * field means "not computed"):
 *   row, file, item, part, status, quantity, units, material, thickness, density,
 *   area, areaError, perimeter, centroidX, centroidY, Ix, Iy, Ixy, I1, I2, principalAngle,
 *   width, height (axis-aligned bounding rectangle),
 *   cutLength, cutLengthOuter, cutLengthInner, pierces,
 *   blankWidth, blankHeight, blankAngle, blankArea, scrapFraction,
 *   netMass, netMassError, blankMass (constant single-layer plates),
 *   mass, massError (integrated mass properties: layered or varying plates, or when a stated value needs them),
 *   verdict (pass / fail / inconclusive, empty when nothing was stated), passes, fails, inconclusive,
 *   notPassed (each stated value that did not pass: "key verdict: stated S, computed C ± E, tolerance T"; "; "
 *   between them), error (why the part failed).
 * JSON Lines: one object per part with every quantity as { value, error }, the comparison rows, warnings;
 * the last line is { "summary": { ... } }.
 */
import { warningJson } from './words.js';
import { formatCsvRow } from '../base/csv.js';
import { formatError, formatNumber } from './text.js';
import { LENGTH_UNITS, type LengthUnit } from '../base/units.js';
import type { Verdict } from '../qa/verdict.js';
import type { BatchRow } from '../batch/task.js';

const VALUE_KEYS = [
  'area', 'areaError', 'perimeter', 'centroidX', 'centroidY', 'Ix', 'Iy', 'Ixy', 'I1', 'I2', 'principalAngle',
  'width', 'height', 'cutLength', 'cutLengthOuter', 'cutLengthInner', 'pierces',
  'blankWidth', 'blankHeight', 'blankAngle', 'blankArea', 'scrapFraction', 'netMass', 'netMassError', 'blankMass', 'mass', 'massError',
] as const;

export const BATCH_CSV_HEADER: readonly string[] = [
  'row', 'file', 'item', 'part', 'status', 'quantity', 'units', 'unitsFrom', 'material', 'thickness', 'density',
  ...VALUE_KEYS, 'markingLength', 'verdict', 'passes', 'fails', 'inconclusive', 'notPassed', 'error',
];

function valueOf(r: BatchRow, key: string): number | null {
  if (key.endsWith('Error')) return r.quantities[key.slice(0, -5)]?.error ?? null;
  return r.quantities[key]?.value ?? null;
}

export function notPassedText(r: BatchRow): string {
  if (!r.comparison) return '';
  return r.comparison.filter((c) => c.verdict !== 'pass').map((c) => {
    const u = c.unit ? ' ' + c.unit : '';
    const computed = c.computed === null ? 'not computed' : `computed ${formatNumber(c.computed)}${u} ± ${formatError(c.error ?? NaN)}`;
    return `${c.quantity} ${c.verdict}: stated ${formatNumber(c.statedAsWritten)}${c.statedUnit ? ' ' + c.statedUnit : ''}, ${computed}, tolerance ${formatNumber(c.tolerance, 4)}${u}${c.note ? ` (${c.note})` : ''}`;
  }).join('; ');
}

export function batchCsvHeader(): string {
  return formatCsvRow(BATCH_CSV_HEADER) + '\r\n';
}

export function batchCsvRow(r: BatchRow): string {
  return formatCsvRow([
    r.row, r.file, r.item, r.part, r.status, r.quantity, r.units, r.unitSource, r.material, r.thickness, r.density,
    ...VALUE_KEYS.map((k) => valueOf(r, k)), r.markingLength,
    r.verdict, r.counts?.pass ?? null, r.counts?.fail ?? null, r.counts?.inconclusive ?? null, notPassedText(r), r.error,
  ], { neutralise: true }) + '\r\n'; // a spreadsheet must never run a part or file name as a formula
}

export function batchJsonLine(r: BatchRow): string {
  const o = {
    row: r.row, file: r.file, item: r.item, items: r.items, part: r.part, status: r.status, quantity: r.quantity,
    units: r.units, unitsFrom: r.unitSource, markingLength: r.markingLength, material: r.material, thickness: r.thickness, density: r.density, densitySource: r.densitySource,
    quantities: r.quantities, verdict: r.verdict, counts: r.counts,
    comparison: r.comparison?.map((c) => ({
      quantity: c.quantity, stated: c.statedAsWritten, statedUnit: c.statedUnit, statedConverted: c.stated, unit: c.unit,
      computed: c.computed, error: c.error, difference: c.difference, tolerance: c.tolerance,
      toleranceSource: c.toleranceSource, verdict: c.verdict, ...(c.note ? { note: c.note } : {}),
    })) ?? null,
    warnings: r.warnings.map(warningJson), error: r.error,
  };
  return JSON.stringify(o) + '\n';
}

// ---------------------------------------------------------------- summary

export interface BatchSummary {
  /** Manifest rows (files) and parts. */
  rows: number;
  parts: number;
  partsMeasured: number;
  partsFailed: number;
  /** Σ quantity over measured parts. */
  pieces: number;
  /** Σ netMass × quantity, kg (the integrated mass for layered or varying plates), over parts that have one; and its summed estimate. */
  netMassKg: number;
  netMassErrorKg: number;
  /** Σ blankMass × quantity, kg. */
  blankMassKg: number;
  /** Measured parts without a mass (no thickness or density). */
  partsWithoutMass: number;
  /** Σ cutLength × quantity, metres. */
  cutLengthM: number;
  /** Σ pierces × quantity. */
  pierces: number;
  /** Parts by verdict; `none` = nothing stated. */
  verdicts: Record<Verdict | 'none', number>;
  jobs: number;
  seconds: number;
  partsPerSecond: number;
  caution: string;
}

export const BATCH_CAUTION =
  'Totals are sums of nominal figures for planning and quoting. Masses assume the nominal thickness and density ' +
  'given; lifting, rigging and structural decisions rest with competent people under local codes.';

export class SummaryBuilder {
  private s: BatchSummary;
  private files = new Set<number>();
  constructor(jobs: number) {
    this.s = {
      rows: 0, parts: 0, partsMeasured: 0, partsFailed: 0, pieces: 0, netMassKg: 0, netMassErrorKg: 0, blankMassKg: 0,
      partsWithoutMass: 0, cutLengthM: 0, pierces: 0, verdicts: { pass: 0, fail: 0, inconclusive: 0, none: 0 },
      jobs, seconds: 0, partsPerSecond: 0, caution: BATCH_CAUTION,
    };
  }
  add(r: BatchRow): void {
    const s = this.s;
    this.files.add(r.row);
    s.parts++;
    if (r.status !== 'ok') { s.partsFailed++; return; }
    s.partsMeasured++;
    s.pieces += r.quantity;
    const q = r.quantities;
    const m = q.netMass ?? q.mass;
    if (m) {
      s.netMassKg += m.value * r.quantity;
      s.netMassErrorKg += m.error * r.quantity;
      s.blankMassKg += (q.blankMass?.value ?? 0) * r.quantity;
    } else {
      s.partsWithoutMass++;
    }
    if (q.cutLength) s.cutLengthM += q.cutLength.value * LENGTH_UNITS[r.units as LengthUnit] * r.quantity;
    if (q.pierces) s.pierces += q.pierces.value * r.quantity;
    s.verdicts[r.verdict ?? 'none']++;
  }
  finish(seconds: number): BatchSummary {
    this.s.rows = this.files.size;
    this.s.seconds = seconds;
    this.s.partsPerSecond = seconds > 0 ? this.s.parts / seconds : 0;
    return { ...this.s, verdicts: { ...this.s.verdicts } };
  }
}

export function summaryText(s: BatchSummary): string {
  const lines = [
    `batch: ${s.rows} file${s.rows === 1 ? '' : 's'}, ${s.parts} part${s.parts === 1 ? '' : 's'}: ${s.partsMeasured} measured, ${s.partsFailed} failed; ${s.pieces} pieces in all`,
    `totals (× quantity): cut length ${formatNumber(s.cutLengthM, 6)} m, pierces ${s.pierces}, ` +
      (s.partsMeasured - s.partsWithoutMass > 0
        ? `net mass ${formatNumber(s.netMassKg, 6)} kg ± ${formatError(s.netMassErrorKg)}, blank mass ${formatNumber(s.blankMassKg, 6)} kg`
        : 'no masses (give a thickness and a material or density)') +
      (s.partsWithoutMass > 0 && s.partsMeasured > s.partsWithoutMass ? ` (${s.partsWithoutMass} measured part${s.partsWithoutMass === 1 ? '' : 's'} without a mass, not in the total)` : ''),
    `verdicts: ${s.verdicts.pass} pass, ${s.verdicts.fail} fail, ${s.verdicts.inconclusive} inconclusive, ${s.verdicts.none} with nothing stated`,
    `${s.jobs} worker${s.jobs === 1 ? '' : 's'}, ${s.seconds.toFixed(2)} s, ${formatNumber(s.partsPerSecond, 4)} parts/s`,
    s.caution,
  ];
  return lines.join('\n') + '\n';
}
