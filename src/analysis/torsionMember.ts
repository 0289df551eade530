/**
 * Member-section analysis of a part taken as the cross-section of a prismatic member: the section
 * properties (measureSection), the plastic and principal elastic moduli (src/properties/plasticSection.ts),
 * torsion, shear centre and warping constant (src/analysis/torsion.ts) and, on request, the bolt group of
 * its circular holes. Facts only; words in src/output/memberText.ts.
 */
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
}

export interface MemberResult {
  part: string;
  units: Part['units'];
  section: SectionResult;
  plastic: Record<PlasticKey, Quantity>;
  exactFibres: boolean;
  torsion?: TorsionResult;
  boltGroup?: BoltGroup & { selectedFrom: number };
  /** the cautions every output carries: geometry, and torsion's prismatic-member assumption */
  cautions: ('geometry' | 'prismatic-member')[];
}

export function analyzeMember(input: Part, options: MemberOptions = {}): MemberResult {
  const part = preparePart(input);
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
    torsion, boltGroup: group,
    cautions: torsion ? ['geometry', 'prismatic-member'] : ['geometry'],
  };
}
