import { addWindowCounts } from './add-window-counts';

/**
 * Peri-event spike counts: for each alignment time a_k, the counts of spikes
 * in nBins consecutive bins [a_k + startS + j*binS, a_k + startS + (j+1)*binS).
 * Returns a row-major Float64Array (events x bins). Each event's first spike
 * is searched from the previous event's (galloping search, so events in time
 * order walk the train once), then a single pass over that event's spikes. Bins are half-open, so
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
  let hint = 0;
  for (let k = 0; k < alignTimes.length; k++) {
    const a = alignTimes[k];
    if (Number.isFinite(a)) hint = addWindowCounts(spikeTimes, a + startS, binS, nBins, out, k * nBins, hint);
  }
  return out;
}
