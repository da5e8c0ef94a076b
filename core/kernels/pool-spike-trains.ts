/**
 * All spikes of several trains in one sorted Float64Array (for a population
 * prediction: the kernel is linear, so the average of the units' traces is
 * the pooled train's trace divided by the number of units). NaN are dropped.
 * O(total log total) with the typed-array numeric sort.
 */
export function poolSpikeTrains(trains: readonly ArrayLike<number>[]): Float64Array {
  let total = 0;
  for (const t of trains) total += t.length;
  const out = new Float64Array(total);
  let k = 0;
  for (const t of trains) for (let i = 0; i < t.length; i++) if (t[i] === t[i]) out[k++] = t[i];
  return out.subarray(0, k).sort();
}
