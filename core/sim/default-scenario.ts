import type { LightBlockSpec, ScenarioSpec, TaskSpec } from './types';

/** The task of the invented demo scenario (DESIGN.md section 6). */
export const DEFAULT_TASK: TaskSpec = {
  trials: 120,
  conditions: [
    { name: 'standard', weight: 0.6, sweepS: 4 },
    { name: 'fast', weight: 0.15, sweepS: 2.5 },
    { name: 'probe', weight: 0.25, sweepS: 4, probe: true },
  ],
  preSweepS: 0.5,
  postRewardS: 1.5,
  itiS: [2, 4],
  jumpAfterS: [1, 2],
  jumpShiftS: 1.5,
  jumpKinds: ['forward', 'backward'],
  rampStepS: 0.05,
};

/**
 * The light block of the demo scenario: 5 ms pulses at 5 mW, ~300 single
 * pulses near 1 Hz (0.8-1.2 s apart), then ten 10-pulse trains at 10 Hz and
 * ten at 20 Hz, 2.5-3.5 s between trains (about 6 minutes in all).
 */
export const DEFAULT_LIGHT: LightBlockSpec = {
  pulseS: 0.005,
  powerMw: 5,
  leadS: 10,
  singles: { count: 300, intervalS: [0.8, 1.2] },
  trains: [
    { frequencyHz: 10, trains: 10, pulsesPerTrain: 10 },
    { frequencyHz: 20, trains: 10, pulsesPerTrain: 10 },
  ],
  interTrainS: [2.5, 3.5],
};

/**
 * A scenario with the demo's task and light block and the given overrides
 * (units default to none). Spike times on a 30 kHz clock, a 64-channel probe
 * (20 micrometre pitch), 60 s before the first trial, 5 s after the last
 * pulse, drift steps of 30 s, 90-sample (3 ms) waveforms at 30 kHz.
 */
export function defaultScenario(given: Partial<ScenarioSpec> = {}): ScenarioSpec {
  return {
    seed: 1,
    sampleRateHz: 30000,
    probe: { channels: 64, area: 'dorsal raphe', pitchUm: 20 },
    preTaskS: 60,
    task: DEFAULT_TASK,
    light: DEFAULT_LIGHT,
    tailS: 5,
    driftStepS: 30,
    waveformSamples: 90,
    waveformSampleRateHz: 30000,
    units: [],
    ...given,
  };
}
