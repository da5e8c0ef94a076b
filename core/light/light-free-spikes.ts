/**
 * The spikes outside light-affected time (schedule.lightIntervals, merged and
 * sorted [a0, b0, a1, b1, ...], half-open [a, b)), and the coefficient of
 * variation of the ISIs between consecutive light-free spikes that no light
 * interval separates. One forward pass over the spikes (no search: the
 * walk that sums the ISIs also finds where each light interval starts).
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
  // each, walked forward (the ISIs are summed on the way, so finding the range's end costs
  // nothing more); the spikes inside light intervals are stepped over. ISIs only inside a range.
  let from = 0;
  for (let k = 0; k <= nk; k += 2) {
    const a = k < nk ? lightIntervals[k] : Infinity;
    let to = from;
    if (to < ns && spikeTimes[to] < a) {
      let prev = spikeTimes[to++];
      for (; to < ns; to++) {
        const t = spikeTimes[to];
        if (!(t < a)) break;
        const d = t - prev;
        s += d;
        s2 += d * d;
        prev = t;
      }
      if (keepSpikes) out.set(spikeTimes.subarray(from, to), n);
      n += to - from;
      m += to - from - 1;
    }
    if (k < nk) {
      const b = lightIntervals[k + 1];
      from = to;
      while (from < ns && spikeTimes[from] < b) from++;
    }
  }
  let isiCv = NaN;
  if (m >= 2) {
    const mean = s / m;
    const v = (s2 - m * mean * mean) / (m - 1);
    isiCv = mean > 0 ? Math.sqrt(Math.max(0, v)) / mean : NaN;
  }
  return { spikes: keepSpikes ? out.slice(0, n) : out, isiCv, isiCount: m };
}
