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
  /** Ramp before reward (DESIGN.md section 4; issue 5). */
  ramp: {
    /** Alignment event label. */
    event: 'reward',
    /** Window relative to the event, s. */
    windowStartS: -3,
    windowEndS: 0,
    /** Reference condition ("" = all trials; all trials also when trials carry no condition). */
    condition: 'standard',
    /** Bin width for the per-trial slopes and the GLM, s. */
    binS: 0.1,
    /** BH FDR level of the up/down verdict. */
    alpha: 0.05,
    /** Fewest trials for the signed-rank test: with 5 the two-sided exact p cannot go below 0.0625 (derived). */
    minTrials: 6,
    /** Largest trial count for the exact signed-rank distribution; above it the normal approximation (common practice). */
    exactMaxN: 30,
  },
  /** Transient answers to task-state jumps (DESIGN.md section 4; issue 5). */
  jump: {
    /** Alignment event label; events are grouped by their `kind`. */
    event: 'jump',
    /** Answer window and pre-event window, s relative to the jump. */
    postStartS: 0,
    postEndS: 0.3,
    preStartS: -0.3,
    preEndS: 0,
    /** Later window for the transient-versus-step comparison, s (issue 5). */
    lateStartS: 0.5,
    lateEndS: 1,
    /** BH FDR level of the excited/suppressed verdict (per kind, across units). */
    alpha: 0.05,
    /** Condition of the trials that serve as matched control ("" = no control). */
    controlCondition: 'standard',
    /** Fewest events of a kind for the test (as ramp.minTrials; derived). */
    minEvents: 6,
    exactMaxN: 30,
    /** PSTH bin for latency and peak, s (common practice). */
    psthBinS: 0.01,
    /** Latency: first of this many consecutive PSTH bins beyond zThreshold (common practice). */
    latencyRunBins: 2,
    zThreshold: 2,
    /** Trial covariate holding a numeric jump size ("" = none); answer vs size by Spearman. */
    sizeCovariate: 'jump_size',
  },
  /** Population clusters of trial-averaged responses (issue 5). */
  cluster: {
    /** Candidate numbers of clusters; the best mean silhouette wins. */
    kMin: 2,
    kMax: 6,
    /** k-means restarts per k and the first seed. */
    restarts: 10,
    seed: 1,
    /** Principal components kept for clustering (at most this many; fewer when the data have fewer). */
    components: 5,
    /** Bin of the trial-averaged responses that are clustered, s (common practice). */
    binS: 0.1,
    /** Fewest units with a response needed to cluster. */
    minUnits: 8,
    /** Event types with fewer events are left out of the clustered responses (too noisy; common practice). */
    minEvents: 10,
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
