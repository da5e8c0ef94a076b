/**
 * Local variation LV of a spike train, Shinomoto, Shima & Tanji (2003),
 * Neural Comput 15:2823 (formula verified):
 *     LV = 3 / (n - 1) * sum_{i=1}^{n-1} ((I_i - I_{i+1}) / (I_i + I_{i+1}))^2
 * over the n ISIs I_i. LV = 1 for a Poisson train, < 1 for regular firing,
 * > 1 for bursty firing; unlike the CV it is insensitive to slow rate changes.
 *
 * Input: sorted spike times (s). NaN with fewer than 3 spikes (2 ISIs). A pair
 * of zero ISIs (three identical times) contributes 0.
 */
export function localVariation(spikeTimes: ArrayLike<number>): number {
  const nIsi = spikeTimes.length - 1;
  if (nIsi < 2) return NaN;
  let sum = 0;
  for (let i = 1; i < nIsi; i++) {
    const a = spikeTimes[i] - spikeTimes[i - 1];
    const b = spikeTimes[i + 1] - spikeTimes[i];
    const s = a + b;
    if (s > 0) {
      const d = (a - b) / s;
      sum += d * d;
    }
  }
  return (3 * sum) / (nIsi - 1);
}
