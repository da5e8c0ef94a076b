import { sortWithIndex } from './sort-with-index';

/**
 * Mid-ranks (average ranks for ties), 1-based, of a numeric sample, and the
 * tie term sum(t^3 - t) over groups of t tied values, which the variance of
 * every rank statistic needs.
 *
 * Units: ranks are dimensionless; values may be in any unit.
 * Edge cases: empty input gives empty ranks and tieSum 0; NaN values are a
 * caller bug (callers drop them first). O(n log n): one sort of a copy with
 * the original positions carried along, then one pass.
 * Reference: the usual definition (Hollander & Wolfe 1973, ch. 3-4), the same
 * as SciPy's rankdata(method="average"); checked in the rank-test fixtures.
 */
export function midRanks(values: ArrayLike<number>): { ranks: Float64Array; tieSum: number } {
  const n = values.length;
  // Sort a copy together with the original positions (sortWithIndex: several
  // times faster than TypedArray sort), NaN moved to the end first, then walk
  // runs of equal values: a run at sorted positions [i, j) gets rank (i + 1 + j) / 2.
  if (buffers.sorted.length < n) buffers = { sorted: new Float64Array(2 * n), index: new Int32Array(2 * n) };
  const { sorted, index } = buffers; // reused across calls (not re-entrant; nothing escapes)
  let m = 0;
  let back = n;
  for (let k = 0; k < n; k++) {
    const v = values[k];
    if (v === v) {
      sorted[m] = v;
      index[m++] = k;
    } else {
      sorted[--back] = v;
      index[back] = k;
    }
  }
  sortWithIndex(sorted, index, 0, m);
  const ranks = new Float64Array(n);
  let tieSum = 0;
  let i = 0;
  while (i < m) {
    let j = i + 1;
    while (j < m && sorted[j] === sorted[i]) j++;
    const t = j - i;
    if (t > 1) tieSum += t * t * t - t;
    const r = (i + 1 + j) / 2; // mean of ranks i+1 .. j
    for (let k = i; k < j; k++) ranks[index[k]] = r;
    i = j;
  }
  // NaN (a caller bug): rank 0.5, as a binary search in the sorted copy gave.
  for (let k = m; k < n; k++) ranks[index[k]] = 0.5;
  return { ranks, tieSum };
}

let buffers = { sorted: new Float64Array(0), index: new Int32Array(0) };
