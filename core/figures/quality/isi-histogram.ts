/**
 * Histogram of inter-spike intervals in bins [k*binS, (k+1)*binS) up to
 * nBins*binS (longer ISIs are not counted; `beyond` tells how many). Sorted
 * spike times, one pass. Units: seconds.
 */
export function isiHistogram(spikeTimes: ArrayLike<number>, binS: number, nBins: number): { counts: Float64Array; beyond: number } {
  const counts = new Float64Array(Math.max(0, nBins));
  let beyond = 0;
  if (!(binS > 0) || nBins < 1) return { counts, beyond: Math.max(0, spikeTimes.length - 1) };
  for (let i = 1; i < spikeTimes.length; i++) {
    const k = Math.floor((spikeTimes[i] - spikeTimes[i - 1]) / binS);
    if (k < nBins) counts[k]++;
    else beyond++;
  }
  return { counts, beyond };
}
