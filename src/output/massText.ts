/**
 * Writers for mass properties (measure with thickness and density) and for user integrals (integrate):
 * a plain-text table for people and a stable JSON shape for programs. Kept apart from output.ts, which
 * owns the area-property writers.
 *
 * JSON keys (stable): mass, weight, massCentreX, massCentreY, massCentreZ, massMomentX, massMomentY,
 * massMomentZ, massProductXY, massProductXZ, massProductYZ — each { value, error } in the units named in
 * "units" (mass: kg | g | lb; weight: N; centres: the part's length unit; moments: kg·m² | lb·in² | …).
 */
import type { ExpressionResult, MassResult } from '../analysis/plate.js';
import { isCap } from '../quadrature/stop.js';
import { notBoundText, stopText } from './stopText.js';
import { GEOMETRY_CAUTION, MASS_CAUTION } from './cautions.js';
import { type MassMomentUnit, type MassUnit, massFromKg, massMomentFromSI } from '../model/massUnits.js';
import { MASS_QUANTITIES, type MassKey } from '../properties/mass.js';
import type { Quantity } from '../properties/quantities.js';
import { densityText, integralWarningText } from './words.js';
import { type QuantityRow, formatError, formatNumber, formatValue, renderRows } from './text.js';

/** Where the mesh of an integral was limited to (src/analysis/localize.ts), in words. */
function meshedBoxText(b: readonly number[], unit: string): string {
  const n = (v: number) => formatNumber(v, 6);
  return `; meshed only within x ${n(b[0])} to ${n(b[2])}, y ${n(b[1])} to ${n(b[3])} ${unit}, where interval arithmetic could not show the integrand negligible (its bound elsewhere is in the ±)`;
}

export interface MassUnits {
  mass: MassUnit;
  inertia: MassMomentUnit;
}

function convert(key: MassKey, q: Quantity, u: MassUnits): Quantity {
  const info = MASS_QUANTITIES.find((i) => i.key === key)!;
  switch (info.dimension) {
    case 'mass': return { ...q, value: massFromKg(q.value, u.mass), error: massFromKg(q.error, u.mass) };
    case 'massMoment': return { ...q, value: massMomentFromSI(q.value, u.inertia), error: massMomentFromSI(q.error, u.inertia) };
    default: return { ...q };
  }
}

function unitOf(key: MassKey, length: string, u: MassUnits): string {
  const d = MASS_QUANTITIES.find((i) => i.key === key)!.dimension;
  return d === 'mass' ? u.mass : d === 'massMoment' ? u.inertia : d === 'force' ? 'N' : length;
}

function convertAll(q: Record<MassKey, Quantity>, u: MassUnits): Record<string, Quantity> {
  const out: Record<string, Quantity> = {};
  for (const i of MASS_QUANTITIES) out[i.key] = convert(i.key as MassKey, q[i.key as MassKey], u);
  return out;
}

function rows(q: Record<MassKey, Quantity>, length: string, u: MassUnits): QuantityRow[] {
  return MASS_QUANTITIES.map((i) => {
    const c = convert(i.key as MassKey, q[i.key as MassKey], u);
    return { key: i.key, value: formatValue(c.value, c.error), error: formatError(c.error), unit: unitOf(i.key as MassKey, length, u) };
  });
}

/** The method line of a result integrated exactly from the boundary, `why` saying what made that possible. */
export function boundaryMethodText(why: string): string {
  return `method: ${why}, so exact boundary integrals (Green's theorem, no mesh); estimate = round-off and representation allowance, propagated through each quantity`;
}

/** Plain-text mass report: whole part, then each layer when there are several, method, caution. */
export function massText(r: MassResult, u: MassUnits): string {
  const out: string[] = [];
  out.push(`${r.part} — mass properties (lengths in ${r.units}, density in kg/m³, z up from the first layer's underside)`);
  for (const l of r.layers) out.push(`  ${r.layers.length > 1 ? `layer "${l.name}": ` : ''}thickness ${l.thickness} ${r.units}${r.layers.length > 1 ? `, underside at z = ${formatNumber(l.z0)} ${r.units}` : ''}; density ${densityText(l.densityFrom)}`);
  out.push('', renderRows(rows(r.quantities, r.units, u)));
  if (r.layers.length > 1) {
    for (const l of r.layers) {
      const keys: MassKey[] = ['mass', 'massCentreX', 'massCentreY', 'massCentreZ'];
      out.push('', `layer "${l.name}"`, renderRows(rows(l.quantities, r.units, u).filter((row) => keys.includes(row.key as MassKey))));
    }
  }
  const m = r.method;
  out.push('', m.estimator === 'exact boundary integrals'
    ? boundaryMethodText('thickness and density constant or polynomials in x and y')
    : `method: Dunavant degree ${m.degree} (${m.rulePoints} points) on ${m.triangles} triangles (from ${m.baseTriangles}); ${stopText(m)}; estimate = refinement and companion-rule differences, propagated through each quantity, + round-off allowance`);
  if (!m.errorIsBound) out.push(`note: ${notBoundText(m)}`);
  out.push('', MASS_CAUTION);
  return out.join('\n') + '\n';
}

/** JSON for mass properties (the "massProperties" member of measure --json). */
export function massJson(r: MassResult, u: MassUnits): Record<string, unknown> {
  return {
    units: { mass: u.mass, weight: 'N', length: r.units, massMoment: u.inertia, density: 'kg/m3' },
    quantities: convertAll(r.quantities, u),
    layers: r.layers.map((l) => ({ name: l.name, z: l.z0, thickness: l.thickness, density: densityText(l.densityFrom), material: l.material ?? null, quantities: convertAll(l.quantities, u) })),
    method: { ...r.method },
    caution: MASS_CAUTION,
  };
}

/** The result's warnings, and a stop at a cap in words (the result carries it as a code). */
function warningsOf(r: ExpressionResult): string[] {
  const words = r.warnings.map(integralWarningText);
  return isCap(r.method.stopped) ? [...words, stopText(r.method)] : words;
}

/** Plain-text result of `integrate`. `fUnit` names the unit of f when the user gave one. */
export function integralText(r: ExpressionResult, fUnit?: string): string {
  const f = fUnit ? fUnit : '(unit of f)';
  const L = r.units;
  const rowsOut: QuantityRow[] = [
    { key: '∫ f dA', value: formatValue(r.integral.value, r.integral.error), error: formatError(r.integral.error), unit: `${f}·${L}²` },
    { key: '∫ f·x dA', value: formatValue(r.momentX.value, r.momentX.error), error: formatError(r.momentX.error), unit: `${f}·${L}³` },
    { key: '∫ f·y dA', value: formatValue(r.momentY.value, r.momentY.error), error: formatError(r.momentY.error), unit: `${f}·${L}³` },
  ];
  if (r.pointX && r.pointY) {
    rowsOut.push({ key: 'point of action x', value: formatValue(r.pointX.value, r.pointX.error), error: formatError(r.pointX.error), unit: L });
    rowsOut.push({ key: 'point of action y', value: formatValue(r.pointY.value, r.pointY.error), error: formatError(r.pointY.error), unit: L });
  }
  const m = r.method;
  const out = [
    `${r.part} — f(x, y) = ${r.expression}; x, y in ${L}`, '', renderRows(rowsOut), '',
    m.estimator === 'exact boundary integrals'
      ? boundaryMethodText('a polynomial integrand')
      : `method: Dunavant degree ${m.degree} (${m.rulePoints} points) on ${m.triangles} triangles (from ${m.baseTriangles}); ${stopText(m)}${m.meshedBox ? meshedBoxText(m.meshedBox, L) : ''}`,
  ];
  if (!m.errorIsBound) out.push(`note: ${notBoundText(m)}`);
  for (const w of warningsOf(r)) out.push(`warning: ${w}`);
  out.push('', GEOMETRY_CAUTION);
  return out.join('\n') + '\n';
}

export function integralJson(r: ExpressionResult, fUnit?: string): Record<string, unknown> {
  return {
    part: r.part,
    expression: r.expression,
    units: { length: r.units, f: fUnit ?? null, integral: `${fUnit ?? '(unit of f)'}·${r.units}²`, firstMoment: `${fUnit ?? '(unit of f)'}·${r.units}³` },
    quantities: {
      integral: r.integral, firstMomentX: r.momentX, firstMomentY: r.momentY,
      pointOfActionX: r.pointX, pointOfActionY: r.pointY,
    },
    method: { ...r.method },
    warnings: warningsOf(r),
    caution: GEOMETRY_CAUTION,
  };
}
