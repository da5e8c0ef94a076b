/**
 * Data model of one recording session, as every analysis sees it.
 *
 * Units: seconds everywhere (converted at import). Spike times are sorted
 * Float64Arrays. Everything here is treated as immutable after import:
 * analyses read these arrays and never write to them.
 */

/** A scalar value of free-form metadata or a trial covariate. */
export type Scalar = number | string;

/** One sorted unit (putative neuron). */
export interface Unit {
  /** Unit id as given by the spike sorter, always as a string. */
  readonly id: string;
  /** Spike times in seconds, sorted ascending, finite. */
  readonly spikeTimes: Float64Array;
  /** Free-form metadata (channel, depth, sorter label, ...). */
  readonly meta: Readonly<Record<string, Scalar>>;
  /** Mean spike waveform from the inputs, microvolts by convention, if given. */
  readonly waveformMean?: Float64Array;
  /**
   * Times the unit was observed, if the inputs say (NWB `obs_intervals`):
   * flat pairs [start0, stop0, start1, stop1, ...] in s, sorted, not
   * overlapping. Absent = observed over the whole recording span. For presence
   * ratio and for limiting baselines to observed time.
   */
  readonly observedIntervals?: Float64Array;
}

/** Laser pulses as columns of typed arrays, sorted by onset. */
export interface Pulses {
  /** Onset of each pulse, s. */
  readonly onset: Float64Array;
  /** Duration of each pulse, s (NaN when unknown). */
  readonly duration: Float64Array;
  /** Train id of each pulse (pulses of one train share it; single pulses get their own id). */
  readonly train: Int32Array;
  /** Nominal pulse frequency of the pulse's train, Hz (NaN for single pulses or unknown). */
  readonly frequencyHz: Float64Array;
  /** Laser power, mW (NaN when unknown). */
  readonly powerMw: Float64Array;
}

/** Task events as columns, sorted by time. */
export interface Events {
  /** Event time, s. */
  readonly time: Float64Array;
  /** Event label, e.g. "reward", "jump", "tone_on". */
  readonly label: readonly string[];
  /** Trial number the event belongs to (NaN when not given). */
  readonly trial: Float64Array;
  /** Event kind, e.g. "forward"/"backward" for jumps ("" when not given). */
  readonly kind: readonly string[];
}

/** Trials as columns, sorted by start. */
export interface Trials {
  /** Trial number. */
  readonly trial: Float64Array;
  /** Trial start, s. */
  readonly start: Float64Array;
  /** Trial stop, s. */
  readonly stop: Float64Array;
  /** Condition label ("" when not given). */
  readonly condition: readonly string[];
  /** Extra columns: numeric covariates as Float64Array, text ones as string arrays. */
  readonly covariates: Readonly<Record<string, Float64Array | readonly string[]>>;
}

/**
 * Sampled behavioural variables (behaviour.csv): position, progress through
 * the approach, speed... One time base, any sampling rate (irregular
 * allowed), sorted, no duplicate times; one finite value per sample per
 * variable. Between samples a variable is read by linear interpolation.
 */
export interface BehaviourSamples {
  /** Sample times, s, strictly increasing. */
  readonly time: Float64Array;
  /** Variable name (the file's column header) -> value per sample, in the file's column order. */
  readonly variables: ReadonlyMap<string, Float64Array>;
}

/** One imported recording session. */
export interface Recording {
  readonly units: readonly Unit[];
  readonly pulses: Pulses;
  readonly events: Events;
  readonly trials: Trials;
  /** Recording span [start, stop], s. rate_hz = spikes / (stop - start). */
  readonly span: readonly [number, number];
  /** Where the span came from: "manifest", "observation-intervals" or "inputs". */
  readonly spanSource: 'manifest' | 'observation-intervals' | 'inputs';
  /** Sample rate of waveformMean samples, Hz (NaN when there are no waveforms). */
  readonly waveformSampleRateHz: number;
  /** Raw extracellular voltage, when the session names a raw binary file. */
  readonly raw?: RawSource;
  /** Sampled behavioural variables, when the session has behaviour.csv. */
  readonly behaviour?: BehaviourSamples;
  /**
   * Descriptive session metadata from the inputs, if any (for run.json and
   * reports): e.g. from an NWB file nwb_version, identifier,
   * session_description, session_start_time, and the light source's
   * stimulus_site_description / _location / excitation_lambda_nm.
   */
  readonly meta?: Readonly<Record<string, Scalar>>;
}

/**
 * Random access to a raw interleaved int16 recording (frames x channels),
 * read by offset, never loaded whole. The edge (Node: fs.readSync; browser
 * worker: FileReaderSync) implements readFrames; core only calls it.
 */
export interface RawSource {
  /** File name as the user gave it. */
  readonly file: string;
  readonly channelCount: number;
  readonly sampleRateHz: number;
  /** Microvolts per integer step. */
  readonly gainUvPerBit: number;
  /** Number of frames (samples per channel) in the file. */
  readonly frameCount: number;
  /** Time of frame 0 on the recording clock, s. */
  readonly startS: number;
  /**
   * The probe channel id stored in each column of the file (session.json
   * raw.channel_map), when the file's columns are not the probe's channels
   * 0, 1, 2, ... in order; units' `channel` metadata names these ids.
   */
  readonly channelIds?: readonly string[];
  /** Frames [startFrame, startFrame + frameCount) interleaved by channel; clipped at the file's ends. */
  readFrames(startFrame: number, frameCount: number): Int16Array;
}

/** A benign problem found in the inputs, counted and written to run.json. */
export interface Warning {
  /** Stable machine-readable code, e.g. "unsorted-spikes". */
  readonly code: string;
  /** One sentence for a person. */
  readonly message: string;
  /** How many times it happened. */
  readonly count: number;
  /** The input file it concerns, if any. */
  readonly file?: string;
}
