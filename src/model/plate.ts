/**
 * The plate model: a part's shape (one or more layers), the plate data its file states (thickness,
 * density, material, layer heights) and where its length unit came from; and the one resolution of
 * thickness and density per layer from the file and from settings given elsewhere (flags, manifest cells),
 * through the one settings grammar (./settings.ts).
 *
 * Precedence, the same for every command:
 *   - the file's own figures;
 *   - `given` settings (measure/compare flags, a batch manifest row): a figure the file already states is
 *     refused (one place for each figure);
 *   - `defaults` (batch command-line defaults): fill only what neither the file nor the row states.
 * A density and a material for the same layer from the same place are refused; a density given in a more
 * specific place wins over a material from a less specific one.
 */
import { InputError } from '../base/errors.js';
import type { LengthUnit } from '../base/units.js';
import { compileExpression } from '../expr/index.js';
import type { Part } from '../geometry/part.js';
import { type Material, type MaterialTable, findMaterial } from './materials.js';
import {
  type DensitySetting, type GivenSetting, type SettingWarning, type ThicknessSetting,
  parseDensity, parseThickness, plausibility, thicknessInPartUnit,
} from './settings.js';

/** Where the length unit came from: stated by the file, chosen by the user, or assumed (warned). */
export type UnitSource = 'file' | 'option' | 'assumed';

export interface LayerSpec {
  name: string;
  /** JSON path of the layer ('' for a part without "layers"). */
  where: string;
  /** The layer's shape as a Part (name "<part> / <layer>"), not yet validated. */
  part: Part;
  thickness?: GivenSetting;
  density?: GivenSetting;
  material?: GivenSetting;
  /** Underside height, part length unit; undefined = stacked on the previous layer (first: 0). */
  z?: number;
  zWhere?: string;
}

export interface PlateModel {
  name: string;
  units: LengthUnit;
  unitSource: UnitSource;
  /** True when the file used "layers". */
  layered: boolean;
  layers: LayerSpec[];
}

/** A part read from a drawing (or a plain part file) as a plate of one layer with no stated thickness. */
export function singleLayerModel(part: Part, unitSource: UnitSource = 'file'): PlateModel {
  return { name: part.name, units: part.units, unitSource, layered: false, layers: [{ name: part.name, where: '', part }] };
}

/** Settings from outside the file. Plain data (crosses to worker threads). */
export interface PlateSettings {
  thickness?: GivenSetting;
  density?: GivenSetting;
  material?: GivenSetting;
}

/** Check settings early (before any part is read) so that a bad flag or cell is reported at once. */
export function checkSettings(s: PlateSettings, materials?: MaterialTable): void {
  if (s.density !== undefined && s.material !== undefined) {
    throw new InputError(s.material.where, `given together with a density (${s.density.where}); give one or the other`);
  }
  if (s.thickness) settingThickness(s.thickness);
  if (s.density) settingDensity(s.density);
  if (s.material) lookupMaterial(s.material, materials);
}

/** A thickness or density ready to evaluate. */
export interface Field {
  /** Where it was given: a JSON path ("layers[1].thickness"), a flag ("--thickness" → "thickness"), a cell. */
  where: string;
  what: 'thickness' | 'density';
  /** As given. */
  text: string;
  evaluate: (x: number, y: number) => number;
  /** Value when the field does not depend on x, y (thickness in the part's unit, density in kg/m³). */
  constant?: number;
}

/** Where a layer's density comes from: a material of the table, or a figure given at a place. */
export type DensityOrigin =
  | { kind: 'material'; id: string; name: string; density: number; source: string; origin: string; where: string }
  | { kind: 'given'; where: string; text: string };

export interface ResolvedLayer {
  name: string;
  where: string;
  part: Part;
  thickness: Field;
  density: Field;
  densityFrom: DensityOrigin;
  material?: string;
  /** Underside height, part length unit. */
  z0: number;
}

const settingThickness = (g: GivenSetting): ThicknessSetting => parseThickness(g);
const settingDensity = (g: GivenSetting): DensitySetting => parseDensity(g);

export function lookupMaterial(g: GivenSetting, table?: MaterialTable): Material {
  try {
    return findMaterial(String(g.text), table);
  } catch (e) {
    if (e instanceof InputError) throw new InputError(g.where, e.detail);
    throw e;
  }
}

function fmt(v: number): string {
  return Number.isFinite(v) ? String(Number(v.toPrecision(6))) : String(v);
}

function expressionField(text: string, where: string, what: 'thickness' | 'density'): Field {
  const c = compileExpression(text, where);
  if (c.isConstant) {
    const v = c.constant!;
    if (!(v > 0) || !Number.isFinite(v)) throw new InputError(where, `is ${fmt(v)}; expected a positive ${what}${what === 'density' ? ' in kg/m³' : ''}`);
    return { where, what, text, evaluate: () => v, constant: v };
  }
  return { where, what, text, evaluate: c.evaluate };
}

export function thicknessField(g: GivenSetting, partUnit: LengthUnit): Field {
  const t = settingThickness(g);
  if (t.kind === 'expression') return expressionField(t.text, t.where, 'thickness');
  const v = thicknessInPartUnit(t, partUnit);
  return { where: t.where, what: 'thickness', text: t.text, evaluate: () => v, constant: v };
}

export function densityField(g: GivenSetting): Field {
  const d = settingDensity(g);
  if (d.kind === 'expression') return expressionField(d.text, d.where, 'density');
  const v = d.kgm3;
  return { where: d.where, what: 'density', text: d.text, evaluate: () => v, constant: v };
}

/** The error for a thickness or density that is not positive and finite at a point. */
export function fieldError(field: Field, v: number, x: number, y: number): InputError {
  return new InputError(field.where, `is ${fmt(v)} at (${x.toFixed(1)}, ${y.toFixed(1)}); expected a positive ${field.what} everywhere on the part`);
}

export interface Resolution {
  /** Every layer resolved, or null when a thickness or a density is missing somewhere. */
  layers: ResolvedLayer[] | null;
  /** What is missing (for messages and for stated mass values that cannot be computed). */
  missing: ('thickness' | 'density')[];
  warnings: SettingWarning[];
}

/** Does the model or the settings say anything about thickness, density or material? */
export function hasPlateData(model: PlateModel, given: PlateSettings = {}, defaults: PlateSettings = {}): boolean {
  const any = (s: PlateSettings) => s.thickness !== undefined || s.density !== undefined || s.material !== undefined;
  return any(given) || any(defaults) || model.layers.some((l) => l.thickness !== undefined || l.density !== undefined || l.material !== undefined);
}

/**
 * Resolve thickness, density and height of every layer (see the precedence at the top of this file).
 * `partSize` (largest extent, part unit) feeds the plausibility warnings.
 */
export function resolveLayers(
  model: PlateModel, given: PlateSettings = {}, defaults: PlateSettings = {}, materials?: MaterialTable, partSize = NaN,
): Resolution {
  checkSettings(given, materials);
  checkSettings(defaults, materials);
  const out: ResolvedLayer[] = [];
  const missing = new Set<'thickness' | 'density'>();
  const warnings: SettingWarning[] = [];
  for (let i = 0; i < model.layers.length; i++) {
    const l = model.layers[i];
    if (given.thickness !== undefined && l.thickness) {
      throw new InputError(given.thickness.where, `the part file already gives a thickness at ${l.thickness.where}; give it in one place`);
    }
    const givenD = given.density ?? given.material;
    const fileD = l.density ?? l.material;
    if (givenD !== undefined && fileD !== undefined) {
      throw new InputError(givenD.where, `the part file already gives ${l.density ? 'a density' : 'a material'} at ${fileD.where}; give it in one place`);
    }
    const tSet = l.thickness ?? given.thickness ?? defaults.thickness;
    let dSet: { density?: GivenSetting; material?: GivenSetting };
    if (fileD) dSet = { density: l.density, material: l.material };
    else if (givenD) dSet = { density: given.density, material: given.material };
    else dSet = { density: defaults.density, material: defaults.material };
    if (!tSet) missing.add('thickness');
    if (!dSet.density && !dSet.material) missing.add('density');
    if (!tSet || (!dSet.density && !dSet.material)) continue;
    const thickness = thicknessField(tSet, model.units);
    let density: Field;
    let densityFrom: DensityOrigin;
    let material: string | undefined;
    if (dSet.density) {
      density = densityField(dSet.density);
      densityFrom = { kind: 'given', where: dSet.density.where, text: density.text };
    } else {
      const m = lookupMaterial(dSet.material!, materials);
      density = { where: dSet.material!.where, what: 'density', text: String(m.density), evaluate: () => m.density, constant: m.density };
      densityFrom = { kind: 'material', id: m.id, name: m.name, density: m.density, source: m.source, origin: m.origin, where: dSet.material!.where };
      material = m.id;
    }
    let z0: number;
    if (l.z !== undefined) z0 = l.z;
    else if (i === 0) z0 = 0;
    else {
      const prev = out[i - 1];
      if (prev === undefined || prev.thickness.constant === undefined) {
        throw new InputError(l.where, `expected "z" (height of the layer's underside): the layer below${prev ? `, "${prev.name}",` : ''} has ${prev ? 'a variable thickness' : 'no thickness'}, so there is no single top to stack on`);
      }
      z0 = prev.z0 + prev.thickness.constant;
    }
    warnings.push(...plausibility({ thickness: thickness.constant, thicknessWhere: thickness.where, density: density.constant, densityWhere: density.where }, model.units, partSize));
    out.push({ name: l.name, where: l.where, part: l.part, thickness, density, densityFrom, material, z0 });
  }
  return { layers: missing.size === 0 ? out : null, missing: [...missing], warnings };
}

/** One constant thickness and density for the whole plate (fabrication masses), when there is one. */
export interface ConstantPlate {
  /** Thickness in the part's length unit. */
  thickness: number;
  /** Density in kg/m³. */
  density: number;
  material?: string;
  densityFrom: DensityOrigin;
}

export function constantPlate(layers: ResolvedLayer[] | null): ConstantPlate | undefined {
  if (!layers || layers.length !== 1) return undefined;
  const l = layers[0];
  if (l.thickness.constant === undefined || l.density.constant === undefined) return undefined;
  return { thickness: l.thickness.constant, density: l.density.constant, material: l.material, densityFrom: l.densityFrom };
}

/**
 * The constant thickness (part unit) of a one-layer plate for a net area: the part file's own, or the given
 * text (labelled --thickness) where the file gives none; undefined when neither does. A thickness given in
 * both places is refused; one that varies over the plate is refused, or with `varying: 'omit'` gives undefined.
 */
export function netThickness(layer: LayerSpec, given: string | undefined, varying: 'refuse' | 'omit' = 'refuse'): number | undefined {
  if (given !== undefined && layer.thickness) {
    throw new InputError('--thickness', `the part file already gives a thickness (at "${layer.thickness.where}"); give it in one place`);
  }
  const g = layer.thickness ?? (given === undefined ? undefined : { text: given, where: '--thickness' });
  if (!g) return undefined;
  const f = thicknessField(g, layer.part.units);
  if (f.constant === undefined && varying === 'omit') return undefined;
  if (f.constant === undefined) throw new InputError(f.where, `a net area needs one constant thickness; "${f.text}" varies over the plate`);
  return f.constant;
}
