import { formatNumber } from '../table/format-number';

/**
 * A p-value as text that never reads "0": a value at or below a test's
 * resolution is written with that resolution ("p<=0.0099 (1/101)" for a
 * permutation p whose smallest value is 1 / rows; "p<0.0002 (1/4950)" for
 * SALT's published p, which is 0 when no null distance reaches the test's),
 * an underflowed tail probability as "p<1e-300", NaN as "p n/a".
 *
 * resolution: smallest attainable p (NaN when unknown); denominator: its
 * 1/x form (0 to leave it out); strict: the resolution itself is not
 * attained (published SALT p = 0 means p < 1/#null).
 */
export function formatP(p: number, resolution = NaN, denominator = 0, strict = false, digits = 2): string {
  if (Number.isNaN(p)) return 'p n/a';
  const frac = denominator > 0 ? ` (1/${denominator})` : '';
  if (resolution === resolution && p <= resolution * (1 + 1e-12)) {
    return strict || p < resolution * (1 - 1e-12) ? `p<${formatNumber(resolution, digits)}${frac}` : `p<=${formatNumber(resolution, digits)}${frac}`;
  }
  if (p <= 0) return 'p<1e-300';
  return `p=${formatNumber(p, digits)}`;
}
