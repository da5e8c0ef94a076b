import { gallopBound } from './gallop-bound';

/**
 * lowerBound(sorted, x) (first index with sorted[i] >= x) searched from a
 * hint: up to 32 steps forward one by one, then a galloping search. Walking
 * windows in time order with the hint = where the previous window ended, the
 * usual gap holds a few spikes, and reading them in order is faster than any
 * jump around the array (the memory system prefetches sequential reads;
 * spike trains of a session do not fit in cache). Any hint in [0, length]
 * gives the right answer (a hint past the answer gallops back). NaN x gives
 * the length. Checked against lowerBound in test/core/align/lower-bound-near.test.ts.
 */
export function lowerBoundNear(sorted: ArrayLike<number>, x: number, hint: number): number {
  const n = sorted.length;
  if (x !== x) return n;
  let i = hint < 0 ? 0 : hint > n ? n : hint;
  if (i > 0 && sorted[i - 1] >= x) return gallopBound(sorted, x, i); // answer before the hint
  const stop = i + 32 < n ? i + 32 : n;
  while (i < stop && sorted[i] < x) i++;
  if (i === stop && i < n && sorted[i] < x) return gallopBound(sorted, x, i);
  return i;
}
