import { addWindowCounts } from '../align/add-window-counts';
import { lowerBoundFrom } from '../align/lower-bound-from';

/**
 * Adds the spike counts around every alignment time into one histogram:
 * out[offset + j] += number of spikes in [a + startS + j binS, a + startS +
 * (j + 1) binS) summed over alignment times a. Same bins as binCounts (a
 * spike on an edge counts in the later bin) without the events x bins
 * matrix, so event-averaged PSTHs of many units allocate nothing.
 */
export function addEventCounts(
  spikeTimes: Float64Array,
  alignTimes: Float64Array,
  startS: number,
  binS: number,
  nBins: number,
  out: Float64Array,
  offset = 0,
): void {
  const n = spikeTimes.length;
  const rateHz = n > 1 ? (n - 1) / (spikeTimes[n - 1] - spikeTimes[0]) : 0;
  let hint = 0; // search from where the previous event's window ended, guessing long gaps from the mean rate
  for (let k = 0; k < alignTimes.length; k++) {
    const a = alignTimes[k];
    if (Number.isFinite(a)) hint = addWindowCounts(spikeTimes, a + startS, binS, nBins, out, offset, lowerBoundFrom(spikeTimes, a + startS, hint, rateHz));
  }
}
