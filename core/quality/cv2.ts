/**
 * CV2 of a spike train, Holt et al. (1996), J Neurophysiol 75 (citation
 * verified, formula from memory): the mean over consecutive ISI pairs of
 *     2 |I_{i+1} - I_i| / (I_{i+1} + I_i).
 * CV2 = 1 on average for a Poisson train; like LV it looks only at adjacent
 * intervals, so slow rate changes barely move it.
 *
 * Input: sorted spike times (s). NaN with fewer than 3 spikes. A pair of zero
 * ISIs contributes 0.
 */
export function cv2(spikeTimes: ArrayLike<number>): number {
  const nIsi = spikeTimes.length - 1;
  if (nIsi < 2) return NaN;
  let sum = 0;
  for (let i = 1; i < nIsi; i++) {
    const a = spikeTimes[i] - spikeTimes[i - 1];
    const b = spikeTimes[i + 1] - spikeTimes[i];
    const s = a + b;
    if (s > 0) sum += (2 * Math.abs(b - a)) / s;
  }
  return sum / (nIsi - 1);
}
