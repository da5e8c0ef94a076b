import { lowerBoundNear } from '../align/lower-bound-near';

/**
 * Time spent by a sampled variable in each of nBins equal bins [lo + j w,
 * lo + (j + 1) w) (the last bin closed at hi = lo + nBins w) during each
 * window [starts[k], stops[k]), s. Row-major (windows x bins).
 *
 * The variable is read by linear interpolation between samples, so between
 * two samples it moves at constant speed and the time it spends in a bin is
 * the segment's duration times the share of the segment's value range that
 * lies in the bin (exact for the piecewise-linear path); a segment with no
 * change gives all its time to the bin of its value. Time outside [lo, hi],
 * before the first or after the last sample is not counted.
 *
 * Inputs: sample times sorted strictly increasing (BehaviourSamples), windows
 * in any order (searches walk on from the previous window, so time order is
 * fastest). Edge cases: empty or reversed windows give zero rows; fewer than
 * two samples give zeros. Reference: the definition above, checked by hand
 * on piecewise-linear paths in test/core/classify/progress-ramps.test.ts.
 */
export function progressOccupancy(
  time: Float64Array,
  values: Float64Array,
  starts: ArrayLike<number>,
  stops: ArrayLike<number>,
  lo: number,
  binWidth: number,
  nBins: number,
): Float64Array {
  const out = new Float64Array(starts.length * nBins);
  const n = time.length;
  const hi = lo + nBins * binWidth;
  let hint = 0;
  for (let k = 0; k < starts.length; k++) {
    const a = Math.max(starts[k], n > 0 ? time[0] : Infinity);
    const b = Math.min(stops[k], n > 0 ? time[n - 1] : -Infinity);
    if (!(b > a)) continue;
    const row = k * nBins;
    // Segment i runs from sample i to sample i + 1; the first one holding a.
    hint = lowerBoundNear(time, a, hint);
    let i = time[hint] > a ? hint - 1 : hint;
    for (; i < n - 1 && time[i] < b; i++) {
      const t0 = Math.max(a, time[i]);
      const t1 = Math.min(b, time[i + 1]);
      if (!(t1 > t0)) continue;
      const dt = time[i + 1] - time[i];
      const slope = (values[i + 1] - values[i]) / dt;
      const x0 = values[i] + slope * (t0 - time[i]);
      const x1 = values[i] + slope * (t1 - time[i]);
      const d = t1 - t0;
      if (x0 === x1) {
        if (x0 < lo || x0 > hi) continue;
        let j = Math.floor((x0 - lo) / binWidth);
        if (j >= nBins) j = nBins - 1;
        out[row + j] += d;
        continue;
      }
      const xa = Math.min(x0, x1);
      const xb = Math.max(x0, x1);
      if (xb <= lo || xa >= hi) continue;
      const perUnit = d / (xb - xa);
      const ja = Math.max(0, Math.floor((xa - lo) / binWidth));
      const jb = Math.min(nBins - 1, Math.floor((xb - lo) / binWidth));
      for (let j = ja; j <= jb; j++) {
        const e0 = lo + j * binWidth;
        const e1 = j === nBins - 1 ? hi : e0 + binWidth;
        const overlap = Math.min(xb, e1) - Math.max(xa, e0);
        if (overlap > 0) out[row + j] += overlap * perUnit;
      }
    }
  }
  return out;
}
