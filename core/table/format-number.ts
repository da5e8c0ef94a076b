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
