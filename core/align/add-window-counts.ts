import { lowerBound } from './lower-bound';

/**
 * Adds the counts of spikes in nBins consecutive bins [lo + j*binS,
 * lo + (j+1)*binS) to out[offset + j]. One binary search, then a single pass
 * over the window's spikes. Bins are half-open (a spike on an edge counts in
 * the later bin); rounding at the far edge is kept in the last bin. The one
 * inner loop behind binCounts and addEventCounts.
 */
export function addWindowCounts(
  spikeTimes: ArrayLike<number>,
  lo: number,
  binS: number,
  nBins: number,
  out: Float64Array,
  offset: number,
): void {
  const n = spikeTimes.length;
  const hi = lo + nBins * binS;
  for (let i = lowerBound(spikeTimes, lo); i < n; i++) {
    const t = spikeTimes[i];
    if (t >= hi) break;
    let j = Math.floor((t - lo) / binS);
    if (j >= nBins) j = nBins - 1; // rounding at the far edge
    out[offset + j]++;
  }
}
