import type { SampleGrid } from './types';

/**
 * Linear interpolation of a measured trace (times sorted ascending, s) onto a
 * uniform grid. Grid points outside [times[0], times[last]] get NaN (no
 * extrapolation); a NaN neighbour gives NaN; on a repeated time the later
 * sample wins. Matches numpy.interp inside the range. One forward pass,
 * O(grid + samples).
 */
export function resampleLinear(times: ArrayLike<number>, values: ArrayLike<number>, grid: SampleGrid): Float64Array {
  if (times.length !== values.length) throw new Error('resampleLinear: times and values differ in length');
  const out = new Float64Array(grid.length).fill(NaN);
  const n = times.length;
  if (n === 0) return out;
  let j = 0;
  for (let k = 0; k < grid.length; k++) {
    const t = grid.startS + k / grid.rateHz;
    if (!(t >= times[0] && t <= times[n - 1])) continue;
    while (j < n && times[j] < t) j++;
    // now times[j] >= t and (j === 0 or times[j - 1] < t)
    if (times[j] === t) {
      let e = j;
      while (e + 1 < n && times[e + 1] === t) e++;
      out[k] = values[e];
    } else {
      const t0 = times[j - 1];
      const t1 = times[j];
      out[k] = values[j - 1] + ((t - t0) / (t1 - t0)) * (values[j] - values[j - 1]);
    }
  }
  return out;
}
