import { addWindowCounts } from './add-window-counts';

/**
 * Peri-event spike counts: for each alignment time a_k, the counts of spikes
 * in nBins consecutive bins [a_k + startS + j*binS, a_k + startS + (j+1)*binS).
 * Returns a row-major Float64Array (events x bins). One binary search per
 * event, then a single pass over that event's spikes. Bins are half-open, so
 * a spike on a bin edge counts in the later bin.
 */
export function binCounts(
  spikeTimes: ArrayLike<number>,
  alignTimes: ArrayLike<number>,
  startS: number,
  binS: number,
  nBins: number,
): Float64Array {
  const out = new Float64Array(alignTimes.length * nBins);
  for (let k = 0; k < alignTimes.length; k++) {
    const a = alignTimes[k];
    if (Number.isFinite(a)) addWindowCounts(spikeTimes, a + startS, binS, nBins, out, k * nBins);
  }
  return out;
}
