/** Least-squares fit of a measured trace by a scaled, shifted prediction. */
export interface AmplitudeFit {
  /** a in measured ~ a * predicted + b. */
  readonly amplitude: number;
  /** b, in the measured trace's units. */
  readonly offset: number;
  /** Pearson correlation of predicted and measured. */
  readonly r: number;
  /** Root-mean-square of measured - (a * predicted + b). */
  readonly residualRms: number;
  /** Fraction of the measured variance explained (= r^2 for this model). */
  readonly r2: number;
  /** Number of sample pairs used (both finite). */
  readonly n: number;
}

/**
 * Ordinary least squares of measured on predicted with intercept, over the
 * samples where both are finite. Closed form from centred sums (two passes,
 * for accuracy). Fewer than 3 pairs or a constant prediction give NaNs
 * (amplitude undefined) with n reported. Matches numpy.polyfit(pred, meas, 1)
 * and scipy.stats.pearsonr.
 */
export function fitAmplitudeOffset(predicted: ArrayLike<number>, measured: ArrayLike<number>): AmplitudeFit {
  if (predicted.length !== measured.length) throw new Error('fitAmplitudeOffset: lengths differ');
  let n = 0;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < predicted.length; i++) {
    const x = predicted[i];
    const y = measured[i];
    if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
    n++;
    sx += x;
    sy += y;
  }
  const nan = { amplitude: NaN, offset: NaN, r: NaN, residualRms: NaN, r2: NaN, n };
  if (n < 3) return nan;
  const mx = sx / n;
  const my = sy / n;
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  for (let i = 0; i < predicted.length; i++) {
    const x = predicted[i];
    const y = measured[i];
    if (!Number.isFinite(x) || !Number.isFinite(y)) continue;
    sxx += (x - mx) * (x - mx);
    syy += (y - my) * (y - my);
    sxy += (x - mx) * (y - my);
  }
  if (!(sxx > 0)) return nan;
  const a = sxy / sxx;
  const b = my - a * mx;
  const rss = Math.max(0, syy - a * sxy);
  const r = syy > 0 ? sxy / Math.sqrt(sxx * syy) : NaN;
  return { amplitude: a, offset: b, r, residualRms: Math.sqrt(rss / n), r2: syy > 0 ? 1 - rss / syy : NaN, n };
}
