/**
 * What a batch row adds up to as an order line: the part's figures in fixed units (mm, kg), the line totals
 * (quantity × value) and, with shop rates, the cutting time and cost. Plain arithmetic on the measured
 * figures; the assumptions (src/output/batchRows.ts prints them) are:
 *   cutting time of one part = cut length / cutting speed + pierces × pierce time (marking lines, rapid
 *     moves between contours, lead-ins and kerf are not modelled: the cut follows the drawn contour);
 *   machine cost of one part = cutting time × machine rate;
 *   material cost of one part = blank mass × material price (the smallest enclosing rectangle × thickness ×
 *     density; nesting, remnants and offcuts are the shop's own judgement);
 *   line time = quantity × cutting time + setup time; line cost = quantity × part cost + setup time × machine rate.
 */
import { LENGTH_UNITS, type LengthUnit, isLengthUnit } from '../base/units.js';
import { type ShopRate, type ShopRates, findRate } from './rates.js';
import type { BatchRow } from './task.js';

/** Figures that add up over pieces, in mm and kg; null where the part has none. */
export interface Amounts {
  areaMm2: number | null;
  cutLengthMm: number | null;
  pierces: number | null;
  markingLengthMm: number | null;
  /** netMass, or the integrated mass of a layered or varying plate; kg. */
  massKg: number | null;
  massErrorKg: number | null;
  blankMassKg: number | null;
}

const AMOUNT_KEYS = ['areaMm2', 'cutLengthMm', 'pierces', 'markingLengthMm', 'massKg', 'massErrorKg', 'blankMassKg'] as const satisfies readonly (keyof Amounts)[];

/** A row's own figures in mm and kg, and its line totals (× quantity; zero pieces for a failed part). */
export interface LineFigures extends Amounts {
  /** Length unit of the drawing → mm. */
  toMm: number;
  thicknessMm: number | null;
  line: Amounts;
}

export interface LineCost {
  rate: ShopRate;
  /** One part: cutting (cut length / speed), piercing (pierces × pierce time), their sum; minutes. */
  cutMin: number;
  pierceMin: number;
  partTimeMin: number;
  /** One part: machine (time × rate), material (blank mass × price), their sum; money. */
  machineCost: number;
  materialCost: number;
  partCost: number;
  /** The line: quantity × part time + setup; quantity × part cost + setup × machine rate. */
  setupMin: number;
  setupCost: number;
  lineTimeMin: number;
  lineCost: number;
}

/** Why a row has no cost: a fact, worded in src/output/batchRows.ts. */
export type NoCost =
  | { reason: 'failed' }
  | { reason: 'no-material' }
  | { reason: 'no-thickness' }
  | { reason: 'no-blank' }
  | { reason: 'no-rate'; material: string; thicknessMm: number };

const times = (v: number | null, q: number) => (v === null ? null : v * q);

export function lineFigures(r: BatchRow): LineFigures {
  const toMm = isLengthUnit(r.units) ? LENGTH_UNITS[r.units as LengthUnit] / LENGTH_UNITS.mm : NaN;
  const q = r.quantities;
  const v = (key: string, power: number) => (q[key] === undefined ? null : q[key].value * toMm ** power);
  const m = q.netMass ?? q.mass;
  const f = {
    toMm,
    thicknessMm: r.thickness === null ? null : r.thickness * toMm,
    areaMm2: v('area', 2),
    cutLengthMm: v('cutLength', 1),
    pierces: q.pierces?.value ?? null,
    markingLengthMm: r.markingLength === null ? null : r.markingLength * toMm,
    massKg: m?.value ?? null,
    massErrorKg: m?.error ?? null,
    blankMassKg: q.blankMass?.value ?? null,
  };
  const n = r.status === 'ok' ? r.quantity : 0;
  const line = Object.fromEntries(AMOUNT_KEYS.map((k) => [k, times(f[k], n)])) as Record<keyof Amounts, number | null>;
  return { ...f, line };
}

/** Cutting time and cost of a row under the shop's rates (see the module comment), or why there is none. */
export function priceLine(r: BatchRow, f: LineFigures, rates: ShopRates): LineCost | NoCost {
  if (r.status !== 'ok') return { reason: 'failed' };
  if (r.material === null) return { reason: 'no-material' };
  if (f.thicknessMm === null) return { reason: 'no-thickness' };
  if (f.blankMassKg === null || f.cutLengthMm === null || f.pierces === null) return { reason: 'no-blank' };
  const rate = findRate(rates, r.material, f.thicknessMm);
  if (!rate) return { reason: 'no-rate', material: r.material, thicknessMm: f.thicknessMm };
  const cutMin = f.cutLengthMm / rate.cuttingSpeedMmPerMin;
  const pierceMin = (f.pierces * rate.pierceTimeS) / 60;
  const partTimeMin = cutMin + pierceMin;
  const machineCost = (partTimeMin / 60) * rate.machineRatePerH;
  const materialCost = f.blankMassKg * rate.materialPricePerKg;
  const partCost = machineCost + materialCost;
  const setupMin = rate.setupTimeMin;
  const setupCost = (setupMin / 60) * rate.machineRatePerH;
  return {
    rate, cutMin, pierceMin, partTimeMin, machineCost, materialCost, partCost, setupMin, setupCost,
    lineTimeMin: r.quantity * partTimeMin + setupMin,
    lineCost: r.quantity * partCost + setupCost,
  };
}

export function isPriced(c: LineCost | NoCost | null): c is LineCost {
  return c !== null && 'rate' in c;
}

/** One batch result as an order line: the row, the manifest's note, its figures in mm and kg, its cost. */
export interface BatchLine {
  row: BatchRow;
  note: string | null;
  figures: LineFigures;
  /** null without a rates file. */
  cost: LineCost | NoCost | null;
}

export function batchLine(row: BatchRow, note: string | undefined, rates?: ShopRates): BatchLine {
  const figures = lineFigures(row);
  return { row, note: note ?? null, figures, cost: rates ? priceLine(row, figures, rates) : null };
}
