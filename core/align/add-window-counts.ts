import { gallopBound } from '../light/gallop-bound';
import { lowerBound } from './lower-bound';

/**
 * Adds the counts of spikes in nBins consecutive bins [lo + j*binS,
 * lo + (j+1)*binS) to out[offset + j]. One search for the window's first
 * spike, then a single pass over the window's spikes. Bins are half-open (a
 * spike on an edge counts in the later bin); rounding at the far edge is kept
 * in the last bin. The one inner loop behind binCounts and addEventCounts.
 *
 * hint (optional): an index near the window's first spike, e.g. the value
 * returned for the previous window when windows come in time order; the
 * search then gallops outward from it (O(log distance)) instead of a binary
 * search over the whole train. Any hint gives the same counts.
 * Returns the index of the window's first spike (the next call's hint).
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
  const first = hint >= 0 ? gallopBound(spikeTimes, lo, hint) : lowerBound(spikeTimes, lo);
  for (let i = first; i < n; i++) {
    const t = spikeTimes[i];
    if (t >= hi) break;
    let j = Math.floor((t - lo) / binS);
    if (j >= nBins) j = nBins - 1; // rounding at the far edge
    out[offset + j]++;
  }
  return first;
}
