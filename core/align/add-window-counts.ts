import { lowerBound } from './lower-bound';
import { lowerBoundNear } from './lower-bound-near';

/**
 * Adds the counts of spikes in nBins consecutive bins [lo + j*binS,
 * lo + (j+1)*binS) to out[offset + j]. One search for the window's first
 * spike, then a single pass over the window's spikes. Bins are half-open (a
 * spike on an edge counts in the later bin); rounding at the far edge is kept
 * in the last bin. The one inner loop behind binCounts and addEventCounts.
 *
 * hint (optional): an index near the window's first spike, e.g. the value
 * returned for the previous window when windows come in time order; the
 * search then walks on from it (lowerBoundNear) instead of a binary search
 * over the whole train. Any hint gives the same counts.
 * Returns the index just past the window's last spike (the next call's hint).
 */
export function addWindowCounts(
  spikeTimes: ArrayLike<number>,
  lo: number,
  binS: number,
  nBins: number,
  out: Float64Array,
  offset: number,
  hint = -1,
): number {
  const n = spikeTimes.length;
  const hi = lo + nBins * binS;
  let i = hint >= 0 ? lowerBoundNear(spikeTimes, lo, hint) : lowerBound(spikeTimes, lo);
  for (; i < n; i++) {
    const t = spikeTimes[i];
    if (t >= hi) break;
    let j = Math.floor((t - lo) / binS);
    if (j >= nBins) j = nBins - 1; // rounding at the far edge
    out[offset + j]++;
  }
  return i;
}
