/**
 * Writers for the analysis entry point's report (src/analysis/analyze.ts): the text `measure` prints for
 * people and its JSON for programs. Section properties of every layer, mass properties when computed,
 * fabrication figures when computed, warnings, the unit's source, cautions once each.
 */
import type { PartReport } from '../analysis/analyze.js';
import { GEOMETRY_CAUTION } from './cautions.js';
import { fabricationJson, fabricationText } from './fabricationText.js';
import { type MassUnits, massJson, massText } from './massText.js';
import { sectionJson, sectionText } from './text.js';
import { interpretationText, unitSourceText, warningJson, warningText } from './words.js';

/** Warnings that are not the section's own (those print with their section). */
function extraWarnings(r: PartReport) {
  const own = new Set(r.layers.flatMap((l) => l.section.warnings));
  return r.warnings.filter((w) => !own.has(w as never));
}

export function partReportText(r: PartReport, units: MassUnits): string {
  const out: string[] = [];
  for (const l of r.layers) out.push(sectionText(l.section, false));
  if (r.interpretation) out.push(interpretationText(r.interpretation, r.part).join('\n') + '\n');
  else if (r.unitSource !== 'file') out.push(`length unit ${r.units}: ${unitSourceText(r.unitSource)}\n`);
  for (const w of extraWarnings(r)) out.push(`warning: ${warningText(w)}\n`);
  if (r.mass) out.push(massText(r.mass, units));
  if (r.fabrication) out.push(fabricationText(r.fabrication, r.units, r.plate, r.mass === undefined));
  out.push(GEOMETRY_CAUTION + '\n');
  return out.join('\n');
}

export function partReportJson(r: PartReport, units: MassUnits): Record<string, unknown> {
  const doc: Record<string, unknown> = r.layered
    // top-level quantities: the first layer's (the base plate), as readers that take one Part see it
    ? { ...sectionJson(r.section), part: r.part, quantitiesOf: `layer "${r.layers[0].name}"`, layers: r.layers.map((l) => ({ layer: l.name, ...sectionJson(l.section) })) }
    : sectionJson(r.section);
  doc.units = { ...(doc.units as Record<string, unknown>), lengthSource: r.unitSource };
  const extra = extraWarnings(r);
  if (extra.length > 0) doc.warnings = [...(doc.warnings as unknown[]), ...extra.map(warningJson)];
  if (r.interpretation) {
    const mine = r.interpretation.parts.find((p) => p.name === r.part);
    doc.interpretation = { ...r.interpretation, messages: interpretationText(r.interpretation, r.part) };
    if (mine) doc.markingLength = mine.markingLength;
  }
  if (r.mass) doc.massProperties = massJson(r.mass, units);
  if (r.fabrication) doc.fabrication = fabricationJson(r.fabrication, r.units, r.plate);
  return doc;
}

/** Several parts: one document per part under "parts"; one part: its document. */
export function reportsJson(reports: readonly PartReport[], units: MassUnits): string {
  const docs = reports.map((r) => partReportJson(r, units));
  return JSON.stringify(docs.length === 1 ? docs[0] : { parts: docs }, null, 2) + '\n';
}

export function reportsText(reports: readonly PartReport[], units: MassUnits): string {
  return reports.map((r) => partReportText(r, units)).join('\n');
}
