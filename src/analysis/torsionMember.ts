/**
 * Member-section analysis of a part taken as the cross-section of a prismatic member: the section
 * properties (measureSection), the plastic and principal elastic moduli (src/properties/plasticSection.ts),
 * torsion, shear centre and warping constant (src/analysis/torsion.ts) and, on request, the bolt group of
 * its circular holes. Facts only; words in src/output/memberText.ts.
 */
import { type NetLine, type NetSectionGeometry, netSection } from '../geometry/netSection.js';
import type { Part } from '../geometry/part.js';
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

/** The net section of a prepared part along a line; the thickness (part unit, exact as given) makes the net area. */
export function measureNetSection(part: Part, line: NetLine, thickness?: number): NetSectionResult {
  const { length, lengthError, gross, grossError, net, netError, ...rest } = netSection(part, line);
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
  netSections?: NetSectionResult[];
  /** the cautions every output carries: geometry, and torsion's prismatic-member assumption */
  cautions: ('geometry' | 'prismatic-member')[];
}

export function analyzeMember(input: Part, options: MemberOptions = {}): MemberResult {
  const part = preparePart(input);
  // lines first: a line that misses the part is refused before any long computation
  const netSections = options.netLines?.map((l) => measureNetSection(part, l, options.thickness));
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
