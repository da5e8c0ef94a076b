import { chiSquareSf } from '../stats/distributions';
import { linearFit } from '../stats/linear-fit';
import { poissonGlm } from '../stats/poisson-glm';
import { wilcoxonSignedRank } from '../stats/wilcoxon-signed-rank';
import type { RampUnitResult } from './ramp-unit';

/**
 * Internal to the ramp test: the per-bin sums both accumulators build
 * (rampUnit from a counts matrix, rampUnitFromSpikes straight from spike
 * times), the statistics computed from them (rampSummary), and two small
 * caches that keep repeated divisions and sums identical to a dense pass.
 */
export interface RampSums {
  readonly nTrials: number;
  /** Per-trial slopes, Hz/s, and the values the rank tests use (RampUnitResult.rankKeys). */
  readonly trialSlopes: Float64Array;
  readonly rankKeys: Float64Array;
  /** Per bin: sum of counts, of exposure (s), of count^2 / exposure, of per-trial rates and of their squares. */
  readonly s1: ArrayLike<number>;
  readonly se: ArrayLike<number>;
  readonly sq: ArrayLike<number>;
  readonly sr: ArrayLike<number>;
  readonly sr2: ArrayLike<number>;
  /** Total count and total exposure (s). */
  readonly total: number;
  readonly totalE: number;
}

/**
 * Effect sizes, signed-rank test and Poisson GLM from the sums (see rampUnit's
 * header). tests = false skips the signed-rank test and the GLM (their fields
 * are NaN, direction 0): the per-condition comparison needs only the slopes.
 */
export function rampSummary(sums: RampSums, centresS: Float64Array, minTrials: number, exactMaxN: number, tests = true): RampUnitResult {
  const { nTrials, trialSlopes, rankKeys, s1, se, sq, sr, sr2, total, totalE } = sums;
  const nBins = centresS.length;
  let mx = 0;
  for (let j = 0; j < nBins; j++) mx += centresS[j];
  mx /= nBins;
  const meanRate = new Float64Array(nBins);
  const semRate = new Float64Array(nBins);
  for (let j = 0; j < nBins; j++) {
    meanRate[j] = se[j] > 0 ? s1[j] / se[j] : NaN;
    const m = sr[j] / nTrials;
    const v = nTrials > 1 ? (sr2[j] - nTrials * m * m) / (nTrials - 1) : NaN;
    semRate[j] = Math.sqrt(Math.max(0, v) / nTrials);
  }
  const meanRateHz = nTrials > 0 && totalE > 0 ? total / totalE : NaN;
  const fit = nTrials > 0 && nBins >= 2 ? linearFit(centresS, meanRate, false) : null; // slope, intercept, R^2: no t test needed
  const third = Math.max(1, Math.floor(nBins / 3));
  let early = 0;
  let late = 0;
  for (let j = 0; j < third; j++) {
    early += meanRate[j];
    late += meanRate[nBins - 1 - j];
  }
  // On rankKeys: the same test as on the slopes (same order, ties and signs), sorted by counting.
  const test = tests && nTrials >= minTrials ? wilcoxonSignedRank(rankKeys, exactMaxN) : null;

  let glmSlopePerS = NaN;
  let glmLrtP = NaN;
  let glmDispersion = NaN;
  if (tests && nTrials > 0 && total > 0 && nBins >= 2) {
    const X: number[] = new Array<number>(nBins * 2);
    const offset: number[] = new Array<number>(nBins);
    for (let j = 0; j < nBins; j++) {
      X[2 * j] = 1;
      X[2 * j + 1] = centresS[j] - mx;
      offset[j] = Math.log(se[j]);
    }
    const g = poissonGlm(X, 2, s1, { offset });
    if (g.converged) {
      glmSlopePerS = g.coefficients[1];
      glmLrtP = chiSquareSf(Math.max(0, g.nullDeviance - g.deviance), 1);
      let x2 = 0;
      for (let j = 0; j < nBins; j++) {
        const lambda = g.fitted[j] / se[j];
        x2 += sq[j] / lambda - 2 * s1[j] + lambda * se[j];
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
    rankKeys,
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

/** Sum of binS over nTrials (per bin) and over nTrials x nBins cells, added one by one as a dense pass would; kept per (binS, nTrials, nBins) (every unit of a session asks the same few). */
const exposureSums = new Map<string, { perBin: number; total: number }>();
export function equalExposureSums(binS: number, nTrials: number, nBins: number): { perBin: number; total: number } {
  const key = `${binS}|${nTrials}|${nBins}`;
  const hit = exposureSums.get(key);
  if (hit) return hit;
  let perBin = 0;
  for (let k = 0; k < nTrials; k++) perBin += binS;
  let total = 0;
  for (let i = 0; i < nTrials * nBins; i++) total += binS;
  if (exposureSums.size > 64) exposureSums.clear();
  const sums = { perBin, total };
  exposureSums.set(key, sums);
  return sums;
}

/** Counts below this use the division tables of countTables. */
export const TABLE_SIZE = 64;
let lastTables = { binS: NaN, rate: new Float64Array(0), square: new Float64Array(0) };
/** rate[c] = c / binS and square[c] = c^2 / binS for c < TABLE_SIZE (last binS kept). */
export function countTables(binS: number): { rate: Float64Array; square: Float64Array } {
  if (lastTables.binS === binS) return lastTables;
  const rate = new Float64Array(TABLE_SIZE);
  const square = new Float64Array(TABLE_SIZE);
  for (let c = 0; c < TABLE_SIZE; c++) {
    rate[c] = c / binS;
    square[c] = (c * c) / binS;
  }
  lastTables = { binS, rate, square };
  return lastTables;
}
