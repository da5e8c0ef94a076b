import { Rng } from '../random/rng';
import { baselineZScore } from './baseline-z-score';
import { binCounts } from './bin-counts';
import { smoothRows } from './smooth-rows';
import { smoothingKernel } from './smoothing-kernel';
import type { Psth, PsthOptions } from './types';

/**
 * Peri-stimulus time histogram of one unit around a set of alignment times.
 *
 * Bins of binMs tile [windowStartS, windowStopS) (the count is rounded to the
 * nearest whole bin). Per trial: spike counts (binCounts: one binary search
 * per trial) / bin width = rate in Hz, then smoothing (smoothingKernel, edge-
 * renormalised). The PSTH is the mean over trials; SEM = SD (n - 1) / sqrt(n)
 * across trials. Band "sem": mean +- 1 SEM; "bootstrap": percentile interval
 * of the mean over nBoot resamples of whole trials with replacement (seeded
 * Rng, so bit-for-bit reproducible; Efron & Tibshirani 1993, percentile
 * method; quantiles interpolated as numpy.quantile's default). Baseline
 * window given: z-score (baselineZScore).
 *
 * Edge cases: non-finite alignment times are dropped (nTrials counts the
 * rest); no trials: NaN rates; one trial: SEM and bands NaN; empty train:
 * zero rates (z-score NaN, the baseline being flat).
 */
export function computePsth(spikeTimes: ArrayLike<number>, alignTimes: ArrayLike<number>, o: PsthOptions): Psth {
  const binS = o.binMs / 1000;
  if (!(binS > 0) || !Number.isFinite(binS)) throw new Error(`computePsth: bin width must be positive, got ${o.binMs} ms`);
  if (!(o.windowStopS > o.windowStartS)) throw new Error('computePsth: window stop must be after its start');
  const nBins = Math.max(1, Math.round((o.windowStopS - o.windowStartS) / binS));
  const align: number[] = [];
  for (let i = 0; i < alignTimes.length; i++) if (Number.isFinite(alignTimes[i])) align.push(alignTimes[i]);
  const nTrials = align.length;
  const counts = binCounts(spikeTimes, align, o.windowStartS, binS, nBins);
  for (let i = 0; i < counts.length; i++) counts[i] /= binS;
  const { weights, center } = smoothingKernel(o.smoothing, binS);
  const rates = smoothRows(counts, nTrials, nBins, weights, center);

  const binStartS = new Float64Array(nBins);
  const binCenterS = new Float64Array(nBins);
  for (let j = 0; j < nBins; j++) {
    binStartS[j] = o.windowStartS + j * binS;
    binCenterS[j] = binStartS[j] + binS / 2;
  }
  const rateHz = new Float64Array(nBins);
  const semHz = new Float64Array(nBins);
  for (let j = 0; j < nBins; j++) {
    let s = 0;
    for (let r = 0; r < nTrials; r++) s += rates[r * nBins + j];
    const m = nTrials ? s / nTrials : NaN;
    let ss = 0;
    for (let r = 0; r < nTrials; r++) ss += (rates[r * nBins + j] - m) ** 2;
    rateHz[j] = m;
    semHz[j] = nTrials >= 2 ? Math.sqrt(ss / (nTrials - 1) / nTrials) : NaN;
  }

  const band = o.band ?? 'sem';
  const lowerHz = new Float64Array(nBins).fill(NaN);
  const upperHz = new Float64Array(nBins).fill(NaN);
  if (band === 'sem') {
    for (let j = 0; j < nBins; j++) {
      lowerHz[j] = rateHz[j] - semHz[j];
      upperHz[j] = rateHz[j] + semHz[j];
    }
  } else if (band === 'bootstrap' && nTrials >= 2) {
    const level = o.level ?? 0.95;
    const nBoot = o.nBoot ?? 1000;
    if (!(level > 0 && level < 1)) throw new Error(`computePsth: band level must be in (0, 1), got ${level}`);
    const rng = new Rng(o.seed ?? 1);
    const boot = new Float64Array(nBoot * nBins);
    const pick = new Int32Array(nTrials);
    for (let b = 0; b < nBoot; b++) {
      for (let k = 0; k < nTrials; k++) pick[k] = rng.int(nTrials);
      const row = b * nBins;
      for (let k = 0; k < nTrials; k++) {
        const src = pick[k] * nBins;
        for (let j = 0; j < nBins; j++) boot[row + j] += rates[src + j];
      }
      for (let j = 0; j < nBins; j++) boot[row + j] /= nTrials;
    }
    const col = new Float64Array(nBoot);
    const lo = (1 - level) / 2;
    for (let j = 0; j < nBins; j++) {
      for (let b = 0; b < nBoot; b++) col[b] = boot[b * nBins + j];
      col.sort();
      lowerHz[j] = quantileSorted(col, lo);
      upperHz[j] = quantileSorted(col, 1 - lo);
    }
  }

  let zScore: Float64Array | null = null;
  let baselineMeanHz = NaN;
  let baselineSdHz = NaN;
  if (o.baselineStartS !== undefined && o.baselineStopS !== undefined) {
    const z = baselineZScore(rateHz, binCenterS, o.baselineStartS, o.baselineStopS);
    zScore = z.z;
    baselineMeanHz = z.meanHz;
    baselineSdHz = z.sdHz;
  }
  return { binStartS, binCenterS, binS, rateHz, semHz, lowerHz, upperHz, band, nTrials, zScore, baselineMeanHz, baselineSdHz };
}

/** numpy.quantile(sorted, p) with the default linear interpolation. */
function quantileSorted(v: Float64Array, p: number): number {
  const h = (v.length - 1) * p;
  const lo = Math.floor(h);
  return lo + 1 < v.length ? v[lo] + (h - lo) * (v[lo + 1] - v[lo]) : v[lo];
}
