import { gallopBound } from './gallop-bound';
import { lowerBoundNear } from './lower-bound-near';

/**
 * lowerBound(sorted, x) (first index with sorted[i] >= x) for a search that
 * moves forward from index `from` (e.g. where the previous window of a
 * spike train ended), with a guess from the mean density of the values:
 * perUnit values per unit of x (a spike train's mean rate, Hz, for times in
 * s). When the guess is more than 32 places ahead, a galloping search starts
 * at the guess instead of at `from`: across a long gap of a fast train it
 * touches a few cache lines near the answer instead of a probe sequence that
 * starts far from it (the trains of a session do not fit in cache; each
 * window start would otherwise cost several memory round trips). Short
 * gaps are walked in order (lowerBoundNear).
 *
 * Exact for any from, x and perUnit (a poor guess only costs steps); NaN x
 * gives the length. Checked against lowerBound in
 * test/core/align/lower-bound-from.test.ts.
 */
export function lowerBoundFrom(sorted: ArrayLike<number>, x: number, from: number, perUnit: number): number {
  const n = sorted.length;
  if (!(from >= 0 && from < n) || !(sorted[from] < x)) return lowerBoundNear(sorted, x, from);
  const guess = from + Math.floor((x - sorted[from]) * perUnit);
  if (!(guess - from >= 32)) return lowerBoundNear(sorted, x, from); // also a NaN guess
  return gallopBound(sorted, x, guess > n ? n : guess);
}
