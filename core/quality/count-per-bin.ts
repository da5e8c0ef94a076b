/**
 * Spike counts in out.length equal bins of widthS from startS, for the spikes
 * of a sorted train with startS <= t <= stopS; a spike's bin is
 * min(bins - 1, floor((t - startS) / widthS)), the rule of the presence ratio
 * and the rate-drift screen (a spike exactly at stopS, or pushed past the last
 * edge by rounding, counts in the last bin). Counts are added to `out`.
 *
 * Cost: O(bins log(n / bins)) instead of one division per spike. That bin
 * rule is non-decreasing in t (subtraction, division by a positive width
 * and floor are all monotone in floating point), so in a sorted train each
 * bin's spikes are one run; the end of each run is found by galloping with the
 * same rule, so every spike gets exactly the bin the per-spike loop gives it.
 *
 * Input: spike times (s) sorted ascending, finite; widthS > 0; startS <
 * stopS. Returns the number of spikes counted. Checked against the per-spike
 * loop in test/core/quality/count-per-bin.test.ts.
 */
export function countPerBin(spikeTimes: ArrayLike<number>, startS: number, stopS: number, widthS: number, out: Float64Array): number {
  const bins = out.length;
  const n = spikeTimes.length;
  if (bins === 0 || n === 0) return 0;
  const last = bins - 1;
  // First spike >= startS and first spike > stopS (binary searches).
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const m = (lo + hi) >>> 1;
    if (spikeTimes[m] < startS) lo = m + 1;
    else hi = m;
  }
  const first = lo;
  hi = n;
  while (lo < hi) {
    const m = (lo + hi) >>> 1;
    if (spikeTimes[m] <= stopS) lo = m + 1;
    else hi = m;
  }
  const end = lo;
  let i = first;
  while (i < end) {
    let b = Math.floor((spikeTimes[i] - startS) / widthS);
    if (b >= last) {
      out[last] += end - i; // every later spike is clamped into the last bin
      break;
    }
    // Gallop for the first index in (i, end) whose bin is above b.
    let good = i; // bin(good) <= b
    let step = 1;
    let probe = i + 1;
    while (probe < end && binAtMost(spikeTimes[probe], startS, widthS, b)) {
      good = probe;
      step *= 2;
      probe = i + step;
    }
    let bad = probe < end ? probe : end; // bin(bad) > b, or bad = end
    while (bad - good > 1) {
      const m = (good + bad) >>> 1;
      if (binAtMost(spikeTimes[m], startS, widthS, b)) good = m;
      else bad = m;
    }
    out[b] += bad - i;
    i = bad;
  }
  return end - first;
}

/** True when min(last, floor((t - startS) / widthS)) <= b, for b < last (the clamp cannot matter). */
function binAtMost(t: number, startS: number, widthS: number, b: number): boolean {
  return Math.floor((t - startS) / widthS) <= b;
}
