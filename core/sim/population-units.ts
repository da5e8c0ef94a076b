import { Rng } from '../random/rng';
import type { JumpResponseSpec, LightResponseSpec, RampSpec, RewardResponseSpec, UnitSpec, WaveformSpec } from './types';
import { streamSeed } from './stream-seed';

/**
 * How many units of each kind a simulated population holds. Light classes
 * are exclusive (direct + indirect + inhibited + artefact <= n; the rest
 * have no light answer). Task answers are assigned independently of the
 * light class, so a light-identified unit can also ramp or answer jumps.
 */
export interface PopulationMix {
  readonly direct: number;
  readonly indirect: number;
  readonly inhibited: number;
  readonly artefact: number;
  readonly rampUp: number;
  readonly rampDown: number;
  /** Units with a transient burst / dip / lasting step answer to jumps. */
  readonly jumpBurst: number;
  readonly jumpDip: number;
  readonly jumpStep: number;
  /** Units answering reward delivery. */
  readonly reward: number;
  /** Largest SD of slow log-rate drift (each unit draws uniformly in [0, max]). */
  readonly maxDrift: number;
  /** Probe channels (units are spread over them) and pitch, micrometres. */
  readonly channels: number;
  readonly pitchUm: number;
  /** Median spontaneous rate of units that are not light-identified, Hz (lognormal, SD 0.8 in log). */
  readonly otherMedianHz: number;
}

/**
 * A varied population of n unit specs, deterministic in `seed`; unit ids are
 * "1", "2", ... The ranges are our own choices, wide on purpose so that
 * analyses meet easy and hard cases (sources for the typical values are in
 * REFERENCES.md "Light identification"; ranges: common practice):
 * - light-identified (direct) units: slow and regular (median 2 Hz, gamma
 *   shape 3-10, wide waveforms, as expected of serotonergic cells), latency
 *   lognormal around 3.5 ms (SD 0.3 in log, clamped to 1.5-7 ms), jitter 0.3-2 ms, reliability 0.2-0.95, half-following
 *   frequency 15-40 Hz, latency growth 0.5-3 ms;
 * - indirect responders: latency 7-20 ms, jitter 2.5-7 ms, reliability
 *   0.15-0.6, half-following 4-12 Hz, up to one extra spike on average;
 * - inhibited units: rate x 0-0.3 from 1-3 ms after onset to 10-60 ms after
 *   offset;
 * - artefact "units": 0.2-1 Hz of noise events plus onset- and offset-locked
 *   events, latency 0.1-0.4 ms, jitter 0.01-0.03 ms, reliability 0.9-1;
 * - other units: median `otherMedianHz` (lognormal, clamped to 0.3-40 Hz), gamma shape 0.6-2.5, mixed waveforms;
 * - ramps: up gain 0.4-1.5, down gain -0.8 to -0.3, curvature 0.5, 1 or 2;
 * - jump answers: burst x2.5-5 for 80-200 ms, dip x0-0.3 for 150-300 ms,
 *   step x1.5-2.5 or x0.3-0.6 until reward, each to forward, backward or
 *   both kinds, 20-60 ms after the jump;
 * - reward answers: x2-4 for 0.2-0.5 s from 50-150 ms after reward.
 */
export function populationUnits(n: number, seed: number, mix: PopulationMix): UnitSpec[] {
  const rng = new Rng(streamSeed(seed, 0x5eed));
  const u = (a: number, b: number) => a + (b - a) * rng.uniform();
  const pick = <T>(xs: readonly T[]) => xs[rng.int(xs.length)];
  const lightCount = mix.direct + mix.indirect + mix.inhibited + mix.artefact;
  if (lightCount > n) throw new Error(`populationUnits: ${lightCount} light classes for ${n} units`);
  const lightKinds: LightResponseSpec['kind'][] = [
    ...Array<'direct'>(mix.direct).fill('direct'),
    ...Array<'indirect'>(mix.indirect).fill('indirect'),
    ...Array<'inhibited'>(mix.inhibited).fill('inhibited'),
    ...Array<'artefact'>(mix.artefact).fill('artefact'),
    ...Array<'none'>(n - lightCount).fill('none'),
  ];
  shuffle(rng, lightKinds);
  // task roles over the non-artefact units
  const eligible = lightKinds.map((k, i) => (k === 'artefact' ? -1 : i)).filter((i) => i >= 0);
  const rampOrder = shuffle(rng, eligible.slice());
  const rampOf = new Map<number, 'up' | 'down'>();
  rampOrder.slice(0, mix.rampUp).forEach((i) => rampOf.set(i, 'up'));
  rampOrder.slice(mix.rampUp, mix.rampUp + mix.rampDown).forEach((i) => rampOf.set(i, 'down'));
  const jumpOrder = shuffle(rng, eligible.slice());
  const jumpOf = new Map<number, 'burst' | 'dip' | 'step'>();
  jumpOrder.slice(0, mix.jumpBurst).forEach((i) => jumpOf.set(i, 'burst'));
  jumpOrder.slice(mix.jumpBurst, mix.jumpBurst + mix.jumpDip).forEach((i) => jumpOf.set(i, 'dip'));
  jumpOrder.slice(mix.jumpBurst + mix.jumpDip, mix.jumpBurst + mix.jumpDip + mix.jumpStep).forEach((i) => jumpOf.set(i, 'step'));
  const rewardSet = new Set(shuffle(rng, eligible.slice()).slice(0, mix.reward));
  const channels = Array.from({ length: n }, () => rng.int(mix.channels));

  const out: UnitSpec[] = [];
  for (let i = 0; i < n; i++) {
    const kind = lightKinds[i];
    let rateHz: number;
    let shape: number;
    let waveform: WaveformSpec;
    let light: LightResponseSpec;
    if (kind === 'direct') {
      rateHz = Math.min(8, Math.max(0.5, 2 * Math.exp(0.5 * rng.normal())));
      shape = u(3, 10);
      waveform = { kind: pick(['wide', 'wide', 'triphasic'] as const), amplitudeUv: u(50, 180), troughToPeakMs: u(0.7, 1.2) };
      light = {
        kind,
        latencyMs: Math.min(7, Math.max(1.5, 3.5 * Math.exp(0.3 * rng.normal()))),
        jitterMs: u(0.3, 2),
        reliability: u(0.2, 0.95),
        followHalfHz: u(15, 40),
        decayPerPulse: u(0.7, 0.9),
        latencyGrowthMs: u(0.5, 3),
        extraSpikes: u(0, 0.3),
      };
    } else if (kind === 'artefact') {
      rateHz = u(0.2, 1);
      shape = 1;
      waveform = { kind: 'narrow', amplitudeUv: u(40, 70), troughToPeakMs: u(0.25, 0.4) };
      light = { kind, onsetLatencyMs: u(0.1, 0.4), offsetLatencyMs: u(0.1, 0.4), jitterMs: u(0.01, 0.03), reliability: u(0.9, 1) };
    } else {
      rateHz = Math.min(40, Math.max(0.3, mix.otherMedianHz * Math.exp(0.8 * rng.normal())));
      shape = u(0.6, 2.5);
      const wk = pick(['wide', 'narrow', 'narrow', 'triphasic', 'positive'] as const);
      waveform = { kind: wk, amplitudeUv: u(40, 200), troughToPeakMs: wk === 'narrow' ? u(0.25, 0.45) : u(0.6, 1.1) };
      if (kind === 'indirect') {
        light = {
          kind,
          latencyMs: u(7, 20),
          jitterMs: u(2.5, 7),
          reliability: u(0.15, 0.6),
          followHalfHz: u(4, 12),
          decayPerPulse: u(0.5, 0.8),
          latencyGrowthMs: u(3, 8),
          extraSpikes: u(0, 1),
        };
      } else if (kind === 'inhibited') {
        light = { kind, gain: u(0, 0.3), delayMs: u(1, 3), afterMs: u(10, 60) };
      } else {
        light = { kind: 'none' };
      }
    }
    const r = rampOf.get(i);
    const ramp: RampSpec | null = r
      ? { gain: r === 'up' ? u(0.4, 1.5) : u(-0.8, -0.3), power: pick([0.5, 1, 1, 2]) }
      : null;
    const jt = jumpOf.get(i);
    let jump: { forward?: JumpResponseSpec; backward?: JumpResponseSpec } = {};
    if (jt) {
      const make = (): JumpResponseSpec =>
        jt === 'burst'
          ? { type: 'burst', gain: u(2.5, 5), latencyS: u(0.02, 0.06), durationS: u(0.08, 0.2) }
          : jt === 'dip'
            ? { type: 'dip', gain: u(0, 0.3), latencyS: u(0.02, 0.05), durationS: u(0.15, 0.3) }
            : { type: 'step', gain: rng.uniform() < 0.5 ? u(1.5, 2.5) : u(0.3, 0.6), latencyS: u(0.02, 0.05), durationS: 0 };
      const which = rng.int(3);
      jump = which === 0 ? { forward: make() } : which === 1 ? { backward: make() } : { forward: make(), backward: make() };
    }
    const reward: RewardResponseSpec | null = rewardSet.has(i) ? { gain: u(2, 4), latencyS: u(0.05, 0.15), durationS: u(0.2, 0.5) } : null;
    const ch = channels[i];
    out.push({
      id: String(i + 1),
      channel: ch,
      depthUm: ch * mix.pitchUm,
      rateHz,
      shape,
      refractoryS: u(0.0015, 0.0025),
      drift: u(0, mix.maxDrift),
      light,
      ramp,
      jump,
      reward,
      waveform,
    });
  }
  return out;
}

function shuffle<T>(rng: Rng, xs: T[]): T[] {
  for (let i = xs.length - 1; i > 0; i--) {
    const j = rng.int(i + 1);
    const t = xs[i];
    xs[i] = xs[j];
    xs[j] = t;
  }
  return xs;
}
