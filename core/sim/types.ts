/**
 * Types of the project's seeded session simulator (core/sim). A scenario is
 * a plain, fully explicit description of a session: the task schedule, the
 * light block and every unit's firing and responses. simulateSession turns
 * it into a Recording plus a ground-truth record per unit, so analyses can be
 * tested for calibration (false-positive rate on units with no effect) and
 * power (detection of effects of known size).
 *
 * Times in seconds, rates in Hz, latencies and jitters in milliseconds,
 * waveform amplitudes in microvolts.
 */
import type { Recording } from '../model/types';

/** One condition of the auditory countdown: a sweep of `sweepS` then reward. */
export interface ConditionSpec {
  readonly name: string;
  /** Relative frequency of the condition among trials. */
  readonly weight: number;
  /** Sweep duration, s (tone sweep from sweep_on to reward). */
  readonly sweepS: number;
  /**
   * Probe condition: during the sweep the tone jumps ahead (`forward`, reward
   * comes `jumpShiftS` earlier) or back (`backward`, reward comes later).
   */
  readonly probe?: boolean;
}

/** The task part of the session: trials of the auditory countdown. */
export interface TaskSpec {
  readonly trials: number;
  readonly conditions: readonly ConditionSpec[];
  /** Trial start to sweep_on, s. */
  readonly preSweepS: number;
  /** Reward to trial stop, s. */
  readonly postRewardS: number;
  /** Inter-trial interval (trial stop to next start), uniform in [min, max], s. */
  readonly itiS: readonly [number, number];
  /** Jump time after sweep_on on probe trials, uniform in [min, max], s. */
  readonly jumpAfterS: readonly [number, number];
  /** How far the sweep jumps, in seconds of sweep. */
  readonly jumpShiftS: number;
  /** Jump kinds of probe trials, counterbalanced (each kind once per run of probe trials, random order). */
  readonly jumpKinds: readonly ('forward' | 'backward')[];
  /** Step of the piecewise-constant ramp approximation, s. */
  readonly rampStepS: number;
}

/** A train block of the light protocol. */
export interface TrainSpec {
  readonly frequencyHz: number;
  /** Number of trains at this frequency. */
  readonly trains: number;
  readonly pulsesPerTrain: number;
}

/** The light block that ends the session. */
export interface LightBlockSpec {
  /** Pulse duration, s. */
  readonly pulseS: number;
  /** Laser power at the fibre tip, mW. */
  readonly powerMw: number;
  /** Light-free time between the last trial and the first pulse, s. */
  readonly leadS: number;
  /** Single pulses: count and onset-to-onset interval, uniform in [min, max], s. */
  readonly singles: { readonly count: number; readonly intervalS: readonly [number, number] };
  /** Train blocks, delivered in this order after the single pulses. */
  readonly trains: readonly TrainSpec[];
  /** Gap between the last pulse of a train and the next train's first pulse, uniform in [min, max], s. */
  readonly interTrainS: readonly [number, number];
}

/**
 * How the unit answers a light pulse.
 * - direct: opsin-driven spike at a short latency with small jitter;
 * - indirect: synaptically driven, later and more variable, fades faster;
 * - inhibited: firing drops during the pulse and a while after it;
 * - artefact: a photoelectric "unit" locked to light onset and offset with
 *   near-zero jitter (present without any opsin).
 */
export type LightResponseSpec =
  | { readonly kind: 'none' }
  | {
      readonly kind: 'direct' | 'indirect';
      /** Mean first-spike latency after onset for the first pulse of a train, ms. */
      readonly latencyMs: number;
      /** SD of the latency, ms. */
      readonly jitterMs: number;
      /** Probability of answering a single pulse (or a train's first pulse). */
      readonly reliability: number;
      /**
       * Train frequency at which the steady-state answer probability halves, Hz:
       * steady fraction s(f) = 1 / (1 + (f / followHalfHz)^2).
       */
      readonly followHalfHz: number;
      /** Per-pulse approach to steady state within a train: weight of pulse k is decay^k. */
      readonly decayPerPulse: number;
      /** Latency added at steady state at a frequency where s = 0, ms (scaled by 1 - s). */
      readonly latencyGrowthMs: number;
      /** Extra spikes per answer, Poisson mean (0 for a single spike). */
      readonly extraSpikes: number;
    }
  | {
      readonly kind: 'inhibited';
      /** Rate multiplier during inhibition (0 = silenced). */
      readonly gain: number;
      /** Inhibition starts this long after onset, ms. */
      readonly delayMs: number;
      /** ...and lasts until this long after the pulse's offset, ms. */
      readonly afterMs: number;
    }
  | {
      readonly kind: 'artefact';
      /** Latency of the onset-locked event, ms. */
      readonly onsetLatencyMs: number;
      /** Latency of the offset-locked event after the pulse ends, ms. */
      readonly offsetLatencyMs: number;
      /** SD of both latencies, ms (near zero). */
      readonly jitterMs: number;
      /** Probability of each locked event. */
      readonly reliability: number;
    };

/** Ramp during the sweep: rate x (1 + gain * progress^power), progress 0 -> 1 from sweep_on to reward. */
export interface RampSpec {
  /** Fractional change of rate at the end of the sweep; > 0 ramps up, in (-1, 0) ramps down. */
  readonly gain: number;
  /** Curvature: 1 linear, 2 accelerating, 0.5 saturating. */
  readonly power: number;
}

/** Answer to a jump of one kind. */
export interface JumpResponseSpec {
  /**
   * burst: transient rise; dip: transient fall; step: lasting change from the
   * jump until reward (not a transient).
   */
  readonly type: 'burst' | 'dip' | 'step';
  /** Rate multiplier while the answer lasts. */
  readonly gain: number;
  /** Delay after the jump, s. */
  readonly latencyS: number;
  /** Duration, s (ignored for step: it lasts until reward). */
  readonly durationS: number;
}

/** Answer to reward delivery (after the ramp window). */
export interface RewardResponseSpec {
  readonly gain: number;
  readonly latencyS: number;
  readonly durationS: number;
}

export type WaveformKind = 'wide' | 'narrow' | 'triphasic' | 'positive';

/** A mean extracellular waveform on the unit's peak channel. */
export interface WaveformSpec {
  readonly kind: WaveformKind;
  /** Trough (or main peak for `positive`) amplitude, microvolts (> 0). */
  readonly amplitudeUv: number;
  /** Trough-to-peak time, ms. */
  readonly troughToPeakMs: number;
}

export interface UnitSpec {
  readonly id: string;
  /** Peak channel on the probe (0-based) and its depth, micrometres. */
  readonly channel: number;
  readonly depthUm: number;
  /** Spontaneous rate, Hz. */
  readonly rateHz: number;
  /** Gamma shape of the ISI (1 Poisson-like, > 1 regular, < 1 bursty). */
  readonly shape: number;
  /** Absolute refractory period, s. */
  readonly refractoryS: number;
  /** SD of the slow log-rate drift (0 = stationary), over `driftStepS` steps. */
  readonly drift: number;
  readonly light: LightResponseSpec;
  readonly ramp: RampSpec | null;
  readonly jump: { readonly forward?: JumpResponseSpec; readonly backward?: JumpResponseSpec };
  readonly reward: RewardResponseSpec | null;
  readonly waveform: WaveformSpec;
}

export interface ScenarioSpec {
  /** Master seed: everything is a deterministic function of the spec. */
  readonly seed: number;
  /** Spike times are rounded to this clock (the sorter's sample rate), Hz; null keeps full precision. */
  readonly sampleRateHz: number | null;
  /** Probe description (metadata only). */
  readonly probe: { readonly channels: number; readonly area: string; readonly pitchUm: number };
  /** Spontaneous activity before the first trial, s. */
  readonly preTaskS: number;
  readonly task: TaskSpec | null;
  readonly light: LightBlockSpec | null;
  /** Activity after the last pulse, s. */
  readonly tailS: number;
  /** Step of the slow drift of rates, s. */
  readonly driftStepS: number;
  /** Samples and rate of the mean waveforms. */
  readonly waveformSamples: number;
  readonly waveformSampleRateHz: number;
  readonly units: readonly UnitSpec[];
}

export type LightClass = 'direct' | 'indirect' | 'inhibited' | 'artefact' | 'none';
export type RampClass = 'up' | 'down' | 'flat';
export type JumpAnswer = 'excited' | 'suppressed' | 'none';

/** What the simulator put into one unit, for judging analyses. */
export interface UnitTruth {
  readonly unit: string;
  readonly lightClass: LightClass;
  /** Nominal single-pulse latency, jitter (ms) and reliability (NaN for other classes). */
  readonly latencyMs: number;
  readonly jitterMs: number;
  readonly reliability: number;
  /** Spontaneous rate asked for, Hz, and spikes / span as realised. */
  readonly rateHz: number;
  readonly realisedRateHz: number;
  /**
   * Expected rate of the unit's non-evoked firing over the span: the integral
   * of its rate profile (drift, task answers, light inhibition) / span, Hz.
   */
  readonly expectedRateHz: number;
  /** Number of light-evoked spikes kept (direct, indirect or artefact answers). */
  readonly evokedSpikes: number;
  readonly shape: number;
  readonly ramp: RampClass;
  /** Ramp gain asked for (0 for flat). */
  readonly rampGain: number;
  /**
   * Least-squares slope of the expected rate (Hz/s) in the ramp window before
   * reward on trials of the ramp condition, computed exactly from the rate
   * profile (no sampling noise), with the analysis window and bins of
   * DEFAULTS.ramp.
   */
  readonly rampSlopeHzPerS: number;
  /** Per jump kind: designed answer, mechanism and expected rate change (post - pre window, Hz). */
  readonly jump: Readonly<Record<string, {
    readonly answer: JumpAnswer;
    readonly mechanism: 'burst' | 'dip' | 'step' | 'ramp' | 'none';
    readonly expectedDeltaHz: number;
  }>>;
}

/** A simulated session: the recording as an importer would build it, and the truth. */
export interface SimulatedSession {
  readonly spec: ScenarioSpec;
  readonly recording: Recording;
  readonly truth: readonly UnitTruth[];
  /** Per unit, 1 where the spike was light-evoked (direct, indirect or artefact answers). */
  readonly evoked: readonly Uint8Array[];
  /** Mean spontaneous waveform per unit, row-major (units x samples), microvolts. */
  readonly waveforms: Float64Array;
  /** Mean waveform of light-evoked events (differs from `waveforms` only for artefact units). */
  readonly evokedWaveforms: Float64Array;
}
