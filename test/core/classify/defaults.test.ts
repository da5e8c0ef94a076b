/** Pins the classification defaults (core/defaults.ts; DESIGN.md section 4 and issue 5). */
import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';

describe('classification defaults', () => {
  it('ramp', () => {
    expect(DEFAULTS.ramp).toEqual({ event: 'reward', windowStartS: -3, windowEndS: 0, condition: 'standard', binS: 0.1, alpha: 0.05, minTrials: 6, exactMaxN: 30, anchorEvent: '', progressVariable: '', progressBins: 10, progressMin: null, progressMax: null });
  });
  it('jump', () => {
    expect(DEFAULTS.jump).toEqual({
      event: 'jump', postStartS: 0, postEndS: 0.3, preStartS: -0.3, preEndS: 0, lateStartS: 0.5, lateEndS: 1, alpha: 0.05,
      controlCondition: 'standard', minEvents: 6, exactMaxN: 30, psthBinS: 0.01, latencyRunBins: 2, zThreshold: 2, sizeCovariate: 'jump_size',
    });
  });
  it('cluster', () => {
    expect(DEFAULTS.cluster).toEqual({ kMin: 2, kMax: 6, restarts: 10, seed: 1, components: 5, binS: 0.1, minUnits: 8, minEvents: 10 });
  });
});
