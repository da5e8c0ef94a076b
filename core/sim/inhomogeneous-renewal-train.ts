import type { Rng } from '../random/rng';
import { profileIntegral } from './profile-integral';
import type { RateProfile } from './rate-profile';

/**
 * Spike times on [startS, stopS) of a renewal process whose rate follows a
 * piecewise-constant profile (Hz), by time rescaling (Brown et al. 2002,
 * Neural Comput 14:325; Barbieri et al. 2001, J Neurosci Methods 105:25):
 * after each spike the unit is dead for `refractoryS`; then a gamma interval
 * of mean 1 and shape `shape` is drawn in operational time and mapped back
 * through the integrated "free" rate
 *   f(t) = r(t) / (1 - r(t) * refractoryS),
 * chosen so that inside any stretch of constant rate r the mean ISI is
 * refractoryS + 1/f = 1/r: the realised rate equals the profile exactly
 * there, as for renewalTrain (which this reduces to for a constant profile).
 * shape = 1 is a Poisson process with dead time; larger shapes fire more
 * regularly (CV of the gamma part 1/sqrt(shape)); shapes below 1 are bursty.
 *
 * The walk is a single pass over spikes and breakpoints together, so an
 * hours-long session with sparse modulation windows costs O(spikes + breaks).
 * The process starts 10 mean ISIs before startS (at the rate in force at
 * startS) so it is stationary from startS. Rates are clamped to
 * [0, 0.95 / refractoryS]; a zero rate simply pauses the process.
 *
 * Edge cases: stopS <= startS gives an empty train; shape <= 0 or a negative
 * refractory period are errors.
 */
export function inhomogeneousRenewalTrain(
  rng: Rng,
  profile: RateProfile,
  startS: number,
  stopS: number,
  shape = 1,
  refractoryS = 0.002,
): Float64Array {
  if (!(stopS > startS)) return new Float64Array(0);
  if (!(shape > 0)) throw new Error(`gamma shape must be > 0, got ${shape}`);
  if (!(refractoryS >= 0)) throw new Error(`refractory period must be >= 0, got ${refractoryS}`);
  const breaks = profile.breaks;
  const values = profile.values;
  const nb = breaks.length;
  const maxRate = refractoryS > 0 ? 0.95 / refractoryS : Infinity;
  const free = (r: number) => {
    const c = r > maxRate ? maxRate : r > 0 ? r : 0;
    return c / (1 - c * refractoryS);
  };

  // segment k covers [breaks[k-1], breaks[k]) with value values[k]
  let k = 0;
  while (k < nb && breaks[k] <= startS) k++;
  const r0 = values[k] > 0 ? Math.min(values[k], maxRate) : 0;
  let pos = r0 > 0 ? startS - 10 / r0 : startS;
  k = 0;
  while (k < nb && breaks[k] <= pos) k++;

  let out = new Float64Array(Math.max(16, Math.ceil(Math.min(5e7, profileIntegral(profile, startS, stopS)) * 1.2 + 16)));
  let n = 0;
  const unitShape = shape === 1;
  for (;;) {
    // operational time to the next spike, mean 1
    let u = unitShape ? rng.exponential() : rng.gamma(shape) / shape;
    // walk segments until u is used up
    let t = NaN;
    while (pos < stopS) {
      const end = k < nb ? breaks[k] : Infinity;
      const f = free(values[k]);
      if (f > 0) {
        const dt = u / f;
        if (pos + dt < end) {
          t = pos + dt;
          break;
        }
        u -= (end - pos) * f;
      }
      if (end === Infinity) break; // silent for ever after
      pos = end;
      k++;
    }
    if (!(t < stopS)) break;
    if (t >= startS) {
      if (n === out.length) {
        const grown = new Float64Array(out.length * 2);
        grown.set(out);
        out = grown;
      }
      out[n++] = t;
    }
    // dead time
    pos = t + refractoryS;
    while (k < nb && breaks[k] <= pos) k++;
  }
  return out.slice(0, n);
}
