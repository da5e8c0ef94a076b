import { lowerBound } from './lower-bound';
import type { Raster } from './types';

/**
 * Spikes around each alignment time, relative to it: row k holds the spikes
 * with alignTimes[k] + startS <= t < alignTimes[k] + stopS, as t - alignTimes[k].
 * Two passes (count, then fill) with one binary search per row and no
 * per-spike allocation. Non-finite alignment times give empty rows; an empty
 * train gives an empty raster with the right number of rows.
 */
export function extractRaster(spikeTimes: ArrayLike<number>, alignTimes: ArrayLike<number>, startS: number, stopS: number): Raster {
  const rows = alignTimes.length;
  const offsets = new Int32Array(rows + 1);
  const first = new Int32Array(rows);
  for (let r = 0; r < rows; r++) {
    const a = alignTimes[r];
    let c = 0;
    if (Number.isFinite(a) && stopS > startS) {
      const i0 = lowerBound(spikeTimes, a + startS);
      first[r] = i0;
      c = lowerBound(spikeTimes, a + stopS, i0) - i0;
    }
    offsets[r + 1] = offsets[r] + c;
  }
  const times = new Float64Array(offsets[rows]);
  for (let r = 0; r < rows; r++) {
    const a = alignTimes[r];
    for (let k = offsets[r], i = first[r]; k < offsets[r + 1]; k++, i++) times[k] = spikeTimes[i] - a;
  }
  return { offsets, times, rows, startS, stopS };
}
