/**
 * Laser pulses from a sampled power trace by threshold crossing (used for
 * NWB OptogeneticSeries and for TTL-like event series).
 *
 * A pulse starts at the first sample >= threshold after a sample below it (or
 * at the first sample when the trace starts high) and ends at the first later
 * sample below threshold; duration = end time - start time (the trace's
 * sample grid limits its precision to one sample interval); power = the
 * largest value inside the pulse. A pulse still on at the last sample ends
 * there. Default threshold: half the trace's maximum (common practice for
 * square pulses); a trace that never rises above 0 has no pulses.
 *
 * Units: times in s; values and threshold in the trace's unit (mW for laser
 * power). NaN samples count as below threshold.
 *
 * NOTE for the lead: the import area owns the laser-trace pulse detector in
 * core/io/; when it lands on main, this adapter calls it instead.
 */
export interface SeriesPulses {
  readonly onset: Float64Array;
  readonly duration: Float64Array;
  readonly powerMw: Float64Array;
  readonly thresholdMw: number;
}

export function pulsesFromSeries(times: Float64Array, values: Float64Array, threshold?: number): SeriesPulses {
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) if (values[i] > max) max = values[i];
  const thr = threshold ?? (max > 0 ? max / 2 : Infinity);
  const onset: number[] = [];
  const duration: number[] = [];
  const power: number[] = [];
  let inPulse = false;
  let start = 0;
  let peak = 0;
  for (let i = 0; i < values.length; i++) {
    const high = values[i] >= thr;
    if (high && !inPulse) {
      inPulse = true;
      start = times[i];
      peak = values[i];
    } else if (high) {
      if (values[i] > peak) peak = values[i];
    } else if (inPulse) {
      inPulse = false;
      onset.push(start);
      duration.push(times[i] - start);
      power.push(peak);
    }
  }
  if (inPulse) {
    onset.push(start);
    duration.push(times[times.length - 1] - start);
    power.push(peak);
  }
  return { onset: Float64Array.from(onset), duration: Float64Array.from(duration), powerMw: Float64Array.from(power), thresholdMw: thr };
}
