import type { Unit } from '../model/types';

/**
 * All spikes of all units in time order, as a spike sorter writes them
 * (spike times plus a unit index per spike): a k-way merge of the units'
 * sorted trains with a binary heap, O(N log units). Ties keep unit order.
 * Returns parallel arrays: unit index (into `units`) and time, s.
 */
export function spikeTimeOrder(units: readonly Unit[]): { unit: Int32Array; time: Float64Array } {
  let total = 0;
  for (const u of units) total += u.spikeTimes.length;
  const unitOut = new Int32Array(total);
  const timeOut = new Float64Array(total);
  const k = units.length;
  const heap = new Int32Array(k); // unit indices, ordered by their next spike time
  const pos = new Int32Array(k);
  let size = 0;
  const key = (u: number) => units[u].spikeTimes[pos[u]];
  const less = (a: number, b: number) => {
    const ka = key(a);
    const kb = key(b);
    return ka < kb || (ka === kb && a < b);
  };
  const siftDown = (i: number) => {
    for (;;) {
      const l = 2 * i + 1;
      const r = l + 1;
      let m = i;
      if (l < size && less(heap[l], heap[m])) m = l;
      if (r < size && less(heap[r], heap[m])) m = r;
      if (m === i) return;
      const t = heap[i];
      heap[i] = heap[m];
      heap[m] = t;
      i = m;
    }
  };
  for (let u = 0; u < k; u++) if (units[u].spikeTimes.length > 0) heap[size++] = u;
  for (let i = (size >> 1) - 1; i >= 0; i--) siftDown(i);
  let n = 0;
  while (size > 0) {
    const u = heap[0];
    unitOut[n] = u;
    timeOut[n] = units[u].spikeTimes[pos[u]];
    n++;
    pos[u]++;
    if (pos[u] >= units[u].spikeTimes.length) heap[0] = heap[--size];
    siftDown(0);
  }
  return { unit: unitOut, time: timeOut };
}
