import { predictTrace } from './predict-trace';
import type { Kernel } from './types';

/**
 * Predicted dF/F in a window around each alignment time, on a grid anchored at
 * the event: row k holds samples at alignTimes[k] + windowStartS + c / rateHz,
 * c < round((windowStopS - windowStartS) * rateHz). Each row is computed
 * exactly by predictTrace (spikes before the window contribute their tails),
 * so offsets line up with eventLockedTrace of a measured trace at the same
 * rate. Rows of non-finite alignment times are NaN. Row-major rows x cols.
 */
export function predictTrialWindows(
  spikeTimes: ArrayLike<number>,
  kernel: Kernel,
  alignTimes: ArrayLike<number>,
  windowStartS: number,
  windowStopS: number,
  rateHz: number,
): { values: Float64Array; rows: number; cols: number } {
  const cols = Math.max(0, Math.round((windowStopS - windowStartS) * rateHz));
  const rows = alignTimes.length;
  const values = new Float64Array(rows * cols);
  for (let r = 0; r < rows; r++) {
    const a = alignTimes[r];
    if (!Number.isFinite(a)) {
      values.fill(NaN, r * cols, (r + 1) * cols);
      continue;
    }
    values.set(predictTrace(spikeTimes, kernel, { startS: a + windowStartS, rateHz, length: cols }), r * cols);
  }
  return { values, rows, cols };
}
