/**
 * The spikes outside light-affected time (schedule.lightIntervals, merged and
 * sorted [a0, b0, a1, b1, ...], half-open [a, b)), and the coefficient of
 * variation of the ISIs between consecutive light-free spikes that no light
 * interval separates. One merge pass, O(spikes + intervals).
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
  let n = 0;
  let k = 0;
  const nk = lightIntervals.length;
  let prev = NaN;
  let prevInterval = -1;
  let s = 0;
  let s2 = 0;
  let m = 0;
  for (let i = 0; i < spikeTimes.length; i++) {
    const t = spikeTimes[i];
    while (k < nk && lightIntervals[k + 1] <= t) k += 2;
    if (k < nk && lightIntervals[k] <= t) {
      prev = NaN;
      continue;
    }
    if (keepSpikes) out[n] = t;
    n++;
    // k indexes the next light interval after t: spikes with the same k are not separated by light.
    if (prev === prev && prevInterval === k) {
      const d = t - prev;
      s += d;
      s2 += d * d;
      m++;
    }
    prev = t;
    prevInterval = k;
  }
  let isiCv = NaN;
  if (m >= 2) {
    const mean = s / m;
    const v = (s2 - m * mean * mean) / (m - 1);
    isiCv = mean > 0 ? Math.sqrt(Math.max(0, v)) / mean : NaN;
  }
  return { spikes: keepSpikes ? out.slice(0, n) : out, isiCv, isiCount: m };
}
