/**
 * Words and layout for member-section results (`platewise member`): a table for people and JSON for
 * programs, in a chosen length unit (I in cm⁴ or in⁴, S and Z in cm³ or in³; the input is not changed).
 * Every output carries the geometry caution and, with torsion, the prismatic-member note.
 */
import { type LengthUnit, isLengthUnit, lengthFactor } from '../base/units.js';
import { InputError } from '../base/errors.js';
import type { MemberResult, NetSectionResult } from '../analysis/torsionMember.js';
import type { TorsionFact, TorsionResult } from '../analysis/torsion.js';
import { LENGTH_POWER, type Quantity, quantityInfo, unitText } from '../properties/quantities.js';
import { GEOMETRY_CAUTION, NET_SECTION_NOTE } from './cautions.js';
import { formatError, formatNumber, formatValue } from './numbers.js';

export const PRISMATIC_NOTE =
  'Torsion constant, shear centre and warping constant treat the shape as the cross-section of a long prismatic member ' +
  '(Saint-Venant torsion, linear elastic, isotropic); they say nothing about the plate loaded in its own plane.';

/** A net section's quantities in unit `to` (lengths × f, the area × f²). */
function netQuantities(n: NetSectionResult, from: LengthUnit, to: LengthUnit) {
  const f = lengthFactor(from, to);
  const len = (q: Quantity) => ({ value: q.value * f, error: q.error * f, unit: to as string });
  return {
    length: len(n.length), grossLength: len(n.grossLength), netLength: len(n.netLength), holeLength: len(n.holeLength),
    netArea: n.netArea ? { value: n.netArea.value * f * f, error: n.netArea.error * f * f, unit: `${to}²` } : undefined,
    thickness: n.thickness === undefined ? undefined : { value: n.thickness * f, unit: to as string },
    intervals: n.intervals.map((i) => ({
      from: i.from * f, to: i.to * f, fromError: i.fromError * f, toError: i.toError * f,
      fromPoint: i.fromPoint.map((v) => v * f), toPoint: i.toPoint.map((v) => v * f),
    })),
  };
}

/** A net section as `member --json` writes it (lengths in the print unit). */
export interface NetSectionDoc {
  line: number[][]; where: string; crossings: number;
  length: { value: number; error: number; unit: string }; grossLength: { value: number; error: number; unit: string };
  netLength: { value: number; error: number; unit: string }; holeLength: { value: number; error: number; unit: string };
  netArea?: { value: number; error: number; unit: string }; thickness?: { value: number; unit: string };
  intervals: { from: number; to: number; fromError: number; toError: number; fromPoint: number[]; toPoint: number[] }[];
  startsInMaterial: boolean; endsInMaterial: boolean;
}

function netSectionDoc(n: NetSectionResult, from: LengthUnit, to: LengthUnit): NetSectionDoc {
  const f = lengthFactor(from, to);
  return {
    line: n.points.map((p) => p.map((v) => v * f)), where: n.where, crossings: n.crossings,
    ...netQuantities(n, from, to), startsInMaterial: n.startsInMaterial, endsInMaterial: n.endsInMaterial,
  };
}

/**
 * A net section in words, from its JSON form (unit `to`): the heading, the figure rows with what each means, the
 * runs of material along the line and a note when the line starts or ends inside the material. `member`'s table
 * and the page both say it this way.
 */
export function netSectionWords(q: NetSectionDoc, to: string): {
  heading: string; rows: { key: string; value: number; error: number; unit: string; what: string }[]; noArea?: string; runsHeading: string; runs: string[]; note?: string;
} {
  const pt = ([x, y]: readonly number[]) => `(${formatNumber(x)}, ${formatNumber(y)})`;
  const rows = [
    { key: 'length', ...q.length, what: 'the line itself' },
    { key: 'grossLength', ...q.grossLength, what: 'inside the outline, holes counted as material' },
    { key: 'netLength', ...q.netLength, what: 'through material' },
    { key: 'holeLength', ...q.holeLength, what: 'gross − net: taken by holes' },
    ...(q.netArea ? [{ key: 'netArea', ...q.netArea, what: `netLength × thickness ${formatNumber(q.thickness!.value)} ${to}` }] : []),
  ];
  return {
    heading: `net section along ${q.line.map(pt).join(' → ')} (${q.where}; ${q.crossings} boundary crossing${q.crossings === 1 ? '' : 's'})`,
    rows,
    noArea: q.netArea ? undefined : '(no thickness given: no net area)',
    runsHeading: `material along the line, from its first point (${to}):`,
    runs: q.intervals.map((i) => `${formatNumber(i.from)} ± ${formatError(i.fromError)} to ${formatNumber(i.to)} ± ${formatError(i.toError)}: ${pt(i.fromPoint)} → ${pt(i.toPoint)}`),
    note: q.startsInMaterial || q.endsInMaterial
      ? `note: the line ${q.startsInMaterial && q.endsInMaterial ? 'starts and ends' : q.startsInMaterial ? 'starts' : 'ends'} inside the material; lengths count only the line as given`
      : undefined,
  };
}

function netSectionText(n: NetSectionResult, from: LengthUnit, to: LengthUnit, out: string[]): void {
  const w = netSectionWords(netSectionDoc(n, from, to), to);
  out.push(` ${w.heading}`);
  for (const r of w.rows) out.push(`  ${r.key.padEnd(14)} ${formatNumber(r.value).padStart(18)} ± ${formatError(r.error).padEnd(8)} ${r.unit.padEnd(4)} ${r.what}`);
  if (w.noArea) out.push(`  ${w.noArea}`);
  out.push(`  ${w.runsHeading}`);
  for (const line of w.runs) out.push(`   ${line}`);
  if (w.note) out.push(`  ${w.note}`);
}

const SECTION_KEYS = ['area', 'centroidX', 'centroidY', 'Ix', 'Iy', 'Ixy', 'I1', 'I2', 'principalAngle', 'SxTop', 'SxBottom', 'SyRight', 'SyLeft'] as const;
const PLASTIC_KEYS = ['Zx', 'Zy', 'Z1', 'Z2', 'plasticAxisY', 'plasticAxisX', 'plasticAxis1', 'plasticAxis2', 'S1', 'S2', 'fibre1', 'fibre2', 'shapeFactorX', 'shapeFactorY', 'shapeFactor1', 'shapeFactor2'] as const;
const TORSION_KEYS = ['J', 'shearCentreX', 'shearCentreY', 'Iw', 'tauPerTorque', 'tauAtX', 'tauAtY'] as const;

function convert(key: string, q: Quantity, from: LengthUnit, to: LengthUnit): { value: number; error: number; unit: string; errorIsBound?: false } {
  const info = quantityInfo(key)!;
  const p = LENGTH_POWER[info.dimension] ?? 0;
  const f = lengthFactor(from, to) ** p;
  return { value: q.value * f, error: q.error * f, unit: unitText(info.dimension, to), ...(q.errorIsBound === false ? { errorIsBound: false as const } : {}) };
}

export function torsionFactText(f: TorsionFact): string {
  switch (f.code) {
    case 'reentrant-corners':
      return `The section has ${f.count} re-entrant corner${f.count === 1 ? '' : 's'} (largest interior angle ${formatNumber(f.largestAngle, 4)}°): the mesh is graded toward ${f.count === 1 ? 'it' : 'them'} and the estimates of J, the shear centre and Iw rest on the convergence rate there (checked against much finer solves, not proven); the shear stress is infinite at a sharp re-entrant corner, so tauPerTorque is only the value on this mesh, not a bound (a fillet of radius r makes it finite).`;
    case 'solve-not-converged':
      return `The linear solve stopped at relative residual ${formatError(f.residual)} above its target; the torsion values may be less accurate than their estimates say.`;
    case 'upper-bound-violated':
      return `The finer mesh gave a larger torsion constant (${formatNumber(f.fine)}) than the coarser (${formatNumber(f.coarse)}); expected the reverse: treat the torsion estimate with suspicion.`;
    case 'shear-centre-ill-conditioned':
      return `The second-moment matrix is nearly singular (conditioning ${formatError(f.conditioning)}): the shear centre is poorly determined.`;
  }
}

/** Said beside an estimate that is not a bound (the library's errorIsBound: false). */
export const NOT_A_BOUND = '(± an estimate, not a bound)';
/** Said when fibre distances of elliptical arcs and Béziers were found numerically. */
export const NUMERIC_FIBRES = '(fibre distances of elliptical arcs and Béziers found numerically, to round-off)';

/** One quantity of `memberJson`'s document as the member table prints it: the value rounded to its estimate. */
export function memberFigureText(q: { value: number; error: number }): { value: string; error: string } {
  return { value: formatValue(q.value, q.error), error: formatError(q.error) };
}

function rows(r: MemberResult, keys: readonly string[], src: Record<string, Quantity>, to: LengthUnit, out: string[]): void {
  for (const k of keys) {
    const c = convert(k, src[k], r.units, to);
    const t = memberFigureText(c);
    out.push(`  ${k.padEnd(14)} ${t.value.padStart(18)} ± ${t.error.padEnd(8)} ${c.unit}${c.errorIsBound === false ? ` ${NOT_A_BOUND}` : ''}`.trimEnd());
  }
}

/** How the torsion figures were found, in words. */
export function torsionMethodText(m: TorsionResult['method']): string {
  return `order-${m.order} finite elements, ${m.triangles} triangles, ${m.unknowns} unknowns; estimate ${m.safety} × the change from ${m.coarseTriangles} triangles`;
}

/** What the bolt group's sums are, in words (u: the unit they are printed in). */
export function boltGroupText(g: { count: number; selectedFrom: number }, u: string): string {
  return `${g.count} of ${g.selectedFrom} circular holes, each counted as a unit area at its centre; sums about the group centroid, in ${u}²`;
}

/** A figure of the bolt group as `memberJson` writes it: its path in the part's document and the text the table prints. */
export interface BoltFigure { path: string; label: string; value: number; text: string; unit: string }

/** The bolt group of one part of `memberJson`'s document as figures, rounded as the member table rounds them. */
export function boltGroupFigures(g: { centroid: number[]; sumXX: number; sumYY: number; sumXY: number; sumRR: number; principal: number[]; principalAngle: number;
  bolts: { x: number; y: number; diameter: number; distance: number }[] }, u: string): BoltFigure[] {
  const sq = `${u}²`;
  const f = (path: string, label: string, value: number, unit: string, digits?: number): BoltFigure => ({ path, label, value, text: formatNumber(value, digits), unit });
  return [
    f('centroid.0', 'centroid x', g.centroid[0], u), f('centroid.1', 'centroid y', g.centroid[1], u),
    f('sumXX', 'Σx²', g.sumXX, sq), f('sumYY', 'Σy²', g.sumYY, sq), f('sumXY', 'Σxy', g.sumXY, sq), f('sumRR', 'Σr²', g.sumRR, sq),
    f('principal.0', 'larger principal sum', g.principal[0], sq), f('principal.1', 'smaller principal sum', g.principal[1], sq),
    f('principalAngle', 'larger along, from +x', g.principalAngle, '°', 6),
    ...g.bolts.flatMap((b, i) => [
      f(`bolts.${i}.diameter`, `bolt ${i + 1} Ø`, b.diameter, u, 6), f(`bolts.${i}.x`, `bolt ${i + 1} x`, b.x, u), f(`bolts.${i}.y`, `bolt ${i + 1} y`, b.y, u),
      f(`bolts.${i}.distance`, `bolt ${i + 1} from the centroid`, b.distance, u),
    ]),
  ];
}

/** `--print-unit` as given (mm, cm, m or in; undefined or '' for the part's own unit), refused in one line otherwise. */
export function printUnit(text: string | undefined): LengthUnit | undefined {
  if (text === undefined || text === '') return undefined;
  if (!isLengthUnit(text) || text === 'ft') throw new InputError('--print-unit', `expected mm, cm, m or in, got "${text}"`);
  return text;
}

export function memberText(results: readonly MemberResult[], to?: LengthUnit): string {
  const out: string[] = [];
  for (const r of results) {
    const u = to ?? r.units;
    out.push(`${r.part} (values in ${u}; input in ${r.units})`);
    out.push(' section');
    rows(r, SECTION_KEYS, r.section.quantities, u, out);
    out.push(' plastic and principal moduli');
    rows(r, PLASTIC_KEYS, r.plastic, u, out);
    if (!r.exactFibres) out.push(`  ${NUMERIC_FIBRES}`);
    if (r.torsion) {
      const t = r.torsion;
      out.push(` torsion (${torsionMethodText(t.method)})`);
      rows(r, TORSION_KEYS, t.quantities, u, out);
      for (const f of t.facts) out.push(`  note: ${torsionFactText(f)}`);
    }
    if (r.boltGroup) {
      const g = r.boltGroup, f = lengthFactor(r.units, u);
      out.push(` bolt group: ${boltGroupText(g, u)}`);
      out.push(`  centroid       (${formatNumber(g.centroid[0] * f)}, ${formatNumber(g.centroid[1] * f)}) ${u}`);
      out.push(`  Σx² ${formatNumber(g.sumXX * f * f)}  Σy² ${formatNumber(g.sumYY * f * f)}  Σxy ${formatNumber(g.sumXY * f * f)}  Σr² ${formatNumber(g.sumRR * f * f)}`);
      out.push(`  principal sums ${formatNumber(g.principal[0] * f * f)}, ${formatNumber(g.principal[1] * f * f)}; larger along ${formatNumber(g.principalAngle, 6)}° from +x`);
      for (const b of g.bolts) out.push(`  bolt Ø${formatNumber(b.diameter * f, 6)} at (${formatNumber(b.x * f)}, ${formatNumber(b.y * f)}): ${formatNumber(b.distance * f)} ${u} from the centroid`);
    }
    (r.netSections ?? []).forEach((n, i) => (n ? netSectionText(n, r.units, u, out) : out.push(` net line ${i + 1}: misses this part`)));
    out.push('');
  }
  out.push(GEOMETRY_CAUTION);
  if (results.some((r) => r.torsion)) out.push(PRISMATIC_NOTE);
  if (results.some((r) => r.netSections?.length)) out.push(NET_SECTION_NOTE);
  return out.join('\n') + '\n';
}

export function memberJson(results: readonly MemberResult[], to?: LengthUnit): string {
  const parts = results.map((r) => {
    const u = to ?? r.units;
    const group = (keys: readonly string[], src: Record<string, Quantity>) => Object.fromEntries(keys.map((k) => [k, convert(k, src[k], r.units, u)]));
    const f = lengthFactor(r.units, u);
    return {
      part: r.part, inputUnit: r.units, unit: u,
      section: group(SECTION_KEYS, r.section.quantities),
      plastic: group(PLASTIC_KEYS, r.plastic), exactFibres: r.exactFibres,
      torsion: r.torsion ? { ...group(TORSION_KEYS, r.torsion.quantities), method: r.torsion.method, facts: r.torsion.facts, notes: r.torsion.facts.map(torsionFactText) } : undefined,
      boltGroup: r.boltGroup ? {
        count: r.boltGroup.count, selectedFrom: r.boltGroup.selectedFrom, convention: 'unit area per bolt at its centre; sums about the group centroid',
        centroid: r.boltGroup.centroid.map((v) => v * f), sumXX: r.boltGroup.sumXX * f * f, sumYY: r.boltGroup.sumYY * f * f, sumXY: r.boltGroup.sumXY * f * f,
        sumRR: r.boltGroup.sumRR * f * f, principal: r.boltGroup.principal.map((v) => v * f * f), principalAngle: r.boltGroup.principalAngle,
        sumUnit: `${u}²`, bolts: r.boltGroup.bolts.map((b) => ({ x: b.x * f, y: b.y * f, diameter: b.diameter * f, distance: b.distance * f })),
      } : undefined,
      // null: the line misses this part (files of several parts)
      netSections: r.netSections?.map((n) => n && netSectionDoc(n, r.units, u)),
    };
  });
  const notes = [...(results.some((r) => r.torsion) ? [PRISMATIC_NOTE] : []), ...(results.some((r) => r.netSections?.length) ? [NET_SECTION_NOTE] : [])];
  return JSON.stringify({ parts, cautions: [GEOMETRY_CAUTION, ...notes] }, null, 2) + '\n';
}
