import { lowerBound } from '../align/lower-bound';
import { countPerBin } from './count-per-bin';
import type { DriftSegments } from './drift-segments';
import { exclusionLookup, type ExclusionLookup } from './exclusion-lookup';

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
 * have a rate, or (cv) the mean rate is 0. Sorted spike times: counts per
 * segment from countPerBin (O(segments log n)), then one walk over the
 * spikes between the first excluded interval's start and the last one's end
 * (exclusionLookup's table from the second unit on: one read per spike);
 * the same integer counts as one pass testing every spike.
 * `exclude` intervals must be non-empty, sorted and non-overlapping.
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
  countPerBin(spikeTimes, startS, stopS, width, counts);
  // Spikes inside excluded intervals come off their segment's count: a merge
  // walk over the spikes from the first interval's start to the last one's end
  // (with a lookup table once the same segments serve a second unit).
  const xs = segments.exclude.startS;
  const xe = segments.exclude.stopS;
  const nx = xs.length;
  if (nx > 0) {
    const n = spikeTimes.length;
    const regionEnd = xe[nx - 1];
    const look = lookupFor(segments);
    let i = lowerBound(spikeTimes, Math.max(startS, xs[0]));
    if (look) {
      const { originS, invCellS, first } = look;
      for (; i < n; i++) {
        const t = spikeTimes[i];
        if (t >= regionEnd || t > stopS) break;
        let x = first[Math.floor((t - originS) * invCellS)];
        if (x < 0) continue; // no interval near t
        while (xe[x] <= t) x++;
        if (xs[x] <= t) counts[segmentOf(t, startS, width, k)]--;
      }
    } else {
      let x = 0;
      for (; i < n; i++) {
        const t = spikeTimes[i];
        if (t >= regionEnd || t > stopS) break;
        while (xe[x] <= t) x++; // stops at the last interval at the latest: t < its end
        if (xs[x] <= t) counts[segmentOf(t, startS, width, k)]--;
      }
    }
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

function segmentOf(t: number, startS: number, width: number, k: number): number {
  const b = Math.floor((t - startS) / width);
  return b >= k ? k - 1 : b;
}

/**
 * The exclusion lookup of a session's segments, built when the same segments
 * object serves its second unit (the quality step: one object, every unit;
 * a figure of one unit never pays for the table).
 */
const lookups = new WeakMap<DriftSegments['exclude'], { uses: number; table: ExclusionLookup | null }>();
function lookupFor(segments: DriftSegments): ExclusionLookup | null {
  const ex = segments.exclude;
  const entry = lookups.get(ex);
  if (!entry) {
    lookups.set(ex, { uses: 1, table: null });
    return null;
  }
  if (entry.uses === 1) {
    entry.uses = 2;
    entry.table = exclusionLookup(ex.startS, ex.stopS);
  }
  return entry.table;
}
