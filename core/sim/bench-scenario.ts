import { DEFAULT_TASK, defaultScenario } from './default-scenario';
import { populationUnits, type PopulationMix } from './population-units';
import type { ScenarioSpec } from './types';

/** Population of the benchmark session (proportions as in the demo, slower cells). */
export const BENCH_MIX: PopulationMix = {
  direct: 60,
  indirect: 60,
  inhibited: 40,
  artefact: 10,
  rampUp: 120,
  rampDown: 100,
  jumpBurst: 60,
  jumpDip: 50,
  jumpStep: 40,
  reward: 100,
  maxDrift: 0.2,
  channels: 64,
  pitchUm: 20,
  otherMedianHz: 2,
};

/**
 * The reference session of DESIGN.md section 7: 1,000 units over about 2 h
 * (~20 M spikes), 600 trials, 10,000 pulses (2,000 single pulses 0.3-0.5 s
 * apart, 400 trains of 10 pulses at 10 Hz and 400 at 20 Hz, 1.0-1.4 s between
 * trains). `units` scales the population (the mix is scaled in proportion).
 */
export function benchScenario(seed = 7, units = 1000): ScenarioSpec {
  const k = units / 1000;
  const mix: PopulationMix = Object.fromEntries(
    Object.entries(BENCH_MIX).map(([key, v]) => [key, ['maxDrift', 'channels', 'pitchUm', 'otherMedianHz'].includes(key) ? v : Math.round(v * k)]),
  ) as unknown as PopulationMix;
  return defaultScenario({
    seed,
    task: { ...DEFAULT_TASK, trials: 600, itiS: [1.5, 2.5] },
    light: {
      pulseS: 0.005,
      powerMw: 5,
      leadS: 10,
      singles: { count: 2000, intervalS: [0.3, 0.5] },
      trains: [
        { frequencyHz: 10, trains: 400, pulsesPerTrain: 10 },
        { frequencyHz: 20, trains: 400, pulsesPerTrain: 10 },
      ],
      interTrainS: [1.0, 1.4],
    },
    units: populationUnits(units, seed, mix),
  });
}
