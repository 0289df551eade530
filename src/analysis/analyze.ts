/**
 * The one analysis entry point: a plate model in, a report of facts out. Every command (measure, compare,
 * batch, draw, report) and every library user goes through `analyzePart`:
 *
 *   validate each layer once → section properties per layer (exact boundary integrals, or the mesh if asked) →
 *   resolve thickness and density (file, given settings, defaults; one grammar) →
 *   mass properties (meshing each layer at most once: the section's own mesh is reused) →
 *   fabrication figures (cut length, pierces, blank, scrap; masses with one constant plate)
 *
 * The report holds numbers with their estimates, the method facts, why each computation stopped, and
 * warnings and cautions as codes with parameters. Words are chosen in src/output.
 */
import { assertFiniteReport } from './finite.js';
import { InputError } from '../base/errors.js';
import { type MaterialTable } from '../model/materials.js';
import {
  type ConstantPlate, type PlateModel, type PlateSettings, type ResolvedLayer, type UnitSource,
  constantPlate, hasPlateData, resolveLayers,
} from '../model/plate.js';
import type { SettingWarning } from '../model/settings.js';
import type { InterpretationSummary, NotCut } from '../read/interpret.js';
import { type FabricationFigures, fabricationFigures } from '../properties/fabrication.js';
import type { Quantity } from '../properties/quantities.js';
import { type MeasureOptions, type SectionResult, type SectionWarning, measureSection } from './measure.js';
import { boundaryMass } from './boundaryMass.js';
import { plasticSection } from '../properties/plasticSection.js';
import { measureTorsion } from './torsion.js';
import { type IntegrationOptions, type MassResult, measureMass } from './plate.js';

export type AnalysisWarning =
  | SectionWarning
  | SettingWarning
  | { code: 'mass-not-computed'; missing: ('thickness' | 'density')[] };

export type Caution = 'geometry' | 'mass';

export interface AnalysisRequest {
  /** Section options: rule degree, refinement levels, method, triangulation. */
  section?: MeasureOptions;
  /** Settings from the command line or a manifest row: refused where the file states the same figure. */
  given?: PlateSettings;
  /** Command-line defaults of a batch: fill only what neither the file nor the row states. */
  defaults?: PlateSettings;
  materials?: MaterialTable;
  /**
   * 'required' (measure): with any thickness, density or material in sight, both must be complete, else an
   * InputError; 'optional' (compare, batch): computed when complete, else reported as missing;
   * 'unless-constant': like optional, but a constant single-layer plate skips the integration (netMass is its
   * mass); 'never'.
   */
  mass?: 'required' | 'optional' | 'unless-constant' | 'never';
  /** Adaptive refinement for mass properties. */
  integration?: Pick<IntegrationOptions, 'tolerance' | 'maxTriangles' | 'maxMillis'>;
  /** 'always', 'never', or 'auto': when one constant thickness and density are known. */
  fabrication?: 'always' | 'auto' | 'never';
  /**
   * Member figures as `member` gives them, for a plate of one shape: the plastic group, and the torsion group
   * (a finite-element solve, a second or two). `compare` and `batch` ask for them when a stated value needs them.
   */
  member?: { plastic?: boolean; torsion?: boolean };
}

export interface LayerReport {
  name: string;
  section: SectionResult;
}

export interface PartReport {
  part: string;
  units: PlateModel['units'];
  unitSource: UnitSource;
  layered: boolean;
  /** Section properties of every layer (one for a plain part). */
  layers: LayerReport[];
  /** The first layer's (the base plate's) section properties: what readers of one Part see. */
  section: SectionResult;
  mass?: MassResult;
  fabrication?: FabricationFigures;
  /** The one constant plate (thickness in the part's unit, density kg/m³), when there is one. */
  plate?: ConstantPlate;
  /** What is missing for mass figures (empty when complete or not asked). */
  missing: ('thickness' | 'density')[];
  /** Every computed quantity by catalogue key (section of the first layer, fabrication, mass, member figures asked for). */
  quantities: Record<string, Quantity>;
  /** Member figures were asked for but a plate of several layers has none (they need one shape). */
  memberNotComputed?: { layers: number };
  warnings: AnalysisWarning[];
  cautions: Caution[];
  /** How the drawing was read (drawings only): counts, reasons, units with their source, marking per part. */
  interpretation?: InterpretationSummary;
  /** Marking and ignored geometry of the drawing (for pictures). */
  notCut?: NotCut;
}

function largestExtent(s: SectionResult): number {
  const q = s.quantities;
  return Math.max(q.width.value, q.height.value);
}

export function analyzePart(model: PlateModel & { interpretation?: InterpretationSummary; notCut?: NotCut }, request: AnalysisRequest = {}): PartReport {
  const massMode = request.mass ?? 'optional';
  const layers: LayerReport[] = model.layers.map((l) => ({ name: l.name, section: measureSection(l.part, request.section) }));
  const section = layers[0].section;
  const warnings: AnalysisWarning[] = [...section.warnings];
  for (const l of layers.slice(1)) warnings.push(...l.section.warnings);

  let resolved: ResolvedLayer[] | null = null;
  let missing: ('thickness' | 'density')[] = [];
  const plateData = hasPlateData(model, request.given, request.defaults);
  if (massMode !== 'never' && plateData) {
    const r = resolveLayers(model, request.given, request.defaults, request.materials, largestExtent(section));
    warnings.push(...r.warnings);
    missing = r.missing;
    if (r.layers) {
      // the validated, oriented shapes from the section step: mass integration neither validates nor meshes again
      // (on first use: the boundary path orients a copy of the part only when something needs it)
      resolved = r.layers.map((l, i) => Object.defineProperty({ ...l }, 'part', { get: () => layers[i].section.geometry.part, enumerable: true }));
    } else if (massMode === 'required') {
      const what = missing.map((m) => (m === 'thickness' ? 'a thickness' : 'a density or material')).join(' and ');
      const place = model.layers.find((l) => !(l.thickness ?? request.given?.thickness ?? request.defaults?.thickness))?.where || 'part';
      throw new InputError(place, `no ${missing.join(' and ')} for ${model.layered ? 'every layer' : 'the part'}; expected ${what} in the file or as a setting`);
    } else {
      warnings.push({ code: 'mass-not-computed', missing });
    }
  }
  const plate = constantPlate(resolved);

  const fabMode = request.fabrication ?? 'auto';
  let fabrication: FabricationFigures | undefined;
  if (fabMode === 'always' || (fabMode === 'auto' && plate !== undefined)) {
    fabrication = fabricationFigures(section.geometry.part, { area: section.quantities.area, thickness: plate?.thickness, density: plate?.density });
  }

  let mass: MassResult | undefined;
  if (resolved && !(massMode === 'unless-constant' && plate !== undefined)) {
    // constant thickness and density: the mass sums are multiples of the sections' exact boundary moments
    // (no mesh); otherwise the mesh, built once per layer and shared with drawings
    mass = boundaryMass(model.name, model.units, resolved, layers.map((l) => l.section)) ?? measureMass(model.name, model.units, resolved, {
      degree: request.section?.degree, triangulation: request.section?.triangulation,
      ...request.integration,
      prepared: true,
      meshOf: (i) => layers[i].section.geometry.mesh,
    });
  }

  const quantities: Record<string, Quantity> = { ...section.quantities };
  if (fabrication) for (const [k, v] of Object.entries(fabrication.quantities)) if (v) quantities[k] = v;
  if (mass) for (const [k, v] of Object.entries(mass.quantities)) quantities[k] = v;
  let memberNotComputed: PartReport['memberNotComputed'];
  if (request.member?.plastic || request.member?.torsion) {
    if (model.layers.length !== 1) memberNotComputed = { layers: model.layers.length };
    else {
      if (request.member.plastic) for (const [k, v] of Object.entries(plasticSection(section.geometry.part, section.quantities).quantities)) quantities[k] = v;
      if (request.member.torsion) for (const [k, v] of Object.entries(measureTorsion(model.layers[0].part).quantities)) quantities[k] = v;
    }
  }
  const cautions: Caution[] = ['geometry'];
  if (mass || fabrication?.quantities.netMass) cautions.push('mass');
  // issue 16: no NaN or Infinity is ever reported; the one refusal names the cause (src/analysis/finite.ts)
  for (const l of layers) assertFiniteReport(`part "${model.name}"`, l.section.quantities, mass?.quantities, fabrication?.quantities);
  return {
    part: model.name, units: model.units, unitSource: model.unitSource, layered: model.layered,
    layers, section, mass, fabrication, plate, missing, quantities, warnings, cautions, interpretation: model.interpretation, notCut: model.notCut,
    ...(memberNotComputed ? { memberNotComputed } : {}),
  };
}
