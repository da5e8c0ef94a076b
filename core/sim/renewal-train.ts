import type { Rng } from '../random/rng';

/**
 * Spike times of a stationary renewal process on [startS, stopS): each ISI is
 * an absolute refractory period plus a gamma-distributed interval,
 *   ISI = refractoryS + Gamma(shape, theta),  theta = (1/rateHz - refractoryS) / shape,
 * so the mean rate is rateHz exactly. shape = 1 gives a Poisson process with
 * dead time; larger shapes fire more regularly (CV of the gamma part =
 * 1/sqrt(shape)). The process is started 10 mean ISIs before startS and only
 * spikes inside the window are kept, so the train is stationary from startS.
 *
 * Edge cases: rateHz <= 0 or stopS <= startS gives an empty train; a rate at
 * or above 1/refractoryS is an error (the refractory period cannot be kept).
 */
export function renewalTrain(
  rng: Rng,
  rateHz: number,
  startS: number,
  stopS: number,
  shape = 1,
  refractoryS = 0.002,
): Float64Array {
  if (!(rateHz > 0) || !(stopS > startS)) return new Float64Array(0);
  const meanIsi = 1 / rateHz;
  if (!(meanIsi > refractoryS)) throw new Error(`rate ${rateHz} Hz cannot keep a ${refractoryS} s refractory period`);
  if (!(shape > 0)) throw new Error(`gamma shape must be > 0, got ${shape}`);
  const theta = (meanIsi - refractoryS) / shape;
  const expected = (stopS - startS) * rateHz;
  let out = new Float64Array(Math.ceil(expected + 6 * Math.sqrt(expected) + 16));
  let n = 0;
  let t = startS - 10 * meanIsi;
  for (;;) {
    t += refractoryS + theta * (shape === 1 ? rng.exponential() : rng.gamma(shape));
    if (t >= stopS) break;
    if (t < startS) continue;
    if (n === out.length) {
      const grown = new Float64Array(out.length * 2);
      grown.set(out);
      out = grown;
    }
    out[n++] = t;
  }
  return out.slice(0, n);
}
