import { formatNumber } from '../../core/table/format-number';

/**
 * A number as the screens show it: 4 significant digits; very small or very
 * large magnitudes in exponent form ("1.23e-6") so narrow columns stay
 * readable; NaN as "" (empty cell), as in the exported tables.
 */
export function formatCell(x: number): string {
  const a = Math.abs(x);
  if (Number.isFinite(x) && x !== 0 && (a < 1e-3 || a >= 1e7)) return x.toExponential(2).replace(/\.?0+e/, 'e').replace('e+', 'e');
  return formatNumber(x, 4);
}
