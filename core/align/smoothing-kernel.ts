import type { Smoothing } from './types';

/**
 * Discrete PSTH smoothing weights for a bin width, normalised to sum 1, with
 * `center` = the index of lag 0 (weights[j] multiplies the bin j - center
 * bins earlier: smoothed[i] = sum_j weights[j] x[i - (j - center)]).
 * - gaussian: SD widthMs, sampled at bin centres over +-4 SD (common practice);
 * - exponential: causal, time constant widthMs, exp(-lag/tau) over lags
 *   0..ceil(5 tau) bins (only the present and past bins: no response leaks
 *   before its cause);
 * - boxcar: full width widthMs rounded to whole bins (at least 1), centred
 *   (an even count puts the extra bin in the past);
 * - none, or a width below a tenth of a bin: the identity [1].
 */
export function smoothingKernel(s: Smoothing | undefined, binS: number): { weights: Float64Array; center: number } {
  const identity = { weights: Float64Array.of(1), center: 0 };
  if (!s || s.kind === 'none') return identity;
  if (!(s.widthMs > 0) || !Number.isFinite(s.widthMs)) throw new Error(`smoothing width must be a positive number of ms, got ${s.widthMs}`);
  const w = s.widthMs / 1000 / binS; // width in bins
  if (w < 0.1) return identity;
  let weights: Float64Array;
  let center: number;
  if (s.kind === 'gaussian') {
    const half = Math.ceil(4 * w);
    weights = new Float64Array(2 * half + 1);
    for (let j = -half; j <= half; j++) weights[j + half] = Math.exp(-0.5 * (j / w) * (j / w));
    center = half;
  } else if (s.kind === 'exponential') {
    const len = Math.ceil(5 * w) + 1;
    weights = new Float64Array(len);
    for (let j = 0; j < len; j++) weights[j] = Math.exp(-j / w);
    center = 0;
  } else {
    const nb = Math.max(1, Math.round(w));
    weights = new Float64Array(nb).fill(1);
    // even nb: lags -(nb/2 - 1) .. nb/2, i.e. the extra bin in the past
    center = nb % 2 === 0 ? nb / 2 - 1 : (nb - 1) / 2;
  }
  let sum = 0;
  for (const x of weights) sum += x;
  for (let j = 0; j < weights.length; j++) weights[j] /= sum;
  return { weights, center };
}
