/**
 * One part against a stated-values file, as `compare` runs it: analyse the part (mass when complete,
 * fabrication always, plastic and torsion figures when a stated value needs them), judge every stated value by the one rule (src/qa/verdict.ts), explain missing
 * quantities, and gather what the writers print beside the table. The command line and the page in the
 * browser both call this, so their verdicts, hints and words are the same.
 */
import { type AnalysisRequest, analyzePart } from '../analysis/analyze.js';
import { InputError } from '../base/errors.js';
import type { PlateModel } from '../model/plate.js';
import { explainMissing, memberNeeds, partSize } from '../qa/compute.js';
import type { Reference } from '../qa/reference.js';
import { type Comparison, compareAll } from '../qa/verdict.js';
import { MASS_CAUTION } from './cautions.js';
import { PRISMATIC_NOTE } from './memberText.js';
import type { ComparisonMeta } from './compareText.js';
import { densityText } from './words.js';

/** Pick the one part to compare: the only one, or the one named by --part or by the reference's "part". */
export function pickPart<P extends { name: string }>(parts: P[], label: string, wanted: string | undefined, where: string): P {
  if (wanted !== undefined) {
    const hit = parts.filter((p) => p.name === wanted);
    if (hit.length === 1) return hit[0];
    const names = parts.map((p) => `"${p.name}"`).join(', ');
    // a stated-values file about another part is refused, even when the file holds one part: --part says which to use
    if (where !== '--part') throw new InputError(where, `names part "${wanted}", but ${label} holds ${names}; compare against another part only by naming it with --part`);
    throw new InputError(where, `names part "${wanted}", but ${label} holds ${names}; expected one of these names`);
  }
  if (parts.length === 1) return parts[0];
  throw new InputError(label, `holds ${parts.length} parts (${parts.map((p) => `"${p.name}"`).join(', ')}); expected one, or --part naming one`);
}

export function comparePart(model: PlateModel, reference: Reference, labels: { file: string; reference: string }, request: Pick<AnalysisRequest, 'section' | 'given' | 'materials'>, rule: { toleranceFromDigits?: boolean } = {}): { comparison: Comparison; meta: ComparisonMeta } {
  // plastic and torsion figures only when a stated value needs them (torsion is a finite-element solve)
  const member = memberNeeds(reference.values.map((v) => v.quantity));
  const report = analyzePart(model, { ...request, mass: 'optional', fabrication: 'always', member });
  const comparison = compareAll(reference, report.quantities, {
    lengthUnit: report.units, partSize: partSize(report), toleranceFromDigits: rule.toleranceFromDigits === true, thickness: report.plate?.thickness,
  });
  explainMissing(comparison.rows, report);
  const massStated = reference.values.some((v) => v.dimension === 'mass' || v.dimension === 'massMoment' || v.dimension === 'force');
  const p = report.plate;
  const meta: ComparisonMeta = {
    file: labels.file, part: report.part, reference: labels.reference, lengthUnit: report.units,
    plate: p ? { thickness: p.thickness, density: p.density, material: p.material, densitySource: densityText(p.densityFrom) } : undefined,
    cautions: [...(massStated ? [MASS_CAUTION] : []), ...(member.torsion && !report.memberNotComputed ? [PRISMATIC_NOTE] : [])],
  };
  return { comparison, meta };
}
