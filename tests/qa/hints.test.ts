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
