/**
 * Writers for measured results: a plain-text table for people and a stable JSON shape for programs.
 */
import type { SectionResult } from '../analysis/measure.js';
import { GEOMETRY_CAUTION } from './cautions.js';
import { warningJson, warningText } from './words.js';
import { type Quantity, SECTION_QUANTITIES, quantityInfo, unitText } from '../properties/quantities.js';

export { formatError, formatNumber, formatValue } from './numbers.js';
import { formatError, formatValue } from './numbers.js';

export interface QuantityRow { key: string; value: string; error: string; unit: string; }

export function quantityRows(q: Record<string, Quantity>, lengthUnit: string, massUnit = 'kg'): QuantityRow[] {
  const rows: QuantityRow[] = [];
  for (const [key, v] of Object.entries(q)) {
    const info = quantityInfo(key);
    rows.push({ key, value: formatValue(v.value, v.error), error: formatError(v.error), unit: info ? unitText(info.dimension, lengthUnit, massUnit) : '' });
  }
  return rows;
}

export function renderRows(rows: QuantityRow[]): string {
  const w0 = Math.max(8, ...rows.map((r) => r.key.length));
  const w1 = Math.max(5, ...rows.map((r) => r.value.length));
  const w2 = Math.max(8, ...rows.map((r) => r.error.length));
  const lines = [`${'quantity'.padEnd(w0)}  ${'value'.padStart(w1)}  ${'± estimate'.padStart(w2 + 2)}  unit`];
  for (const r of rows) lines.push(`${r.key.padEnd(w0)}  ${r.value.padStart(w1)}  ± ${r.error.padStart(w2)}  ${r.unit}`);
  return lines.join('\n');
}

export function sectionText(r: SectionResult, withCaution = true): string {
  const regions = r.geometry.part.regions;
  const holes = regions.reduce((n, g) => n + g.holes.length, 0);
  const head = `${r.part} — lengths in ${r.units}; ${regions.length} region${regions.length === 1 ? '' : 's'}, ${holes} cut-out${holes === 1 ? '' : 's'}`;
  const ordered: Record<string, Quantity> = {};
  for (const i of SECTION_QUANTITIES) ordered[i.key] = (r.quantities as Record<string, Quantity>)[i.key];
  const m = r.method;
  const method = m.path === 'boundary'
    ? `method: exact boundary integrals (Green's theorem; closed forms on lines and arcs, exact Gauss–Legendre on Béziers) over ${m.vertices} segments; estimate = round-off allowance (use --method mesh for the mesh)`
    : `method: Dunavant degree ${m.degree} (${m.rulePoints} points) on curved triangles; ${m.baseTriangles} triangles ` +
      `(${m.curvedTriangles} curved) refined ${m.refinementLevels}× to ${m.triangles}; estimate = |refined − coarse| + round-off allowance`;
  const parts = [head, '', renderRows(quantityRows(ordered, r.units)), '', method];
  for (const w of r.warnings) parts.push(`warning: ${warningText(w)}`);
  if (withCaution) parts.push('', GEOMETRY_CAUTION);
  return parts.join('\n') + '\n';
}

export function sectionJson(r: SectionResult): Record<string, unknown> {
  const q: Record<string, Quantity> = {};
  for (const i of SECTION_QUANTITIES) {
    const v = (r.quantities as Record<string, Quantity>)[i.key];
    q[i.key] = { value: v.value, error: v.error };
  }
  return {
    part: r.part,
    units: { length: r.units, angle: 'deg' },
    quantities: q,
    method: { ...r.method },
    warnings: r.warnings.map(warningJson),
    caution: GEOMETRY_CAUTION,
  };
}
