import type { Pulses } from '../model/types';
import type { Rng } from '../random/rng';
import type { LightBlockSpec } from './types';

/** A simulated pulse schedule and each pulse's place in its train. */
export interface LightSchedule {
  readonly pulses: Pulses;
  /** 0-based index of each pulse within its train (0 for single pulses). */
  readonly indexInTrain: Int32Array;
  /** Time after the last pulse's offset, s. */
  readonly endS: number;
}

/**
 * The light block's pulse schedule starting at `startS` (s): first
 * `singles.count` single pulses with onset-to-onset intervals drawn uniformly
 * from `singles.intervalS` (irregular, so spontaneous rhythms cannot lock to
 * them), then for each train block its trains of `pulsesPerTrain` pulses at
 * `frequencyHz`, trains separated by a uniform gap from `interTrainS`.
 * Train ids count up from 0 in onset order; single pulses get their own id
 * and frequency NaN. Every pulse has duration `pulseS` and power `powerMw`.
 */
export function lightSchedule(spec: LightBlockSpec, startS: number, rng: Rng): LightSchedule {
  const total = spec.singles.count + spec.trains.reduce((a, t) => a + t.trains * t.pulsesPerTrain, 0);
  const onset = new Float64Array(total);
  const train = new Int32Array(total);
  const freq = new Float64Array(total).fill(NaN);
  const index = new Int32Array(total);
  const uniformIn = (r: readonly [number, number]) => r[0] + (r[1] - r[0]) * rng.uniform();
  let t = startS;
  let n = 0;
  let id = 0;
  for (let i = 0; i < spec.singles.count; i++) {
    if (i > 0) t += uniformIn(spec.singles.intervalS);
    onset[n] = t;
    train[n] = id++;
    n++;
  }
  let first = spec.singles.count === 0;
  for (const block of spec.trains) {
    const period = 1 / block.frequencyHz;
    for (let j = 0; j < block.trains; j++) {
      t += first ? 0 : uniformIn(spec.interTrainS) + spec.pulseS;
      first = false;
      for (let k = 0; k < block.pulsesPerTrain; k++) {
        if (k > 0) t += period;
        onset[n] = t;
        train[n] = id;
        freq[n] = block.frequencyHz;
        index[n] = k;
        n++;
      }
      id++;
    }
  }
  return {
    pulses: {
      onset,
      duration: new Float64Array(total).fill(spec.pulseS),
      train,
      frequencyHz: freq,
      powerMw: new Float64Array(total).fill(spec.powerMw),
    },
    indexInTrain: index,
    endS: total > 0 ? t + spec.pulseS : startS,
  };
}
