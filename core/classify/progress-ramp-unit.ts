import { chiSquareSf } from '../stats/distributions';
import { poissonGlm } from '../stats/poisson-glm';
import { wilcoxonSignedRank } from '../stats/wilcoxon-signed-rank';

/** Ramp of one unit over a sampled variable (progress ramp). */
export interface ProgressRampUnitResult {
  /** Trials with a per-trial slope (at least two occupied bins). */
  readonly nTrials: number;
  /** Spikes / time over every bin and trial, Hz. */
  readonly meanRateHz: number;
  /** Occupancy-weighted least-squares slope of the trial-pooled rate per bin, Hz per unit of the variable. */
  readonly slopeHzPerUnit: number;
  /** Per-trial weighted slopes, Hz per unit (NaN where a trial occupies fewer than two bins). */
  readonly trialSlopes: Float64Array;
  /** Two-sided Wilcoxon signed-rank p of the per-trial slopes (NaN with too few trials or none non-zero). */
  readonly p: number;
  /** +1 / -1 / 0: side of the signed-rank statistic. */
  readonly direction: number;
  readonly nNonZero: number;
  /** Poisson GLM log rate = a + b x with offset log(occupancy): b (per unit), likelihood-ratio p, Pearson X^2 / df. */
  readonly glmSlopePerUnit: number;
  readonly glmLrtP: number;
  readonly glmDispersion: number;
  /** Pooled rate per bin (Hz; NaN where unoccupied) and total occupancy per bin (s). */
  readonly rate: Float64Array;
  readonly occupancyS: Float64Array;
}

/**
 * Ramp statistics of one unit over a sampled variable x (position, progress
 * through the approach), from counts and occupancy (trials x bins, row-major;
 * progressSpikeCounts, progressOccupancy) with bin centres `centres`.
 *
 * 1. Per trial: weighted least-squares slope of rate (count / occupancy) on
 *    x, weights = occupancy (a rate measured over more time is more precise;
 *    for Poisson counts its variance is rate / occupancy). With weights w,
 *    rates c / w: slope = sum (x - xw) c / sum w (x - xw)^2, xw = the
 *    weighted mean of x; bins without occupancy drop out. Trials occupying
 *    fewer than two bins have no slope (NaN, left out); trials without spikes
 *    have slope 0 (dropped by the signed-rank test, as in the time ramp).
 * 2. Two-sided Wilcoxon signed-rank test of the per-trial slopes (>= minTrials).
 * 3. Summary slope: the same weighted fit to the trial-pooled rate (pooled
 *    counts / pooled occupancy per bin, weights = pooled occupancy).
 * 4. Poisson GLM, counts ~ occupancy exp(a + b x), offset log(occupancy): the
 *    likelihood depends on per-bin totals only, so it is fitted to those;
 *    likelihood-ratio test on 1 df; Pearson X^2 / df over every occupied
 *    trial-bin. Reported beside the signed-rank test, as for the time ramp.
 * Units: slopes in Hz per unit of the variable, GLM slope per unit.
 */
export function progressRampUnit(
  counts: Float64Array,
  occupancyS: Float64Array,
  nTrials: number,
  centres: Float64Array,
  minTrials: number,
  exactMaxN = 30,
): ProgressRampUnitResult {
  const nBins = centres.length;
  const trialSlopes = new Float64Array(nTrials).fill(NaN);
  const C = new Float64Array(nBins);
  const W = new Float64Array(nBins);
  const sq = new Float64Array(nBins); // sum over trials of c^2 / w
  let occupiedCells = 0;
  let nWithSlope = 0;
  for (let k = 0; k < nTrials; k++) {
    const row = k * nBins;
    let sw = 0;
    let swx = 0;
    for (let j = 0; j < nBins; j++) {
      const w = occupancyS[row + j];
      if (!(w > 0)) continue;
      const c = counts[row + j];
      sw += w;
      swx += w * centres[j];
      C[j] += c;
      W[j] += w;
      sq[j] += (c * c) / w;
      occupiedCells++;
    }
    if (!(sw > 0)) continue;
    const xw = swx / sw;
    let num = 0;
    let den = 0;
    for (let j = 0; j < nBins; j++) {
      const w = occupancyS[row + j];
      if (!(w > 0)) continue;
      const dx = centres[j] - xw;
      num += dx * counts[row + j];
      den += w * dx * dx;
    }
    if (den > 0) {
      trialSlopes[k] = num / den;
      nWithSlope++;
    }
  }
  let totalC = 0;
  let totalW = 0;
  let sWx = 0;
  const rate = new Float64Array(nBins);
  for (let j = 0; j < nBins; j++) {
    totalC += C[j];
    totalW += W[j];
    sWx += W[j] * centres[j];
    rate[j] = W[j] > 0 ? C[j] / W[j] : NaN;
  }
  const xW = sWx / totalW;
  let num = 0;
  let den = 0;
  let occupiedBins = 0;
  for (let j = 0; j < nBins; j++) {
    if (!(W[j] > 0)) continue;
    occupiedBins++;
    const dx = centres[j] - xW;
    num += dx * C[j];
    den += W[j] * dx * dx;
  }
  const slopeHzPerUnit = den > 0 ? num / den : NaN;
  const test = nWithSlope >= minTrials ? wilcoxonSignedRank(trialSlopes, exactMaxN) : null;

  let glmSlopePerUnit = NaN;
  let glmLrtP = NaN;
  let glmDispersion = NaN;
  if (totalC > 0 && occupiedBins >= 2) {
    const X = new Float64Array(occupiedBins * 2);
    const y = new Float64Array(occupiedBins);
    const offset = new Float64Array(occupiedBins);
    const used = new Int32Array(occupiedBins);
    let m = 0;
    for (let j = 0; j < nBins; j++) {
      if (!(W[j] > 0)) continue;
      X[2 * m] = 1;
      X[2 * m + 1] = centres[j] - xW;
      y[m] = C[j];
      offset[m] = Math.log(W[j]);
      used[m++] = j;
    }
    const g = poissonGlm(X, 2, y, { offset });
    if (g.converged) {
      glmSlopePerUnit = g.coefficients[1];
      glmLrtP = chiSquareSf(Math.max(0, g.nullDeviance - g.deviance), 1);
      let x2 = 0;
      for (let i = 0; i < occupiedBins; i++) {
        const j = used[i];
        const lambda = g.fitted[i] / W[j];
        x2 += sq[j] / lambda - 2 * C[j] + lambda * W[j];
      }
      const df = occupiedCells - 2;
      glmDispersion = df > 0 ? x2 / df : NaN;
    }
  }
  return {
    nTrials: nWithSlope,
    meanRateHz: totalW > 0 ? totalC / totalW : NaN,
    slopeHzPerUnit,
    trialSlopes,
    p: test && test.n > 0 ? test.p : NaN,
    direction: test ? test.direction : 0,
    nNonZero: test ? test.n : 0,
    glmSlopePerUnit,
    glmLrtP,
    glmDispersion,
    rate,
    occupancyS: W,
  };
}
