import { regularizedGammaQ } from './regularized-gamma';

/**
 * Upper tail of the chi-square distribution with k degrees of freedom:
 * P(X >= x) = Q(k/2, x/2). Used for likelihood-ratio tests.
 * Checked against @stdlib/stats-base-dists-chisquare-cdf.
 */
export function chiSquareSf(x: number, k: number): number {
  if (Number.isNaN(x) || !(k > 0)) return NaN;
  if (x <= 0) return 1;
  return regularizedGammaQ(k / 2, x / 2);
}
