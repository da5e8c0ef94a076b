/**
 * Autocorrelogram of one spike train: counts of spike pairs (i < j) by lag
 * t_j - t_i in consecutive bins [k*binS, (k+1)*binS), k = 0..nBins-1, with
 * nBins = round(windowS / binS). Only positive lags are returned: the full
 * autocorrelogram is symmetric (count at -lag = count at +lag). Pairs of
 * identical times (lag 0) fall in bin 0.
 *
 * Cost: one forward scan per spike that stops at the window edge, so
 * O(n * spikes-per-window), never O(n^2) over all pairs.
 * Units: seconds. Empty result when binS <= 0 or windowS < binS.
 */
export function autocorrelogram(spikeTimes: ArrayLike<number>, binS: number, windowS: number): Float64Array {
  const nBins = binS > 0 ? Math.round(windowS / binS) : 0;
  const out = new Float64Array(Math.max(0, nBins));
  if (nBins < 1) return out;
  const hi = nBins * binS;
  const n = spikeTimes.length;
  for (let i = 0; i < n; i++) {
    const ti = spikeTimes[i];
    for (let j = i + 1; j < n; j++) {
      const lag = spikeTimes[j] - ti;
      if (lag >= hi) break;
      let k = Math.floor(lag / binS);
      if (k >= nBins) k = nBins - 1; // rounding at the far edge
      out[k]++;
    }
  }
  return out;
}
