import { baselineZScore } from './baseline-z-score';
import { lowerBound } from './lower-bound';
import { smoothRows } from './smooth-rows';
import { smoothingKernel } from './smoothing-kernel';
import type { Smoothing } from './types';

export interface PopulationMatrixOptions {
  readonly windowStartS: number;
  readonly windowStopS: number;
  readonly binMs: number;
  readonly smoothing?: Smoothing;
  /** "rate": Hz; "zscore": baseline z-score per unit (needs the baseline window); "peak": rate / the unit's largest |rate|. */
  readonly normalise?: 'rate' | 'zscore' | 'peak';
  readonly baselineStartS?: number;
  readonly baselineStopS?: number;
}

/**
 * Units x time matrix of trial-averaged rates around the same alignment times,
 * for population heatmaps. Per unit: one binary search per alignment time and
 * a pass over its spikes in the window, summed straight into one row (no
 * per-trial or per-spike allocation), / (trials x bin width), then smoothed
 * (smoothingKernel; smoothing commutes with the trial mean) and normalised.
 * Each row equals computePsth(...).rateHz (or its zScore) for that unit.
 * Non-finite alignment times are skipped; no trials give NaN rows; a unit
 * whose z-score or peak is undefined (flat or silent) gets a NaN row.
 */
export function populationMatrix(
  trains: readonly ArrayLike<number>[],
  alignTimes: ArrayLike<number>,
  o: PopulationMatrixOptions,
): { values: Float64Array; rows: number; cols: number; binCenterS: Float64Array; nTrials: number } {
  const binS = o.binMs / 1000;
  if (!(binS > 0) || !Number.isFinite(binS)) throw new Error(`populationMatrix: bin width must be positive, got ${o.binMs} ms`);
  if (!(o.windowStopS > o.windowStartS)) throw new Error('populationMatrix: window stop must be after its start');
  const cols = Math.max(1, Math.round((o.windowStopS - o.windowStartS) / binS));
  const align: number[] = [];
  for (let i = 0; i < alignTimes.length; i++) if (Number.isFinite(alignTimes[i])) align.push(alignTimes[i]);
  const nTrials = align.length;
  const rows = trains.length;
  const values = new Float64Array(rows * cols);
  const binCenterS = Float64Array.from({ length: cols }, (_, j) => o.windowStartS + (j + 0.5) * binS);
  const { weights, center } = smoothingKernel(o.smoothing, binS);
  const row = new Float64Array(cols);
  const norm = o.normalise ?? 'rate';
  if (norm === 'zscore' && (o.baselineStartS === undefined || o.baselineStopS === undefined)) {
    throw new Error('populationMatrix: z-score normalisation needs a baseline window');
  }
  for (let u = 0; u < rows; u++) {
    const t = trains[u];
    const n = t.length;
    row.fill(0);
    for (let k = 0; k < nTrials; k++) {
      const lo = align[k] + o.windowStartS;
      const hi = lo + cols * binS;
      for (let i = lowerBound(t, lo); i < n; i++) {
        const s = t[i];
        if (s >= hi) break;
        let j = Math.floor((s - lo) / binS);
        if (j >= cols) j = cols - 1;
        row[j]++;
      }
    }
    const scale = nTrials ? 1 / (nTrials * binS) : NaN;
    for (let j = 0; j < cols; j++) row[j] *= scale;
    let out = smoothRows(row, 1, cols, weights, center);
    if (norm === 'zscore') out = baselineZScore(out, binCenterS, o.baselineStartS!, o.baselineStopS!).z;
    else if (norm === 'peak') {
      let m = 0;
      for (const v of out) m = Math.max(m, Math.abs(v));
      for (let j = 0; j < cols; j++) out[j] = m > 0 ? out[j] / m : NaN;
    }
    values.set(out, u * cols);
  }
  return { values, rows, cols, binCenterS, nTrials };
}
