import { describe, it, expect } from 'vitest';
import { judge, angleDifference, compareAll, defaultTolerance } from '../../src/qa/verdict.js';
import { parseReferenceJson, parseReferenceCsv } from '../../src/qa/reference.js';
import type { Quantity } from '../../src/properties/quantities.js';

// Boundary cases use values exact in binary (halves and quarters) so that d + e and d − e are exact.
describe('judge: the pass / fail / inconclusive rule', () => {
  const abs = (value: number) => ({ kind: 'absolute' as const, value });
  it('pass exactly at d + e = T, inconclusive just past it', () => {
    expect(judge(100, abs(0.75), { value: 100.5, error: 0.25 }).verdict).toBe('pass');
    expect(judge(100, abs(0.75), { value: 99.5, error: 0.25 }).verdict).toBe('pass');
    expect(judge(100, abs(0.75), { value: 100.5, error: 0.25 + 2 ** -40 }).verdict).toBe('inconclusive');
  });
  it('fail only when d − e > T; at d − e = T it is inconclusive', () => {
    expect(judge(100, abs(0.75), { value: 101, error: 0.25 }).verdict).toBe('inconclusive');
    expect(judge(100, abs(0.75), { value: 101 + 2 ** -30, error: 0.25 }).verdict).toBe('fail');
    expect(judge(100, abs(0.75), { value: 98, error: 0.25 }).verdict).toBe('fail');
  });
  it('a large error estimate makes an otherwise good value inconclusive', () => {
    expect(judge(100, abs(0.5), { value: 100, error: 0.25 }).verdict).toBe('pass');
    expect(judge(100, abs(0.5), { value: 100, error: 0.75 }).verdict).toBe('inconclusive');
  });
  it('relative tolerance is taken of |stated|', () => {
    // 0.5% of 200 = 1 (binary-exact operands: 0.005·200 rounds to 1 exactly)
    const j = judge(200, { kind: 'relative', fraction: 0.005 }, { value: 201, error: 0 });
    expect(j.tolerance).toBe(1);
    expect(j.verdict).toBe('pass');
    expect(judge(-200, { kind: 'relative', fraction: 0.005 }, { value: -201.5, error: 0 }).verdict).toBe('fail');
    // same difference, absolute 1 vs relative 0.1%: pass vs fail
    expect(judge(200, { kind: 'absolute', value: 1 }, { value: 200.75, error: 0 }).verdict).toBe('pass');
    expect(judge(200, { kind: 'relative', fraction: 0.001 }, { value: 200.75, error: 0 }).verdict).toBe('fail');
    expect(judge(0, { kind: 'relative', fraction: 0.01 }, { value: 0, error: 0 }).verdict).toBe('pass');
    expect(judge(0, { kind: 'relative', fraction: 0.01 }, { value: 1e-300, error: 0 }).verdict).toBe('fail');
  });
  it('angles are compared modulo 180°', () => {
    expect(angleDifference(89.9, -89.9)).toBeCloseTo(-0.2, 12);
    expect(angleDifference(0, 180)).toBe(0);
    expect(angleDifference(10, 370)).toBe(0);
    expect(judge(-89.9, abs(0.25), { value: 89.9, error: 0 }, { angle: true }).verdict).toBe('pass');
    expect(judge(-89.9, abs(0.25), { value: 89.9, error: 0 }).verdict).toBe('fail'); // without the angle rule
    expect(judge(45, abs(0.05), { value: 135, error: 0 }, { angle: true }).verdict).toBe('fail');
  });
  it('non-finite values or errors are inconclusive', () => {
    expect(judge(1, abs(1), { value: NaN, error: 0 }).verdict).toBe('inconclusive');
    expect(judge(1, abs(1), { value: 1, error: Infinity }).verdict).toBe('inconclusive');
  });
});

describe('compareAll', () => {
  const computed: Record<string, Quantity> = {
    area: { value: 3000, error: 1e-9 },
    centroidX: { value: 50, error: 1e-12 },
    Ix: { value: 2.5e6, error: 1 },
    Iy: { value: 1.5e6, error: 1 },
    Ixy: { value: 0.5, error: 1e-6 },
    principalAngle: { value: 89.98, error: 1e-6 },
    pierces: { value: 3, error: 0 },
    scrapFraction: { value: 0.2, error: 1e-9 },
  };
  const ctx = { lengthUnit: 'mm' as const, partSize: 100 };

  it('converts stated units, applies given and default tolerances, and sums up', () => {
    const ref = parseReferenceJson(JSON.stringify({
      values: [
        // 4.65 in² = 2999.994 mm² (× 645.16, NIST SP 811): 0.006 mm² off, more than 0.0001% (0.003 mm²) → fail
        { quantity: 'area', value: 4.65, unit: 'in²', tolerance: '0.0001%' },
        { quantity: 'centroidX', value: '5.0005 cm' }, // default 0.01 mm + 0.01 mm: |50.005 − 50| = 0.005 → pass
        { quantity: 'Ix', value: 2.502e6, unit: 'mm4' }, // 0.08% off: passes the 0.1% default
        { quantity: 'Iy', value: 1.51, unit: 'cm^4' }, // 1.51 cm⁴ = 15100 mm⁴: far off → fail
        { quantity: 'Ixy', value: 0, unit: 'mm⁴' }, // default 0.1% of Ix + Iy = 4000 → pass
        { quantity: 'principalAngle', value: -90, unit: 'deg' }, // wraps: 0.02° off, default 0.05°
        { quantity: 'pierces', value: 3 },
        { quantity: 'scrapFraction', value: 20.05, unit: '%' }, // 0.0005 off, default 0.001
        { quantity: 'cutLength', value: 10, unit: 'mm' }, // not computed in this run
      ],
    }), 'ref.json');
    const c = compareAll(ref, computed, ctx);
    const v = Object.fromEntries(c.rows.map((r) => [r.quantity, r.verdict]));
    expect(v).toEqual({
      area: 'fail', centroidX: 'pass', Ix: 'pass', Iy: 'fail', Ixy: 'pass', principalAngle: 'pass',
      pierces: 'pass', scrapFraction: 'pass', cutLength: 'inconclusive',
    });
    const area = c.rows[0];
    expect(area.stated).toBe(4.65 * 645.16);
    expect(area.toleranceSource).toBe('reference');
    expect(c.rows[4].tolerance).toBeCloseTo(4000, 9);
    expect(c.rows[8].note).toMatch(/not computed/);
    expect(c.verdict).toBe('fail');
    expect(c.counts).toEqual({ pass: 6, fail: 2, inconclusive: 1 });
    expect(c.caution).toMatch(/not a structural, lifting/);
  });

  it('the same stated area at 4 significant figures passes the default; overall pass', () => {
    // 3000 mm² = 4.650 in² to 4 figures (2999.994 mm², 0.0002% off)
    const ref = parseReferenceCsv('quantity,value,unit\narea,4.650,in²\n', 'ref.csv');
    const c = compareAll(ref, computed, ctx);
    expect(c.rows[0].verdict).toBe('pass');
    expect(c.rows[0].toleranceText).toMatch(/default/);
    expect(c.verdict).toBe('pass');
  });

  it('a computed error estimate too large gives an inconclusive overall verdict', () => {
    const ref = parseReferenceCsv('quantity,value,unit,tolerance\nIx,2.5e6,mm^4,10 mm^4\n', 'ref.csv');
    const c = compareAll(ref, computed, ctx);
    expect(c.rows[0].verdict).toBe('pass');
    const c2 = compareAll(ref, { ...computed, Ix: { value: 2.5e6, error: 20 } }, ctx);
    expect(c2.verdict).toBe('inconclusive');
  });

  it('a value whose ± is not a bound (errorIsBound: false) is inconclusive, however close (issue 13 item 5)', () => {
    const ref = parseReferenceCsv('quantity,value,unit,tolerance\nIx,2.5e6,mm^4,10 mm^4\n', 'ref.csv');
    const c = compareAll(ref, { ...computed, Ix: { value: 2.5e6, error: 1, errorIsBound: false } }, ctx);
    expect(c.rows[0].verdict).toBe('inconclusive');
    expect(c.rows[0].note).toMatch(/not a bound/);
    expect(c.verdict).toBe('inconclusive');
    // nor can it fail: far off, the difference could still be within an unbounded error
    const far = parseReferenceCsv('quantity,value,unit,tolerance\nIx,3e6,mm^4,10 mm^4\n', 'ref.csv');
    expect(compareAll(far, { ...computed, Ix: { value: 2.5e6, error: 1, errorIsBound: false } }, ctx).rows[0].verdict).toBe('inconclusive');
    expect(compareAll(far, computed, ctx).rows[0].verdict).toBe('fail');
  });

  it('default length tolerance scales with the part unit', () => {
    const dIn = defaultTolerance('centroidX', 'length', { lengthUnit: 'in', partSize: 10 });
    expect(dIn.tolerance).toEqual({ kind: 'absolute', value: 0.01 / 25.4 + 1e-3 });
    expect(defaultTolerance('pierces', 'count', ctx).tolerance).toEqual({ kind: 'absolute', value: 0 });
  });
});
