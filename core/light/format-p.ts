import { formatNumber } from '../table/format-number';

/**
 * A p-value as text that never reads "0": a value at or below a test's
 * resolution is written with that resolution, rounded up to `digits`
 * significant digits so the statement stays true ("p<=0.01 (1/101)" for a
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
    // The bound is rounded up, so the text stays true ("p<=0.0100" for 1/101 = 0.0099..., not "0.0099").
    const e = Math.floor(Math.log10(resolution)) - (digits - 1);
    const up = Number((Math.ceil(resolution / Math.pow(10, e) - 1e-9) * Math.pow(10, e)).toPrecision(digits));
    return strict || p < resolution * (1 - 1e-12) ? `p<${formatNumber(up, digits)}${frac}` : `p<=${formatNumber(up, digits)}${frac}`;
  }
  if (p <= 0) return 'p<1e-300';
  return `p=${formatNumber(p, digits)}`;
}
