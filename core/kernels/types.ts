/**
 * Fluorescence-indicator kernels: the dF/F answer of an indicator to one
 * spike at t = 0, as a function of time after the spike (s). Zero for t < 0.
 *
 * - double-exponential: h(t) = peakDff * (exp(-t/tauDecayS) - exp(-t/tauRiseS)) / hPeak,
 *   where hPeak is the unscaled value at the peak, so max h = peakDff.
 * - alpha: h(t) = peakDff * (t/tauS) * exp(1 - t/tauS); peak at t = tauS.
 * - sampled: values[j] at t = j / sampleRateHz, linearly interpolated between
 *   samples and down to 0 one sample after the last one; 0 before t = 0
 *   (causal: a spike never shows before it happens); multiplied by `gain`.
 *
 * peakDff is the single-spike peak dF/F as a fraction (0.41 = 41 %). When it
 * is not published, library kernels use 1 and say so (`amplitudeKnown`):
 * predicted traces are then in units of one spike's peak.
 */
export type Kernel =
  | { readonly kind: 'double-exponential'; readonly tauRiseS: number; readonly tauDecayS: number; readonly peakDff: number }
  | { readonly kind: 'alpha'; readonly tauS: number; readonly peakDff: number }
  | { readonly kind: 'sampled'; readonly values: Float64Array; readonly sampleRateHz: number; readonly gain: number };

/** Timing of a kernel's single-spike answer, s (NaN when undefined). */
export interface KernelTiming {
  /** Time from the spike to half the peak on the way up. */
  readonly halfRiseS: number;
  /** Time from the spike to the peak. */
  readonly timeToPeakS: number;
  /** Time from the peak to half the peak on the way down. */
  readonly halfDecayS: number;
  /** Peak value (dF/F). */
  readonly peak: number;
}

/** A uniform sample grid: sample n sits at startS + n / rateHz. */
export interface SampleGrid {
  readonly startS: number;
  readonly rateHz: number;
  readonly length: number;
}

/** Reliability marker of a library value (REFERENCES.md markers). */
export type SourceStatus = 'verified' | 'from memory' | 'illustrative';

/** Published single-spike quantities a library kernel cites, ms. */
export interface PublishedKinetics {
  readonly halfRiseMs?: number;
  readonly timeToPeakMs?: number;
  readonly halfDecayMs?: number;
  /** Published rise (on) time constant, ms. */
  readonly tauOnMs?: number;
  /** Published decay (off) time constant, ms. */
  readonly tauOffMs?: number;
}

/** Which two published quantities a two-exponential kernel reproduces exactly. */
export type MatchedPair = 'timeToPeak+halfDecay' | 'halfRise+halfDecay' | 'tauOn+tauOff';

/** One entry of the indicator library. */
export interface KernelEntry {
  /** Indicator name as users type it (case-insensitive lookup), e.g. "jGCaMP8f". */
  readonly name: string;
  readonly family: 'calcium' | 'dopamine';
  readonly published: PublishedKinetics;
  readonly matched: MatchedPair;
  /** Derived rise and decay time constants, s. */
  readonly tauRiseS: number;
  readonly tauDecayS: number;
  /** Single-spike peak dF/F as a fraction, or null when not published. */
  readonly peakDff: number | null;
  /** Where the numbers come from (author, year, journal). */
  readonly source: string;
  /** Preparation the numbers were measured in. */
  readonly preparation: string;
  /** Marker of the published numbers (REFERENCES.md). */
  readonly status: SourceStatus;
  /** Hill coefficient of the indicator's calcium (or ligand) binding, when recalled. */
  readonly hillN?: { readonly value: number; readonly status: SourceStatus };
  readonly note?: string;
}
