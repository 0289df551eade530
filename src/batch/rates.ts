/**
 * Shop rates for `batch`: a small CSV file of our own, one row per material and thickness, from which the
 * batch works out a cutting time and a cost per part, per line and in total. The tool computes; the shop
 * decides: every figure is a plain product of the rates given, and the assumptions are printed with them.
 *
 * Format (RFC 4180, or the spreadsheet-locale dialect with semicolons and decimal commas; header required;
 * each heading carries its unit in brackets, as every CSV platewise writes does; units are never assumed):
 *
 *   material             material name, resolved through the materials table (its aliases and designations
 *                        work: S355J2+N is steel), so a rate applies to every part of that material
 *   thickness [mm]       plate thickness; unit mm, cm, m or in
 *   cuttingSpeed [mm/min]  feed along the cut; unit mm/min, m/min, mm/s or in/min; more than zero
 *   pierceTime [s]       time for one pierce; unit s; zero or more
 *   machineRate [EUR/h]  money per machine hour; any currency label before "/h" (EUR, USD, CHF, £ …)
 *   materialPrice [EUR/kg]  money per kg of material; the same currency label as machineRate, before "/kg"
 *   setupTime [min]      time charged once per line (a row of results: one part of a manifest row or of a
 *                        folder's file); unit min, s or h
 *   note                 optional free text (where the figure came from)
 *
 * One row per material and thickness (a second row for the same pair is refused, naming both lines).
 * Errors name the file, line and column.
 */
import { InputError } from '../base/errors.js';
import { type CsvDialect, RFC_4180, csvWhere, decimalCommaCell, otherSeparator, otherSeparatorError, parseCsvRecords, parseCsvRows } from '../base/csv.js';
import { suggestKey } from '../qa/reference.js';
import type { MaterialTable } from '../model/materials.js';
import { lookupMaterial } from '../model/plate.js';

export interface ShopRate {
  /** Material id after resolution through the materials table. */
  material: string;
  /** As written in the file. */
  materialText: string;
  thicknessMm: number;
  cuttingSpeedMmPerMin: number;
  pierceTimeS: number;
  machineRatePerH: number;
  materialPricePerKg: number;
  setupTimeMin: number;
  note: string | null;
  /** "rates.csv:line 3": where the row is. */
  where: string;
}

export interface ShopRates {
  label: string;
  /** The currency label the file gives in its headings ("EUR"). */
  currency: string;
  rates: ShopRate[];
}

/** Slowest cutting speed accepted (mm/min): keeps every time finite. */
const MIN_SPEED_MM_PER_MIN = 0.001;

/** Thicknesses closer than this (relative) are the same thickness: 3/8 in and 9.525 mm meet. */
const SAME_THICKNESS = 1e-9;

const COLUMNS = ['material', 'thickness', 'cuttingSpeed', 'pierceTime', 'machineRate', 'materialPrice', 'setupTime', 'note'] as const;
type Column = (typeof COLUMNS)[number];

const UNITS: Record<Exclude<Column, 'material' | 'note' | 'machineRate' | 'materialPrice'>, Record<string, number>> = {
  thickness: { mm: 1, cm: 10, m: 1000, in: 25.4 },
  cuttingSpeed: { 'mm/min': 1, 'm/min': 1000, 'mm/s': 60, 'in/min': 25.4 },
  pierceTime: { s: 1 },
  setupTime: { min: 1, s: 1 / 60, h: 60 },
};

export const RATE_FILE_EXAMPLE = 'material,thickness [mm],cuttingSpeed [mm/min],pierceTime [s],machineRate [EUR/h],materialPrice [EUR/kg],setupTime [min],note';

function unitList(c: keyof typeof UNITS): string {
  return Object.keys(UNITS[c]).join(', ');
}

/** Read a shop-rates file; `materials` resolves names the same way as everywhere else. */
export function parseRates(text: string, label: string, options: { materials?: MaterialTable; dialect?: CsvDialect; dialectSwitch?: { toSemicolons: string; toCommas: string } } = {}): ShopRates {
  const dialect = options.dialect ?? RFC_4180;
  if (otherSeparator(text, dialect.separator)) throw otherSeparatorError(label, dialect.separator, 'a rates file', options.dialectSwitch);
  const t = parseCsvRecords(text, label, { separator: dialect.separator });
  const head = parseCsvRows(text, label, dialect.separator).find((r) => !(r.fields.length === 1 && r.fields[0] === ''))!;
  const byName = new Map<Column, { header: string; scale: number }>();
  let currency: string | null = null;
  let currencyAt = '';
  t.header.forEach((h, k) => {
    const at = csvWhere(label, head.starts[k][0], head.starts[k][1]);
    const m = /^(.*?)\s*(?:\[([^\]]*)\])?$/.exec(h)!;
    const name = m[1];
    const unit = m[2]?.trim();
    if (!(COLUMNS as readonly string[]).includes(name)) {
      const best = suggestKey(name, COLUMNS);
      const hint = best ? `; did you mean "${best}"?` : '';
      throw new InputError(at, `unknown column "${h}"${hint}; expected ${COLUMNS.join(', ')} (the numbers with their unit in brackets, such as "thickness [mm]")`);
    }
    const c = name as Column;
    if (byName.has(c)) throw new InputError(at, `column "${c}" appears twice; expected each column once`);
    if (c === 'material' || c === 'note') {
      if (unit !== undefined) throw new InputError(at, `column "${h}" takes no unit`);
      byName.set(c, { header: h, scale: 1 });
      return;
    }
    if (unit === undefined || unit === '') {
      const example = c === 'machineRate' ? 'EUR/h' : c === 'materialPrice' ? 'EUR/kg' : Object.keys(UNITS[c])[0];
      throw new InputError(at, `column "${h}" needs its unit in brackets, such as "${c} [${example}]"; units are never assumed`);
    }
    if (c === 'machineRate' || c === 'materialPrice') {
      const per = c === 'machineRate' ? 'h' : 'kg';
      const mm = new RegExp(`^(.{1,12}?)\\s*/\\s*${per}$`).exec(unit);
      if (!mm || /[\d\s]/.test(mm[1])) throw new InputError(at, `column "${h}": expected money per ${per === 'h' ? 'machine hour' : 'kilogram'} as "<currency>/${per}", such as "${c} [EUR/${per}]"`);
      if (currency !== null && currency !== mm[1]) throw new InputError(at, `column "${h}" is in ${mm[1]}, but ${currencyAt} is in ${currency}; expected one currency (no currency is converted)`);
      currency = mm[1];
      currencyAt = `column "${h}"`;
      byName.set(c, { header: h, scale: 1 });
      return;
    }
    const scale = UNITS[c][unit];
    if (scale === undefined) throw new InputError(at, `column "${h}": unknown unit "${unit}"; expected ${unitList(c)}`);
    byName.set(c, { header: h, scale });
  });
  for (const c of COLUMNS) {
    if (c === 'note' || byName.has(c)) continue;
    throw new InputError(csvWhere(label, head.line, 1), `expected a column "${c}"; a rates file has the columns ${RATE_FILE_EXAMPLE} (note optional)`);
  }
  if (t.records.length === 0) throw new InputError(label, 'expected at least one rate row below the header');

  const rates: ShopRate[] = t.records.map((rec, i) => {
    const loc = t.locations[i];
    const at = (c: Column) => csvWhere(label, loc.fields[byName.get(c)!.header][0], loc.fields[byName.get(c)!.header][1]);
    const raw = (c: Column) => rec[byName.get(c)!.header].trim();
    const number = (c: Exclude<Column, 'material' | 'note'>, positive: boolean): number => {
      const text = raw(c);
      const plain = dialect.decimalComma ? decimalCommaCell(text, at(c)) : text;
      if (text === '') throw new InputError(at(c), `expected a number for ${c}, got an empty cell`);
      if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(plain)) throw new InputError(at(c), `expected a plain number for ${c} (the unit is in the heading, "${byName.get(c)!.header}"), got "${text.length > 40 ? text.slice(0, 40) + '…' : text}"`);
      const v = Number(plain) * byName.get(c)!.scale;
      if (!Number.isFinite(v) || v > 1e12) throw new InputError(at(c), `${c} ${text} is beyond the range of a shop rate`);
      if (positive ? !(v > 0) : !(v >= 0)) throw new InputError(at(c), `expected ${c} ${positive ? 'more than zero' : 'of zero or more'}, got ${text}`);
      // a speed of 1e-300 would make every time infinite: far below any machine, refused
      if (c === 'cuttingSpeed' && v < MIN_SPEED_MM_PER_MIN) throw new InputError(at(c), `a cutting speed of ${text} ${byName.get(c)!.header.replace(/^.*\[|\]$/g, '')} is below ${MIN_SPEED_MM_PER_MIN} mm/min; expected the machine's speed`);
      return v;
    };
    const materialText = raw('material');
    if (materialText === '') throw new InputError(at('material'), 'expected a material name, got an empty cell');
    const material = lookupMaterial({ text: materialText, where: at('material') }, options.materials).id;
    const note = byName.has('note') ? raw('note') : '';
    return {
      material, materialText,
      thicknessMm: number('thickness', true),
      cuttingSpeedMmPerMin: number('cuttingSpeed', true),
      pierceTimeS: number('pierceTime', false),
      machineRatePerH: number('machineRate', false),
      materialPricePerKg: number('materialPrice', false),
      setupTimeMin: number('setupTime', false),
      note: note === '' ? null : note,
      where: `${label}:line ${loc.line}`,
    };
  });
  rates.forEach((r, i) => {
    const twin = rates.slice(0, i).find((q) => q.material === r.material && sameThickness(q.thicknessMm, r.thicknessMm));
    if (twin) throw new InputError(r.where, `a second rate for ${r.material} ${r.thicknessMm} mm (the first is at ${twin.where}); expected one row per material and thickness`);
  });
  return { label, currency: currency!, rates };
}

function sameThickness(a: number, b: number): boolean {
  return Math.abs(a - b) <= SAME_THICKNESS * Math.max(a, b);
}

/** The rate for a material id and a thickness in mm, if the file has one. */
export function findRate(rates: ShopRates, material: string, thicknessMm: number): ShopRate | undefined {
  return rates.rates.find((r) => r.material === material && sameThickness(r.thicknessMm, thicknessMm));
}
