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
    /**
     * Which SALT p the rule and `tag_p` use: 'calibrated' (rank of the test histogram among all
     * J + 1 histograms: close to uniform under no light effect, but never below 1 / (J + 1)),
     * 'published' (the authors' p, conservative), or 'auto' (own choice, the default):
     * calibrated when 1 / (J + 1) < alphaSalt on this session's schedule, else published.
     */
    saltP: 'auto' as 'auto' | 'calibrated' | 'published',
    /** Mean first-spike latency limit of the identified rule, ms. */
    maxLatencyMs: 6,
    /** Waveform correlation needed when waveforms exist (common practice). */
    minWaveformR: 0.9,
    /**
     * Most light-free time before each pulse cut into SALT baseline windows, ms
     * (100 windows of 10 ms: 4,950 null distances; the calibrated p can reach
     * 1/101 < 0.01 where the schedule leaves that much light-free time per pulse).
     * Common practice: a few hundred ms to a second before the pulse.
     */
    saltBaselineMs: 1000,
    /** Fewest baseline windows SALT runs with (REFERENCES.md: p < 0.01 needs >= ~15 windows). */
    saltMinWindows: 15,
    /** Share of pulses that should get a baseline block of their own before fewer windows are used (down to saltMinWindows; own choice). */
    saltMinPulseFraction: 0.8,
    /**
     * Time after each pulse's end (or after its test window, whichever is later)
     * treated as light-affected and kept out of every baseline, ms (common practice:
     * covers rebound and indirect answers).
     */
    lightGuardMs: 100,
    /** Count test (exact Poisson) threshold used for the borderline call and the SALT pitfall. */
    alphaCount: 0.01,
    /**
     * Least excess reliability (window spike probability minus the baseline windows') of a
     * `tagged` unit; below it a significant unit is `borderline` (unreliable). Own choice,
     * well below the 0.3-0.5 reliability criteria in use (REFERENCES.md, from memory).
     */
    minEvokedReliability: 0.1,
    /** Jitter below this is an artefact signature (photoelectric artefacts have ~zero jitter), ms (common practice). */
    artefactJitterMs: 0.2,
    /** Latency below this is faster than a light-gated channel fires a spike, ms (common practice). */
    artefactMinLatencyMs: 1,
    /** Window after pulse offset searched for offset-locked answers, ms (common practice). */
    offsetWindowMs: 2,
    /** Waveform snippet before / after the spike time, ms (common practice). */
    waveformPreMs: 1,
    waveformPostMs: 2,
    /** Channels compared (the best channel first, then the largest spontaneous peak-to-peak). */
    waveformChannels: 4,
    /** Most spikes averaged per mean waveform (evenly spread over the session). */
    waveformMaxSpikes: 500,
    /** Fewest evoked or spontaneous spikes for a waveform correlation. */
    waveformMinSpikes: 10,
    /** Null units simulated per node of the trust grid (rate 2^k Hz x ISI CV 0.5/1/2) for the false-identification estimate. */
    trustNullSimulations: 200,
    /** Simulated responders per reliability step of the power search. */
    trustPowerSimulations: 40,
    /**
     * Budget of the trust simulation per session, in pulse evaluations: when nodes x pulses
     * x trustNullSimulations exceeds it, each node gets fewer null units (at least 50) and
     * fewer responders per power step (at least 10, a fifth of the null units), so a
     * 1,000-unit, 10,000-pulse session stays within seconds. run.json reports the counts used.
     */
    trustBudget: 10000000,
    /** Latency and jitter of the simulated responders of the power search, ms (common practice for direct answers). */
    trustPowerLatencyMs: 4,
    trustPowerJitterMs: 1,
    /** Power asked of the smallest detectable reliability. */
    trustPower: 0.8,
    /** Seed of the trust simulation (results are bit-for-bit reproducible). */
    seed: 1,
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
    /**
     * Start anchor of a time-warped window ("" = the fixed window above): when set (e.g.
     * "sweep_on"), each trial's stretch from this event to `event` is warped onto the median
     * duration and cut into bins of about binS; slopes are then per template second.
     */
    anchorEvent: '',
    /**
     * Behavioural variable (a column of behaviour.csv, e.g. "position" or "progress") over which
     * the ramp is also expressed ("" = none): spikes and time in the ramp windows are binned by
     * the variable's interpolated value, and the progress_ramp columns report the per-trial
     * occupancy-weighted slopes (Hz per unit of the variable), signed-rank test and Poisson GLM.
     */
    progressVariable: '',
    /** Equal bins of the progress variable over its range (common practice). */
    progressBins: 10,
    /** Range of the progress variable; null = its 1st / 99th percentile over the samples inside the ramp windows. */
    progressMin: null as number | null,
    progressMax: null as number | null,
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
