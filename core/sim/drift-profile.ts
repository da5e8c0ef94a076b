import type { Rng } from '../random/rng';
import type { RateProfile } from './rate-profile';
import { constantProfile } from './constant-profile';

/**
 * Slow multiplicative drift of a unit's rate (the slow changes of excitability
 * and electrode distance seen over hours): a gain constant on steps of
 * `stepS` from `startS` to `stopS`, gain = exp(x_k - sd^2 / 2) where x_k is a
 * stationary AR(1) series with SD `sd` and correlation 0.9 between steps
 * (common practice for simulated drift; our choice). The -sd^2/2 makes the
 * mean gain 1. sd = 0 (or stepS <= 0) gives the constant gain 1.
 */
export function driftProfile(rng: Rng, sd: number, stepS: number, startS: number, stopS: number): RateProfile {
  if (!(sd > 0) || !(stepS > 0) || !(stopS > startS)) return constantProfile(1);
  const steps = Math.max(1, Math.ceil((stopS - startS) / stepS));
  const rho = 0.9;
  const innov = sd * Math.sqrt(1 - rho * rho);
  const breaks = new Float64Array(steps - 1);
  const values = new Float64Array(steps);
  let x = sd * rng.normal();
  for (let k = 0; k < steps; k++) {
    if (k > 0) {
      x = rho * x + innov * rng.normal();
      breaks[k - 1] = startS + k * stepS;
    }
    values[k] = Math.exp(x - (sd * sd) / 2);
  }
  return { breaks, values };
}
