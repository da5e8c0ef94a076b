import { countTables, equalExposureSums, rampSummary, TABLE_SIZE } from './ramp-sums';

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
  /**
   * Per-trial values in the same order, with the same ties and signs, as
   * trialSlopes, for the rank tests: with equal bins the slopes' integer
   * numerators w (slope = w / (2 binS^2 sum_j (j - (nBins - 1) / 2)^2), one
   * positive denominator for every trial and every condition), which rank
   * tests sort by counting; otherwise the slopes themselves.
   */
  readonly rankKeys: Float64Array;
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
 * Ramp statistics from peri-event counts (trials x bins, row-major) with bin
 * centres `centresS` (s relative to the event). Each trial-bin covers binS
 * seconds of real time, or `exposureS` (same shape) when given: a
 * time-warped bin covers a different real time in each trial.
 *
 * 1. Per trial: least-squares slope of rate (count / exposure) on time.
 * 2. Two-sided Wilcoxon signed-rank test of the per-trial slopes against 0
 *    (trials are the replicates, so trial-to-trial variability and
 *    overdispersion are respected); run only with >= minTrials trials.
 * 3. Effect sizes from the trial-averaged rate (pooled count / pooled
 *    exposure per bin): slope (Hz/s; with uniform bins this equals the mean
 *    per-trial slope), slope relative to the mean rate, R^2 of its
 *    straight-line fit, late/early third ratio.
 * 4. Poisson GLM, log rate linear in time, mu = exposure exp(a + b t), on all
 *    trial-bins; the likelihood depends on the per-bin totals of counts and
 *    exposure only, so it is fitted to those (offset log exposure);
 *    likelihood-ratio test on 1 df; Pearson X^2/df over every trial-bin from
 *    per-bin sums of y, e and y^2/e. The LRT assumes Poisson counts: a
 *    dispersion well above 1 means its p is too small.
 *
 * exactMaxN: largest trial count for the exact signed-rank distribution.
 * tests = false leaves out the signed-rank test and the GLM (NaN fields).
 */
export function rampUnit(
  counts: Float64Array,
  nTrials: number,
  centresS: Float64Array,
  binS: number,
  minTrials: number,
  exactMaxN = 30,
  exposureS?: Float64Array,
  tests = true,
): RampUnitResult {
  const nBins = centresS.length;
  const trialSlopes = new Float64Array(nTrials);
  let rankKeys = trialSlopes;
  // Per-bin sums as plain arrays (allocated on the JS heap: typed arrays this
  // size each cost an external allocation, which adds up over units x conditions).
  const s1: number[] = new Array<number>(nBins).fill(0); // sum of counts
  const se: number[] = new Array<number>(nBins).fill(0); // sum of exposure
  const sq: number[] = new Array<number>(nBins).fill(0); // sum of count^2 / exposure
  const sr: number[] = new Array<number>(nBins).fill(0); // sum of per-trial rates
  const sr2: number[] = new Array<number>(nBins).fill(0); // sum of squared per-trial rates
  let total = 0;
  let totalE = 0;
  let mx = 0;
  for (let j = 0; j < nBins; j++) mx += centresS[j];
  mx /= nBins;
  let sxx = 0;
  for (let j = 0; j < nBins; j++) sxx += (centresS[j] - mx) ** 2;
  let sjj = 0;
  for (let j = 0; j < nBins; j++) sjj += (j - (nBins - 1) / 2) ** 2;
  if (exposureS) {
    const rate = new Float64Array(nBins);
    for (let k = 0; k < nTrials; k++) {
      const row = k * nBins;
      let my = 0;
      for (let j = 0; j < nBins; j++) {
        const c = counts[row + j];
        const e = exposureS[row + j];
        const r = e > 0 ? c / e : 0;
        rate[j] = r;
        my += r;
        s1[j] += c;
        se[j] += e;
        if (e > 0) sq[j] += (c * c) / e;
        sr[j] += r;
        sr2[j] += r * r;
        total += c;
        totalE += e;
      }
      my /= nBins;
      let sxy = 0;
      for (let j = 0; j < nBins; j++) sxy += (centresS[j] - mx) * (rate[j] - my);
      trialSlopes[k] = sxy / sxx;
    }
  } else {
    // Equal bins of binS: only non-zero counts change the sums (adding +0 leaves
    // a sum as it is), so empty bins are skipped; the exposure sums are the same
    // for every unit. Same operations in the same order as a dense pass.
    const e = binS;
    // c / e and c^2 / e for small counts, computed once (the same divisions, so the same values).
    const tab = countTables(e);
    const denom = 2 * binS * binS * sjj;
    if (denom > 0 && denom < Infinity) rankKeys = new Float64Array(nTrials);
    for (let k = 0; k < nTrials; k++) {
      const row = k * nBins;
      // Integer weights 2j - (nBins - 1) keep the numerator exact, so trials
      // whose slopes are equal in exact arithmetic tie exactly (ties matter to ranks).
      let w = 0;
      for (let j = 0; j < nBins; j++) {
        const c = counts[row + j];
        if (c === 0) continue;
        const small = c < TABLE_SIZE && e > 0;
        const r = small ? tab.rate[c] : e > 0 ? c / e : 0;
        s1[j] += c;
        if (e > 0) sq[j] += small ? tab.square[c] : (c * c) / e;
        sr[j] += r;
        sr2[j] += r * r;
        total += c;
        w += (2 * j - (nBins - 1)) * c;
      }
      trialSlopes[k] = w / (2 * binS * binS * sjj);
      if (rankKeys !== trialSlopes) rankKeys[k] = w;
    }
    const sums = equalExposureSums(binS, nTrials, nBins);
    se.fill(sums.perBin);
    totalE = sums.total;
  }
  return rampSummary({ nTrials, trialSlopes, rankKeys, s1, se, sq, sr, sr2, total, totalE }, centresS, minTrials, exactMaxN, tests);
}
