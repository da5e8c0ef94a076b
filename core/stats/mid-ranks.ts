/**
 * Mid-ranks (average ranks for ties), 1-based, of a numeric sample, and the
 * tie term sum(t^3 - t) over groups of t tied values, which the variance of
 * every rank statistic needs.
 *
 * Units: ranks are dimensionless; values may be in any unit.
 * Edge cases: empty input gives empty ranks and tieSum 0; NaN values are a
 * caller bug (callers drop them first). O(n log n): a native sort of a copy,
 * then two binary searches per value.
 * Reference: the usual definition (Hollander & Wolfe 1973, ch. 3-4), the same
 * as SciPy's rankdata(method="average"); checked in the rank-test fixtures.
 */
export function midRanks(values: ArrayLike<number>): { ranks: Float64Array; tieSum: number } {
  const n = values.length;
  // Native numeric sort of a copy (much faster than sorting indices with a
  // comparator), then each value's mid-rank from its run of equal values.
  const sorted = Float64Array.from(values).sort();
  const ranks = new Float64Array(n);
  let tieSum = 0;
  let i = 0;
  while (i < n) {
    let j = i + 1;
    while (j < n && sorted[j] === sorted[i]) j++;
    const t = j - i;
    if (t > 1) tieSum += t * t * t - t;
    i = j;
  }
  for (let k = 0; k < n; k++) {
    const v = values[k];
    // First index >= v and first index > v in the sorted copy.
    let lo = 0;
    let hi = n;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (sorted[mid] < v) lo = mid + 1;
      else hi = mid;
    }
    let lo2 = lo;
    let hi2 = n;
    while (lo2 < hi2) {
      const mid = (lo2 + hi2) >>> 1;
      if (sorted[mid] <= v) lo2 = mid + 1;
      else hi2 = mid;
    }
    ranks[k] = (lo + 1 + lo2) / 2; // mean of ranks lo+1 .. lo2
  }
  return { ranks, tieSum };
}
