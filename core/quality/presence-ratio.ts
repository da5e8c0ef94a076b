/**
 * Presence ratio: the fraction of `nBins` equal time bins over [startS, stopS)
 * that hold at least one spike (common practice; 100 bins is usual).
 *
 * A spike exactly at stopS counts in the last bin; spikes outside the span are
 * ignored. Returns NaN when the span is empty or nBins < 1. Sorted spike
 * times, single pass, O(n).
 */
export function presenceRatio(spikeTimes: ArrayLike<number>, startS: number, stopS: number, nBins: number): number {
  const len = stopS - startS;
  const bins = Math.floor(nBins);
  if (!(len > 0) || !(bins >= 1)) return NaN;
  const width = len / bins;
  let occupied = 0;
  let last = -1;
  for (let i = 0; i < spikeTimes.length; i++) {
    const t = spikeTimes[i];
    if (t < startS || t > stopS) continue;
    let b = Math.floor((t - startS) / width);
    if (b >= bins) b = bins - 1;
    if (b !== last) {
      occupied++;
      last = b;
    }
  }
  return occupied / bins;
}
