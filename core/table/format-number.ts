/**
 * Formats a number for a text table: NaN -> "" (empty cell), integers as
 * integers, others with `digits` significant digits and no trailing zeros.
 * Infinity is written as "inf"/"-inf" (NumPy's and pandas' spelling).
 */
export function formatNumber(x: number, digits = 6): string {
  if (Number.isNaN(x)) return '';
  if (x === Infinity) return 'inf';
  if (x === -Infinity) return '-inf';
  if (Number.isInteger(x) && Math.abs(x) < 1e15) return String(x);
  const s = x.toPrecision(digits);
  if (s.includes('e')) {
    const [m, e] = s.split('e');
    return `${m.includes('.') ? m.replace(/\.?0+$/, '') : m}e${e}`;
  }
  return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
}

/**
 * A time in seconds on the recording clock for a text table: fixed to the
 * microsecond (6 decimals), trailing zeros removed; NaN -> "". Significant
 * digits would not do for absolute times: 6 of them resolve only 10 ms after
 * 1,000 s and 0.1 s after 10,000 s, coarser than a 30 Hz sample grid.
 */
export function formatTimeS(t: number): string {
  if (Number.isNaN(t)) return '';
  if (!Number.isFinite(t)) return formatNumber(t);
  const s = t.toFixed(6).replace(/\.?0+$/, '');
  return s === '-0' ? '0' : s;
}
