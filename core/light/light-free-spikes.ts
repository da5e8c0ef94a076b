import { lowerBoundNear } from '../align/lower-bound-near';

/**
 * The spikes outside light-affected time (schedule.lightIntervals, merged and
 * sorted [a0, b0, a1, b1, ...], half-open [a, b)), and the coefficient of
 * variation of the ISIs between consecutive light-free spikes that no light
 * interval separates. One search per interval edge from the previous one (lowerBoundNear: a few steps, then galloping) and one tight
 * pass over the light-free spikes.
 *
 * CV = SD (n - 1) / mean of those ISIs; NaN with fewer than 2 ISIs. Poisson
 * firing has CV 1, regular firing < 1, bursty firing > 1 (Softky & Koch 1993,
 * J Neurosci 13:334; from memory).
 *
 * keepSpikes = false returns an empty `spikes` and allocates nothing (when only
 * the CV is wanted).
 */
export function lightFreeSpikes(spikeTimes: Float64Array, lightIntervals: Float64Array, keepSpikes = true): { spikes: Float64Array; isiCv: number; isiCount: number } {
  const out = keepSpikes ? new Float64Array(spikeTimes.length) : new Float64Array(0);
  const ns = spikeTimes.length;
  const nk = lightIntervals.length;
  let n = 0;
  let s = 0;
  let s2 = 0;
  let m = 0;
  // Light-free stretches [b_(k-1), a_k) one by one: a contiguous range of spike indices
  // each, found by searching on from the previous one; ISIs only inside a range.
  let from = 0;
  for (let k = 0; k <= nk; k += 2) {
    const to = k < nk ? lowerBoundNear(spikeTimes, lightIntervals[k], from) : ns;
    if (to > from) {
      if (keepSpikes) out.set(spikeTimes.subarray(from, to), n);
      n += to - from;
      let prev = spikeTimes[from];
      for (let j = from + 1; j < to; j++) {
        const t = spikeTimes[j];
        const d = t - prev;
        s += d;
        s2 += d * d;
        prev = t;
      }
      m += to - from - 1;
    }
    if (k < nk) from = lowerBoundNear(spikeTimes, lightIntervals[k + 1], to);
  }
  let isiCv = NaN;
  if (m >= 2) {
    const mean = s / m;
    const v = (s2 - m * mean * mean) / (m - 1);
    isiCv = mean > 0 ? Math.sqrt(Math.max(0, v)) / mean : NaN;
  }
  return { spikes: keepSpikes ? out.slice(0, n) : out, isiCv, isiCount: m };
}
