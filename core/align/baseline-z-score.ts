/**
 * Baseline z-score of a PSTH: z = (rate - m) / s, where m and s are the mean
 * and SD (n - 1) of the PSTH's bins whose centres lie in [baselineStartS,
 * baselineStopS) (common practice: the spread of the trial-averaged rate over
 * baseline bins). Consequently the z-scores of the baseline bins have mean 0
 * and SD 1. Fewer than 2 baseline bins, or a flat baseline (s = 0, e.g. no
 * spikes), give NaN z-scores and say so through the NaN s.
 */
export function baselineZScore(
  rateHz: ArrayLike<number>,
  binCenterS: ArrayLike<number>,
  baselineStartS: number,
  baselineStopS: number,
): { z: Float64Array; meanHz: number; sdHz: number } {
  let n = 0;
  let sum = 0;
  for (let i = 0; i < rateHz.length; i++) {
    const c = binCenterS[i];
    if (c >= baselineStartS && c < baselineStopS && Number.isFinite(rateHz[i])) {
      n++;
      sum += rateHz[i];
    }
  }
  const mean = n ? sum / n : NaN;
  let ss = 0;
  for (let i = 0; i < rateHz.length; i++) {
    const c = binCenterS[i];
    if (c >= baselineStartS && c < baselineStopS && Number.isFinite(rateHz[i])) ss += (rateHz[i] - mean) ** 2;
  }
  const sd = n >= 2 ? Math.sqrt(ss / (n - 1)) : NaN;
  const z = new Float64Array(rateHz.length);
  for (let i = 0; i < z.length; i++) z[i] = sd > 0 ? (rateHz[i] - mean) / sd : NaN;
  return { z, meanHz: mean, sdHz: sd > 0 ? sd : NaN };
}
