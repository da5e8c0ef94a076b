/**
 * Index of the first element of a sorted array that is >= x, searched
 * outward from a hint (exponential, "galloping" search, then binary search
 * inside the bracket): O(log d) where d is the distance from the hint to the
 * answer, so walking nearby, slowly moving targets (pulse after pulse) costs
 * almost nothing. Same result as lowerBound(sorted, x) for any hint; NaN x
 * gives the length.
 */
export function gallopBound(sorted: ArrayLike<number>, x: number, hint: number): number {
  const n = sorted.length;
  if (x !== x) return n;
  const h = hint < 0 ? 0 : hint > n ? n : hint;
  let lo: number;
  let hi: number;
  if (h < n && sorted[h] < x) {
    // answer is after h
    let step = 1;
    lo = h + 1;
    hi = h + 1;
    while (hi < n && sorted[hi] < x) {
      lo = hi + 1;
      hi = h + (step <<= 1);
    }
    if (hi > n) hi = n;
  } else {
    // answer is at or before h
    let step = 1;
    hi = h;
    lo = h - 1;
    while (lo >= 0 && sorted[lo] >= x) {
      hi = lo;
      lo = h - (step <<= 1);
    }
    lo = lo < 0 ? 0 : lo + 1;
  }
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
