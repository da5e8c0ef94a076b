import { regularizedBeta } from './regularized-beta';

/**
 * Binomial distribution, n trials, success probability p, integer k.
 * binomialCdf(k) = P(X <= k) = I_{1-p}(n - k, k + 1); binomialSf(k) =
 * P(X >= k) = I_p(k, n - k + 1) (Abramowitz & Stegun 26.5.24).
 * Checked against @stdlib/stats-base-dists-binomial-cdf.
 */
export function binomialCdf(k: number, n: number, p: number): number {
  if ([k, n, p].some(Number.isNaN) || n < 0 || p < 0 || p > 1) return NaN;
  const kk = Math.floor(k);
  if (kk < 0) return 0;
  if (kk >= n) return 1;
  if (p === 0) return 1;
  if (p === 1) return 0;
  return regularizedBeta(1 - p, n - kk, kk + 1);
}

/** P(X >= k) for a binomial count. */
export function binomialSf(k: number, n: number, p: number): number {
  if ([k, n, p].some(Number.isNaN) || n < 0 || p < 0 || p > 1) return NaN;
  const kk = Math.ceil(k);
  if (kk <= 0) return 1;
  if (kk > n) return 0;
  if (p === 0) return 0;
  if (p === 1) return 1;
  return regularizedBeta(p, kk, n - kk + 1);
}
