/**
 * Hints on failed rows and advice on undecided ones (common practice, no source): a product of inertia
 * stated with the other sign convention, a principal angle of the other axis, a unit slip by a power of ten
 * or of 25.4 (1 in = 25.4 mm exactly, NIST SP 811); notes from the reference shown; the table fits 100 columns.
 * The stated values are invented for the test.
 */
import { describe, expect, it } from 'vitest';
import { readReference } from '../../src/qa/reference.js';
import { compareAll } from '../../src/qa/verdict.js';
import { comparisonText, rowAdvice } from '../../src/output/compareText.js';

const computed = {
  area: { value: 1234.5, error: 1e-9 }, Ixy: { value: -52000, error: 1e-6 }, principalAngle: { value: 21.3, error: 1e-9 },
  width: { value: 80, error: 1e-12 }, Ix: { value: 2.5e6, error: 1e-6 }, Iy: { value: 1.1e6, error: 1e-6 },
};
const ctx = { lengthUnit: 'mm' as const, partSize: 100 };

describe('hints and advice', () => {
  it('names the slip behind each failed row, and none where the difference is ordinary', () => {
    const ref = readReference(JSON.stringify({
      values: [
        { quantity: 'Ixy', value: 52000, unit: 'mm4', note: 'from the customer sheet' },
        { quantity: 'principalAngle', value: 111.3, unit: 'deg' },
        { quantity: 'area', value: 123450, unit: 'mm2' },
        { quantity: 'width', value: 80 / 25.4 * 25.4 * 25.4, unit: 'mm' },
        { quantity: 'Ix', value: 2.6e6, unit: 'mm4' },
      ],
    }), 'ref.json');
    const c = compareAll(ref, computed, ctx);
    const h = Object.fromEntries(c.rows.map((r) => [r.quantity, r.hint]));
    expect(h.Ixy).toEqual({ code: 'opposite-sign' });
    expect(h.principalAngle).toEqual({ code: 'other-principal-axis' });
    expect(h.area).toMatchObject({ code: 'unit-slip', base: 10, power: 2 });
    expect(h.width).toMatchObject({ code: 'unit-slip', base: 25.4, power: 1 });
    expect(h.Ix).toBeUndefined(); // 4 % off: an ordinary difference, no hint
    const text = comparisonText(c, { file: 'p.json', part: 'p', reference: 'ref.json', lengthUnit: 'mm' });
    expect(text).toMatch(/Ixy: the reference notes: "from the customer sheet"/);
    expect(text).toMatch(/Ixy: the stated value is the computed one with the opposite sign/);
    for (const l of text.split('\n')) expect(l.length, l).toBeLessThanOrEqual(100);
  });
  it('an inconclusive row says what would decide it', () => {
    const ref = readReference(JSON.stringify({ values: [{ quantity: 'area', value: 1234.5000004, unit: 'mm2', tolerance: '0.0000005 mm2' }] }), 'ref.json');
    const c = compareAll(ref, { area: { value: 1234.5, error: 1e-6 } }, ctx);
    expect(c.rows[0].verdict).toBe('inconclusive');
    expect(rowAdvice(c.rows[0]).join(' ')).toMatch(/too large to decide against the tolerance: raise --degree or --levels/);
  });
});

describe('tolerance from the stated digits (common practice, no source: half a unit in the last digit written)', () => {
  it('reads the place value of the last digit from the text as written', async () => {
    const { lastDigitOf } = await import('../../src/qa/reference.js');
    expect(lastDigitOf('0.588')).toBe(0.001);
    expect(lastDigitOf('0.5880')).toBe(0.0001);
    expect(lastDigitOf('588')).toBe(1);
    expect(lastDigitOf('1.20e3')).toBe(10);
    expect(lastDigitOf('7.5E-4')).toBe(1e-5);
    expect(lastDigitOf('.5')).toBe(0.1);
  });
  it('0.588 m passes against 587.96 mm only with the option, and the output says where the tolerance came from', () => {
    const ref = readReference('quantity,value,unit\ncutLength,0.588,m\nwidth,80.0,mm\n', 'ref.csv');
    const q = { cutLength: { value: 587.96, error: 1e-9 }, width: { value: 80.04, error: 1e-12 } };
    const plain = compareAll(ref, q, ctx);
    // default length tolerance 0.01 mm + 0.01 % of 100 mm = 0.02 mm: 0.04 mm off fails
    expect(plain.rows.map((r) => r.verdict)).toEqual(['fail', 'fail']);
    const c = compareAll(ref, q, { ...ctx, toleranceFromDigits: true });
    expect(c.rows[0]).toMatchObject({ verdict: 'pass', toleranceSource: 'digits' });
    expect(c.rows[0].tolerance).toBeCloseTo(0.5, 12); // ± 0.0005 m in the part's mm
    expect(c.rows[0].toleranceText).toBe('half the last stated digit: ± 0.0005 m');
    expect(c.rows[1]).toMatchObject({ verdict: 'pass', toleranceSource: 'digits' }); // 80.0 → ± 0.05 mm
    const text = comparisonText(c, { file: 'p.json', part: 'p', reference: 'ref.csv', lengthUnit: 'mm' });
    expect(text).toMatch(/0\.5 †/);
    expect(text.replace(/\n\s*/g, ' ')).toMatch(/† tolerance from the stated digits: half a unit in the last digit written/);
  });
  it('a tolerance written in the reference wins over the digits', () => {
    const ref = readReference('quantity,value,unit,tolerance\ncutLength,0.588,m,0.01 mm\n', 'ref.csv');
    const c = compareAll(ref, { cutLength: { value: 587.96, error: 1e-9 } }, { ...ctx, toleranceFromDigits: true });
    expect(c.rows[0]).toMatchObject({ verdict: 'fail', toleranceSource: 'reference' });
  });
});

describe('thickness slip (mass is linear in a constant thickness; common practice, no source)', () => {
  const mass = { mass: { value: 3.2887, error: 1e-9 }, weight: { value: 32.25, error: 1e-9 } };
  it('a mass stated for a 10 mm plate against one computed at 12 mm gets the hint', () => {
    const ref = readReference('quantity,value,unit\nmass,2.741,kg\n', 'ref.csv');
    const c = compareAll(ref, mass, { ...ctx, thickness: 12 });
    expect(c.rows[0].hint).toEqual({ code: 'thickness-slip', thickness: 10, used: 12, unit: 'mm' });
    expect(rowAdvice(c.rows[0]).join(' ')).toMatch(/fits a plate 10 mm thick \(computed with 12 mm\): a thickness slip, or another density\?/);
  });
  it('no hint for an ordinary difference, nor without a known thickness', () => {
    const ref = readReference('quantity,value,unit\nmass,3.1,kg\n', 'ref.csv');
    // 3.1 / 3.2887 × 12 = 11.31 mm: 0.19 mm from 11.5 mm, which gives 3.152 kg, outside 0.5 %
    expect(compareAll(ref, mass, { ...ctx, thickness: 12 }).rows[0].hint).toBeUndefined();
    const ref2 = readReference('quantity,value,unit\nmass,2.741,kg\n', 'ref.csv');
    expect(compareAll(ref2, mass, ctx).rows[0].hint).toBeUndefined();
  });
});
