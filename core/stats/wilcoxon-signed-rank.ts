import { normalCdf } from './distributions';
import { sortWithIndex } from './sort-with-index';

export interface SignedRankResult {
  /** V = sum of the ranks of |d| over positive d (zeros dropped). */
  readonly statistic: number;
  /** Number of non-zero differences used. */
  readonly n: number;
  /** Number of zero differences dropped. */
  readonly zeros: number;
  /** Two-sided p-value (NaN when n = 0). */
  readonly p: number;
  /** One-sided p for the alternative "differences tend to be positive". */
  readonly pGreater: number;
  /** One-sided p for "differences tend to be negative". */
  readonly pLess: number;
  /** +1 when V is above its null mean n(n+1)/4, -1 below, 0 at it. */
  readonly direction: number;
  /** "exact" or "normal". */
  readonly method: 'exact' | 'normal';
}

/**
 * Wilcoxon signed-rank test of the hypothesis that the differences d are
 * symmetric about 0 (paired samples: pass d = x - y).
 *
 * - Zeros are dropped (Wilcoxon's convention; R and @stdlib default).
 *   NaN differences are dropped too (counted neither as zeros nor in n).
 * - |d| get mid-ranks. n <= exactMaxN (default 50; callers running thousands of tests may lower it, the exact
 *   computation costs O(n^3)): the exact permutation
 *   distribution of V given those ranks (all 2^n sign patterns equally likely),
 *   computed by dynamic programming over twice the ranks, so ties are handled
 *   exactly rather than switching to an approximation.
 * - Larger n: normal approximation, mean n(n+1)/4, variance
 *   n(n+1)(2n+1)/24 - sum(t^3 - t)/48, with a continuity correction of 0.5
 *   toward the mean (as R's wilcox.test and @stdlib/stats-wilcoxon).
 * - Two-sided p = min(1, 2 min(P(V <= v), P(V >= v))).
 *
 * Reference: Hollander & Wolfe (1973) Nonparametric Statistical Methods,
 * section 3.1 and p. 29 example; checked against @stdlib/stats-wilcoxon.
 */
export function wilcoxonSignedRank(d: ArrayLike<number>, exactMaxN = 50): SignedRankResult {
  // |d| of the non-zero, non-NaN differences into reused buffers, with their
  // signs; one sort, then mid-ranks run by run. V and the tie term are sums of
  // half-integers and integers, exact in any order, so they equal the sums of
  // midRanks' ranks over the positive differences.
  if (buffers.abs.length < d.length) buffers = { abs: new Float64Array(2 * d.length), index: new Int32Array(2 * d.length), positive: new Uint8Array(2 * d.length), r2: new Int32Array(2 * d.length) };
  const { abs, index, positive, r2 } = buffers; // reused across calls (not re-entrant; nothing escapes)
  let zeros = 0;
  let n = 0;
  for (let i = 0; i < d.length; i++) {
    const v = d[i];
    if (v === 0) zeros++;
    else if (v === v) {
      abs[n] = Math.abs(v);
      positive[n] = v > 0 ? 1 : 0;
      index[n] = n;
      n++;
    }
  }
  if (n === 0) {
    return { statistic: 0, n: 0, zeros, p: NaN, pGreater: NaN, pLess: NaN, direction: 0, method: 'exact' };
  }
  sortWithIndex(abs, index, 0, n);
  let v = 0;
  let tieSum = 0;
  for (let i = 0; i < n; ) {
    let j = i + 1;
    while (j < n && abs[j] === abs[i]) j++;
    const t = j - i;
    if (t > 1) tieSum += t * t * t - t;
    const rank = (i + 1 + j) / 2; // mean of ranks i+1 .. j
    for (let k = i; k < j; k++) {
      if (positive[index[k]]) v += rank;
      r2[index[k]] = i + 1 + j; // doubled mid-rank, an integer
    }
    i = j;
  }
  const mean = (n * (n + 1)) / 4;
  const direction = v > mean ? 1 : v < mean ? -1 : 0;
  let pLess: number;
  let pGreater: number;
  let method: 'exact' | 'normal';
  if (n <= exactMaxN) {
    method = 'exact';
    // Doubled mid-ranks are integers; count sign patterns by their doubled V.
    let total = 0;
    for (let i = 0; i < n; i++) total += r2[i];
    // Frequencies as probabilities (each step halves), avoiding overflow of 2^n.
    let dist = new Float64Array(total + 1);
    dist[0] = 1;
    let reach = 0;
    for (let i = 0; i < n; i++) {
      const next = new Float64Array(total + 1);
      const r = r2[i];
      for (let s = 0; s <= reach; s++) {
        const f = dist[s];
        if (f === 0) continue;
        next[s] += 0.5 * f;
        next[s + r] += 0.5 * f;
      }
      reach += r;
      dist = next;
    }
    const v2 = Math.round(2 * v);
    let le = 0;
    for (let s = 0; s <= v2; s++) le += dist[s];
    let ge = 0;
    for (let s = v2; s <= total; s++) ge += dist[s];
    pLess = Math.min(1, le);
    pGreater = Math.min(1, ge);
  } else {
    method = 'normal';
    const sd = Math.sqrt((n * (n + 1) * (2 * n + 1)) / 24 - tieSum / 48);
    if (!(sd > 0)) {
      pLess = 1;
      pGreater = 1;
    } else {
      pGreater = normalCdf(-(v - mean - 0.5) / sd);
      pLess = normalCdf((v - mean + 0.5) / sd);
    }
  }
  let p: number;
  if (method === 'normal') {
    // Continuity correction toward the mean, as R / @stdlib: z = (V - mean - 0.5 sign) / sd.
    const sd = Math.sqrt((n * (n + 1) * (2 * n + 1)) / 24 - tieSum / 48);
    const z = sd > 0 ? (v - mean - 0.5 * Math.sign(v - mean)) / sd : 0;
    p = Math.min(1, 2 * normalCdf(-Math.abs(z)));
  } else {
    p = Math.min(1, 2 * Math.min(pLess, pGreater));
  }
  return { statistic: v, n, zeros, p, pGreater, pLess, direction, method };
}

let buffers = { abs: new Float64Array(0), index: new Int32Array(0), positive: new Uint8Array(0), r2: new Int32Array(0) };
