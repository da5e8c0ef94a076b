import type { TrialAnchors } from './trial-anchors';
import type { Raster } from './types';
import { unwarpTime } from './unwarp-time';

export interface WarpedPsth {
  /** Bin left edges in template time, s. */
  readonly binStartS: Float64Array;
  readonly binS: number;
  /** Spike counts, rows (warped trials) x bins, row-major. */
  readonly counts: Float64Array;
  /** Real time each warped bin covers in each trial, s (same shape). */
  readonly exposureS: Float64Array;
  /** Pooled rate per bin: total count / total real exposure, Hz. */
  readonly rateHz: Float64Array;
  /** SEM across trials of the per-trial rates count / exposure, Hz. */
  readonly semHz: Float64Array;
  readonly rows: number;
}

/**
 * Warped counts and rates from a warped raster (warpSpikes). Bins of binMs
 * tile the raster window in template time. A warped bin of a stretched
 * segment covers less real time, so rates divide by the real exposure
 * (unwarpTime of the bin's edges), not by the template bin width: a
 * homogeneous Poisson train therefore stays flat at its rate after warping.
 */
export function warpedPsth(raster: Raster & { trialRow: Int32Array }, a: TrialAnchors, template: Float64Array, binMs: number): WarpedPsth {
  const binS = binMs / 1000;
  if (!(binS > 0)) throw new Error(`warpedPsth: bin width must be positive, got ${binMs} ms`);
  const K = a.labels.length;
  const nBins = Math.max(1, Math.round((raster.stopS - raster.startS) / binS));
  const rows = raster.rows;
  const binStartS = Float64Array.from({ length: nBins }, (_, j) => raster.startS + j * binS);
  const counts = new Float64Array(rows * nBins);
  const exposureS = new Float64Array(rows * nBins);
  for (let q = 0; q < rows; q++) {
    const base = raster.trialRow[q] * K;
    for (let k = raster.offsets[q]; k < raster.offsets[q + 1]; k++) {
      let j = Math.floor((raster.times[k] - raster.startS) / binS);
      if (j >= nBins) j = nBins - 1;
      if (j >= 0) counts[q * nBins + j]++;
    }
    let prev = unwarpTime(binStartS[0], a.times, base, template);
    for (let j = 0; j < nBins; j++) {
      const next = unwarpTime(raster.startS + (j + 1) * binS, a.times, base, template);
      exposureS[q * nBins + j] = next - prev;
      prev = next;
    }
  }
  const rateHz = new Float64Array(nBins);
  const semHz = new Float64Array(nBins);
  for (let j = 0; j < nBins; j++) {
    let c = 0;
    let e = 0;
    let s = 0;
    for (let q = 0; q < rows; q++) {
      c += counts[q * nBins + j];
      e += exposureS[q * nBins + j];
      s += counts[q * nBins + j] / exposureS[q * nBins + j];
    }
    rateHz[j] = e > 0 ? c / e : NaN;
    const m = s / rows;
    let ss = 0;
    for (let q = 0; q < rows; q++) ss += (counts[q * nBins + j] / exposureS[q * nBins + j] - m) ** 2;
    semHz[j] = rows >= 2 ? Math.sqrt(ss / (rows - 1) / rows) : NaN;
  }
  return { binStartS, binS, counts, exposureS, rateHz, semHz, rows };
}
