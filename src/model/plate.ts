/**
 * Plate settings for fabrication and mass figures: thickness, material and density as given on the command
 * line (`--thickness`, `--material`, `--density`) or in a batch manifest, resolved against one part's
 * length unit.
 *
 * - thickness: "10 mm", "0.375 in", "1 cm"; a bare number ("10") is in the part's own length unit.
 * - density: "7850 kg/m3", "7.85 g/cm3", "0.2836 lb/in3"; a bare number is kg/m³. Given, it overrides the
 *   material's density.
 * - material: a name from the material table (src/model), which supplies a nominal density.
 *
 * Until the part format carries its own thickness and material, these settings are the only source; the
 * mass-bearing quantities (netMass, blankMass) exist only when both a thickness and a density are known.
 */
import { InputError, describeValue } from '../base/errors.js';
import { type Material, type MaterialTable, densityToSI, findMaterial, parseDensityUnit } from './index.js';
import { type LengthUnit, isLengthUnit, lengthFactor } from '../base/units.js';

export interface ThicknessSpec {
  value: number;
  /** null: the part's own length unit. */
  unit: LengthUnit | null;
  text: string;
}

/** Plate settings as given, before a part's unit is known. Plain data (can cross to a worker thread). */
export interface PlateSpec {
  thickness?: ThicknessSpec;
  /** Material id and name as found in the table. */
  material?: { id: string; name: string; density: number; source: string };
  /** Explicit density in kg/m³ (overrides the material's). */
  density?: number;
}

/** Plate settings for one part, in its length unit. */
export interface ResolvedPlate {
  /** Thickness in the part's length unit. */
  thickness?: number;
  /** Density in kg/m³. */
  density?: number;
  material?: string;
  /** Where the density comes from: "--density", the material's source, or a manifest cell. */
  densitySource?: string;
}

const NUMBER_UNIT = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*?)\s*$/;

/** "10 mm" → { value: 10, unit: 'mm' }; "10" → unit null (the part's unit). */
export function parseThickness(text: string, where: string): ThicknessSpec {
  const m = NUMBER_UNIT.exec(text);
  if (!m) throw new InputError(where, `expected a thickness such as "10 mm" or "0.375 in", got ${describeValue(text)}`);
  const value = Number(m[1]);
  if (!(value > 0) || !Number.isFinite(value)) throw new InputError(where, `expected a positive thickness, got ${describeValue(text)}`);
  const u = m[2];
  if (u !== '' && !isLengthUnit(u)) throw new InputError(where, `unknown length unit "${u}"; expected mm, cm, m, in or ft`);
  return { value, unit: u === '' ? null : (u as LengthUnit), text: text.trim() };
}

/** "7850", "7850 kg/m3", "7.85 g/cm3" → kg/m³. */
export function parseDensity(text: string, where: string): number {
  const m = NUMBER_UNIT.exec(text);
  if (!m) throw new InputError(where, `expected a density such as "7850 kg/m3" or "7.85 g/cm3", got ${describeValue(text)}`);
  const value = Number(m[1]);
  if (!(value > 0) || !Number.isFinite(value)) throw new InputError(where, `expected a positive density, got ${describeValue(text)}`);
  const kgm3 = m[2] === '' ? value : densityToSI(value, parseDensityUnit(m[2], where));
  if (!(kgm3 >= 1 && kgm3 <= 30000)) {
    throw new InputError(where, `${text.trim()} is ${kgm3} kg/m³, outside 1 to 30 000 kg/m³; expected a density of a plate material (is the unit right?)`);
  }
  return kgm3;
}

/** Look a material up; the InputError names `where` instead of the bare word "material". */
export function lookupMaterial(name: string, where: string, table?: MaterialTable): PlateSpec['material'] {
  let m: Material;
  try {
    m = findMaterial(name, table);
  } catch (e) {
    if (e instanceof InputError) throw new InputError(where, e.detail);
    throw e;
  }
  return { id: m.id, name: m.name, density: m.density, source: m.source };
}

/** Settings from command-line texts (each optional). */
export function plateFromFlags(
  flags: { thickness?: string; material?: string; density?: string }, table?: MaterialTable,
): PlateSpec {
  const spec: PlateSpec = {};
  if (flags.density !== undefined && flags.material !== undefined) throw new InputError('--material', 'given together with --density; give one or the other');
  if (flags.thickness !== undefined) spec.thickness = parseThickness(flags.thickness, '--thickness');
  if (flags.material !== undefined) spec.material = lookupMaterial(flags.material, '--material', table);
  if (flags.density !== undefined) spec.density = parseDensity(flags.density, '--density');
  return spec;
}

/** `over` wins field by field. */
export function mergePlate(base: PlateSpec, over: PlateSpec): PlateSpec {
  return {
    thickness: over.thickness ?? base.thickness,
    material: over.material ?? base.material,
    // an explicit density in the row wins; a material in the row wins over a density on the command line
    density: over.density ?? (over.material ? undefined : base.density),
  };
}

/** Settings in a part's length unit. */
export function resolvePlate(spec: PlateSpec, partUnit: LengthUnit): ResolvedPlate {
  const out: ResolvedPlate = {};
  if (spec.thickness) out.thickness = spec.thickness.value * (spec.thickness.unit ? lengthFactor(spec.thickness.unit, partUnit) : 1);
  if (spec.material) out.material = spec.material.id;
  if (spec.density !== undefined) {
    out.density = spec.density;
    out.densitySource = 'given density';
  } else if (spec.material) {
    out.density = spec.material.density;
    out.densitySource = `${spec.material.id}: ${spec.material.source}`;
  }
  return out;
}
