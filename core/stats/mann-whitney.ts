import { normalCdf } from './distributions';
import { sortWithIndex } from './sort-with-index';

export interface RankSumResult {
  /** W = sum of the ranks of y in the pooled sample (Hollander & Wolfe's statistic). */
  readonly rankSumY: number;
  /** U = number of pairs (x_i, y_j) with x_i > y_j, ties counting 1/2 (R's "W"). */
  readonly uX: number;
  readonly nX: number;
  readonly nY: number;
  /** Two-sided p-value (NaN when either sample is empty). */
  readonly p: number;
  /** One-sided p for "x tends to be larger than y". */
  readonly pXGreater: number;
  /** One-sided p for "x tends to be smaller than y". */
  readonly pXLess: number;
  readonly method: 'exact' | 'normal';
}

/**
 * Wilcoxon rank-sum / Mann-Whitney test of two independent samples. NaNs are
 * dropped.
 *
 * - No ties and both samples <= exactMaxN (default 50): exact null
 *   distribution of the rank sum (all C(N, nY) rank sets equally likely).
 * - Otherwise normal approximation: E[U] = nX nY / 2,
 *   Var[U] = nX nY / 12 (N + 1 - sum(t^3 - t) / (N (N - 1))), continuity
 *   correction 0.5 toward the mean (as R's wilcox.test).
 * - Two-sided p = min(1, 2 min(one-sided p)).
 *
 * Reference: Hollander & Wolfe (1973) Nonparametric Statistical Methods,
 * section 4.1 and the p. 69 example (W = 35, one-sided p = 382/3003).
 */
export function mannWhitney(x: ArrayLike<number>, y: ArrayLike<number>, exactMaxN = 50): RankSumResult {
  let nX = 0;
  let nY = 0;
  for (let i = 0; i < x.length; i++) if (x[i] === x[i]) nX++;
  for (let j = 0; j < y.length; j++) if (y[j] === y[j]) nY++;
  if (nX === 0 || nY === 0) {
    return { rankSumY: NaN, uX: NaN, nX, nY, p: NaN, pXGreater: NaN, pXLess: NaN, method: 'normal' };
  }
  // Sort each sample, then merge: a run of equal values at pooled positions
  // pos+1 .. pos+t has mid-rank pos + (t + 1) / 2, of which x holds a values.
  // (Sums of half-integers are exact, so rx equals the sum of x's mid-ranks.)
  const buf = scratch(nX + nY);
  const xs = buf.values.subarray(0, nX);
  const ys = buf.values.subarray(nX, nX + nY);
  for (let i = 0, k = 0; i < x.length; i++) if (x[i] === x[i]) xs[k++] = x[i];
  for (let j = 0, k = 0; j < y.length; j++) if (y[j] === y[j]) ys[k++] = y[j];
  sortWithIndex(buf.values, buf.index, 0, nX);
  sortWithIndex(buf.values, buf.index, nX, nX + nY);
  let rx = 0;
  let tieSum = 0;
  let pos = 0;
  let i = 0;
  let j = 0;
  while (i < nX || j < nY) {
    const v = i < nX && (j >= nY || xs[i] <= ys[j]) ? xs[i] : ys[j];
    let a = 0;
    let b = 0;
    while (i < nX && xs[i] === v) {
      a++;
      i++;
    }
    while (j < nY && ys[j] === v) {
      b++;
      j++;
    }
    const t = a + b;
    rx += a * (pos + (t + 1) / 2);
    if (t > 1) tieSum += t * t * t - t;
    pos += t;
  }
  const nn = nX + nY;
  const rankSumY = (nn * (nn + 1)) / 2 - rx;
  const uX = rx - (nX * (nX + 1)) / 2;
  const meanU = (nX * nY) / 2;
  let pXGreater: number;
  let pXLess: number;
  let method: 'exact' | 'normal';
  if (tieSum === 0 && nX <= exactMaxN && nY <= exactMaxN) {
    method = 'exact';
    // ways[k][s]: subsets of size k of ranks 1..i with rank sum s (s offset by k(k+1)/2 not needed).
    const m = nX;
    const maxSum = (nn * (nn + 1)) / 2;
    let ways: Float64Array[] = Array.from({ length: m + 1 }, () => new Float64Array(maxSum + 1));
    ways[0][0] = 1;
    for (let r = 1; r <= nn; r++) {
      for (let k = Math.min(r, m); k >= 1; k--) {
        const dst = ways[k];
        const src = ways[k - 1];
        for (let s = maxSum; s >= r; s--) dst[s] += src[s - r];
      }
    }
    const dist = ways[m];
    ways = [];
    let total = 0;
    for (let s = 0; s <= maxSum; s++) total += dist[s];
    const obs = Math.round(rx);
    let le = 0;
    for (let s = 0; s <= obs; s++) le += dist[s];
    let ge = 0;
    for (let s = obs; s <= maxSum; s++) ge += dist[s];
    pXLess = Math.min(1, le / total);
    pXGreater = Math.min(1, ge / total);
  } else {
    method = 'normal';
    const sd = Math.sqrt(((nX * nY) / 12) * (nn + 1 - tieSum / (nn * (nn - 1))));
    if (!(sd > 0)) {
      pXGreater = 1;
      pXLess = 1;
    } else {
      pXGreater = normalCdf(-(uX - meanU - 0.5) / sd);
      pXLess = normalCdf((uX - meanU + 0.5) / sd);
    }
  }
  let p: number;
  if (method === 'normal') {
    const sd = Math.sqrt(((nX * nY) / 12) * (nn + 1 - tieSum / (nn * (nn - 1))));
    const z = sd > 0 ? (uX - meanU - 0.5 * Math.sign(uX - meanU)) / sd : 0;
    p = Math.min(1, 2 * normalCdf(-Math.abs(z)));
  } else {
    p = Math.min(1, 2 * Math.min(pXLess, pXGreater));
  }
  return { rankSumY, uX, nX, nY, p, pXGreater, pXLess, method };
}

/** Sort buffers reused across calls (thousands of tests per session; not re-entrant, nothing escapes). */
let buffers = { values: new Float64Array(0), index: new Int32Array(0) };
function scratch(n: number): { values: Float64Array; index: Int32Array } {
  if (buffers.values.length < n) buffers = { values: new Float64Array(2 * n), index: new Int32Array(2 * n) };
  return buffers;
}
