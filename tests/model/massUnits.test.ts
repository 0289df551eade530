import { describe, it, expect } from 'vitest';
import { InputError } from '../../src/base/errors.js';
import {
  DENSITY_UNITS,
  MASS_MOMENT_UNITS,
  MASS_UNITS,
  POUND_KG,
  STANDARD_GRAVITY,
  densityToSI,
  massFromKg,
  massMomentFromSI,
  massOfVolume,
  parseDensityUnit,
  parseMassMomentUnit,
  parseMassUnit,
  standardWeight,
} from '../../src/model/index.js';

/** Exact rational value of a finite positive double: [numerator, denominator = 2^k]. */
function rationalOf(d: number): [bigint, bigint] {
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, d);
  const bits = view.getBigUint64(0);
  const exp = Number((bits >> 52n) & 0x7ffn);
  const frac = bits & ((1n << 52n) - 1n);
  const mant = exp === 0 ? frac : frac | (1n << 52n);
  const e = (exp === 0 ? 1 : exp) - 1075; // d = mant * 2^e
  return e >= 0 ? [mant << BigInt(e), 1n] : [mant, 1n << BigInt(-e)];
}

/** True when the double f is the correctly rounded value of the exact rational p/q (within half an ulp). */
function correctlyRounded(f: number, p: bigint, q: bigint): boolean {
  const [fn, fd] = rationalOf(f);
  const [un, ud] = rationalOf(2 ** (Math.floor(Math.log2(f)) - 52));
  const diff = fn * q - p * fd;
  const absDiff = diff < 0n ? -diff : diff;
  return 2n * absDiff * ud <= un * fd * q;
}

// Exact definitions, NIST SP 811 (2008), appendix B: 1 lb = 0.45359237 kg, 1 in = 0.0254 m,
// 1 ft = 0.3048 m. As integers: lb = 45359237/10^8 kg, in = 254/10^4 m, ft = 3048/10^4 m.
const LB = [45359237n, 10n ** 8n] as const;
const IN = [254n, 10n ** 4n] as const;
const FT = [3048n, 10n ** 4n] as const;

describe('exact factors (NIST SP 811 definitions)', () => {
  it('pound and gram', () => {
    expect(POUND_KG).toBe(0.45359237);
    expect(MASS_UNITS.lb).toBe(0.45359237);
    expect(MASS_UNITS.g).toBe(0.001);
    expect(MASS_UNITS.kg).toBe(1);
  });
  it('standard gravity is 9.80665 m/s² (3rd CGPM 1901; NIST SP 811)', () => {
    expect(STANDARD_GRAVITY).toBe(9.80665);
    expect(standardWeight(1)).toBe(9.80665);
  });
  it('density factors are the exact rationals correctly rounded', () => {
    // lb/in³ = lb / in³ = (45359237/10^8) / (254^3/10^12)
    expect(correctlyRounded(DENSITY_UNITS['lb/in3'], LB[0] * IN[1] ** 3n, LB[1] * IN[0] ** 3n)).toBe(true);
    expect(correctlyRounded(DENSITY_UNITS['lb/ft3'], LB[0] * FT[1] ** 3n, LB[1] * FT[0] ** 3n)).toBe(true);
    expect(DENSITY_UNITS['g/cm3']).toBe(1000);
  });
  it('mass-moment factors are the exact rationals correctly rounded', () => {
    expect(correctlyRounded(MASS_MOMENT_UNITS['lb·in²'], LB[0] * IN[0] ** 2n, LB[1] * IN[1] ** 2n)).toBe(true);
    expect(correctlyRounded(MASS_MOMENT_UNITS['lb·ft²'], LB[0] * FT[0] ** 2n, LB[1] * FT[1] ** 2n)).toBe(true);
    expect(MASS_MOMENT_UNITS['kg·mm²']).toBe(1e-6);
    expect(MASS_MOMENT_UNITS['g·cm²']).toBe(1e-7);
  });
  it('the self-check above can fail: a factor off by 1 ulp is caught', () => {
    const f = DENSITY_UNITS['lb/in3'];
    const off = f + 2 ** (Math.floor(Math.log2(f)) - 52);
    expect(correctlyRounded(off, LB[0] * IN[1] ** 3n, LB[1] * IN[0] ** 3n)).toBe(false);
  });
  it('agrees with the rounded conversion factors printed in NIST SP 811 appendix B.9 (7 digits, from memory)', () => {
    // pound per cubic inch → 2.767 990 E+04 kg/m³; pound per cubic foot → 1.601 846 E+01 kg/m³;
    // pound square inch → 2.926 397 E−04 kg·m²; pound square foot → 4.214 011 E−02 kg·m².
    const rel = (a: number, b: number) => Math.abs(a - b) / b;
    expect(rel(DENSITY_UNITS['lb/in3'], 2.76799e4)).toBeLessThan(5e-7);
    expect(rel(DENSITY_UNITS['lb/ft3'], 1.601846e1)).toBeLessThan(5e-7);
    expect(rel(MASS_MOMENT_UNITS['lb·in²'], 2.926397e-4)).toBeLessThan(5e-7);
    expect(rel(MASS_MOMENT_UNITS['lb·ft²'], 4.214011e-2)).toBeLessThan(5e-7);
  });
});

describe('conversions', () => {
  it('steel plate 1 m × 1 m × 10 mm at 7850 kg/m³ weighs 78.5 kg (common practice: 7.85 kg per m² per mm)', () => {
    const areaMm2 = 1000 * 1000;
    const thicknessMm = 10;
    expect(massOfVolume(areaMm2 * thicknessMm, 'mm', 7850)).toBeCloseTo(78.5, 12);
    expect(massOfVolume(1 * 0.01, 'm', 7850)).toBeCloseTo(78.5, 12);
    // per mm of thickness per m²
    expect(massOfVolume(1e6 * 1, 'mm', 7850)).toBeCloseTo(7.85, 13);
  });
  it('steel at 7850 kg/m³ is about 490 lb/ft³ (common practice, no source: the usual US figure)', () => {
    const lbPerFt3 = massFromKg(massOfVolume(1, 'ft', 7850), 'lb');
    expect(lbPerFt3).toBeCloseTo(490.06, 2);
    expect(densityToSI(lbPerFt3, 'lb/ft3')).toBeCloseTo(7850, 9);
  });
  it('round trips', () => {
    expect(massFromKg(0.45359237, 'lb')).toBe(1);
    expect(massFromKg(2.5, 'g')).toBeCloseTo(2500, 12);
    expect(massMomentFromSI(MASS_MOMENT_UNITS['lb·in²'], 'lb·in²')).toBe(1);
    expect(densityToSI(7.85, 'g/cm3')).toBeCloseTo(7850, 10);
  });
  it('parses unit spellings and rejects unknown ones with InputError', () => {
    expect(parseDensityUnit('kg/m³')).toBe('kg/m3');
    expect(parseDensityUnit(' g/cm^3 ')).toBe('g/cm3');
    expect(parseMassUnit('lbs')).toBe('lb');
    expect(parseMassMomentUnit('lb*in2')).toBe('lb·in²');
    expect(parseMassMomentUnit('kg.m2')).toBe('kg·m²');
    expect(() => parseMassUnit('ton', 'massUnit')).toThrow(InputError);
    expect(() => parseMassUnit('ton', 'massUnit')).toThrow(/^massUnit: unknown mass unit "ton"; expected one of kg, g, lb$/);
    expect(() => parseDensityUnit('toString')).toThrow(InputError);
    expect(() => parseDensityUnit(7)).toThrow(/unknown density unit number/);
  });
});
