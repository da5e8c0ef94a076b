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
  /** Unit quality. */
  quality: {
    /** ISI refractory period, ms (common practice). */
    refractoryMs: 1.5,
    /** Censored period, ms (common practice). */
    censoredMs: 0,
    /** Equal time bins over the span for the presence ratio (common practice: 100). */
    presenceBins: 100,
    /** Consecutive equal segments of the span for rate drift (our choice, no published source). */
    driftSegments: 10,
    /** Autocorrelogram bin and half-window, ms (common practice for figures). */
    acgBinMs: 1,
    acgWindowMs: 50,
    /** Screening thresholds of the `quality` verdict (common practice unless noted). */
    /** Fewest spikes for a unit to be judged at all (our choice). */
    minSpikes: 100,
    /** Largest Hill et al. (2011) contamination estimate (common practice: 0.1). */
    maxContamination: 0.1,
    /** Smallest presence ratio (common practice: 0.9). */
    minPresenceRatio: 0.9,
    /** Largest coefficient of variation of segment rates (our choice; Poisson noise alone gives ~sqrt(segments / spikes)). */
    maxRateDriftCv: 0.5,
  },
};

export type Parameters = typeof DEFAULTS;

/** A partial override of the parameters, as read from session.json or --config. */
export type ParameterOverrides = {
  [S in keyof Parameters]?: Partial<Parameters[S]>;
};
