import { addWindowCounts } from '../align/add-window-counts';

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
  let hint = 0; // galloping search from the previous event's first spike
  for (let k = 0; k < alignTimes.length; k++) {
    const a = alignTimes[k];
    if (Number.isFinite(a)) hint = addWindowCounts(spikeTimes, a + startS, binS, nBins, out, offset, hint);
  }
}
