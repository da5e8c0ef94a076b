/**
 * Time windows that may hold light-evoked spikes: [onset + startMs, onset +
 * endMs) after every pulse, merged where they overlap, as sorted
 * non-overlapping intervals (s). Used to keep light-evoked spikes out of the
 * rate-drift screen (a light-identified unit firing extra spikes during a
 * light block is not drifting). Empty when there are no pulses or the
 * window is empty.
 */
export function lightWindows(onsets: ArrayLike<number>, startMs: number, endMs: number): { startS: Float64Array; stopS: Float64Array } {
  const a = startMs / 1000;
  const b = endMs / 1000;
  const starts: number[] = [];
  const stops: number[] = [];
  if (!(b > a)) return { startS: new Float64Array(0), stopS: new Float64Array(0) };
  const sorted = Float64Array.from(onsets).sort();
  for (const t of sorted) {
    if (!Number.isFinite(t)) continue;
    const s = t + a;
    const e = t + b;
    if (stops.length && s <= stops[stops.length - 1]) stops[stops.length - 1] = Math.max(stops[stops.length - 1], e);
    else {
      starts.push(s);
      stops.push(e);
    }
  }
  return { startS: Float64Array.from(starts), stopS: Float64Array.from(stops) };
}
