/**
 * Writers for a comparison (src/qa/verdict.ts): a table for people, JSON and CSV for programs.
 *
 * Table columns: quantity, stated (as written, with its unit), computed (in the part's units) with our
 * estimate, difference (computed − stated, in the computed unit), tolerance (absolute, same unit, and where
 * it came from), verdict. CSV: one record per stated value, numbers written to round-trip (RFC 4180).
 */
import { formatCsv } from '../base/csv.js';
import { formatError, formatNumber } from './text.js';
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

const VERDICT_WORD = { pass: 'pass', fail: 'FAIL', inconclusive: 'inconclusive' } as const;

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
    r.computed === null ? '—' : `${withUnit(formatNumber(r.computed), r.unit)} ± ${formatError(r.error ?? NaN)}`,
    r.difference === null ? '—' : withUnit(formatNumber(r.difference, 4), r.unit),
    `${withUnit(formatNumber(r.tolerance, 4), r.unit)} (${r.toleranceSource === 'default' ? r.toleranceText : 'stated: ' + r.toleranceText})`,
    VERDICT_WORD[r.verdict] + (r.note ? ` (${r.note})` : ''),
  ]);
  const titles = ['quantity', 'stated', 'computed ± estimate', 'difference', 'tolerance', 'verdict'];
  const widths = titles.map((t, k) => Math.max(t.length, ...table.map((row) => row[k].length)));
  const line = (cells: string[]) => cells.map((s, k) => (k === 0 || k === 5 ? s.padEnd(widths[k]) : s.padStart(widths[k]))).join('  ').trimEnd();
  const lines = [...head, '', line(titles), ...table.map(line), ''];
  const n = c.counts;
  lines.push(`verdict: ${VERDICT_WORD[c.verdict]} — ${n.pass} pass, ${n.fail} fail, ${n.inconclusive} inconclusive`);
  lines.push('rule: pass when |difference| + estimate ≤ tolerance; fail when |difference| − estimate > tolerance; otherwise inconclusive');
  lines.push('', c.caution);
  for (const x of meta.cautions ?? []) lines.push(x);
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
    })),
    caution: c.caution,
    cautions: meta.cautions ?? [],
  };
}

export const COMPARISON_CSV_HEADER = [
  'quantity', 'stated', 'statedUnit', 'statedConverted', 'unit', 'computed', 'error', 'difference',
  'tolerance', 'toleranceSource', 'toleranceText', 'verdict', 'note',
] as const;

export function comparisonCsv(c: Comparison): string {
  return formatCsv([
    [...COMPARISON_CSV_HEADER],
    ...c.rows.map((r) => [
      r.quantity, r.statedAsWritten, r.statedUnit, r.stated, r.unit, r.computed, r.error, r.difference,
      r.tolerance, r.toleranceSource, r.toleranceText, r.verdict, r.note ?? '',
    ]),
  ], { neutralise: true });
}
