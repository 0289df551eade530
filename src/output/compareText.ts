/**
 * Writers for a comparison (src/qa/verdict.ts): a table for people, JSON and CSV for programs.
 *
 * Table columns: quantity, stated (as written, with its unit), computed (in the part's units) with our
 * estimate, difference (computed − stated, in the computed unit), tolerance (absolute, same unit, and where
 * it came from), verdict. CSV: one record per stated value, numbers written to round-trip (RFC 4180).
 */
import { type CsvDialect, RFC_4180, formatCsv } from '../base/csv.js';
import { formatError, formatNumber, formatValue } from './text.js';
import type { Comparison, ComparisonRow } from '../qa/verdict.js';

export interface ComparisonMeta {
  /** Part file and part name. */
  file: string;
  part: string;
  reference: string;
  lengthUnit: string;
  /** Plate settings used, if any (shown so a mass verdict can be traced). */
  plate?: { thickness?: number; density?: number; material?: string; densitySource?: string };
  /** Cautions beyond the comparison's own (mass). */
  cautions?: string[];
}

function statedText(r: ComparisonRow): string {
  return `${formatNumber(r.statedAsWritten)}${r.statedUnit ? ' ' + r.statedUnit : ''}`;
}

function withUnit(v: string, unit: string): string {
  return unit ? `${v} ${unit}` : v;
}

/** Marks in the tolerance column: default tolerances and those taken from the stated digits, keyed under the table. */
const TOLERANCE_MARK = { reference: '', default: ' *', digits: ' †' } as const;

const VERDICT_WORD = { pass: 'pass', fail: 'FAIL', inconclusive: 'inconclusive' } as const;

const SLIP_UNITS: Record<number, string> = { 1: 'in for mm', 2: 'in² for mm²', 3: 'in³ for mm³', 4: 'in⁴ for mm⁴' };

/** Words for a row's hint, its reference note, and what would decide an inconclusive row. */
export function rowAdvice(r: ComparisonRow, withReferenceNote = true): string[] {
  const out: string[] = [];
  if (r.note) out.push(r.note);
  if (r.statedNote && withReferenceNote) out.push(`the reference notes: "${r.statedNote}"`);
  const h = r.hint;
  if (h?.code === 'opposite-sign') out.push('the stated value is the computed one with the opposite sign: the reference may use the other sign convention for the product of inertia');
  else if (h?.code === 'other-principal-axis') out.push('the stated angle differs by a right angle: it may be the angle of the other principal axis (I2)');
  else if (h?.code === 'unit-slip') {
    const what = h.base === 25.4 ? `a factor 25.4${Math.abs(h.power) === 1 ? '' : `^${Math.abs(h.power)}`} (${SLIP_UNITS[Math.abs(h.power)] ?? 'inches for millimetres'}${h.power < 0 ? ', or the other way round' : ''})` : `a factor 10^${h.power}`;
    out.push(`stated = computed × ${formatNumber(h.factor, 6)}: ${what} — a unit slip in the reference or the drawing?`);
  } else if (h?.code === 'thickness-slip') {
    out.push(`the stated value fits a plate ${formatNumber(h.thickness, 6)} ${h.unit} thick (computed with ${formatNumber(h.used, 6)} ${h.unit}): a thickness slip, or another density?`);
  }
  if (r.verdict === 'inconclusive' && r.computed !== null) {
    out.push(r.note === 'the computed error is an estimate, not a bound'
      ? 'cannot be decided here: the ± of this value is an estimate, not a bound (see the method notes)'
      : `our estimate (± ${formatError(r.error ?? NaN)}) is too large to decide against the tolerance: raise --degree or --levels (or, for mass values, give --tolerance), or widen the tolerance if the drawing allows`);
  } else if (r.verdict === 'inconclusive' && r.computed === null && !r.note?.startsWith('not computed:')) {
    out.push('not computed in this run: give what it needs (a thickness and a material for mass values)');
  }
  return out;
}

/** Word-wrap a line at `width` columns; continuation lines start with `indent`. */
function wrap(text: string, width: number, indent = ''): string[] {
  const out: string[] = [];
  let line = '';
  for (const w of text.split(' ')) {
    if (line !== '' && line.length + 1 + w.length > width) { out.push(line); line = indent + w; } else line = line === '' ? w : `${line} ${w}`;
  }
  if (line !== '') out.push(line);
  return out;
}

export function comparisonText(c: Comparison, meta: ComparisonMeta): string {
  const head = [
    `${meta.part} (${meta.file}) against ${meta.reference} — computed values in ${meta.lengthUnit}, degrees, kg`,
  ];
  if (meta.plate && (meta.plate.thickness !== undefined || meta.plate.density !== undefined)) {
    const p = meta.plate;
    head.push(`plate: thickness ${p.thickness !== undefined ? formatNumber(p.thickness) + ' ' + meta.lengthUnit : 'not given'}, ` +
      `density ${p.density !== undefined ? formatNumber(p.density) + ' kg/m³' : 'not given'}${p.densitySource ? ` (${p.densitySource})` : ''}`);
  }
  const table = c.rows.map((r) => [
    r.quantity,
    statedText(r),
    r.computed === null ? '—' : `${withUnit(formatValue(r.computed, r.error ?? NaN), r.unit)} ± ${formatError(r.error ?? NaN)}`,
    r.difference === null ? '—' : formatNumber(r.difference, 4),
    `${formatNumber(r.tolerance, 4)}${TOLERANCE_MARK[r.toleranceSource]}`,
    VERDICT_WORD[r.verdict],
  ]);
  // difference and tolerance are in the computed value's unit; defaults are listed once under the table
  const defaults = [...new Set(c.rows.filter((r) => r.toleranceSource === 'default').map((r) => `${r.quantity} ${r.toleranceText.replace(/^default: /, '')}`))];
  const titles = ['quantity', 'stated', 'computed ± estimate', 'difference', 'tolerance', 'verdict'];
  const widths = titles.map((t, k) => Math.max(t.length, ...table.map((row) => row[k].length)));
  const line = (cells: string[]) => cells.map((s, k) => (k === 0 || k === 5 ? s.padEnd(widths[k]) : s.padStart(widths[k]))).join('  ').trimEnd();
  const lines = [...head.flatMap((h) => wrap(h, 100, '  ')), '', line(titles), ...table.map(line)];
  const fromDigits = c.rows.some((r) => r.toleranceSource === 'digits')
    ? '; † tolerance from the stated digits: half a unit in the last digit written, converted' : '';
  lines.push(...wrap(`difference and tolerance in the computed value's unit${defaults.length ? `; * default tolerance: ${defaults.join(', ')}` : ''}${fromDigits}`, 100, '  '), '');
  const advice = c.rows.flatMap((r) => rowAdvice(r).map((a) => `${r.quantity}: ${a}`));
  for (const a of advice) lines.push(...wrap(a, 100, '  '));
  if (advice.length > 0) lines.push('');
  const n = c.counts;
  lines.push(`verdict: ${VERDICT_WORD[c.verdict]} — ${n.pass} pass, ${n.fail} fail, ${n.inconclusive} inconclusive`);
  lines.push(...wrap('rule: pass when |difference| + estimate ≤ tolerance; fail when |difference| − estimate > tolerance; otherwise inconclusive', 100, '  '));
  lines.push('', ...wrap(c.caution, 100));
  for (const x of meta.cautions ?? []) lines.push(...wrap(x, 100));
  return lines.join('\n') + '\n';
}

export function comparisonJson(c: Comparison, meta: ComparisonMeta): Record<string, unknown> {
  return {
    file: meta.file,
    part: meta.part,
    reference: meta.reference,
    units: { length: meta.lengthUnit, angle: 'deg', mass: 'kg' },
    plate: meta.plate ?? null,
    verdict: c.verdict,
    counts: c.counts,
    rows: c.rows.map((r) => ({
      quantity: r.quantity,
      stated: r.statedAsWritten,
      statedUnit: r.statedUnit,
      statedConverted: r.stated,
      unit: r.unit,
      computed: r.computed,
      error: r.error,
      difference: r.difference,
      tolerance: r.tolerance,
      toleranceText: r.toleranceText,
      toleranceSource: r.toleranceSource,
      verdict: r.verdict,
      ...(r.note ? { note: r.note } : {}),
      ...(r.statedNote !== undefined ? { referenceNote: r.statedNote } : {}),
      ...(r.hint ? { hint: { ...r.hint } } : {}),
      advice: rowAdvice(r),
    })),
    caution: c.caution,
    cautions: meta.cautions ?? [],
  };
}

/**
 * Units in the headings as in every CSV platewise writes (src/output/batchRows.ts): each row is another
 * quantity, so a heading's brackets name the column that holds the row's unit: `computed [unit]` is in the
 * unit of the `unit` column, `stated [statedUnit]` in that of `statedUnit`.
 */
export const COMPARISON_CSV_HEADER = [
  'quantity', 'stated [statedUnit]', 'statedUnit', 'statedConverted [unit]', 'unit', 'computed [unit]', 'error [unit]', 'difference [unit]',
  'tolerance [unit]', 'toleranceSource', 'toleranceText', 'verdict', 'note', 'referenceNote', 'advice',
] as const;

export function comparisonCsv(c: Comparison, dialect: CsvDialect = RFC_4180): string {
  return formatCsv([
    [...COMPARISON_CSV_HEADER],
    ...c.rows.map((r) => [
      r.quantity, r.statedAsWritten, r.statedUnit, r.stated, r.unit, r.computed, r.error, r.difference,
      r.tolerance, r.toleranceSource, r.toleranceText, r.verdict, r.note ?? '', r.statedNote ?? '', rowAdvice(r, false).join('; '),
    ]),
  ], { neutralise: true, dialect });
}
