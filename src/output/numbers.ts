/** Number formatting shared by every writer. */

/** A number with up to `digits` significant digits, no trailing zeros. */
export function formatNumber(v: number, digits = 10): string {
  if (!Number.isFinite(v)) return String(v);
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e-4 && a < 1e12) {
    const s = v.toPrecision(digits);
    return s.includes('e') ? s : s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
  }
  return v.toExponential(digits - 1).replace(/\.?0+e/, 'e');
}

export function formatError(e: number): string {
  if (e === 0) return '0';
  return e.toExponential(1);
}

/**
 * Rounding rule for values shown beside their estimate: the estimate is shown to two significant digits,
 * and the value is rounded to the decimal place of the estimate's second digit (it carries nothing finer),
 * with at most `digits` significant digits. A value that rounds to zero there is shown as 0: it cannot be
 * told from zero. Without a positive finite estimate the value keeps `digits` significant digits.
 * Machine outputs (JSON, CSV) keep the full values.
 */
export const ROUNDING_RULE =
  'Values are rounded to the decimal place of the second significant digit of their estimate (shown as ± to two digits), ' +
  'at most 10 significant digits; a value that rounds to zero there is shown as 0. JSON and CSV keep every digit.';

export function formatValue(v: number, err: number, digits = 10): string {
  if (!Number.isFinite(v) || !(err > 0) || !Number.isFinite(err)) return formatNumber(v, digits);
  const place = Math.floor(Math.log10(err)) - 1; // decimal place of the estimate's second significant digit
  if (Math.abs(v) < 0.5 * 10 ** place) return '0';
  const lead = Math.floor(Math.log10(Math.abs(v)));
  const sig = Math.min(digits, lead - place + 1);
  if (sig < 1) return '0';
  return formatNumber(Number(v.toPrecision(sig)), sig).replace('e+', 'e');
}
