import { regularizedBeta } from './regularized-beta';

/**
 * Student t distribution with nu > 0 degrees of freedom.
 * Two-sided p of |T| >= |t|: I_{nu/(nu+t^2)}(nu/2, 1/2) (Abramowitz & Stegun
 * 26.7.1). Checked against @stdlib/stats-base-dists-t-cdf.
 */
export function studentTTwoSided(t: number, nu: number): number {
  if (Number.isNaN(t) || !(nu > 0)) return NaN;
  if (!Number.isFinite(t)) return 0;
  return regularizedBeta(nu / (nu + t * t), nu / 2, 0.5);
}

/** P(T <= t). */
export function studentTCdf(t: number, nu: number): number {
  const tail = studentTTwoSided(t, nu) / 2;
  return t < 0 ? tail : 1 - tail;
}
