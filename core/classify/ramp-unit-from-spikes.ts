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
  // Per-bin sums (typed: one element kind from the start, so addWindow sees one array shape).
  const s1 = new Float64Array(nBins);
  const sq = new Float64Array(nBins);
  const sr = new Float64Array(nBins);
  const sr2 = new Float64Array(nBins);
  let sjj = 0;
  for (let j = 0; j < nBins; j++) sjj += (j - (nBins - 1) / 2) ** 2;
  const tab = countTables(binS);
  const denom = 2 * binS * binS * sjj;
  // The slopes' integer numerators, for the rank tests (see RampUnitResult.rankKeys).
  const rankKeys = denom > 0 && denom < Infinity ? new Float64Array(nTrials) : trialSlopes;
  const n = spikeTimes.length;
  const rateHz = n > 1 ? (n - 1) / (spikeTimes[n - 1] - spikeTimes[0]) : 0; // guesses where each window starts
  const acc = new Float64Array(2); // [spikes so far, this trial's slope numerator]
  let hint = 0;
  for (let k = 0; k < nTrials; k++) {
    const a = alignTimes[k];
    acc[1] = 0;
    if (Number.isFinite(a)) {
      const lo = a + startS;
      // From where the previous window ended (sequential reads over short gaps, a guess from the mean rate over long ones).
      const i0 = lowerBoundFrom(spikeTimes, lo, hint, rateHz);
      hint = addWindow(spikeTimes, i0, lo, lo + nBins * binS, binS, nBins, s1, sq, sr, sr2, tab.rate, tab.square, acc);
    }
    const w = acc[1];
    trialSlopes[k] = w / denom;
    if (rankKeys !== trialSlopes) rankKeys[k] = w;
  }
  const total = acc[0];
  const sums = equalExposureSums(binS, nTrials, nBins);
  const se: number[] = new Array<number>(nBins).fill(sums.perBin);
  return rampSummary({ nTrials, trialSlopes, rankKeys, s1, se, sq, sr, sr2, total, totalE: sums.total }, centresS, minTrials, exactMaxN, tests);
}

/**
 * One window [lo, hi) of trial spikes from index i0: each run of spikes in
 * one bin is one non-zero count c, added to the per-bin sums (count, c^2 /
 * binS, rate, rate^2) as a dense pass would add it. acc[0] += the window's
 * spikes, acc[1] += its integer slope numerator sum_j (2j - (nBins - 1)) c_j
 * (both integers, exact in any order). Returns the index past the window.
 * A function of its own, called once per window: V8 optimises it with every
 * path seen, instead of compiling the caller's loop mid-way and undoing it.
 */
function addWindow(
  spikeTimes: Float64Array,
  i0: number,
  lo: number,
  hi: number,
  binS: number,
  nBins: number,
  s1: Float64Array,
  sq: Float64Array,
  sr: Float64Array,
  sr2: Float64Array,
  rate: Float64Array,
  square: Float64Array,
  acc: Float64Array,
): number {
  const n = spikeTimes.length;
  const e = binS;
  let total = 0;
  let w = 0;
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
      // One non-zero count c in bin runBin.
      const small = c < TABLE_SIZE && e > 0;
      const r = small ? rate[c] : e > 0 ? c / e : 0;
      s1[runBin] += c;
      if (e > 0) sq[runBin] += small ? square[c] : (c * c) / e;
      sr[runBin] += r;
      sr2[runBin] += r * r;
      total += c;
      w += (2 * runBin - (nBins - 1)) * c;
    }
    if (j === -2) break;
    runBin = j;
    c = 1;
  }
  acc[0] += total;
  acc[1] += w;
  return i;
}
