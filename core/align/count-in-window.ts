import { lowerBound } from './lower-bound';

/** Number of spikes with a <= t < b in sorted spike times. O(log n). */
export function countInWindow(spikeTimes: ArrayLike<number>, a: number, b: number): number {
  if (!(b > a)) return 0;
  const i = lowerBound(spikeTimes, a);
  return lowerBound(spikeTimes, b, i) - i;
}
