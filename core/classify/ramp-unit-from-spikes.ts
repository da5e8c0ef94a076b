import { lowerBoundFrom } from '../align/lower-bound-from';
import { countTables, equalExposureSums, rampSummary, TABLE_SIZE } from './ramp-sums';
import type { RampUnitResult } from './ramp-unit';

/**
 * rampUnit for the fixed window, straight from spike times: the same result,
 * bit for bit, as rampUnit(binCounts(spikeTimes, alignTimes, startS, binS,
 * nBins), ...), without the trials x bins matrix. In each window the spikes
 * come in time order, so their bins come in increasing order; each run of
 * spikes in one bin is one non-zero count, added to the per-bin sums in the
 * order a dense pass over the matrix would add it (trial by trial, bin by
 * bin), so every floating-point sum is the same. The first spike of each
 * window is searched from where the previous window ended (lowerBoundFrom).
 *
 * Inputs: sorted spike times (s), alignment times (s; non-finite ones give an
 * empty trial, as binCounts), window start relative to them and bin width
 * (s), bin centres (s, nBins of them). See rampUnit for the statistics;
 * tests = false leaves out the signed-rank test and the GLM (rampSummary).
 */
export function rampUnitFromSpikes(
  spikeTimes: Float64Array,
  alignTimes: Float64Array,
  startS: number,
  binS: number,
  centresS: Float64Array,
  minTrials: number,
  exactMaxN = 30,
  tests = true,
): RampUnitResult {
  const nBins = centresS.length;
  const nTrials = alignTimes.length;
  const trialSlopes = new Float64Array(nTrials);
  const s1: number[] = new Array<number>(nBins).fill(0);
  const sq: number[] = new Array<number>(nBins).fill(0);
  const sr: number[] = new Array<number>(nBins).fill(0);
  const sr2: number[] = new Array<number>(nBins).fill(0);
  let total = 0;
  let sjj = 0;
  for (let j = 0; j < nBins; j++) sjj += (j - (nBins - 1) / 2) ** 2;
  const e = binS;
  const tab = countTables(e);
  const denom = 2 * binS * binS * sjj;
  // The slopes' integer numerators, for the rank tests (see RampUnitResult.rankKeys).
  const rankKeys = denom > 0 && denom < Infinity ? new Float64Array(nTrials) : trialSlopes;
  const n = spikeTimes.length;
  const rateHz = n > 1 ? (n - 1) / (spikeTimes[n - 1] - spikeTimes[0]) : 0; // guesses where each window starts
  let hint = 0;
  for (let k = 0; k < nTrials; k++) {
    const a = alignTimes[k];
    let w = 0;
    if (Number.isFinite(a)) {
      const lo = a + startS;
      const hi = lo + nBins * binS;
      // From where the previous window ended (sequential reads over short gaps, a guess from the mean rate over long ones).
      const i0 = lowerBoundFrom(spikeTimes, lo, hint, rateHz);
      let runBin = -1;
      let c = 0;
      let i = i0;
      for (; i <= n; i++) {
        let j = -2; // past the window (or the train): ends the last run
        if (i < n) {
          const t = spikeTimes[i];
          if (t < hi) {
            j = Math.floor((t - lo) / binS);
            if (j >= nBins) j = nBins - 1; // rounding at the far edge, as addWindowCounts
          }
        }
        if (j === runBin) {
          c++;
          continue;
        }
        if (c > 0) {
          // One non-zero count c in bin runBin of trial k.
          const small = c < TABLE_SIZE && e > 0;
          const r = small ? tab.rate[c] : e > 0 ? c / e : 0;
          s1[runBin] += c;
          if (e > 0) sq[runBin] += small ? tab.square[c] : (c * c) / e;
          sr[runBin] += r;
          sr2[runBin] += r * r;
          total += c;
          w += (2 * runBin - (nBins - 1)) * c;
        }
        if (j === -2) break;
        runBin = j;
        c = 1;
      }
      hint = i;
    }
    trialSlopes[k] = w / denom;
    if (rankKeys !== trialSlopes) rankKeys[k] = w;
  }
  const sums = equalExposureSums(binS, nTrials, nBins);
  const se: number[] = new Array<number>(nBins).fill(sums.perBin);
  return rampSummary({ nTrials, trialSlopes, rankKeys, s1, se, sq, sr, sr2, total, totalE: sums.total }, centresS, minTrials, exactMaxN, tests);
}
