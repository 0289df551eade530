/**
 * Batch output: one record per part, as CSV (numbers that round-trip) or JSON Lines, and the run's summary.
 *
 * Units in CSV headings, one convention for every CSV platewise writes: a column that holds a number with a
 * unit carries the unit in square brackets after its name, `netMass [kg]`, `area [mm2]` (ASCII: mm2 is mm²,
 * mm4 is mm⁴, kg/m3 is kg/m³, so that every spreadsheet shows it; the manifest reads the same form). A column
 * without brackets holds a count, a ratio or text. In the batch CSV every length is converted from the
 * drawing's unit (`drawingUnit`) to mm with the exact factors, so one heading fits every row; angles are in
 * degrees, masses in kg, times in minutes, money in the rates file's currency.
 *
 * CSV columns, in order (an empty field means "not computed"):
 *   row, file, item, part, status, quantity, note (the manifest's note cell), drawingUnit, unitsFrom,
 *   material, thickness [mm], density [kg/m3],
 *   the part's figures (VALUE_KEYS, each with its unit), markingLength [mm],
 *   line totals (quantity × value): lineArea [mm2], lineCutLength [mm], linePierces, lineMarkingLength [mm],
 *   lineMass [kg] (netMass, or the integrated mass of a layered or varying plate), lineBlankMass [kg],
 *   with shop rates: rate (the rates file line used), cutTime [min], partCost [CUR], lineTime [min], lineCost [CUR],
 *   verdict, passes, fails, inconclusive, notPassed, warnings (worded, "; " between them), error.
 * JSON Lines: one object per part with every quantity as { value, error } in the drawing's unit, the note,
 * the line totals and cost in mm, kg, min; the last line is { "summary": { ... } }.
 */
import { warningJson, warningText } from './words.js';
import { type CsvDialect, RFC_4180, formatCsvRow } from '../base/csv.js';
import { formatError, formatNumber } from './text.js';
import { terminalText } from '../base/errors.js';
import { LENGTH_POWER, QUANTITIES } from '../properties/quantities.js';
import type { Verdict } from '../qa/verdict.js';
import type { BatchRow } from '../batch/task.js';
import { type BatchLine, type LineCost, type NoCost, isPriced } from '../batch/lines.js';
import type { ShopRates } from '../batch/rates.js';

const VALUE_KEYS = [
  'area', 'areaError', 'perimeter', 'centroidX', 'centroidY', 'Ix', 'Iy', 'Ixy', 'I1', 'I2', 'principalAngle',
  'width', 'height', 'cutLength', 'cutLengthOuter', 'cutLengthInner', 'pierces',
  'blankWidth', 'blankHeight', 'blankAngle', 'blankArea', 'scrapFraction', 'netMass', 'netMassError', 'blankMass', 'mass', 'massError',
] as const;

/** Heading unit of each dimension in the batch CSV (ASCII); none for counts and ratios. */
const CSV_UNIT: Record<string, string> = { length: 'mm', area: 'mm2', length3: 'mm3', length4: 'mm4', angle: 'deg', mass: 'kg' };

function dimensionOf(key: string) {
  const base = key.endsWith('Error') ? key.slice(0, -5) : key;
  return QUANTITIES.find((q) => q.key === base)!.dimension;
}

function withUnit(name: string, unit: string | undefined): string {
  return unit ? `${name} [${unit}]` : name;
}

export interface BatchCsvOptions {
  dialect?: CsvDialect;
  /** Given with a rates file: its currency label, for the money headings (and the cost columns appear). */
  currency?: string;
}

export function batchCsvColumns(o: BatchCsvOptions = {}): string[] {
  return [
    'row', 'file', 'item', 'part', 'status', 'quantity', 'note', 'drawingUnit', 'unitsFrom', 'material', 'thickness [mm]', 'density [kg/m3]',
    ...VALUE_KEYS.map((k) => withUnit(k, CSV_UNIT[dimensionOf(k)])), 'markingLength [mm]',
    'lineArea [mm2]', 'lineCutLength [mm]', 'linePierces', 'lineMarkingLength [mm]', 'lineMass [kg]', 'lineBlankMass [kg]',
    ...(o.currency !== undefined ? ['rate', 'cutTime [min]', `partCost [${o.currency}]`, 'lineTime [min]', `lineCost [${o.currency}]`] : []),
    'verdict', 'passes', 'fails', 'inconclusive', 'notPassed', 'warnings', 'error',
  ];
}

/** The batch CSV's columns with the default options (RFC 4180, no rates). */
export const BATCH_CSV_HEADER: readonly string[] = batchCsvColumns();

function valueOf(r: BatchRow, key: string, toMm: number): number | null {
  const power = LENGTH_POWER[dimensionOf(key)] ?? 0;
  const q = key.endsWith('Error') ? r.quantities[key.slice(0, -5)]?.error : r.quantities[key]?.value;
  return q === undefined ? null : power === 0 ? q : q * toMm ** power;
}

/** Why a row has no cost, in words. */
export function noCostText(c: NoCost): string {
  switch (c.reason) {
    case 'failed': return 'no cost: the part failed';
    case 'no-material': return 'no cost: the part has no material (rates are per material and thickness)';
    case 'no-thickness': return 'no cost: the part has no single thickness (layered or varying plate)';
    case 'no-blank': return 'no cost: the part has no blank mass or cut length (layered or varying plate)';
    case 'no-rate': return `no cost: the rates file has no row for ${c.material} ${formatNumber(c.thicknessMm, 8)} mm`;
  }
}

/** Every warning of a row, worded, and why it has no cost. */
export function lineWarnings(l: BatchLine): string[] {
  const out = l.row.warnings.map(warningText);
  if (l.cost !== null && !isPriced(l.cost) && l.cost.reason !== 'failed') out.push(noCostText(l.cost));
  return out;
}

export function notPassedText(r: BatchRow): string {
  if (!r.comparison) return '';
  return r.comparison.filter((c) => c.verdict !== 'pass').map((c) => {
    const u = c.unit ? ' ' + c.unit : '';
    const computed = c.computed === null ? 'not computed' : `computed ${formatNumber(c.computed)}${u} ± ${formatError(c.error ?? NaN)}`;
    return `${c.quantity} ${c.verdict}: stated ${formatNumber(c.statedAsWritten)}${c.statedUnit ? ' ' + c.statedUnit : ''}, ${computed}, tolerance ${formatNumber(c.tolerance, 4)}${u}${c.note ? ` (${c.note})` : ''}`;
  }).join('; ');
}

export function batchCsvHeader(o: BatchCsvOptions = {}): string {
  return formatCsvRow(batchCsvColumns(o), { dialect: o.dialect ?? RFC_4180 }) + '\r\n';
}

export function batchCsvRow(l: BatchLine, o: BatchCsvOptions = {}): string {
  const r = l.row;
  const f = l.figures;
  const c = isPriced(l.cost) ? l.cost : null;
  return formatCsvRow([
    r.row, r.file, r.item, r.part, r.status, r.quantity, l.note, r.units, r.unitSource, r.material, f.thicknessMm, r.density,
    ...VALUE_KEYS.map((k) => valueOf(r, k, f.toMm)), f.markingLengthMm,
    f.line.areaMm2, f.line.cutLengthMm, f.line.pierces, f.line.markingLengthMm, f.line.massKg, f.line.blankMassKg,
    ...(o.currency !== undefined ? [c?.rate.where ?? null, c?.partTimeMin ?? null, c?.partCost ?? null, c?.lineTimeMin ?? null, c?.lineCost ?? null] : []),
    r.verdict, r.counts?.pass ?? null, r.counts?.fail ?? null, r.counts?.inconclusive ?? null, notPassedText(r), lineWarnings(l).join('; '), r.error,
  ], { neutralise: true, dialect: o.dialect ?? RFC_4180 }) + '\r\n'; // a spreadsheet must never run a part or file name as a formula
}

function costJson(c: LineCost | NoCost | null): Record<string, unknown> | null {
  if (c === null) return null;
  if (!isPriced(c)) return { reason: c.reason, message: noCostText(c) };
  return {
    rate: c.rate.where, partTimeMin: c.partTimeMin, cutMin: c.cutMin, pierceMin: c.pierceMin,
    machineCost: c.machineCost, materialCost: c.materialCost, partCost: c.partCost,
    setupMin: c.setupMin, setupCost: c.setupCost, lineTimeMin: c.lineTimeMin, lineCost: c.lineCost,
  };
}

export function batchJsonLine(l: BatchLine): string {
  const r = l.row;
  const f = l.figures;
  const o = {
    row: r.row, file: r.file, item: r.item, items: r.items, part: r.part, status: r.status, quantity: r.quantity, note: l.note,
    units: r.units, unitsFrom: r.unitSource, markingLength: r.markingLength, material: r.material, thickness: r.thickness, density: r.density, densitySource: r.densitySource,
    quantities: r.quantities, verdict: r.verdict, counts: r.counts,
    comparison: r.comparison?.map((c) => ({
      quantity: c.quantity, stated: c.statedAsWritten, statedUnit: c.statedUnit, statedConverted: c.stated, unit: c.unit,
      computed: c.computed, error: c.error, difference: c.difference, tolerance: c.tolerance,
      toleranceSource: c.toleranceSource, verdict: c.verdict, ...(c.note ? { note: c.note } : {}),
    })) ?? null,
    // quantity × value, in fixed units whatever the drawing's unit
    lineTotals: r.status === 'ok' ? {
      areaMm2: f.line.areaMm2, cutLengthMm: f.line.cutLengthMm, pierces: f.line.pierces, markingLengthMm: f.line.markingLengthMm,
      massKg: f.line.massKg, massErrorKg: f.line.massErrorKg, blankMassKg: f.line.blankMassKg,
    } : null,
    ...(l.cost !== null ? { cost: costJson(l.cost) } : {}),
    warnings: r.warnings.map(warningJson), error: r.error,
  };
  return JSON.stringify(o) + '\n';
}

// ---------------------------------------------------------------- summary

/** Sums over one material and thickness (or over everything), × quantity, in fixed units. */
export interface BatchTotals {
  /** Parts (in the summary: every part, failed ones too; in a group: its measured parts). */
  parts: number;
  /** Σ quantity over measured parts. */
  pieces: number;
  areaM2: number;
  /** Σ cutLength × quantity, metres. */
  cutLengthM: number;
  pierces: number;
  markingLengthM: number;
  /** Σ netMass × quantity (the integrated mass for layered or varying plates), kg; and its summed estimate. */
  netMassKg: number;
  netMassErrorKg: number;
  /** Σ blankMass × quantity, kg. */
  blankMassKg: number;
  /** Measured parts without a mass (no thickness or density). */
  partsWithoutMass: number;
}

/** Totals of one material and thickness: `material` is the material's id, else null (then `density` was given, or nothing). */
export interface GroupTotals extends BatchTotals {
  material: string | null;
  /** kg/m³; null when parts of the group have no density. */
  density: number | null;
  /** null: no single thickness (layered or varying plates, or none given). */
  thicknessMm: number | null;
  /** With shop rates. */
  cost?: CostTotals;
}

export interface CostTotals {
  /** Parts priced, and measured parts that had no rate (not in the sums). */
  partsPriced: number;
  partsNotPriced: number;
  cuttingMin: number;
  setupMin: number;
  machineCost: number;
  materialCost: number;
  setupCost: number;
  /** machineCost + materialCost + setupCost. */
  totalCost: number;
}

export interface BatchSummary extends BatchTotals {
  /** Manifest rows (files) and parts. */
  rows: number;
  partsMeasured: number;
  partsFailed: number;
  /** Parts by verdict; `none` = nothing stated. */
  verdicts: Record<Verdict | 'none', number>;
  /** Totals per material and thickness, in order of first appearance (rows are added in job order). */
  byMaterialAndThickness: GroupTotals[];
  /** With shop rates: where they came from, their currency, the grand totals and the assumptions, worded. */
  rates?: { file: string; currency: string; assumptions: string[] } & CostTotals;
  jobs: number;
  seconds: number;
  partsPerSecond: number;
  caution: string;
}

export const BATCH_CAUTION =
  'Totals are sums of nominal figures for planning and quoting. Masses assume the nominal thickness and density ' +
  'given; lifting, rigging and structural decisions rest with competent people under local codes.';

/** What the cost figures assume (printed with them; src/batch/lines.ts computes exactly this). */
export const COST_ASSUMPTIONS: readonly string[] = [
  'cutting time per part = cut length / cutting speed + pierces × pierce time; kerf, lead-ins, rapid moves between contours and marking lines are not modelled',
  'machine cost = cutting time × machine rate; material cost = blank mass (smallest enclosing rectangle × thickness × density) × material price; nesting, remnants and offcuts are not modelled',
  'setup time is charged once per line at the machine rate (a line is a row of results: one part of a manifest row or of a folder\'s file)',
  'rates and prices are the shop\'s own, as given; no currency conversion, tax or margin: the tool computes, the shop decides',
];

function emptyTotals(): BatchTotals {
  return { parts: 0, pieces: 0, areaM2: 0, cutLengthM: 0, pierces: 0, markingLengthM: 0, netMassKg: 0, netMassErrorKg: 0, blankMassKg: 0, partsWithoutMass: 0 };
}

function emptyCost(): CostTotals {
  return { partsPriced: 0, partsNotPriced: 0, cuttingMin: 0, setupMin: 0, machineCost: 0, materialCost: 0, setupCost: 0, totalCost: 0 };
}

function addTo(t: BatchTotals, l: BatchLine): void {
  const f = l.figures.line;
  t.pieces += l.row.quantity;
  if (f.areaMm2 !== null) t.areaM2 += f.areaMm2 * 1e-6;
  if (f.cutLengthMm !== null) t.cutLengthM += f.cutLengthMm * 1e-3;
  if (f.pierces !== null) t.pierces += f.pierces;
  if (f.markingLengthMm !== null) t.markingLengthM += f.markingLengthMm * 1e-3;
  if (f.massKg !== null) {
    t.netMassKg += f.massKg;
    t.netMassErrorKg += f.massErrorKg ?? 0;
    t.blankMassKg += f.blankMassKg ?? 0;
  } else {
    t.partsWithoutMass++;
  }
}

function addCost(t: CostTotals, l: BatchLine): void {
  const c = l.cost;
  if (!isPriced(c)) { t.partsNotPriced++; return; }
  const n = l.row.quantity;
  t.partsPriced++;
  t.cuttingMin += n * c.partTimeMin;
  t.setupMin += c.setupMin;
  t.machineCost += n * c.machineCost;
  t.materialCost += n * c.materialCost;
  t.setupCost += c.setupCost;
  t.totalCost += c.lineCost;
}

/** Adds rows in the order given (job order: the sums come out the same for any number of workers). */
export class SummaryBuilder {
  private s: BatchSummary;
  private files = new Set<number>();
  private groups = new Map<string, GroupTotals>();
  private cost: CostTotals | null;
  constructor(jobs: number, private readonly rates?: ShopRates) {
    this.s = {
      rows: 0, ...emptyTotals(), partsMeasured: 0, partsFailed: 0, verdicts: { pass: 0, fail: 0, inconclusive: 0, none: 0 },
      byMaterialAndThickness: [], jobs, seconds: 0, partsPerSecond: 0, caution: BATCH_CAUTION,
    };
    this.cost = rates ? emptyCost() : null;
  }
  add(l: BatchLine): void {
    const s = this.s;
    const r = l.row;
    this.files.add(r.row);
    s.parts++;
    if (r.status !== 'ok') { s.partsFailed++; return; }
    s.partsMeasured++;
    addTo(s, l);
    const t = l.figures.thicknessMm;
    const key = `${r.material ?? (r.density !== null ? `density ${r.density}` : 'none')}|${t ?? 'none'}`;
    let g = this.groups.get(key);
    if (!g) {
      g = { material: r.material, density: r.density, thicknessMm: t, ...emptyTotals(), ...(this.cost ? { cost: emptyCost() } : {}) };
      this.groups.set(key, g);
    }
    g.parts++;
    addTo(g, l);
    if (this.cost) { addCost(this.cost, l); addCost(g.cost!, l); }
    s.verdicts[r.verdict ?? 'none']++;
  }
  finish(seconds: number): BatchSummary {
    this.s.rows = this.files.size;
    this.s.seconds = seconds;
    this.s.partsPerSecond = seconds > 0 ? this.s.parts / seconds : 0;
    const out: BatchSummary = { ...this.s, verdicts: { ...this.s.verdicts }, byMaterialAndThickness: [...this.groups.values()].map((g) => ({ ...g })) };
    if (this.rates && this.cost) out.rates = { file: this.rates.label, currency: this.rates.currency, assumptions: [...COST_ASSUMPTIONS], ...this.cost };
    return out;
  }
}

function groupName(g: GroupTotals): string {
  return g.material ?? (g.density !== null ? `${formatNumber(g.density, 6)} kg/m³` : 'no material');
}

function thicknessName(g: GroupTotals): string {
  return g.thicknessMm === null ? (g.material === null && g.density === null ? '—' : 'varies') : `${formatNumber(g.thicknessMm, 6)} mm`;
}

/** A plain table: the first column left-aligned, the others right-aligned, two spaces between. */
function table(rows: string[][]): string[] {
  const w = rows[0].map((_, k) => Math.max(...rows.map((r) => r[k].length)));
  return rows.map((r) => r.map((c, k) => (k === 0 ? c.padEnd(w[k]) : c.padStart(w[k]))).join('  ').trimEnd());
}

const fixed = (v: number, d: number) => v.toFixed(d);

/** Words of `text` in lines of at most `width` characters (a longer word stands alone). */
function wrap(text: string, width: number): string[] {
  const out: string[] = [];
  let line = '';
  for (const w of text.split(' ')) {
    if (line !== '' && line.length + 1 + w.length > width) { out.push(line); line = w; } else line = line === '' ? w : `${line} ${w}`;
  }
  if (line !== '') out.push(line);
  return out;
}

export function summaryText(s: BatchSummary): string {
  const lines = [
    `batch: ${s.rows} file${s.rows === 1 ? '' : 's'}, ${s.parts} part${s.parts === 1 ? '' : 's'}: ${s.partsMeasured} measured, ${s.partsFailed} failed; ${s.pieces} piece${s.pieces === 1 ? '' : 's'} in all`,
  ];
  if (s.byMaterialAndThickness.length > 0) {
    lines.push('totals by material and thickness (× quantity):');
    const mass = (t: BatchTotals, v: number) => (t.pieces > 0 && (t === s ? s.partsMeasured : t.parts) > t.partsWithoutMass ? formatNumber(v, 6) : '—');
    const row = (name: string, th: string, t: BatchTotals) => [name, th, String(t.pieces), mass(t, t.netMassKg), mass(t, t.blankMassKg),
      formatNumber(t.cutLengthM, 6), String(t.pierces), formatNumber(t.markingLengthM, 6), formatNumber(t.areaM2, 6)];
    lines.push(...table([
      ['material', 'thickness', 'pieces', 'net kg', 'blank kg', 'cut m', 'pierces', 'marking m', 'area m²'],
      ...s.byMaterialAndThickness.map((g) => row(groupName(g), thicknessName(g), g)),
      row('all', '', s),
    ]).map((l) => '  ' + l));
  }
  lines.push(
    `totals (× quantity): cut length ${formatNumber(s.cutLengthM, 6)} m, pierces ${s.pierces}, marking ${formatNumber(s.markingLengthM, 6)} m, area ${formatNumber(s.areaM2, 6)} m²`,
    '  ' + (s.partsMeasured - s.partsWithoutMass > 0
      ? `net mass ${formatNumber(s.netMassKg, 6)} kg ± ${formatError(s.netMassErrorKg)}, blank mass ${formatNumber(s.blankMassKg, 6)} kg`
      : 'no masses (give a thickness and a material or density)') +
      (s.partsWithoutMass > 0 && s.partsMeasured > s.partsWithoutMass ? ` (${s.partsWithoutMass} measured part${s.partsWithoutMass === 1 ? '' : 's'} without a mass, not in it)` : ''),
  );
  if (s.rates) {
    const r = s.rates;
    const cur = terminalText(r.currency);
    lines.push(`cost under the shop rates of ${terminalText(r.file)} (${cur}; the tool computes, the shop decides):`);
    const row = (name: string, th: string, c: CostTotals) => [name, th, String(c.partsPriced), fixed(c.cuttingMin, 1), fixed(c.setupMin, 1),
      fixed(c.machineCost, 2), fixed(c.materialCost, 2), fixed(c.setupCost, 2), fixed(c.totalCost, 2)];
    lines.push(...table([
      ['material', 'thickness', 'parts', 'cut min', 'setup min', 'machine', 'material', 'setup', 'total'],
      ...s.byMaterialAndThickness.map((g) => row(groupName(g), thicknessName(g), g.cost!)),
      row('all', '', r),
    ]).map((l) => '  ' + l));
    if (r.partsNotPriced > 0) lines.push(`  ${r.partsNotPriced} measured part${r.partsNotPriced === 1 ? '' : 's'} not priced (see the rows' warnings), not in the cost`);
    lines.push('  money rounded to 0.01 and minutes to 0.1 here; the rows and the summary file carry every digit.', '  Assumptions:');
    for (const a of r.assumptions) lines.push(...wrap(a, 94).map((l, k) => (k === 0 ? '  - ' : '    ') + l));
  }
  lines.push(
    `verdicts: ${s.verdicts.pass} pass, ${s.verdicts.fail} fail, ${s.verdicts.inconclusive} inconclusive, ${s.verdicts.none} with nothing stated`,
    `${s.jobs} worker${s.jobs === 1 ? '' : 's'}, ${s.seconds.toFixed(2)} s, ${formatNumber(s.partsPerSecond, 4)} parts/s`,
    ...wrap(s.caution, 100),
  );
  return lines.join('\n') + '\n';
}
