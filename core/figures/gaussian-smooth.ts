/**
 * Smooths a binned series with a Gaussian kernel of standard deviation
 * `sdBins` bins, truncated at 4 sd (as scipy.ndimage.gaussian_filter1d's
 * default truncate=4.0). At the edges the kernel is renormalised over the
 * bins that exist, so a constant series stays constant (no fall-off toward
 * the window's ends). sdBins <= 0 or non-finite returns a copy. NaN bins are
 * skipped (weights renormalised over finite neighbours; all-NaN stays NaN).
 * Interior values equal gaussian_filter1d's (checked in the test).
 */
export function gaussianSmooth(values: ArrayLike<number>, sdBins: number): Float64Array {
  const n = values.length;
  const out = new Float64Array(n);
  if (!(sdBins > 0) || !Number.isFinite(sdBins)) {
    for (let i = 0; i < n; i++) out[i] = values[i];
    return out;
  }
  const half = Math.max(1, Math.floor(4 * sdBins + 0.5)); // radius as SciPy: int(truncate * sd + 0.5)
  const w = new Float64Array(2 * half + 1);
  for (let k = -half; k <= half; k++) w[k + half] = Math.exp(-(k * k) / (2 * sdBins * sdBins));
  for (let i = 0; i < n; i++) {
    let s = 0;
    let ws = 0;
    const lo = Math.max(0, i - half);
    const hi = Math.min(n - 1, i + half);
    for (let j = lo; j <= hi; j++) {
      const v = values[j];
      if (v !== v) continue;
      const wt = w[j - i + half];
      s += wt * v;
      ws += wt;
    }
    out[i] = ws > 0 ? s / ws : NaN;
  }
  return out;
}
