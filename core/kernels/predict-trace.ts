import { predictTrains } from './predict-trains';
import type { Kernel, SampleGrid } from './types';

/**
 * Predicted dF/F of one spike train (sorted, s) through an indicator kernel on
 * a uniform grid: predictTrains with a single train (methods, exactness and
 * edge cases documented there). weight scales the output.
 */
export function predictTrace(spikeTimes: ArrayLike<number>, kernel: Kernel, grid: SampleGrid, weight = 1): Float64Array {
  return predictTrains([spikeTimes], kernel, grid, weight);
}
