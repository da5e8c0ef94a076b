import { fitAmplitudeOffset, type AmplitudeFit } from './fit-amplitude-offset';
import { predictTrace } from './predict-trace';
import type { SampleGrid } from './types';

export interface KernelGridSearch {
  readonly tauRiseS: Float64Array;
  readonly tauDecayS: Float64Array;
  /** Correlation for each (rise, decay) pair, row-major rise x decay; NaN where decay <= rise. */
  readonly r: Float64Array;
  /** Best pair by correlation, with its least-squares fit (NaN when no pair is valid). */
  readonly best: { readonly tauRiseS: number; readonly tauDecayS: number; readonly fit: AmplitudeFit };
}

/**
 * Grid search of a two-exponential kernel's constants against a measured
 * trace already on a uniform grid (see resampleLinear): for every rise x decay
 * pair with decay > rise, predicts the trace (exact recursive filter, unit
 * peak) and fits amplitude and offset by least squares; the pair with the
 * highest correlation wins (amplitude and offset are free, so correlation
 * ranks pairs exactly as the residual does). Cost: pairs x (samples + spikes).
 */
export function gridSearchKernel(
  spikeTimes: ArrayLike<number>,
  measured: ArrayLike<number>,
  grid: SampleGrid,
  tauRiseS: readonly number[],
  tauDecayS: readonly number[],
): KernelGridSearch {
  if (measured.length !== grid.length) throw new Error('gridSearchKernel: measured trace and grid differ in length');
  const r = new Float64Array(tauRiseS.length * tauDecayS.length).fill(NaN);
  let best = { tauRiseS: NaN, tauDecayS: NaN, fit: fitAmplitudeOffset([], []) };
  let bestR = -Infinity;
  tauRiseS.forEach((tr, i) => {
    tauDecayS.forEach((td, j) => {
      if (!(tr > 0) || !(td > tr)) return;
      const pred = predictTrace(spikeTimes, { kind: 'double-exponential', tauRiseS: tr, tauDecayS: td, peakDff: 1 }, grid);
      const fit = fitAmplitudeOffset(pred, measured);
      r[i * tauDecayS.length + j] = fit.r;
      if (fit.r > bestR) {
        bestR = fit.r;
        best = { tauRiseS: tr, tauDecayS: td, fit };
      }
    });
  });
  return { tauRiseS: Float64Array.from(tauRiseS), tauDecayS: Float64Array.from(tauDecayS), r, best };
}
