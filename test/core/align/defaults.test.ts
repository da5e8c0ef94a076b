import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import { findKernelEntry } from '../../../core/kernels/kernel-library';

describe('DEFAULTS.align (common practice; README "Alignment, PSTHs and indicator kernels")', () => {
  it('pins the documented defaults', () => {
    expect(DEFAULTS.align).toEqual({
      event: 'reward',
      windowStartS: -3,
      windowStopS: 2,
      binMs: 50,
      smoothing: 'gaussian',
      smoothingWidthMs: 50,
      band: 'sem',
      bandLevel: 0.95,
      bootstrapResamples: 1000,
      seed: 1,
      groupBy: 'condition',
      kernel: 'jGCaMP8m',
      predictRateHz: 30,
    });
  });
  it('names a kernel the library has', () => {
    expect(findKernelEntry(DEFAULTS.align.kernel)).toBeDefined();
  });
});
