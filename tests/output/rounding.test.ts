/**
 * Rounding of values shown beside their estimate (src/output/numbers.ts, formatValue): to the decimal place
 * of the estimate's second significant digit, at most 10 significant digits, 0 when it rounds to zero there.
 * Common practice, no source (an uncertainty to two digits and the value to the same place). Each expected
 * text is worked out by hand from the rule.
 */
import { describe, expect, it } from 'vitest';
import { formatError, formatValue } from '../../src/output/numbers.js';

describe('values rounded to what their estimates support', () => {
  it('drops digits finer than the estimate', () => {
    expect(formatValue(-3.585618521e-9, 9.3e-6)).toBe('0'); // the product of inertia: noise about zero
    expect(formatValue(70.00000000000001, 1e-13)).toBe('70');
    expect(formatValue(3.14159, 0.04)).toBe('3.142'); // estimate 0.040: second digit at 0.001
    expect(formatValue(-52000.123, 0.05)).toBe('-52000.123');
    expect(formatValue(0.0012345678, 2.3e-7)).toBe('0.00123457');
    expect(formatValue(12345678.9, 3e5)).toBe('1.235e7');
    expect(formatError(9.3e-6)).toBe('9.3e-6');
  });
  it('keeps at most 10 significant digits where the estimate is finer', () => {
    expect(formatValue(90694.07051234, 8.7e-9)).toBe('90694.07051');
    expect(formatValue(150, 6.4e-12)).toBe('150');
  });
  it('without a positive finite estimate: 10 significant digits', () => {
    expect(formatValue(1 / 3, 0)).toBe('0.3333333333');
    expect(formatValue(1 / 3, NaN)).toBe('0.3333333333');
  });
});
