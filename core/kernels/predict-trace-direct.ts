import { kernelValue } from './kernel-value';
import type { Kernel, SampleGrid } from './types';

/**
 * Reference prediction by direct summation: y(t_n) = weight * sum over all
 * spikes s <= t_n of h(t_n - s), evaluating the kernel's closed form (or its
 * linear interpolant for sampled kernels) for every spike-sample pair.
 * O(samples x spikes): for checking predictTrace and for tiny inputs only.
 * NaN spike times are skipped; a spike within 1e-9 sample of a sample
 * counts as on it (as in predictTrace).
 */
export function predictTraceDirect(spikeTimes: ArrayLike<number>, kernel: Kernel, grid: SampleGrid, weight = 1): Float64Array {
  const h = kernelValue(kernel);
  const out = new Float64Array(grid.length);
  for (let k = 0; k < grid.length; k++) {
    const t = grid.startS + k / grid.rateHz;
    let s = 0;
    for (let i = 0; i < spikeTimes.length; i++) {
      let d = t - spikeTimes[i];
      if (Math.abs(d) * grid.rateHz < 1e-9) d = 0; // on the sample (predictTrace's convention)
      if (d >= 0) s += h(d);
    }
    out[k] = weight * s;
  }
  return out;
}
