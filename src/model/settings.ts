/**
 * The one settings grammar: thickness, density, material and length unit, parsed the same way wherever the
 * text comes from (part files, command-line flags, batch manifests, reference files).
 *
 *   thickness  10 · 10 mm · 0.375in · 3/8 in · 1 1/2 in · 12.7 mm · an expression in x and y
 *              (a bare number or an expression is in the part's own length unit)
 *   density    7850 · 7850 kg/m3 · 7.85 g/cm3 · 0.284 lb/in3 · 490 lb/ft3 · an expression in x and y
 *              (a bare number or an expression is in kg/m³)
 *   material   a material id or alias from the table (src/model/materials.ts) or a user file
 *   unit       mm · cm · m · in · ft (and the spellings millimetre(s), inch(es), ", …)
 *
 * Hard limits refuse what cannot be a plate (not a finite positive number, a thickness under 1 nm or over
 * 1 km, a density under 1 or over 30 000 kg/m³); softer plausibility ranges give a warning, never silence
 * (`plausibility`). Every command takes the same texts and applies the same rules.
 */
import { InputError, describeValue } from '../base/errors.js';
import { LENGTH_UNITS, type LengthUnit, isLengthUnit, lengthFactor } from '../base/units.js';
import { densityToSI, parseDensityUnit } from './massUnits.js';

/** A setting as given: the text (or JSON number) and where it was given ("--thickness", "layers[1].density", "job.csv row 4 thickness"). */
export interface GivenSetting {
  text: string | number;
  where: string;
}

export type ThicknessSetting =
  | { kind: 'constant'; value: number; unit: LengthUnit | null; text: string; where: string }
  | { kind: 'expression'; text: string; where: string };

export type DensitySetting =
  | { kind: 'constant'; kgm3: number; text: string; where: string }
  | { kind: 'expression'; text: string; where: string };

/** A warning as a fact; the output layer words it. */
export interface SettingWarning {
  code: 'density-implausible' | 'thickness-exceeds-part' | 'thickness-very-thin';
  where: string;
  value: number;
  /** The plausible range or the part size the value was compared with. */
  limit: number | [number, number];
  unit: string;
}

/** Hard limits (refused) and plausible ranges (warned). */
export const DENSITY_LIMITS_KGM3: readonly [number, number] = [1, 30_000];
export const DENSITY_PLAUSIBLE_KGM3: readonly [number, number] = [100, 25_000];
export const THICKNESS_LIMITS_M: readonly [number, number] = [1e-9, 1e3];
/** Thinner than this (0.01 mm) gets a warning: foil, or a unit slip. */
export const THICKNESS_THIN_M = 1e-5;

const LENGTH_SPELLINGS: Readonly<Record<string, LengthUnit>> = {
  mm: 'mm', millimetre: 'mm', millimetres: 'mm', millimeter: 'mm', millimeters: 'mm',
  cm: 'cm', centimetre: 'cm', centimetres: 'cm', centimeter: 'cm', centimeters: 'cm',
  m: 'm', metre: 'm', metres: 'm', meter: 'm', meters: 'm',
  in: 'in', inch: 'in', inches: 'in', '"': 'in', '″': 'in',
  ft: 'ft', foot: 'ft', feet: 'ft', "'": 'ft', '′': 'ft',
};

/** A length unit by name or spelling, or undefined. */
export function lengthUnitOf(text: string): LengthUnit | undefined {
  const t = text.trim().toLowerCase();
  return Object.prototype.hasOwnProperty.call(LENGTH_SPELLINGS, t) ? LENGTH_SPELLINGS[t] : undefined;
}

export function parseLengthUnit(text: unknown, where: string): LengthUnit {
  const u = typeof text === 'string' ? lengthUnitOf(text) : undefined;
  if (u === undefined) throw new InputError(where, `expected a length unit (${Object.keys(LENGTH_UNITS).join(', ')}), got ${describeValue(text)}`);
  return u;
}

// a decimal, a fraction "3/8", or a mixed number "1 1/2", then the rest (a unit, or nothing)
const AMOUNT = /^\s*(?:([+-]?\d+)\s+(\d+)\s*\/\s*(\d+)|([+-]?\d+)\s*\/\s*(\d+)|([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?))\s*(.*?)\s*$/;

/** "3/8 in" → { amount: 0.375, rest: 'in' }; undefined when the text does not start with a number. */
export function splitAmount(text: string): { amount: number; rest: string } | undefined {
  const m = AMOUNT.exec(text);
  if (!m) return undefined;
  let amount: number;
  if (m[1] !== undefined) {
    const whole = Number(m[1]), num = Number(m[2]), den = Number(m[3]);
    amount = (whole < 0 || m[1].startsWith('-') ? -1 : 1) * (Math.abs(whole) + num / den);
  } else if (m[4] !== undefined) amount = Number(m[4]) / Number(m[5]);
  else amount = Number(m[6]);
  return { amount, rest: m[7] };
}

const looksNumeric = (rest: string) => rest === '' || /^[a-zA-Z"'″′µ/³^0-9.\s]+$/.test(rest);

function checkRange(v: number, [lo, hi]: readonly [number, number], where: string, what: string, unit: string, shown: string): void {
  if (!Number.isFinite(v) || !(v > 0)) throw new InputError(where, `expected a positive ${what}, got ${shown}`);
  if (v < lo || v > hi) throw new InputError(where, `${shown} is ${Number(v.toPrecision(6))} ${unit}, outside ${lo} to ${hi} ${unit}; expected the ${what} of a plate (is the unit right?)`);
}

/**
 * Thickness: a number with an optional length unit, or an expression in x and y (part units). The hard limits
 * are checked for numbers with a unit here, and for bare numbers once the part's unit is known
 * (`thicknessInPartUnit`).
 */
export function parseThickness(given: GivenSetting): ThicknessSetting {
  const { where } = given;
  if (typeof given.text === 'number') {
    const v = given.text;
    if (!Number.isFinite(v) || !(v > 0)) throw new InputError(where, `expected a positive thickness, got ${describeValue(v)}`);
    return { kind: 'constant', value: v, unit: null, text: String(v), where };
  }
  const text = given.text.trim();
  if (text === '') throw new InputError(where, 'expected a thickness such as 10, "10 mm" or "3/8 in", got an empty text');
  const a = splitAmount(text);
  if (a && looksNumeric(a.rest)) {
    const unit = a.rest === '' ? null : lengthUnitOf(a.rest);
    if (a.rest !== '' && unit === undefined) {
      throw new InputError(where, `unknown length unit "${a.rest}" in ${describeValue(text)}; expected mm, cm, m, in or ft`);
    }
    if (!Number.isFinite(a.amount) || !(a.amount > 0)) throw new InputError(where, `expected a positive thickness, got ${describeValue(text)}`);
    if (unit) checkRange(a.amount * LENGTH_UNITS[unit], THICKNESS_LIMITS_M, where, 'thickness', 'm', describeValue(text));
    return { kind: 'constant', value: a.amount, unit: unit ?? null, text, where };
  }
  return { kind: 'expression', text, where };
}

/** Density: a number with an optional density unit (bare: kg/m³), or an expression in x and y (kg/m³). */
export function parseDensity(given: GivenSetting): DensitySetting {
  const { where } = given;
  if (typeof given.text === 'number') {
    const v = given.text;
    checkRange(v, DENSITY_LIMITS_KGM3, where, 'density', 'kg/m³', describeValue(v));
    return { kind: 'constant', kgm3: v, text: String(v), where };
  }
  const text = given.text.trim();
  if (text === '') throw new InputError(where, 'expected a density such as 7850, "7850 kg/m3" or "7.85 g/cm3", got an empty text');
  const a = splitAmount(text);
  if (a && looksNumeric(a.rest)) {
    const kgm3 = a.rest === '' ? a.amount : densityToSI(a.amount, parseDensityUnit(a.rest, where));
    checkRange(kgm3, DENSITY_LIMITS_KGM3, where, 'density', 'kg/m³', describeValue(text));
    return { kind: 'constant', kgm3, text, where };
  }
  return { kind: 'expression', text, where };
}

/** A constant thickness in the part's length unit, with the hard limits checked. */
export function thicknessInPartUnit(t: Extract<ThicknessSetting, { kind: 'constant' }>, partUnit: LengthUnit): number {
  const v = t.value * (t.unit ? lengthFactor(t.unit, partUnit) : 1);
  checkRange(v * LENGTH_UNITS[partUnit], THICKNESS_LIMITS_M, t.where, 'thickness', 'm', t.unit ? describeValue(t.text) : `${describeValue(t.text)} ${partUnit}`);
  return v;
}

/** Warnings for values outside the plausible ranges (never silence). `partSize`: largest extent, part unit. */
export function plausibility(
  s: { thickness?: number; thicknessWhere?: string; density?: number; densityWhere?: string },
  partUnit: LengthUnit, partSize: number,
): SettingWarning[] {
  const out: SettingWarning[] = [];
  if (s.density !== undefined && (s.density < DENSITY_PLAUSIBLE_KGM3[0] || s.density > DENSITY_PLAUSIBLE_KGM3[1])) {
    out.push({ code: 'density-implausible', where: s.densityWhere ?? 'density', value: s.density, limit: [...DENSITY_PLAUSIBLE_KGM3] as [number, number], unit: 'kg/m³' });
  }
  if (s.thickness !== undefined) {
    if (Number.isFinite(partSize) && partSize > 0 && s.thickness > partSize) {
      out.push({ code: 'thickness-exceeds-part', where: s.thicknessWhere ?? 'thickness', value: s.thickness, limit: partSize, unit: partUnit });
    }
    if (s.thickness * LENGTH_UNITS[partUnit] < THICKNESS_THIN_M) {
      out.push({ code: 'thickness-very-thin', where: s.thicknessWhere ?? 'thickness', value: s.thickness, limit: THICKNESS_THIN_M / LENGTH_UNITS[partUnit], unit: partUnit });
    }
  }
  return out;
}

export { isLengthUnit };
