import { doubleExponentialPeakTime } from './double-exponential-peak-time';
import type { Kernel } from './types';

/**
 * A function t (s after the spike) -> dF/F of the kernel (types.ts gives the
 * forms). The returned closure precomputes the normalisation once. 0 for t < 0
 * and NaN t gives NaN.
 */
export function kernelValue(kernel: Kernel): (t: number) => number {
  switch (kernel.kind) {
    case 'double-exponential': {
      const { tauRiseS: tr, tauDecayS: td, peakDff } = kernel;
      const tp = doubleExponentialPeakTime(tr, td);
      const hp = Math.exp(-tp / td) - Math.exp(-tp / tr);
      const scale = peakDff / hp;
      return (t) => (t < 0 ? 0 : scale * (Math.exp(-t / td) - Math.exp(-t / tr)));
    }
    case 'alpha': {
      const { tauS, peakDff } = kernel;
      return (t) => (t < 0 ? 0 : peakDff * (t / tauS) * Math.exp(1 - t / tauS));
    }
    case 'sampled': {
      const { values, sampleRateHz, gain } = kernel;
      const n = values.length;
      return (t) => {
        if (t !== t) return NaN;
        const u = t * sampleRateHz;
        if (u < 0 || u >= n) return 0;
        const i = Math.floor(u);
        const f = u - i;
        const a = values[i];
        const b = i + 1 < n ? values[i + 1] : 0;
        return gain * (a + f * (b - a));
      };
    }
  }
}
