/**
 * Adds `sign` x (the time [a, b) overlaps each bin) to `perBin`, for
 * `perBin.length` equal bins of `widthS` starting at `startS`. [a, b) must
 * already be clipped to the binned span; an empty interval adds nothing. Shared by the
 * presence ratio (observed time per bin, sign +1) and the rate-drift
 * segments (time left per segment after exclusions, sign -1).
 */
export function addIntervalOverlap(perBin: Float64Array, startS: number, widthS: number, a: number, b: number, sign: 1 | -1): void {
  if (!(b > a)) return;
  const bins = perBin.length;
  const first = Math.min(bins - 1, Math.floor((a - startS) / widthS));
  const last = Math.min(bins - 1, Math.floor((b - startS) / widthS));
  for (let k = first; k <= last; k++) {
    const lo = Math.max(a, startS + k * widthS);
    const hi = Math.min(b, startS + (k + 1) * widthS);
    if (hi > lo) perBin[k] += sign * (hi - lo);
  }
}
