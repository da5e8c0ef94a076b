/**
 * Types of the alignment package. Times in seconds; rows of an AlignmentSet
 * are "trials" of a raster (one row per alignment event).
 */

/** Alignment events chosen for a raster or PSTH, one row each, sorted by time. */
export interface AlignmentSet {
  /** What was aligned on: an event label, or "pulses" for laser pulse onsets. */
  readonly source: string;
  /** Alignment times, s. */
  readonly times: Float64Array;
  /** Row of recording.trials each event belongs to, -1 when none. */
  readonly trialRow: Int32Array;
  /** Event kind ("" when none; for pulses "single" or the train frequency, e.g. "10 Hz"). */
  readonly kind: readonly string[];
  /** Condition of the event's trial ("" when none). */
  readonly condition: readonly string[];
}

/**
 * A raster in compressed-row form: the spike times of row r, relative to its
 * alignment time (s), are times[offsets[r] .. offsets[r + 1]).
 */
export interface Raster {
  readonly offsets: Int32Array;
  readonly times: Float64Array;
  readonly rows: number;
  /** Window, s relative to the alignment time: [startS, stopS). */
  readonly startS: number;
  readonly stopS: number;
}

/** A group of alignment rows (indices into an AlignmentSet), in display order. */
export interface TrialGroup {
  readonly label: string;
  readonly rows: Int32Array;
}

/** How alignment rows are grouped. */
export type GroupBy =
  | { readonly by: 'none' }
  | { readonly by: 'condition' }
  | { readonly by: 'kind' }
  /** Numeric covariate: explicit bin edges, or nBins quantile bins (default 3); text covariate: its values. */
  | { readonly by: 'covariate'; readonly name: string; readonly edges?: readonly number[]; readonly nBins?: number };

/** How rows are ordered inside each group (ties keep time order). */
export type OrderBy = { readonly by: 'time' } | { readonly by: 'condition' } | { readonly by: 'covariate'; readonly name: string };

/** PSTH smoothing; widthMs is the Gaussian SD, the exponential time constant, or the boxcar's full width. */
export interface Smoothing {
  readonly kind: 'none' | 'gaussian' | 'exponential' | 'boxcar';
  readonly widthMs: number;
}

export interface PsthOptions {
  /** Window relative to the alignment time, s: [windowStartS, windowStopS). */
  readonly windowStartS: number;
  readonly windowStopS: number;
  readonly binMs: number;
  readonly smoothing?: Smoothing;
  /** Confidence band: mean +- 1 SEM, percentile trial bootstrap, or none. Default "sem". */
  readonly band?: 'sem' | 'bootstrap' | 'none';
  /** Bootstrap band coverage (default 0.95), resamples (default 1000) and seed (default 1). */
  readonly level?: number;
  readonly nBoot?: number;
  readonly seed?: number;
  /** Baseline window for the z-score, s relative to the alignment time; none when omitted. */
  readonly baselineStartS?: number;
  readonly baselineStopS?: number;
}

export interface Psth {
  /** Left edge and centre of each bin, s relative to the alignment time. */
  readonly binStartS: Float64Array;
  readonly binCenterS: Float64Array;
  readonly binS: number;
  /** Trial-averaged firing rate, Hz (smoothed when asked). */
  readonly rateHz: Float64Array;
  /** Standard error of the mean across trials, Hz. */
  readonly semHz: Float64Array;
  /** Band edges, Hz (NaN with band "none"). */
  readonly lowerHz: Float64Array;
  readonly upperHz: Float64Array;
  readonly band: 'sem' | 'bootstrap' | 'none';
  readonly nTrials: number;
  /** Baseline z-score of rateHz (null without a baseline window). */
  readonly zScore: Float64Array | null;
  readonly baselineMeanHz: number;
  readonly baselineSdHz: number;
}
