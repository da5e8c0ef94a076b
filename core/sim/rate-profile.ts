/**
 * A piecewise-constant function of time (a firing rate in Hz, or a unitless
 * gain), stored sparsely as breakpoints:
 *   value(t) = values[0]                 for t < breaks[0]
 *   value(t) = values[i]                 for breaks[i-1] <= t < breaks[i]
 *   value(t) = values[breaks.length]     for t >= breaks[last]
 * so values.length === breaks.length + 1 and breaks ascend strictly.
 * A constant is { breaks: [], values: [c] }. Sessions of hours with sparse
 * modulation windows (trials, pulses) stay small: no per-millisecond grid.
 */
export interface RateProfile {
  readonly breaks: Float64Array;
  readonly values: Float64Array;
}
