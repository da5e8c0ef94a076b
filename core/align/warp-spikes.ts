import { lowerBound } from './lower-bound';
import type { TrialAnchors } from './trial-anchors';
import type { Raster } from './types';
import { warpTime } from './warp-time';

/**
 * A time-warped raster: for each valid trial (in trial order), the spikes in
 * [first anchor - preS, last anchor + postS) mapped to template time
 * (warpTime; 0 = first anchor). `trialRow` gives each raster row's trial.
 * The raster window is [-preS, template[last] + postS). Two passes, one
 * binary search per trial, no per-spike allocation.
 */
export function warpSpikes(
  spikeTimes: ArrayLike<number>,
  a: TrialAnchors,
  template: Float64Array,
  preS: number,
  postS: number,
): Raster & { trialRow: Int32Array } {
  const K = a.labels.length;
  const rowsList: number[] = [];
  for (let r = 0; r < a.trials; r++) if (a.valid[r]) rowsList.push(r);
  const trialRow = Int32Array.from(rowsList);
  const rows = trialRow.length;
  const offsets = new Int32Array(rows + 1);
  const first = new Int32Array(rows);
  for (let q = 0; q < rows; q++) {
    const base = trialRow[q] * K;
    const lo = lowerBound(spikeTimes, a.times[base] - preS);
    const hi = lowerBound(spikeTimes, a.times[base + K - 1] + postS, lo);
    first[q] = lo;
    offsets[q + 1] = offsets[q] + (hi - lo);
  }
  const times = new Float64Array(offsets[rows]);
  for (let q = 0; q < rows; q++) {
    const base = trialRow[q] * K;
    for (let k = offsets[q], i = first[q]; k < offsets[q + 1]; k++, i++) times[k] = warpTime(spikeTimes[i], a.times, base, template);
  }
  return { offsets, times, rows, startS: -preS, stopS: template[K - 1] + postS, trialRow };
}
