import { studentTTwoSided } from './distributions';

export interface LinearFit {
  readonly n: number;
  readonly intercept: number;
  readonly slope: number;
  /** Standard errors of the estimates (residual SD times sqrt of (X'X)^-1 diagonal). */
  readonly interceptSe: number;
  readonly slopeSe: number;
  /** t = slope / slopeSe and its two-sided p on n - 2 degrees of freedom. */
  readonly slopeT: number;
  readonly slopeP: number;
  /** Coefficient of determination (NaN when y has zero variance). */
  readonly r2: number;
  /** Residual sum of squares and residual standard deviation sqrt(RSS / (n - 2)). */
  readonly residualSs: number;
  readonly residualSd: number;
}

/**
 * Ordinary least squares y = b0 + b1 x for one predictor, computed from
 * centred sums (two passes) so that large offsets do not cost precision.
 *
 * Units: slope in y-units per x-unit. Edge cases: n < 2 or zero variance in x
 * gives NaN estimates; n = 2 gives exact fit with NaN standard errors.
 * withP = false skips the t distribution (slopeP is NaN; every other field is
 * the same): callers that need only the line, thousands of times, save its cost.
 * Reference: NIST StRD linear regression dataset "Norris" (certified values),
 * checked in test/core/stats/linear-fit.test.ts.
 */
export function linearFit(x: ArrayLike<number>, y: ArrayLike<number>, withP = true): LinearFit {
  const n = Math.min(x.length, y.length);
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i];
    my += y[i];
  }
  mx /= n;
  my /= n;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx;
    const dy = y[i] - my;
    sxx += dx * dx;
    sxy += dx * dy;
    syy += dy * dy;
  }
  const slope = n >= 2 && sxx > 0 ? sxy / sxx : NaN;
  const intercept = my - slope * mx;
  let rss = 0;
  for (let i = 0; i < n; i++) {
    const r = y[i] - intercept - slope * x[i];
    rss += r * r;
  }
  const df = n - 2;
  const s2 = df > 0 ? rss / df : NaN;
  const slopeSe = Math.sqrt(s2 / sxx);
  const interceptSe = Math.sqrt(s2 * (1 / n + (mx * mx) / sxx));
  const slopeT = slope / slopeSe;
  const slopeP = withP && df > 0 && !Number.isNaN(slopeT) ? studentTTwoSided(slopeT, df) : NaN;
  return {
    n,
    intercept,
    slope,
    interceptSe,
    slopeSe,
    slopeT,
    slopeP,
    r2: syy > 0 ? 1 - rss / syy : NaN,
    residualSs: rss,
    residualSd: Math.sqrt(s2),
  };
}
