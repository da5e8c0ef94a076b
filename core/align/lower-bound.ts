/**
 * Index of the first element of a sorted array that is >= x (array length if
 * none). O(log n). NaN x returns the length. The workhorse of every
 * peri-event count: spikes in [a, b) = lowerBound(t, b) - lowerBound(t, a).
 */
export function lowerBound(sorted: ArrayLike<number>, x: number, from = 0, to = sorted.length): number {
  if (x !== x) return to; // NaN
  let lo = from;
  let hi = to;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
