/**
 * Mid-ranks (average ranks for ties), 1-based, of a numeric sample, and the
 * tie term sum(t^3 - t) over groups of t tied values, which the variance of
 * every rank statistic needs.
 *
 * Units: ranks are dimensionless; values may be in any unit.
 * Edge cases: empty input gives empty ranks and tieSum 0; NaN values are a
 * caller bug (callers drop them first) and are ranked last by the sort.
 * Reference: the usual definition (Hollander & Wolfe 1973, ch. 3-4), the same
 * as SciPy's rankdata(method="average"); checked in the rank-test fixtures.
 */
export function midRanks(values: ArrayLike<number>): { ranks: Float64Array; tieSum: number } {
  const n = values.length;
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((a, b) => {
    const va = values[a];
    const vb = values[b];
    return va < vb ? -1 : va > vb ? 1 : a - b;
  });
  const ranks = new Float64Array(n);
  let tieSum = 0;
  let i = 0;
  while (i < n) {
    let j = i + 1;
    while (j < n && values[order[j]] === values[order[i]]) j++;
    const t = j - i;
    const r = (i + 1 + j) / 2; // mean of ranks i+1 .. j
    for (let k = i; k < j; k++) ranks[order[k]] = r;
    if (t > 1) tieSum += t * t * t - t;
    i = j;
  }
  return { ranks, tieSum };
}
