import { DEFAULTS } from '../defaults';
import { emptyEvents, emptyPulses, emptyTrials } from '../model/empty';
import type { Recording, Unit } from '../model/types';
import { Rng } from '../random/rng';
import { artefactWaveform } from './artefact-waveform';
import { constantProfile } from './constant-profile';
import { driftProfile } from './drift-profile';
import { expectedRampSlope } from './expected-ramp-slope';
import { expectedWindowChange } from './expected-window-change';
import { inhibitionProfile } from './inhibition-profile';
import { inhomogeneousRenewalTrain } from './inhomogeneous-renewal-train';
import { jumpProfile } from './jump-profile';
import { lightEvokedSpikes } from './light-evoked-spikes';
import { lightSchedule, type LightSchedule } from './light-schedule';
import { mergeRefractory } from './merge-refractory';
import { multiplyProfiles } from './multiply-profiles';
import { profileIntegral } from './profile-integral';
import type { RateProfile } from './rate-profile';
import { streamSeed } from './stream-seed';
import { taskProfile } from './task-profile';
import { taskSchedule, type TaskSchedule } from './task-schedule';
import type { JumpAnswer, ScenarioSpec, SimulatedSession, UnitSpec, UnitTruth } from './types';
import { waveformShape } from './waveform-shape';

/** Random streams: 0 task, 1 light, then 8 per unit (see streamSeed). */
const STREAM_TASK = 0;
const STREAM_LIGHT = 1;
const unitStream = (i: number, part: number) => 16 + 8 * i + part;

/**
 * Simulates a whole session from a scenario (core/sim/types.ts): time line
 * [0, preTaskS) spontaneous activity, then the task's trials, then the light
 * block (after light.leadS), then tailS more seconds. Each unit's spikes are
 * a renewal process (inhomogeneousRenewalTrain) whose rate is the product of
 * its spontaneous rate, a slow drift, its task answers (ramp, reward, jumps)
 * and light inhibition, merged with light-evoked spikes under the refractory
 * period (mergeRefractory), rounded to the sample clock. The recording's
 * span is [0, end]. Deterministic: the same spec gives the same bytes, and
 * each unit has its own random streams (changing one unit leaves the others).
 *
 * The truth record holds the designed class of every answer and, for ramps
 * and jumps, the expected effect computed exactly from the rate profile with
 * the analysis windows of DEFAULTS (ramp: `reward`, [-3, 0) s, 100 ms bins,
 * condition `standard`; jump: [0, 0.3) vs [-0.3, 0) s). A jump answer caused
 * only by a ramp following the sweep's jump counts as excited/suppressed
 * ("ramp" mechanism) when its expected change is at least
 * max(0.5 Hz, 10 % of the spontaneous rate).
 */
export function simulateSession(spec: ScenarioSpec): SimulatedSession {
  const task: TaskSchedule | null = spec.task ? taskSchedule(spec.task, spec.preTaskS, new Rng(streamSeed(spec.seed, STREAM_TASK))) : null;
  const taskEnd = task ? task.endS : spec.preTaskS;
  const light: LightSchedule | null = spec.light
    ? lightSchedule(spec.light, taskEnd + spec.light.leadS, new Rng(streamSeed(spec.seed, STREAM_LIGHT)))
    : null;
  const end = (light ? light.endS : taskEnd) + spec.tailS;

  const ns = spec.waveformSamples;
  const fs = spec.waveformSampleRateHz;
  const waveforms = new Float64Array(spec.units.length * ns);
  const evokedWaveforms = new Float64Array(spec.units.length * ns);
  const units: Unit[] = [];
  const truth: UnitTruth[] = [];
  const evokedMasks: Uint8Array[] = [];
  const ids = new Set<string>();

  spec.units.forEach((u, i) => {
    if (ids.has(u.id)) throw new Error(`simulateSession: duplicate unit id "${u.id}"`);
    ids.add(u.id);
    const layers: RateProfile[] = [constantProfile(u.rateHz)];
    layers.push(driftProfile(new Rng(streamSeed(spec.seed, unitStream(i, 2))), u.drift, spec.driftStepS, 0, end));
    if (task) {
      layers.push(taskProfile(task, u.ramp, u.reward, spec.task!.rampStepS));
      layers.push(jumpProfile(task, u.jump));
    }
    if (light && u.light.kind === 'inhibited') {
      layers.push(inhibitionProfile(light, u.light.gain, u.light.delayMs, u.light.afterMs));
    }
    const profile = multiplyProfiles(...layers);
    const spont = inhomogeneousRenewalTrain(new Rng(streamSeed(spec.seed, unitStream(i, 0))), profile, 0, end, u.shape, u.refractoryS);
    const evoked = light ? lightEvokedSpikes(new Rng(streamSeed(spec.seed, unitStream(i, 1))), u.light, light) : new Float64Array(0);
    const merged = mergeRefractory(spont, evoked, u.refractoryS, spec.sampleRateHz);
    evokedMasks.push(merged.evoked);

    const w = waveformShape(u.waveform, ns, fs);
    waveforms.set(w, i * ns);
    evokedWaveforms.set(u.light.kind === 'artefact' ? artefactWaveform(u.waveform.amplitudeUv * 1.5, ns, fs) : w, i * ns);
    units.push({ id: u.id, spikeTimes: merged.times, meta: { channel: u.channel, depth_um: u.depthUm }, waveformMean: w });
    const nEvoked = merged.evoked.reduce((a, b) => a + b, 0);
    truth.push(unitTruth(u, profile, task, merged.times.length / end, profileIntegral(profile, 0, end) / end, nEvoked));
  });

  const recording: Recording = {
    units,
    pulses: light ? light.pulses : emptyPulses(),
    events: task ? task.events : emptyEvents(),
    trials: task ? task.trials : emptyTrials(),
    span: [0, end],
    spanSource: 'manifest',
    waveformSampleRateHz: fs,
  };
  return { spec, recording, truth, evoked: evokedMasks, waveforms, evokedWaveforms };
}

function unitTruth(
  u: UnitSpec,
  profile: RateProfile,
  task: TaskSchedule | null,
  realisedRateHz: number,
  expectedRateHz: number,
  evokedSpikes: number,
): UnitTruth {
  const L = u.light;
  const lightTiming =
    L.kind === 'direct' || L.kind === 'indirect'
      ? { latencyMs: L.latencyMs, jitterMs: L.jitterMs, reliability: L.reliability }
      : L.kind === 'artefact'
        ? { latencyMs: L.onsetLatencyMs, jitterMs: L.jitterMs, reliability: L.reliability }
        : { latencyMs: NaN, jitterMs: NaN, reliability: NaN };
  const rampGain = u.ramp ? u.ramp.gain : 0;
  let rampSlope = NaN;
  const jump: Record<string, UnitTruth['jump'][string]> = {};
  if (task) {
    const R = DEFAULTS.ramp;
    const rewards: number[] = [];
    task.trials.condition.forEach((c, k) => {
      if (c === R.condition) rewards.push(task.rewardS[k]);
    });
    rampSlope = expectedRampSlope(profile, rewards, R.windowStartS, R.windowEndS, R.binS);
    const J = DEFAULTS.jump;
    const kinds = [...new Set(task.jumpKind.filter((k) => k !== ''))].sort();
    for (const kind of kinds) {
      const times: number[] = [];
      task.jumpKind.forEach((k, t) => {
        if (k === kind) times.push(task.jumpS[t]);
      });
      const delta = expectedWindowChange(profile, times, J.preStartS, J.preEndS, J.postStartS, J.postEndS);
      const designed = (u.jump as Record<string, { type: 'burst' | 'dip' | 'step'; gain: number } | undefined>)[kind];
      let answer: JumpAnswer = 'none';
      let mechanism: UnitTruth['jump'][string]['mechanism'] = 'none';
      if (designed && designed.gain !== 1) {
        mechanism = designed.type;
        answer = designed.gain > 1 ? 'excited' : 'suppressed';
      } else if (rampGain !== 0 && Math.abs(delta) >= Math.max(0.5, 0.1 * u.rateHz)) {
        mechanism = 'ramp';
        answer = delta > 0 ? 'excited' : 'suppressed';
      }
      jump[kind] = { answer, mechanism, expectedDeltaHz: delta };
    }
  }
  return {
    unit: u.id,
    lightClass: L.kind,
    ...lightTiming,
    rateHz: u.rateHz,
    realisedRateHz,
    expectedRateHz,
    evokedSpikes,
    shape: u.shape,
    ramp: rampGain > 0 ? 'up' : rampGain < 0 ? 'down' : 'flat',
    rampGain,
    rampSlopeHzPerS: rampSlope,
    jump,
  };
}
