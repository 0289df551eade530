/**
 * Mass properties of plates: checked against closed forms derived by hand from the handbook moments of
 * rectangles and circles (from memory: rectangle b×h about its centre ∫x² dA = h·b³/12; disk of radius r
 * about its centre ∫x² dA = πr⁴/4; parallel-axis theorem), and against the trade's rule of thumb.
 */
import { describe, expect, it } from 'vitest';
import { measureMass } from '../../src/analysis/plate.js';
import { type PlateModel, resolveLayers } from '../../src/model/plate.js';
import { plateModelFromObject } from '../../src/read/partJson.js';
import { MASS_MOMENT_UNITS, MASS_UNITS } from '../../src/model/massUnits.js';
import { STANDARD_GRAVITY } from '../../src/properties/mass.js';
import { rel } from '../helpers.js';

/** Command-line style settings ({ thickness: '12' }) as given settings labelled with their flags. */
const given = (flags: Record<string, string>) => Object.fromEntries(Object.entries(flags).map(([k, v]) => [k, { text: v, where: `--${k}` }]));
const resolvePlate = (model: PlateModel, flags: Record<string, string>) => {
  const r = resolveLayers(model, given(flags));
  if (!r.layers) throw new Error(`part: no ${r.missing.join(' and ')}`);
  return r.layers;
};
const massOf = (obj: unknown, flags: Record<string, string> = {}, opts = {}) => {
  const model = plateModelFromObject(obj);
  return measureMass(model.name, model.units, resolvePlate(model, flags), opts);
};

const rect = (x: number, y: number, w: number, h: number) => ({ rectangle: { corner: [x, y], size: [w, h] } });
const circ = (x: number, y: number, d: number) => ({ circle: { center: [x, y], diameter: d } });

describe('mass of uniform plates', () => {
  it('a steel plate 1 m × 1 m × 10 mm weighs 78.5 kg', () => {
    // common practice, no source: steel plate weighs 7.85 kg per m² per mm of thickness
    const r = massOf({ units: 'mm', outline: rect(0, 0, 1000, 1000), thickness: 10, material: 'steel' });
    expect(Math.abs(r.quantities.mass.value - 78.5)).toBeLessThan(1e-9);
    expect(r.quantities.mass.error).toBeLessThan(1e-9);
    expect(r.quantities.mass.error).toBeGreaterThanOrEqual(Math.abs(r.quantities.mass.value - 78.5));
    // standard gravity 9.80665 m/s² exactly (NIST SP 811)
    expect(rel(r.quantities.weight.value, 78.5 * 9.80665)).toBeLessThan(1e-13);
    expect(STANDARD_GRAVITY).toBe(9.80665);
    expect(r.quantities.massCentreZ.value).toBeCloseTo(5, 12);
  });

  it('mass moments of a rectangular block: m(b² + t²)/12 and m(a² + b²)/12', () => {
    // handbook, from memory: rectangular block a×b×t about axes through its centre
    const a = 600, b = 250, t = 30;
    const r = massOf({ units: 'mm', outline: rect(-100, 40, a, b), thickness: t, density: 7850 });
    const m = 7850 * a * b * t * 1e-9;
    expect(rel(r.quantities.mass.value, m)).toBeLessThan(1e-13);
    const mm2 = 1e-6; // kg·mm² → kg·m²
    expect(rel(r.quantities.massMomentX.value, (m * (b * b + t * t)) / 12 * mm2)).toBeLessThan(1e-11);
    expect(rel(r.quantities.massMomentY.value, (m * (a * a + t * t)) / 12 * mm2)).toBeLessThan(1e-11);
    expect(rel(r.quantities.massMomentZ.value, (m * (a * a + b * b)) / 12 * mm2)).toBeLessThan(1e-11);
    expect(Math.abs(r.quantities.massProductXY.value)).toBeLessThan(1e-12);
    expect(r.quantities.massCentreX.value).toBeCloseTo(-100 + a / 2, 9);
    expect(r.quantities.massCentreY.value).toBeCloseTo(40 + b / 2, 9);
  });

  it('exact unit factors (NIST SP 811: 1 lb = 0.45359237 kg, 1 in = 25.4 mm)', () => {
    expect(MASS_UNITS.lb).toBe(0.45359237);
    expect(rel(MASS_MOMENT_UNITS['lb·in²'], 0.45359237 * 0.0254 * 0.0254)).toBeLessThan(1e-15);
    // the same plate in inches and in millimetres has the same mass
    const mm = massOf({ units: 'mm', outline: rect(0, 0, 254, 508), thickness: 25.4, material: 'steel' });
    const inch = massOf({ units: 'in', outline: rect(0, 0, 10, 20), thickness: 1, material: 'steel' });
    expect(rel(inch.quantities.mass.value, mm.quantities.mass.value)).toBeLessThan(1e-13);
    expect(rel(inch.quantities.massMomentZ.value, mm.quantities.massMomentZ.value)).toBeLessThan(1e-11);
  });
});

describe('variable thickness and density over a plate with a hole (closed forms by hand)', () => {
  // plate [0, 400] × [0, 200] less a disk of radius 40 at (300, 100)
  const r0 = 40, xc = 300, yc = 100;
  const disk = Math.PI * r0 * r0;
  const A = 400 * 200 - disk;
  const Ix1 = 200 * 400 * 200 - disk * xc; // ∫x dA
  const Ix2 = (200 * 400 ** 3) / 3 - disk * (xc * xc + (r0 * r0) / 4); // ∫x² dA
  const Iy1 = 400 * 200 * 100 - disk * yc; // ∫y dA
  const Ixy = (400 * 400 / 2) * (200 * 200 / 2) - disk * xc * yc; // ∫xy dA
  const part = { units: 'mm', outline: rect(0, 0, 400, 200), cutouts: [circ(xc, yc, 2 * r0)] };

  it('tapered thickness t = 20 − 0.025x, steel', () => {
    const r = massOf({ ...part, thickness: '20 - 0.025*x', density: 7850 });
    const S0 = 20 * A - 0.025 * Ix1; // ∫t dA
    const Sx = 20 * Ix1 - 0.025 * Ix2; // ∫t·x dA
    const Sy = 20 * Iy1 - 0.025 * Ixy; // ∫t·y dA
    const m = 7850 * S0 * 1e-9;
    const q = r.quantities;
    expect(rel(q.mass.value, m)).toBeLessThan(1e-12);
    expect(Math.abs(q.mass.value - m)).toBeLessThanOrEqual(q.mass.error);
    expect(Math.abs(q.massCentreX.value - Sx / S0)).toBeLessThan(1e-9);
    expect(Math.abs(q.massCentreX.value - Sx / S0)).toBeLessThanOrEqual(q.massCentreX.error);
    expect(Math.abs(q.massCentreY.value - Sy / S0)).toBeLessThan(1e-9);
    // z: ∫t²/2 dA / ∫t dA with t² = 400 − x + 0.000625x²
    const St2 = 400 * A - Ix1 + 0.000625 * Ix2;
    expect(Math.abs(q.massCentreZ.value - St2 / 2 / S0)).toBeLessThan(1e-9);
  });

  it('density ρ = 7000 + 2y kg/m³ at constant thickness 12', () => {
    const r = massOf({ ...part, thickness: 12, density: '7000 + 2*y' });
    const m = 12 * (7000 * A + 2 * Iy1) * 1e-9;
    expect(rel(r.quantities.mass.value, m)).toBeLessThan(1e-12);
    expect(Math.abs(r.quantities.mass.value - m)).toBeLessThanOrEqual(r.quantities.mass.error);
  });
});

describe('layers', () => {
  it('a pad stacked on a base plate: mass sums, z of the centre of mass from each mid-plane', () => {
    const r = massOf({
      units: 'mm',
      layers: [
        { name: 'base', outline: rect(0, 0, 400, 200), thickness: 20, material: 'steel' },
        { name: 'pad', outline: rect(50, 50, 100, 100), thickness: 12, density: 7850 },
      ],
    });
    const m1 = 7850 * 400 * 200 * 20 * 1e-9, m2 = 7850 * 100 * 100 * 12 * 1e-9;
    expect(rel(r.quantities.mass.value, m1 + m2)).toBeLessThan(1e-13);
    expect(r.layers.map((l) => l.z0)).toEqual([0, 20]);
    // by hand: z̄ = (m1·10 + m2·26)/(m1 + m2), x̄ = (m1·200 + m2·100)/(m1 + m2)
    expect(Math.abs(r.quantities.massCentreZ.value - (m1 * 10 + m2 * 26) / (m1 + m2))).toBeLessThan(1e-10);
    expect(Math.abs(r.quantities.massCentreX.value - (m1 * 200 + m2 * 100) / (m1 + m2))).toBeLessThan(1e-10);
    // Jz about the common centre: each block's m(a² + b²)/12 + m·d² (parallel axes, handbook from memory)
    const cx = (m1 * 200 + m2 * 100) / (m1 + m2), cy = (m1 * 100 + m2 * 100) / (m1 + m2);
    const Jz = m1 * (400 ** 2 + 200 ** 2) / 12 + m1 * ((200 - cx) ** 2 + (100 - cy) ** 2) +
      m2 * (100 ** 2 + 100 ** 2) / 12 + m2 * ((100 - cx) ** 2 + (100 - cy) ** 2);
    expect(rel(r.quantities.massMomentZ.value, Jz * 1e-6)).toBeLessThan(1e-11);
    const cz = (m1 * 10 + m2 * 26) / (m1 + m2);
    const Jx = m1 * (200 ** 2 + 20 ** 2) / 12 + m1 * ((100 - cy) ** 2 + (10 - cz) ** 2) +
      m2 * (100 ** 2 + 12 ** 2) / 12 + m2 * ((100 - cy) ** 2 + (26 - cz) ** 2);
    expect(rel(r.quantities.massMomentX.value, Jx * 1e-6)).toBeLessThan(1e-11);
  });

  it('a layer on top of a tapered one needs an explicit z', () => {
    expect(() => massOf({
      layers: [
        { name: 'base', outline: rect(0, 0, 400, 200), thickness: '20 - 0.01*x', material: 'steel' },
        { name: 'pad', outline: rect(50, 50, 100, 100), thickness: 12, material: 'steel' },
      ],
    })).toThrow(/layers\[1\]: expected "z"/);
  });
});

describe('bad thickness and density are found by the integration', () => {
  it('thickness that goes negative inside the part is reported with its place', () => {
    // 20 − 0.025x reaches zero at x = 800: the plate runs to 1000
    let msg = '';
    try {
      massOf({ outline: rect(0, 0, 1000, 80), thickness: '20 - 0.025*x', material: 'steel' });
    } catch (e) {
      msg = (e as Error).message;
    }
    const m = /^thickness: is (-?[\d.e-]+) at \(([\d.]+), ([\d.]+)\); expected a positive thickness everywhere on the part$/.exec(msg);
    expect(m, msg).not.toBeNull();
    expect(Number(m![1])).toBeLessThanOrEqual(0);
    expect(Number(m![2])).toBeGreaterThanOrEqual(799.9);
  });
  it('a layer density that is NaN somewhere names the layer', () => {
    expect(() => massOf({ layers: [{ name: 'a', outline: rect(0, 0, 100, 100), thickness: 10, density: 'sqrt(50 - x)*1000' }] }))
      .toThrow(/^layers\[0\]\.density: is NaN at \((\d+\.\d), (\d+\.\d)\)/);
  });
  it('flags fill in; a flag that repeats the file is refused', () => {
    const model = plateModelFromObject({ outline: rect(0, 0, 100, 100), thickness: 10 });
    expect(() => resolvePlate(model, { thickness: '12', material: 'steel' })).toThrow(/--thickness: the part file already gives a thickness at thickness/);
    const ok = resolvePlate(model, { material: 'aluminium' });
    expect(ok[0].density.constant).toBe(2700);
    expect(() => resolvePlate(model, {})).toThrow(/part: no density/);
    expect(() => resolvePlate(model, { material: 'unobtainium' })).toThrow(/^--material: unknown material/);
  });
});
