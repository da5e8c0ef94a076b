import { studentTTwoSided } from './distributions';
import { midRanks } from './mid-ranks';

export interface SpearmanResult {
  /** Spearman's rho: Pearson correlation of the mid-ranks (ties averaged). */
  readonly rho: number;
  /** Pairs used (both finite). */
  readonly n: number;
  /** Two-sided p from t = rho sqrt((n - 2) / (1 - rho^2)) on n - 2 df. */
  readonly p: number;
}

/**
 * Spearman rank correlation with the usual t approximation for its p-value.
 * Pairs with a NaN on either side are dropped.
 *
 * Edge cases: n < 3 or a constant sample gives NaN rho and p; |rho| = 1
 * gives p = 0.
 * Reference: SciPy 1.17 scipy.stats.spearmanr (same rho and p definition),
 * checked against a committed SciPy fixture (test/fixtures/spearman.json).
 */
export function spearman(x: ArrayLike<number>, y: ArrayLike<number>): SpearmanResult {
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 0; i < Math.min(x.length, y.length); i++) {
    if (x[i] === x[i] && y[i] === y[i]) {
      xs.push(x[i]);
      ys.push(y[i]);
    }
  }
  const n = xs.length;
  if (n < 3) return { rho: NaN, n, p: NaN };
  const rx = midRanks(xs).ranks;
  const ry = midRanks(ys).ranks;
  const m = (n + 1) / 2;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const a = rx[i] - m;
    const b = ry[i] - m;
    sxy += a * b;
    sxx += a * a;
    syy += b * b;
  }
  if (!(sxx > 0) || !(syy > 0)) return { rho: NaN, n, p: NaN };
  const rho = Math.max(-1, Math.min(1, sxy / Math.sqrt(sxx * syy)));
  const df = n - 2;
  const t = rho * Math.sqrt(df / ((1 + rho) * (1 - rho)));
  return { rho, n, p: studentTTwoSided(t, df) };
}
