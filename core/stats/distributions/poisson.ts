import { regularizedGammaP, regularizedGammaQ } from './regularized-gamma';

/**
 * Poisson distribution with mean lambda >= 0, for integer counts k.
 * poissonCdf(k) = P(X <= k) = Q(k + 1, lambda); poissonSf(k) = P(X >= k)
 * = P(k, lambda) for k >= 1 (Abramowitz & Stegun 26.4.21). Exact-test tails
 * without summing terms. Checked against @stdlib/stats-base-dists-poisson-cdf.
 * lambda = 0: all mass at 0.
 */
export function poissonCdf(k: number, lambda: number): number {
  if (Number.isNaN(k) || Number.isNaN(lambda) || lambda < 0) return NaN;
  if (k < 0) return 0;
  const kk = Math.floor(k);
  if (lambda === 0) return 1;
  return regularizedGammaQ(kk + 1, lambda);
}

/** P(X >= k) for a Poisson count with mean lambda. */
export function poissonSf(k: number, lambda: number): number {
  if (Number.isNaN(k) || Number.isNaN(lambda) || lambda < 0) return NaN;
  const kk = Math.ceil(k);
  if (kk <= 0) return 1;
  if (lambda === 0) return 0;
  return regularizedGammaP(kk, lambda);
}
