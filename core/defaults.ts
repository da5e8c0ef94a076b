/**
 * Every analysis default, in one table. Each value is pinned by
 * test/core/defaults.test.ts and echoed into run.json.
 *
 * Names carry their units (windowMs, binS, ...). Sources: DESIGN.md section 4
 * ("common practice" where no paper fixes the value).
 */
export const DEFAULTS = {
  /** Recording span: null = [0, latest time in any input]. */
  span: {
    startS: null as number | null,
    stopS: null as number | null,
    /** Times beyond the span by more than this are an input error (s). */
    toleranceS: 1,
  },
  /** Light identification (issue: light-identification engine). */
  light: {
    /** Test window after pulse onset, ms. */
    windowStartMs: 0,
    windowEndMs: 10,
    /** SALT latency bin, ms. */
    saltBinMs: 1,
    /** SALT p threshold of the identified rule. */
    alphaSalt: 0.01,
    /** Mean first-spike latency limit of the identified rule, ms. */
    maxLatencyMs: 6,
    /** Waveform correlation needed when waveforms exist (common practice). */
    minWaveformR: 0.9,
  },
  /** Ramp before reward. */
  ramp: {
    event: 'reward',
    windowStartS: -3,
    windowEndS: 0,
    condition: 'standard',
    binS: 0.1,
    alpha: 0.05,
  },
  /** Transient answers to task-state jumps. */
  jump: {
    event: 'jump',
    postStartS: 0,
    postEndS: 0.3,
    preStartS: -0.3,
    preEndS: 0,
    alpha: 0.05,
  },
  /** Rasters, PSTHs and indicator predictions (issue 4); widths and windows: common practice. */
  align: {
    /** Event label to align on when none is given. */
    event: 'reward',
    /** Window around the event, s. */
    windowStartS: -3,
    windowStopS: 2,
    /** PSTH bin width, ms. */
    binMs: 50,
    /** PSTH smoothing: none | gaussian | exponential | boxcar; width in ms (Gaussian SD). */
    smoothing: 'gaussian',
    smoothingWidthMs: 50,
    /** Confidence band: sem | bootstrap | none; bootstrap coverage, resamples and seed. */
    band: 'sem',
    bandLevel: 0.95,
    bootstrapResamples: 1000,
    seed: 1,
    /** Trial grouping: none | condition | kind. */
    groupBy: 'condition',
    /** Indicator kernel (library name) and sample rate of predicted traces, Hz. */
    kernel: 'jGCaMP8m',
    predictRateHz: 30,
  },
  /** Unit quality. */
  quality: {
    /** ISI refractory period, ms (common practice). */
    refractoryMs: 1.5,
    /** Censored period, ms (common practice). */
    censoredMs: 0,
  },
};

export type Parameters = typeof DEFAULTS;

/** A partial override of the parameters, as read from session.json or --config. */
export type ParameterOverrides = {
  [S in keyof Parameters]?: Partial<Parameters[S]>;
};
