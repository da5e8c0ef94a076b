import { doubleExponentialPeakTime } from './double-exponential-peak-time';
import { kernelValue } from './kernel-value';
import type { Kernel, KernelTiming } from './types';

/**
 * Half-rise time, time to peak and half-decay time of a kernel's single-spike
 * answer (definitions in types.ts: half-rise and time to peak from the spike,
 * half-decay from the peak), s.
 *
 * Analytic kernels: the peak from its closed form (double exponential:
 * REFERENCES.md formula; alpha: t = tau), the half-way times by bisection to
 * ~1e-13 relative. Sampled kernels: peak at the largest sample, half-way times
 * by linear interpolation between samples; NaN when the kernel never falls to
 * half its peak inside its samples, or has a non-positive peak.
 */
export function kernelTiming(kernel: Kernel): KernelTiming {
  if (kernel.kind === 'sampled') return sampledTiming(kernel.values, kernel.sampleRateHz, kernel.gain);
  const h = kernelValue(kernel);
  const tp = kernel.kind === 'alpha' ? kernel.tauS : doubleExponentialPeakTime(kernel.tauRiseS, kernel.tauDecayS);
  const peak = h(tp);
  if (!(peak > 0) || !Number.isFinite(tp)) return { halfRiseS: NaN, timeToPeakS: NaN, halfDecayS: NaN, peak };
  const slow = kernel.kind === 'alpha' ? kernel.tauS : Math.max(kernel.tauRiseS, kernel.tauDecayS);
  const half = peak / 2;
  const rise = bisect((t) => h(t) - half, 0, tp);
  const fall = bisect((t) => half - h(t), tp, tp + 60 * slow);
  return { halfRiseS: rise, timeToPeakS: tp, halfDecayS: fall - tp, peak };
}

/** Root of an increasing-through-zero f on [lo, hi] (f(lo) < 0 <= f(hi)). */
function bisect(f: (t: number) => number, lo: number, hi: number): number {
  for (let i = 0; i < 200 && hi - lo > 1e-15 * Math.max(1, hi); i++) {
    const mid = 0.5 * (lo + hi);
    if (f(mid) < 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

function sampledTiming(values: Float64Array, rateHz: number, gain: number): KernelTiming {
  const n = values.length;
  let ip = -1;
  let peak = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = gain * values[i];
    if (v > peak) {
      peak = v;
      ip = i;
    }
  }
  if (ip < 0 || !(peak > 0)) return { halfRiseS: NaN, timeToPeakS: NaN, halfDecayS: NaN, peak: n ? peak : NaN };
  const half = peak / 2;
  // Up: last crossing below the peak; a kernel that starts at or above half its peak has half-rise 0.
  let rise = 0;
  for (let i = ip; i >= 1; i--) {
    const a = gain * values[i - 1];
    const b = gain * values[i];
    if (a < half && b >= half) {
      rise = (i - 1 + (half - a) / (b - a)) / rateHz;
      break;
    }
  }
  let fall = NaN;
  for (let i = ip; i + 1 < n; i++) {
    const a = gain * values[i];
    const b = gain * values[i + 1];
    if (a > half && b <= half) {
      fall = (i + (a - half) / (a - b)) / rateHz;
      break;
    }
  }
  const tp = ip / rateHz;
  return { halfRiseS: rise, timeToPeakS: tp, halfDecayS: fall - tp, peak };
}
