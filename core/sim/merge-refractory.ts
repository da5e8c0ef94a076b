/**
 * Merges a unit's spontaneous and light-evoked spike times (each sorted)
 * and keeps the refractory period: walking in time order, a spike closer
 * than refractoryS to the last kept spike is dropped (an evoked spike right
 * after a spontaneous one fails; a spontaneous spike right after an evoked
 * one does not happen). When sampleRateHz is given, times are then rounded
 * to that clock (sorter output comes in samples). Returns the merged times
 * and a 0/1 mask of which kept spikes were evoked.
 */
export function mergeRefractory(
  spontaneous: Float64Array,
  evoked: Float64Array,
  refractoryS: number,
  sampleRateHz: number | null = null,
): { times: Float64Array; evoked: Uint8Array } {
  const times = new Float64Array(spontaneous.length + evoked.length);
  const mask = new Uint8Array(times.length);
  let i = 0;
  let j = 0;
  let n = 0;
  let last = -Infinity;
  while (i < spontaneous.length || j < evoked.length) {
    const takeEvoked = j < evoked.length && (i >= spontaneous.length || evoked[j] < spontaneous[i]);
    const t = takeEvoked ? evoked[j++] : spontaneous[i++];
    if (t - last < refractoryS) continue;
    times[n] = t;
    mask[n] = takeEvoked ? 1 : 0;
    n++;
    last = t;
  }
  const out = times.slice(0, n);
  if (sampleRateHz !== null && sampleRateHz > 0) {
    for (let k = 0; k < n; k++) out[k] = Math.round(out[k] * sampleRateHz) / sampleRateHz;
  }
  return { times: out, evoked: mask.slice(0, n) };
}
