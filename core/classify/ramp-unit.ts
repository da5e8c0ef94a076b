import { chiSquareSf } from '../stats/distributions';
import { linearFit } from '../stats/linear-fit';
import { poissonGlm } from '../stats/poisson-glm';
import { wilcoxonSignedRank } from '../stats/wilcoxon-signed-rank';

/** Ramp statistics of one unit over one set of aligned trials. */
export interface RampUnitResult {
  /** Trials used. */
  readonly nTrials: number;
  /** Mean rate over the window and trials, Hz. */
  readonly meanRateHz: number;
  /** Least-squares slope of the trial-averaged binned rate, Hz/s (= mean of the per-trial slopes). */
  readonly slopeHzPerS: number;
  /** slopeHzPerS / meanRateHz, 1/s (NaN when the unit is silent in the window). */
  readonly slopeRelPerS: number;
  /** R^2 of the straight-line fit to the trial-averaged rate. */
  readonly r2: number;
  /** Mean rate in the last third of the window over the first third. */
  readonly lateEarlyRatio: number;
  /** Per-trial slopes, Hz/s. */
  readonly trialSlopes: Float64Array;
  /** Two-sided Wilcoxon signed-rank p of the per-trial slopes (NaN with too few trials). */
  readonly p: number;
  /** +1 / -1 / 0: side of the signed-rank statistic (more positive or negative slopes). */
  readonly direction: number;
  /** Signed-rank statistic V and the non-zero slopes it used. */
  readonly statistic: number;
  readonly nNonZero: number;
  /** Poisson GLM log rate = a + b t: b (1/s), likelihood-ratio p, Pearson X^2 / df. */
  readonly glmSlopePerS: number;
  readonly glmLrtP: number;
  readonly glmDispersion: number;
  /** Trial-averaged rate per bin, Hz, and its standard error across trials. */
  readonly meanRate: Float64Array;
  readonly semRate: Float64Array;
  /** Intercept of the straight line at time 0 of the window axis, Hz (fit = intercept + slope t). */
  readonly interceptHz: number;
}

/**
 * Ramp statistics from peri-event counts (trials x bins, row-major), bins of
 * binS seconds whose centres are `centresS` (s relative to the event).
 *
 * 1. Per trial: least-squares slope of rate (count / binS) on time.
 * 2. Two-sided Wilcoxon signed-rank test of the per-trial slopes against 0
 *    (trials are the replicates, so trial-to-trial variability and
 *    overdispersion are respected); run only with >= minTrials trials.
 * 3. Effect sizes from the trial-averaged rate: slope (Hz/s), slope relative
 *    to the mean rate, R^2 of its straight-line fit, late/early third ratio.
 * 4. Poisson GLM, log rate linear in time, fitted to the counts of all
 *    trial-bins (aggregated per bin: the likelihood depends on the per-bin
 *    totals only); likelihood-ratio test on 1 df; Pearson X^2/df computed over
 *    every trial-bin from per-bin sums of counts and squared counts. The LRT
 *    assumes Poisson counts: a dispersion well above 1 means its p is too small.
 *
 * exactMaxN: largest trial count for the exact signed-rank distribution.
 */
export function rampUnit(
  counts: Float64Array,
  nTrials: number,
  centresS: Float64Array,
  binS: number,
  minTrials: number,
  exactMaxN = 30,
): RampUnitResult {
  const nBins = centresS.length;
  let mx = 0;
  for (let j = 0; j < nBins; j++) mx += centresS[j];
  mx /= nBins;
  let sxx = 0;
  for (let j = 0; j < nBins; j++) sxx += (centresS[j] - mx) ** 2;
  const trialSlopes = new Float64Array(nTrials);
  const s1 = new Float64Array(nBins);
  const s2 = new Float64Array(nBins);
  let total = 0;
  for (let k = 0; k < nTrials; k++) {
    const row = k * nBins;
    let sxy = 0;
    for (let j = 0; j < nBins; j++) {
      const c = counts[row + j];
      sxy += (centresS[j] - mx) * c;
      s1[j] += c;
      s2[j] += c * c;
      total += c;
    }
    trialSlopes[k] = sxy / sxx / binS;
  }
  const meanRate = new Float64Array(nBins);
  const semRate = new Float64Array(nBins);
  for (let j = 0; j < nBins; j++) {
    const m = s1[j] / nTrials;
    meanRate[j] = m / binS;
    const v = nTrials > 1 ? (s2[j] - nTrials * m * m) / (nTrials - 1) : NaN;
    semRate[j] = Math.sqrt(Math.max(0, v) / nTrials) / binS;
  }
  const meanRateHz = nTrials > 0 ? total / (nTrials * nBins * binS) : NaN;
  const fit = nTrials > 0 && nBins >= 2 ? linearFit(centresS, meanRate) : null;
  const third = Math.max(1, Math.floor(nBins / 3));
  let early = 0;
  let late = 0;
  for (let j = 0; j < third; j++) {
    early += meanRate[j];
    late += meanRate[nBins - 1 - j];
  }
  const test = nTrials >= minTrials ? wilcoxonSignedRank(trialSlopes, exactMaxN) : null;

  // Poisson GLM on per-bin totals (weights = trials, y = mean count per trial-bin).
  let glmSlopePerS = NaN;
  let glmLrtP = NaN;
  let glmDispersion = NaN;
  if (nTrials > 0 && total > 0 && nBins >= 2) {
    const X = new Float64Array(nBins * 2);
    const y = new Float64Array(nBins);
    const w = new Float64Array(nBins).fill(nTrials);
    for (let j = 0; j < nBins; j++) {
      X[2 * j] = 1;
      X[2 * j + 1] = centresS[j] - mx;
      y[j] = s1[j] / nTrials;
    }
    const g = poissonGlm(X, 2, y, { weights: w });
    if (g.converged) {
      glmSlopePerS = g.coefficients[1];
      glmLrtP = chiSquareSf(Math.max(0, g.nullDeviance - g.deviance), 1);
      let x2 = 0;
      for (let j = 0; j < nBins; j++) {
        const mu = g.fitted[j];
        x2 += (s2[j] - 2 * mu * s1[j] + nTrials * mu * mu) / mu;
      }
      const df = nTrials * nBins - 2;
      glmDispersion = df > 0 ? x2 / df : NaN;
    }
  }
  return {
    nTrials,
    meanRateHz,
    slopeHzPerS: fit ? fit.slope : NaN,
    slopeRelPerS: fit && meanRateHz > 0 ? fit.slope / meanRateHz : NaN,
    r2: fit ? fit.r2 : NaN,
    lateEarlyRatio: early > 0 ? late / early : NaN,
    trialSlopes,
    p: test ? test.p : NaN,
    direction: test ? test.direction : 0,
    statistic: test ? test.statistic : NaN,
    nNonZero: test ? test.n : 0,
    glmSlopePerS,
    glmLrtP,
    glmDispersion,
    meanRate,
    semRate,
    interceptHz: fit ? fit.intercept : NaN,
  };
}
