import { defaultScenario } from './default-scenario';
import { populationUnits, type PopulationMix } from './population-units';
import type { ScenarioSpec } from './types';

/** Seed of the bundled demo session (sample-data/demo). */
export const DEMO_SEED = 20260;

/** The demo's population: 48 units from a 64-channel probe in the dorsal raphe. */
export const DEMO_MIX: PopulationMix = {
  direct: 7,
  indirect: 4,
  inhibited: 3,
  artefact: 1,
  rampUp: 6,
  rampDown: 5,
  jumpBurst: 3,
  jumpDip: 3,
  jumpStep: 2,
  reward: 6,
  maxDrift: 0.15,
  channels: 64,
  pitchUm: 20,
  otherMedianHz: 2.5,
};

/**
 * The invented demo scenario of DESIGN.md section 6: a head-fixed mouse does
 * the auditory countdown (120 trials: standard 4 s sweeps, fast 2.5 s sweeps,
 * probe trials with forward/backward jumps), then a 6-minute light block
 * (300 single 5 ms pulses near 1 Hz, ten 10-pulse trains at 10 Hz and ten at
 * 20 Hz); 48 units of populationUnits(48, seed, DEMO_MIX).
 */
export function demoScenario(seed = DEMO_SEED): ScenarioSpec {
  return defaultScenario({ seed, units: populationUnits(48, seed, DEMO_MIX) });
}
