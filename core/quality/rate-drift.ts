import type { DriftSegments } from './drift-segments';

/**
 * Rate stability over the session. The span [startS, stopS) is cut into
 * `nSegments` equal consecutive segments and the firing rate of each is
 * counted (spikes / segment length, Hz).
 *
 * - `cv`: coefficient of variation of the segment rates (population SD /
 *   mean). 0 for a perfectly steady rate. For a stationary Poisson unit with
 *   N spikes it is about sqrt(nSegments / N) from counting noise alone, so a
 *   screen on it should only judge units with enough spikes.
 * - `slopeHzPerMin`: least-squares slope of segment rate against segment
 *   centre time, Hz per minute (negative = the unit fades, as when a probe
 *   drifts away from it). Rounding noise of a flat rate is written as 0.
 *
 * Segment choice: our own (no published standard); 10 segments by default.
 * The segments come from driftSegments (computed once per session); its
 * `exclude` intervals (sorted, non-overlapping, e.g. lightWindows) remove
 * both the spikes inside the intervals and the intervals' time from each
 * segment, so a segment's rate is that of the remaining time. A segment
 * with less than 1 % of its time left gets a NaN rate and is left out of
 * cv and slope. NaN metrics when the span is empty, fewer than 2 segments
 * have a rate, or (cv) the mean rate is 0. Single pass over sorted spikes
 * and intervals.
 */
export interface RateDrift {
  /** Rate in each segment, Hz. */
  readonly ratesHz: Float64Array;
  /** Centre time of each segment, s. */
  readonly centresS: Float64Array;
  readonly cv: number;
  readonly slopeHzPerMin: number;
}

export function rateDrift(spikeTimes: Float64Array, segments: DriftSegments): RateDrift {
  const { startS, stopS, count: k, widthS: width, timeLeftS: kept } = segments;
  if (k === 0) return { ratesHz: new Float64Array(0), centresS: new Float64Array(0), cv: NaN, slopeHzPerMin: NaN };
  const len = stopS - startS;
  const counts = new Float64Array(k);
  const xs = segments.exclude.startS;
  const xe = segments.exclude.stopS;
  let x = 0;
  for (let i = 0; i < spikeTimes.length; i++) {
    const t = spikeTimes[i];
    if (t < startS || t > stopS) continue;
    while (x < xs.length && xe[x] <= t) x++;
    if (x < xs.length && xs[x] <= t) continue; // inside an excluded interval
    let b = Math.floor((t - startS) / width);
    if (b >= k) b = k - 1;
    counts[b]++;
  }
  const ratesHz = new Float64Array(k);
  const centresS = new Float64Array(k);
  let m = 0;
  let mean = 0;
  let meanT = 0;
  for (let b = 0; b < k; b++) {
    ratesHz[b] = kept[b] > 0.01 * width ? counts[b] / kept[b] : NaN;
    centresS[b] = startS + (b + 0.5) * width;
    if (Number.isNaN(ratesHz[b])) continue;
    m++;
    mean += ratesHz[b];
    meanT += centresS[b];
  }
  if (m < 2) return { ratesHz, centresS, cv: NaN, slopeHzPerMin: NaN };
  mean /= m;
  meanT /= m;
  let ss = 0;
  let sxy = 0;
  let sxx = 0;
  for (let b = 0; b < k; b++) {
    if (Number.isNaN(ratesHz[b])) continue;
    const d = ratesHz[b] - mean;
    const dt = centresS[b] - meanT;
    ss += d * d;
    sxy += dt * d;
    sxx += dt * dt;
  }
  const cv = mean > 0 ? Math.sqrt(ss / m) / mean : NaN;
  let slopeHzPerMin = (sxy / sxx) * 60;
  // rounding noise of a flat rate (|change over the span| < 1e-12 x mean) is written as 0
  if (Math.abs(slopeHzPerMin * (len / 60)) < 1e-12 * mean) slopeHzPerMin = 0;
  return { ratesHz, centresS, cv, slopeHzPerMin };
}
