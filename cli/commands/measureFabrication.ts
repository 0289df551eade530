/**
 * The fabrication part of `measure`: cut length, pierces, bounding and minimum-area rectangles, scrap
 * fraction, and net and blank masses when a thickness and a density (or material) are known. Kept apart from
 * measure.ts, which calls `fabricationBlock` once and appends what it returns.
 *
 * Shown when `--fabrication` is given, or when a thickness is known together with a material or a density:
 * from the command line, or from the top-level "thickness", "material", "density" of a part file. The thickness must then be a plain number (the part's unit) or a number with a length unit;
 * a thickness that varies over the part (an expression) gives the figures without masses (the mass block
 * integrates it properly).
 */
import { type MeasureOptions, type SectionResult, measureSection } from '../../src/analysis/measure.js';
import type { InputText } from '../../src/base/files.js';
import { type ReadOptions, readParts } from '../../src/read/read.js';
import { fabricationJson, fabricationText } from '../../src/output/fabricationText.js';
import { fabricationFigures } from '../../src/properties/fabrication.js';
import { type PlateSpec, lookupMaterial, parseDensity, parseThickness, resolvePlate } from '../../src/model/plate.js';

export interface FabricationFlags { fabrication?: boolean; thickness?: string; material?: string; density?: string }

/** Plain (non-expression) thickness, material, density at the top level of a part file, as flag texts. */
function fileSettings(input: InputText): FabricationFlags {
  let doc: unknown;
  try { doc = JSON.parse(input.text.replace(/^\ufeff/, '')); } catch { return {}; }
  if (typeof doc !== 'object' || doc === null || Array.isArray(doc)) return {};
  const o = doc as Record<string, unknown>;
  const text = (v: unknown) => (typeof v === 'number' ? String(v) : typeof v === 'string' ? v : undefined);
  return { thickness: text(o.thickness), material: typeof o.material === 'string' ? o.material : undefined, density: text(o.density) };
}

/**
 * Add the fabrication block to measure's output (`out`: its text, or its JSON text when `json`): text gets one
 * block per part appended; JSON gets a "fabrication" object on each part's document. `out` comes back
 * unchanged when fabrication figures are not asked for. `measured`: the parts' area results when the caller
 * has them already.
 */
export function withFabrication(out: string, input: InputText, readOpts: ReadOptions, flags: FabricationFlags & { json?: boolean }, section: MeasureOptions = {}, measured?: readonly SectionResult[]): string {
  const file = fileSettings(input);
  const merged: FabricationFlags = {
    fabrication: flags.fabrication,
    thickness: flags.thickness ?? file.thickness,
    material: flags.material ?? file.material,
    density: flags.density ?? file.density,
  };
  const known = merged.thickness !== undefined && (merged.material !== undefined || merged.density !== undefined);
  if (!flags.fabrication && !known) return out;
  // the parts' area results: those measure already has, else measured here
  const results = measured ?? readParts(input.text, input.label, readOpts).map((p) => measureSection(p, section));
  const block = fabricationBlock(results, { ...merged, fabrication: true })!;
  if (!flags.json) return out + '\n' + block.text.join('\n');
  const doc = JSON.parse(out) as Record<string, unknown>;
  if (Array.isArray(doc.parts) && doc.parts.length === results.length) {
    (doc.parts as Record<string, unknown>[]).forEach((d, i) => { d.fabrication = block.json[i]; });
  } else if (results.length === 1) {
    doc.fabrication = block.json[0];
  } else {
    doc.fabrication = block.json;
  }
  return JSON.stringify(doc, null, 2) + '\n';
}

function lenient<T>(f: () => T): T | undefined {
  try { return f(); } catch { return undefined; }
}

/** Per part: the text block and the JSON object; undefined when fabrication figures are not asked for. */
export function fabricationBlock(results: readonly SectionResult[], flags: FabricationFlags): { text: string[]; json: Record<string, unknown>[] } | undefined {
  const known = flags.thickness !== undefined && (flags.material !== undefined || flags.density !== undefined);
  if (!flags.fabrication && !known) return undefined;
  // thickness, material and density flags are checked by the mass block; here they are only used when plain
  const spec: PlateSpec = {
    thickness: flags.thickness !== undefined ? lenient(() => parseThickness(flags.thickness!, '--thickness')) : undefined,
    material: flags.material !== undefined ? lenient(() => lookupMaterial(flags.material!, '--material')) : undefined,
    density: flags.density !== undefined ? lenient(() => parseDensity(flags.density!, '--density')) : undefined,
  };
  const text: string[] = [];
  const json: Record<string, unknown>[] = [];
  for (const r of results) {
    const plate = resolvePlate(spec, r.units);
    const f = fabricationFigures(r.geometry.part, { area: r.quantities.area, thickness: plate.thickness, density: plate.density });
    text.push(fabricationText(f, r.units, plate));
    json.push(fabricationJson(f, r.units, plate));
  }
  return { text, json };
}
