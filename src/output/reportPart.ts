/**
 * The HTML report of the parts of one file, as `report` makes it: each part measured exactly as `measure`
 * measures it (so the table equals `measure --json`), a convergence run with at least three refinement levels,
 * the mass or why it is missing, and how the drawing was read. The command line and the page in the browser
 * both call this; only the file's digest and the date come from the caller.
 */
import { analyzePart } from '../analysis/analyze.js';
import { type MeasureOptions, measureSection } from '../analysis/measure.js';
import type { PlateModel, PlateSettings } from '../model/plate.js';
import type { SectionMarks } from '../analysis/torsionMember.js';
import type { MaterialTable } from '../model/materials.js';
import type { InterpretationSummary, NotCut } from '../read/interpret.js';
import { type ReportInput, buildReport } from './html.js';
import { interpretationText, unitSourceText } from './words.js';

/** Levels of the run behind the convergence plot (at least three refinements). */
export const CONVERGENCE_LEVELS = 3;

export async function reportHtml(
  models: readonly (PlateModel & { interpretation?: InterpretationSummary; notCut?: NotCut })[],
  options: Omit<ReportInput, 'parts'> & { section: MeasureOptions; given: PlateSettings; marks?: readonly (SectionMarks | undefined)[]; materials?: MaterialTable },
): Promise<string> {
  const { section, given, marks, materials, ...input } = options;
  const reports = models.map((m) => analyzePart(m, { section, given, materials, mass: 'optional', fabrication: 'always' }));
  // the convergence plot needs at least three refinement levels: a separate run on the same shape, made only
  // where the table's values come from a mesh (exact boundary results have no convergence to show)
  const convergence = reports.map((r) => (r.section.method.path === 'boundary' || r.section.levels.length > CONVERGENCE_LEVELS
    ? r.section.levels
    : measureSection(r.section.geometry.part, { ...section, levels: CONVERGENCE_LEVELS }).levels));
  const notes = reports.map((r) => (r.mass ? undefined : r.missing.length > 0
    ? `Mass not shown: no ${r.missing.join(' and ')} — add "thickness" and "density" or "material" to the part file, or use --thickness with --density or --material.`
    : 'Mass not shown: no thickness and density (or material) were given — add "thickness" and "density" or "material" to the part file, or use --thickness with --density or --material.'));
  return buildReport({
    ...input,
    parts: reports.map((r, i) => ({
      result: r.section, convergence: convergence[i], mass: r.mass, massNote: notes[i], fabrication: r.fabrication, marks: marks?.[i],
      markingLength: r.interpretation?.parts.find((p) => p.name === r.part)?.markingLength,
      reading: {
        lines: r.interpretation ? interpretationText(r.interpretation, r.part) : [`length unit ${r.units}: ${unitSourceText(r.unitSource)}`],
        draw: { notCut: r.notCut, gapsClosed: r.interpretation?.gapsClosed, unitSource: r.unitSource },
      },
    })),
  });
}
