/**
 * Mass, mass-moment and density units with exact factors, and standard gravity.
 * Definitions (exact): 1 lb = 0.45359237 kg, 1 in = 0.0254 m, 1 ft = 0.3048 m (NIST SP 811,
 * 2008 edition, appendix B); standard acceleration of gravity g_n = 9.80665 m/s² (3rd CGPM, 1901;
 * NIST SP 811). Each compound factor below is written as ONE division of two integers that doubles
 * hold exactly, so it is the correctly rounded double of the exact rational value
 * (e.g. lb/in³ = 0.45359237 / 0.0254³ = 453 592 370 000 / 254³).
 */
import { InputError } from '../base/errors.js';
import { LENGTH_UNITS, type LengthUnit } from '../base/units.js';

/** kg per pound, exact by definition. */
export const POUND_KG = 0.45359237;
/** Standard acceleration of gravity in m/s², exact by definition. */
export const STANDARD_GRAVITY = 9.80665;

export type MassUnit = 'kg' | 'g' | 'lb';
/** Factor from each mass unit to kilograms. */
export const MASS_UNITS: Readonly<Record<MassUnit, number>> = Object.freeze({
  kg: 1,
  g: 0.001,
  lb: POUND_KG,
});

export type MassMomentUnit = 'kg·m²' | 'kg·mm²' | 'g·cm²' | 'lb·in²' | 'lb·ft²';
/** Factor from each mass-moment-of-inertia unit to kg·m². */
export const MASS_MOMENT_UNITS: Readonly<Record<MassMomentUnit, number>> = Object.freeze({
  'kg·m²': 1,
  'kg·mm²': 1e-6,
  'g·cm²': 1e-7,
  'lb·in²': (45359237 * 254 * 254) / 1e16, // 0.45359237 kg × (0.0254 m)²
  'lb·ft²': (45359237 * 3048 * 3048) / 1e16, // 0.45359237 kg × (0.3048 m)²
});

export type DensityUnit = 'kg/m3' | 'g/cm3' | 'lb/in3' | 'lb/ft3';
/** Factor from each density unit to kg/m³. */
export const DENSITY_UNITS: Readonly<Record<DensityUnit, number>> = Object.freeze({
  'kg/m3': 1,
  'g/cm3': 1000,
  'lb/in3': 453592370000 / (254 * 254 * 254), // 0.45359237 kg / (0.0254 m)³
  'lb/ft3': 453592370000 / (3048 * 3048 * 3048), // 0.45359237 kg / (0.3048 m)³
});

/** Other spellings accepted on input, mapped to the canonical names above. */
const SPELLINGS: Readonly<Record<string, string>> = Object.freeze({
  'kg/m³': 'kg/m3',
  'kg/m^3': 'kg/m3',
  'g/cm³': 'g/cm3',
  'g/cm^3': 'g/cm3',
  'g/cc': 'g/cm3',
  'lb/in³': 'lb/in3',
  'lb/in^3': 'lb/in3',
  'lb/ft³': 'lb/ft3',
  'lb/ft^3': 'lb/ft3',
  lbs: 'lb',
  'kg*m2': 'kg·m²',
  'kg.m2': 'kg·m²',
  'kg*m^2': 'kg·m²',
  'kg·m2': 'kg·m²',
  'kg*mm2': 'kg·mm²',
  'kg.mm2': 'kg·mm²',
  'kg*mm^2': 'kg·mm²',
  'g*cm2': 'g·cm²',
  'g.cm2': 'g·cm²',
  'g*cm^2': 'g·cm²',
  'lb*in2': 'lb·in²',
  'lb.in2': 'lb·in²',
  'lb*in^2': 'lb·in²',
  'lb·in2': 'lb·in²',
  'lb*ft2': 'lb·ft²',
  'lb.ft2': 'lb·ft²',
  'lb*ft^2': 'lb·ft²',
  'lb·ft2': 'lb·ft²',
});

function parseUnit<U extends string>(table: Readonly<Record<U, number>>, text: unknown, where: string, what: string): U {
  if (typeof text === 'string') {
    const t = text.trim();
    const canon = Object.prototype.hasOwnProperty.call(SPELLINGS, t) ? SPELLINGS[t]! : t;
    if (Object.prototype.hasOwnProperty.call(table, canon)) return canon as U;
  }
  const shown = typeof text === 'string' ? `"${text}"` : typeof text;
  throw new InputError(where, `unknown ${what} unit ${shown}; expected one of ${Object.keys(table).join(', ')}`);
}

export function parseMassUnit(text: unknown, where = 'mass unit'): MassUnit {
  return parseUnit(MASS_UNITS, text, where, 'mass');
}
export function parseMassMomentUnit(text: unknown, where = 'mass moment unit'): MassMomentUnit {
  return parseUnit(MASS_MOMENT_UNITS, text, where, 'mass moment');
}
export function parseDensityUnit(text: unknown, where = 'density unit'): DensityUnit {
  return parseUnit(DENSITY_UNITS, text, where, 'density');
}

/** Mass in kg → mass in `to`. */
export function massFromKg(kg: number, to: MassUnit): number {
  return to === 'kg' ? kg : kg / MASS_UNITS[to];
}
/** Mass moment of inertia in kg·m² → value in `to`. */
export function massMomentFromSI(kgm2: number, to: MassMomentUnit): number {
  return to === 'kg·m²' ? kgm2 : kgm2 / MASS_MOMENT_UNITS[to];
}
/** Density in `from` → kg/m³. */
export function densityToSI(value: number, from: DensityUnit): number {
  return from === 'kg/m3' ? value : value * DENSITY_UNITS[from];
}

/**
 * Mass in kg of a volume given in cubic `lengthUnit` at a density in kg/m³.
 * (The length unit is cubed separately from the volume, so 10^9 mm³ × 7850 gives 7850 kg.)
 */
export function massOfVolume(volume: number, lengthUnit: LengthUnit, densityKgPerM3: number): number {
  const f = LENGTH_UNITS[lengthUnit];
  return volume * f * f * f * densityKgPerM3;
}

/** Weight force in newtons of a mass in kg under standard gravity. */
export function standardWeight(massKg: number): number {
  return massKg * STANDARD_GRAVITY;
}
