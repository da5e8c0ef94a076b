import { lowerBoundNear } from '../align/lower-bound-near';
import { gallopBound } from '../align/gallop-bound';

/**
 * Spike counts of one unit by the value of a sampled variable at each spike:
 * for each window [starts[k], stops[k]), every spike inside it is given the
 * variable's value at its time (linear interpolation between samples) and
 * counted in bin floor((x - lo) / binWidth) of nBins equal bins (the last bin
 * closed at hi = lo + nBins binWidth, like progressOccupancy). Spikes outside
 * [lo, hi], before the first or after the last sample are not counted.
 * Written into out (windows x bins, row-major), which is zeroed first.
 *
 * Searches walk on from the previous window and the previous spike
 * (lowerBoundNear: windows in time order read the spike train and the
 * samples in order). sampleStarts (optional, the same for every unit): per
 * window, an index near its first sample (e.g. lowerBound(time, start)),
 * computed once per session instead of once per unit. Reference: the definition, with
 * progressOccupancy the same path, so counts / occupancy is a rate per bin;
 * tested in test/core/classify/progress-ramps.test.ts.
 */
export function progressSpikeCounts(
  spikeTimes: Float64Array,
  time: Float64Array,
  values: Float64Array,
  starts: ArrayLike<number>,
  stops: ArrayLike<number>,
  lo: number,
  binWidth: number,
  nBins: number,
  out: Float64Array,
  sampleStarts?: Int32Array,
): Float64Array {
  out.fill(0);
  const n = time.length;
  if (n < 2) return out;
  const hi = lo + nBins * binWidth;
  const last = time[n - 1];
  const rate = (n - 1) / (last - time[0]); // mean samples per second
  let spikeHint = 0;
  let sampleHint = 0;
  for (let k = 0; k < starts.length; k++) {
    const a = Math.max(starts[k], time[0]);
    const b = stops[k];
    if (!(b > a)) continue;
    const row = k * nBins;
    if (sampleStarts) sampleHint = sampleStarts[k];
    let s = lowerBoundNear(spikeTimes, a, spikeHint);
    for (; s < spikeTimes.length; s++) {
      const t = spikeTimes[s];
      if (t >= b || t > last) break;
      // Segment holding t: time[i] <= t < time[i + 1] (t = last sample: the last segment).
      // Guess the sample from the mean sampling rate (exact for regular sampling),
      // then correct by a galloping search (irregular sampling costs O(log error)).
      const guess = sampleHint + Math.floor((t - time[sampleHint < n ? sampleHint : n - 1]) * rate);
      sampleHint = gallopBound(time, t, guess < sampleHint ? sampleHint : guess);
      let i = time[sampleHint] > t ? sampleHint - 1 : sampleHint;
      if (i >= n - 1) i = n - 2;
      const x = values[i] + ((values[i + 1] - values[i]) * (t - time[i])) / (time[i + 1] - time[i]);
      if (!(x >= lo && x <= hi)) continue;
      let j = Math.floor((x - lo) / binWidth);
      if (j >= nBins) j = nBins - 1;
      out[row + j]++;
    }
    spikeHint = s;
  }
  return out;
}
