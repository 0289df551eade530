/**
 * Member-section analysis of a part taken as the cross-section of a prismatic member: the section
 * properties (measureSection), the plastic and principal elastic moduli (src/properties/plasticSection.ts),
 * torsion, shear centre and warping constant (src/analysis/torsion.ts) and, on request, the bolt group of
 * its circular holes. Facts only; words in src/output/memberText.ts.
 */
import { type NetLine, type NetSectionGeometry, netSection } from '../geometry/netSection.js';
import type { Part } from '../geometry/part.js';
import { InputError } from '../base/errors.js';
import { type PlateModel, netThickness } from '../model/plate.js';
import { type Bolt, type BoltGroup, boltGroup, circularHoles, selectBolts } from '../properties/boltGroup.js';
import { plasticSection } from '../properties/plasticSection.js';
import type { PlasticKey, Quantity } from '../properties/quantities.js';
import { type SectionResult, measureSection, preparePart } from './measure.js';
import { type TorsionOptions, type TorsionResult, measureTorsion } from './torsion.js';

export interface MemberOptions {
  torsion?: false | TorsionOptions;
  /** bolt group of the circular holes: undefined = none; [] = all; else the diameters to take */
  bolts?: readonly number[];
  /** lines along which to take net sections, with the plate thickness (part unit) for the net area */
  netLines?: readonly NetLine[];
  thickness?: number;
  /** one part of several: a line that misses this part is null here instead of refused */
  netLinesMayMiss?: boolean;
}

/** A net section along a user's line: lengths with bounds, the runs of material, and with a thickness the net area. */
export interface NetSectionResult extends Omit<NetSectionGeometry, 'length' | 'lengthError' | 'gross' | 'grossError' | 'net' | 'netError'> {
  where: string;
  length: Quantity; grossLength: Quantity; netLength: Quantity;
  /** gross − net: the length the holes take from the line */
  holeLength: Quantity;
  netArea?: Quantity;
  thickness?: number;
}

/**
 * The net section of a prepared part along a line; the thickness (part unit, exact as given) makes the net
 * area. A line that misses the part is refused, or with `ifMissed: 'none'` gives null.
 */
export function measureNetSection(part: Part, line: NetLine, thickness?: number, ifMissed: 'refuse' | 'none' = 'refuse'): NetSectionResult | null {
  const g = netSection(part, line, ifMissed);
  if (!g) return null;
  const { length, lengthError, gross, grossError, net, netError, ...rest } = g;
  return {
    where: line.where, ...rest,
    length: { value: length, error: lengthError },
    grossLength: { value: gross, error: grossError },
    netLength: { value: net, error: netError },
    holeLength: { value: gross - net, error: grossError + netError + Number.EPSILON * gross },
    ...(thickness === undefined ? {} : { thickness, netArea: { value: net * thickness, error: netError * thickness + Number.EPSILON * net * thickness } }),
  };
}

export interface MemberResult {
  part: string;
  units: Part['units'];
  section: SectionResult;
  plastic: Record<PlasticKey, Quantity>;
  exactFibres: boolean;
  torsion?: TorsionResult;
  boltGroup?: BoltGroup & { selectedFrom: number };
  /** one per line, null where the line misses this part (files of several parts) */
  netSections?: (NetSectionResult | null)[];
  /** the cautions every output carries: geometry, and torsion's prismatic-member assumption */
  cautions: ('geometry' | 'prismatic-member')[];
}

export function analyzeMember(input: Part, options: MemberOptions = {}): MemberResult {
  const part = preparePart(input);
  // lines first: a line that misses the part is refused before any long computation
  const netSections = options.netLines?.map((l) => measureNetSection(part, l, options.thickness, options.netLinesMayMiss ? 'none' : 'refuse'));
  const section = measureSection(input);
  const pl = plasticSection(part, section.quantities);
  const torsion = options.torsion === false ? undefined : measureTorsion(input, options.torsion ?? {});
  let group: MemberResult['boltGroup'];
  if (options.bolts) {
    const all: Bolt[] = circularHoles(part);
    group = { ...boltGroup(selectBolts(all, options.bolts)), selectedFrom: all.length };
  }
  return {
    part: input.name, units: input.units, section, plastic: pl.quantities, exactFibres: pl.exactFibres,
    torsion, boltGroup: group, netSections,
    cautions: torsion ? ['geometry', 'prismatic-member'] : ['geometry'],
  };
}

/** What a drawing of the section may show besides the part (facts in the part's unit; words in src/output). */
export interface SectionMarks {
  shearCentre?: { x: number; y: number; error: number; errorIsBound: boolean };
  /** plastic neutral axes: a point on each and its direction (unit), with the offset's estimate */
  plasticAxes?: { key: 'plasticAxisY' | 'plasticAxisX' | 'plasticAxis1' | 'plasticAxis2'; px: number; py: number; dx: number; dy: number; error: number }[];
  netSections?: (NetSectionResult | null)[];
}

export interface MarkOptions {
  shearCentre?: boolean;
  plasticAxes?: boolean;
  netLines?: readonly NetLine[];
}

/**
 * The marks a drawing shows on request: the shear centre (torsion solve at default settings), the plastic
 * neutral axes (parallel to x and y always; parallel to the principal axes when those are defined and turned
 * away from x and y), and net sections along the user's lines.
 */
export function analyzeMarks(input: Part, want: MarkOptions, thickness?: number, netLinesMayMiss = false): SectionMarks {
  const r = analyzeMember(input, { torsion: want.shearCentre ? {} : false, netLines: want.netLines, thickness, netLinesMayMiss });
  const out: SectionMarks = {};
  if (r.torsion) {
    const { shearCentreX: sx, shearCentreY: sy } = r.torsion.quantities;
    // at re-entrant corners the torsion estimate rests on the asymptotic rate and may understate (a fact of the solve)
    const bound = sx.errorIsBound !== false && sy.errorIsBound !== false && !r.torsion.facts.some((f) => f.code === 'reentrant-corners');
    out.shearCentre = { x: sx.value, y: sy.value, error: Math.max(sx.error, sy.error), errorIsBound: bound };
  }
  if (want.plasticAxes) {
    const q = r.section.quantities, p = r.plastic;
    const cx = q.centroidX.value, cy = q.centroidY.value;
    const axes: NonNullable<SectionMarks['plasticAxes']> = [
      { key: 'plasticAxisY', px: cx, py: p.plasticAxisY.value, dx: 1, dy: 0, error: p.plasticAxisY.error },
      { key: 'plasticAxisX', px: p.plasticAxisX.value, py: cy, dx: 0, dy: 1, error: p.plasticAxisX.error },
    ];
    const th = (q.principalAngle.value * Math.PI) / 180, c = Math.cos(th), s = Math.sin(th);
    const turned = Math.abs(Math.sin(2 * th)) > 1e-9 && q.principalAngle.error < 90;
    if (turned) {
      axes.push({ key: 'plasticAxis1', px: cx - s * p.plasticAxis1.value, py: cy + c * p.plasticAxis1.value, dx: c, dy: s, error: p.plasticAxis1.error });
      axes.push({ key: 'plasticAxis2', px: cx + c * p.plasticAxis2.value, py: cy + s * p.plasticAxis2.value, dx: -s, dy: c, error: p.plasticAxis2.error });
    }
    out.plasticAxes = axes;
  }
  if (r.netSections) out.netSections = r.netSections;
  return out;
}

/** The marks named in a drawing option's text ("shear-centre,plastic-axes"); `where` names the option. */
export function parseMarkNames(text: string, where: string): { shearCentre: boolean; plasticAxes: boolean } {
  const names = text.split(',').map((t) => t.trim()).filter((t) => t.length > 0);
  if (names.length === 0) throw new InputError(where, 'expected shear-centre, plastic-axes or both, comma-separated; got an empty text');
  for (const n of names) if (n !== 'shear-centre' && n !== 'plastic-axes') throw new InputError(where, `unknown mark "${n}"; expected shear-centre or plastic-axes`);
  return { shearCentre: names.includes('shear-centre'), plasticAxes: names.includes('plastic-axes') };
}

/** A one-layer model's shape (member properties and marks belong to one shape). */
function oneShape(model: PlateModel, what: string) {
  if (model.layers.length !== 1) throw new InputError(model.name, `${what} need one shape; this plate has ${model.layers.length} layers`);
  return model.layers[0];
}

/**
 * With several parts, a net line is taken on each part it crosses and shows as missed on the others; a line
 * that misses every part is refused (as it would be on one part).
 */
function refuseLinesMissingEverywhere(lines: readonly NetLine[] | undefined, found: readonly ((NetSectionResult | null)[] | undefined)[], models: readonly PlateModel[]): void {
  lines?.forEach((l, i) => {
    if (found.some((f) => f?.[i])) return;
    // the one-part refusal names the line and the outline's extent
    if (models.length === 1) measureNetSection(models[0].layers[0].part, l);
    throw new InputError(l.where, `the line ${l.points.map(([x, y]) => `(${x}, ${y})`).join(' → ')} misses every one of the ${models.length} parts`);
  });
}

/** Member analysis of every one-layer model of a file; the thickness text (a flag) is used for net areas. */
export function analyzeMemberModels(models: readonly PlateModel[], options: Omit<MemberOptions, 'thickness' | 'netLinesMayMiss'>, thickness?: string): MemberResult[] {
  const results = models.map((m) => {
    const layer = oneShape(m, 'member properties');
    return analyzeMember(layer.part, { ...options, netLinesMayMiss: models.length > 1, thickness: options.netLines ? netThickness(layer, thickness) : undefined });
  });
  refuseLinesMissingEverywhere(options.netLines, results.map((r) => r.netSections), models);
  return results;
}

/**
 * Marks for every one-layer model of a file (a layered plate is refused: the marks belong to one shape). The
 * net area uses the file's constant thickness or the given one; a thickness that varies gives lengths only.
 */
export function marksOfModels(models: readonly PlateModel[], want: MarkOptions, thickness?: string): SectionMarks[] {
  const marks = models.map((m) => {
    const layer = oneShape(m, 'section marks');
    return analyzeMarks(layer.part, want, want.netLines ? netThickness(layer, thickness, 'omit') : undefined, models.length > 1);
  });
  refuseLinesMissingEverywhere(want.netLines, marks.map((k) => k.netSections), models);
  return marks;
}
