import { mannWhitney } from '../stats/mann-whitney';
import { spearman } from '../stats/spearman';
import { wilcoxonSignedRank } from '../stats/wilcoxon-signed-rank';

/** Inputs of one unit for one jump kind; per-event arrays have one entry per event. */
export interface JumpUnitInput {
  /** Rates in the pre, answer (post) and late windows, Hz. */
  readonly pre: Float64Array;
  readonly post: Float64Array;
  readonly late: Float64Array;
  /** Matched-control change post - pre and late - pre at each event's time-in-trial, Hz (0 when no control). */
  readonly controlPost: Float64Array;
  readonly controlLate: Float64Array;
  /**
   * The same windows' rates in reference trials, one sample per reference
   * trial at the time-in-trial of one of the jumps (see classifyJumps), Hz;
   * empty when there is no matched control.
   */
  readonly refPre: Float64Array;
  readonly refPost: Float64Array;
  readonly refLate: Float64Array;
  /** Event-averaged, control-subtracted PSTH (Hz) on bins of binS starting at psthStartS. */
  readonly psth: Float64Array;
  readonly psthStartS: number;
  readonly binS: number;
  /** Numeric jump size per event (NaN when unknown). */
  readonly size: Float64Array;
}

export interface JumpUnitResult {
  readonly nEvents: number;
  /** Mean controlled change in the answer window, Hz (post - pre minus the control's). */
  readonly deltaHz: number;
  /** Mean controlled change in the late window, Hz. */
  readonly lateDeltaHz: number;
  /**
   * Two-sided p of the answer (NaN with too few events): rank-sum of the
   * events' changes against the reference samples' (`test` 'rank-sum'), or
   * without reference samples signed-rank of the events' changes ('signed-rank').
   */
  readonly p: number;
  /** +1 when the events' changes tend to be larger (rank-sum: than the reference samples'; signed-rank: than 0), -1 smaller, 0 neither. */
  readonly direction: number;
  readonly test: 'rank-sum' | 'signed-rank';
  /** Reference samples the rank-sum compared against (0 for signed-rank). */
  readonly nReference: number;
  /** The same test of the late change, and of answer minus late change (decay); NaN when not run (opts.shapeTestsBelowP). */
  readonly lateP: number;
  readonly decayP: number;
  readonly decayDirection: number;
  readonly lateDirection: number;
  /** (early - late) / (|early| + |late|), signed so 1 = returns to baseline, 0 = lasting step, < 0 = grows. */
  readonly transience: number;
  /** PSTH peak in the answer window, in the direction of the mean change (maximum when it is positive, minimum when negative). */
  readonly peakDeltaHz: number;
  readonly peakZ: number;
  readonly peakS: number;
  /** First time the PSTH stays beyond +-zThreshold for runBins bins in the answer's direction, s (NaN if never). */
  readonly latencyS: number;
  /** Spearman of the controlled answer against jump size. */
  readonly sizeRho: number;
  readonly sizeP: number;
  /** The control-subtracted event-averaged PSTH (Hz) it was computed from, bins of binS from psthStartS. */
  readonly psth: Float64Array;
}

/**
 * Largest sample (each side) for the exact rank-sum distribution; above it (or
 * with ties) the normal approximation. The exact count costs about
 * (nX + nY) nX (nX + nY)^2 / 2 steps, ~3 M at 30 + 30, run three times per unit
 * and kind: too slow for a 1,000-unit session, where 15 + 15 costs ~0.2 M. Our choice.
 */
export const RANK_SUM_EXACT_MAX_N = 15;

/**
 * A change in Hz rounded to 1e-6 Hz before ranking: changes are differences
 * of counts / window length, and equal differences computed from different
 * counts (5/0.3 - 3/0.3 and 4/0.3 - 2/0.3) can differ in the last bit, which
 * would break their tie at random. 1e-6 Hz is far below one spike per window.
 */
function snap(hz: number): number {
  return Math.round(hz * 1e6) / 1e6;
}

/**
 * Statistics of one unit's answer to one kind of jump (issue 5).
 *
 * Effect sizes use the matched control by subtraction: each event's change
 * (post - pre) minus the mean change of all reference trials over the same
 * windows at the same time-in-trial, so a change that an ongoing ramp would
 * produce anyway is not counted as an answer (deltaHz, lateDeltaHz, the PSTH).
 *
 * The test compares the events' own changes with reference samples' changes
 * (one per reference trial, at a jump's time-in-trial): a two-sample rank-sum
 * (Mann-Whitney) test, two-sided. Testing the control-subtracted changes
 * against 0 instead (a signed-rank test) is not valid: every event shares
 * the same estimated control, whose error the test ignores, and for a sparse
 * unit most changes are exactly 0, so subtracting a small control gives them
 * all one sign (simulated null units below 1 Hz reached p < 0.05 in 26-35 %
 * of cases; test/core/classify/classify-jumps.test.ts). Without reference
 * samples: signed-rank of the events' changes (no control).
 */
export function jumpUnit(
  x: JumpUnitInput,
  window: { postStartS: number; postEndS: number; preStartS: number; preEndS: number },
  opts: {
    minEvents: number;
    exactMaxN: number;
    zThreshold: number;
    runBins: number;
    direction?: number;
    /**
     * The late and decay tests only when the answer's p is below this (default: always).
     * classifyJumps passes the FDR level: a BH q is never below its p, so a unit with
     * p >= alpha is never called, and its shape is never asked for (lateP, decayP NaN).
     */
    shapeTestsBelowP?: number;
  },
): JumpUnitResult {
  const n = x.pre.length;
  const early = new Float64Array(n);
  const late = new Float64Array(n);
  const decay = new Float64Array(n);
  const controlled = new Float64Array(n); // the answer net of the matched control (size relation)
  let se = 0;
  let sl = 0;
  for (let e = 0; e < n; e++) {
    early[e] = snap(x.post[e] - x.pre[e]);
    late[e] = snap(x.late[e] - x.pre[e]);
    decay[e] = snap(x.post[e] - x.late[e]);
    controlled[e] = x.post[e] - x.pre[e] - x.controlPost[e]; // effect sizes from the unrounded changes
    se += controlled[e];
    sl += x.late[e] - x.pre[e] - x.controlLate[e];
  }
  const deltaHz = n > 0 ? se / n : NaN;
  const lateDeltaHz = n > 0 ? sl / n : NaN;
  const enough = n >= opts.minEvents;
  const nRef = x.refPre.length;
  const rankSum = nRef > 0;
  let test: (d: Float64Array, ref: (k: number) => number) => { p: number; direction: number };
  if (rankSum) {
    const refD = new Float64Array(nRef);
    test = (d, ref) => {
      for (let k = 0; k < nRef; k++) refD[k] = snap(ref(k));
      const r = mannWhitney(d, refD, Math.min(opts.exactMaxN, RANK_SUM_EXACT_MAX_N));
      return { p: r.p, direction: r.pXGreater < r.pXLess ? 1 : r.pXLess < r.pXGreater ? -1 : 0 };
    };
  } else test = (d) => wilcoxonSignedRank(d, opts.exactMaxN);
  const t = enough ? test(early, (k) => x.refPost[k] - x.refPre[k]) : null;
  const shape = t !== null && t.p < (opts.shapeTestsBelowP ?? Infinity);
  const tl = shape ? test(late, (k) => x.refLate[k] - x.refPre[k]) : null;
  const td = shape ? test(decay, (k) => x.refPost[k] - x.refLate[k]) : null;
  const s = Math.sign(deltaHz);
  const denom = Math.abs(deltaHz) + Math.abs(lateDeltaHz);
  const transience = denom > 0 ? (s * (deltaHz - lateDeltaHz)) / denom : NaN;

  // PSTH: baseline from the pre window's bins, peak and latency in the answer window.
  const nb = x.psth.length;
  const binOf = (tS: number) => Math.round((tS - x.psthStartS) / x.binS);
  const b0 = Math.max(0, binOf(window.preStartS));
  const b1 = Math.min(nb, binOf(window.preEndS));
  const a0 = Math.max(0, binOf(window.postStartS));
  const a1 = Math.min(nb, binOf(window.postEndS));
  let m = 0;
  for (let j = b0; j < b1; j++) m += x.psth[j];
  const nbBase = b1 - b0;
  m = nbBase > 0 ? m / nbBase : NaN;
  let v = 0;
  for (let j = b0; j < b1; j++) v += (x.psth[j] - m) ** 2;
  const sd = nbBase > 1 ? Math.sqrt(v / (nbBase - 1)) : NaN;
  const dir = opts.direction ?? Math.sign(deltaHz);
  let best = -1;
  let bestScore = -Infinity;
  for (let j = a0; j < a1; j++) {
    const d = x.psth[j] - m;
    const score = dir > 0 ? d : dir < 0 ? -d : Math.abs(d);
    if (score > bestScore) {
      bestScore = score;
      best = j;
    }
  }
  const peakDeltaHz = best >= 0 ? x.psth[best] - m : NaN;
  const peakZ = best >= 0 && sd > 0 ? peakDeltaHz / sd : NaN;
  const peakS = best >= 0 ? x.psthStartS + (best + 0.5) * x.binS : NaN;
  let latencyS = NaN;
  if (dir !== 0 && sd > 0) {
    let run = 0;
    for (let j = a0; j < a1; j++) {
      const z = (x.psth[j] - m) / sd;
      if (dir * z > opts.zThreshold) {
        run++;
        if (run >= opts.runBins) {
          latencyS = x.psthStartS + (j - run + 1) * x.binS;
          break;
        }
      } else run = 0;
    }
  }
  const sz = spearman(x.size, controlled);
  return {
    nEvents: n,
    deltaHz,
    lateDeltaHz,
    p: t ? t.p : NaN,
    direction: t ? t.direction : 0,
    test: rankSum ? 'rank-sum' : 'signed-rank',
    nReference: nRef,
    lateP: tl ? tl.p : NaN,
    lateDirection: tl ? tl.direction : 0,
    decayP: td ? td.p : NaN,
    decayDirection: td ? td.direction : 0,
    transience,
    peakDeltaHz,
    peakZ,
    peakS,
    latencyS,
    sizeRho: sz.rho,
    sizeP: sz.p,
    psth: x.psth,
  };
}
