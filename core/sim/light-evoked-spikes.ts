import type { Rng } from '../random/rng';
import type { LightSchedule } from './light-schedule';
import type { LightResponseSpec } from './types';
import { lightFollow } from './light-follow';

/**
 * Light-evoked spike times (s, sorted) of one unit for a pulse schedule.
 * - direct / indirect: with probability lightFollow(...).probability the
 *   pulse is answered by a spike at onset + latency, latency ~ Normal(mean
 *   latencyMs + shift, jitterMs) redrawn below 0.3 ms; then Poisson(extraSpikes)
 *   further spikes, each 2 ms plus an exponential of mean 3 ms after the last;
 * - artefact: an event at onset + onsetLatencyMs and one at offset +
 *   offsetLatencyMs, each with probability `reliability` and Normal jitter
 *   jitterMs (clamped at 0);
 * - none / inhibited: no evoked spikes (inhibition acts on the rate profile).
 */
export function lightEvokedSpikes(rng: Rng, response: LightResponseSpec, schedule: LightSchedule): Float64Array {
  const p = schedule.pulses;
  const out: number[] = [];
  if (response.kind === 'direct' || response.kind === 'indirect') {
    for (let i = 0; i < p.onset.length; i++) {
      const f = lightFollow(
        schedule.indexInTrain[i],
        p.frequencyHz[i],
        response.reliability,
        response.followHalfHz,
        response.decayPerPulse,
        response.latencyGrowthMs,
      );
      if (rng.uniform() >= f.probability) continue;
      let lat: number;
      do {
        lat = response.latencyMs + f.latencyShiftMs + response.jitterMs * rng.normal();
      } while (lat < 0.3);
      let t = p.onset[i] + lat / 1000;
      out.push(t);
      const extra = response.extraSpikes > 0 ? rng.poisson(response.extraSpikes) : 0;
      for (let e = 0; e < extra; e++) {
        t += 0.002 + 0.003 * rng.exponential();
        out.push(t);
      }
    }
  } else if (response.kind === 'artefact') {
    for (let i = 0; i < p.onset.length; i++) {
      const dur = Number.isFinite(p.duration[i]) ? p.duration[i] : 0;
      if (rng.uniform() < response.reliability) {
        out.push(p.onset[i] + Math.max(0, response.onsetLatencyMs + response.jitterMs * rng.normal()) / 1000);
      }
      if (rng.uniform() < response.reliability) {
        out.push(p.onset[i] + dur + Math.max(0, response.offsetLatencyMs + response.jitterMs * rng.normal()) / 1000);
      }
    }
  }
  const a = Float64Array.from(out);
  a.sort();
  return a;
}
