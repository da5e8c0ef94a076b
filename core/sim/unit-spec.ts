import type { UnitSpec } from './types';

/**
 * A unit spec with defaults for everything not given: 5 Hz Poisson-like
 * firing (gamma shape 1) with a 2 ms refractory period, no drift, no light,
 * task or reward answer, a wide 80 microvolt waveform on channel 0.
 */
export function unitSpec(given: Partial<UnitSpec> & { readonly id: string }): UnitSpec {
  return {
    channel: 0,
    depthUm: 0,
    rateHz: 5,
    shape: 1,
    refractoryS: 0.002,
    drift: 0,
    light: { kind: 'none' },
    ramp: null,
    jump: {},
    reward: null,
    waveform: { kind: 'wide', amplitudeUv: 80, troughToPeakMs: 0.8 },
    ...given,
  };
}
