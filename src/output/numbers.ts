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
