/**
 * Pulses (or TTL-like events) from a sampled NWB series by threshold
 * crossing, through the project's one laser-trace detector
 * (core/io/detect-laser-pulses.ts: hysteresis between a high and a low level,
 * minimum width, default levels 60 % / 40 % of the way from the trace's
 * minimum to its maximum).
 *
 * Regularly sampled series (starting_time + rate) go to the detector as they
 * are, so an NWB laser trace gives exactly what the same trace gives in a
 * session folder. Series with timestamps (possibly irregular, e.g. a power
 * value stored at each change) are detected on the sample index and mapped
 * back to their timestamps, each sample holding its value until the next:
 * onset = timestamp of the first sample on, end = timestamp of the first
 * sample off (a pulse still on at the last sample ends there). The minimum
 * width then applies in seconds.
 *
 * Power of each pulse: the largest value inside it (trace units; mW for laser
 * power). Units: times in s.
 */
import { detectLaserPulses } from '../detect-laser-pulses';

export interface SeriesPulseOptions {
  /** Sampling rate, Hz, for regularly sampled series; absent for timestamps. */
  readonly rateHz?: number;
  /** Level that switches a pulse on (trace units); with lowThreshold, or both absent. */
  readonly highThreshold?: number;
  readonly lowThreshold?: number;
  /** Shortest pulse kept, s (default 0.0005, as the detector's). */
  readonly minWidthS?: number;
}

export interface SeriesPulses {
  readonly onset: Float64Array;
  readonly duration: Float64Array;
  /** Largest value inside each pulse. */
  readonly peak: Float64Array;
  readonly highThreshold: number;
  readonly dropped: number;
  readonly unterminated: number;
}

export function pulsesFromSeries(times: Float64Array, values: Float64Array, o: SeriesPulseOptions = {}): SeriesPulses {
  const minWidthS = o.minWidthS ?? 0.0005;
  const levels = o.highThreshold !== undefined ? { highThreshold: o.highThreshold, lowThreshold: o.lowThreshold ?? o.highThreshold } : {};
  const peakIn = (a: number, b: number) => {
    let m = -Infinity;
    for (let i = a; i < b; i++) if (values[i] > m) m = values[i];
    return m;
  };
  if (o.rateHz !== undefined && times.length > 0) {
    const t0 = times[0];
    const d = detectLaserPulses(values, { sampleRateHz: o.rateHz, startS: t0, minWidthS, ...levels });
    const peak = new Float64Array(d.onsetS.length);
    for (let k = 0; k < peak.length; k++) {
      const a = Math.round((d.onsetS[k] - t0) * o.rateHz);
      peak[k] = peakIn(a, Math.min(values.length, a + Math.round(d.durationS[k] * o.rateHz)));
    }
    return { onset: d.onsetS, duration: d.durationS, peak, highThreshold: d.highThreshold, dropped: d.dropped, unterminated: d.unterminated };
  }
  // Timestamps: detect on the sample index (rate 1, no width limit), then map to times.
  const d = detectLaserPulses(values, { sampleRateHz: 1, startS: 0, minWidthS: 0, ...levels });
  const onset: number[] = [];
  const duration: number[] = [];
  const peak: number[] = [];
  let dropped = d.dropped;
  const n = times.length;
  for (let k = 0; k < d.onsetS.length; k++) {
    const a = Math.round(d.onsetS[k]);
    const b = a + Math.round(d.durationS[k]);
    const on = times[a];
    const end = b < n ? times[b] : times[n - 1];
    if (end - on + 1e-12 < minWidthS && b < n) {
      dropped++;
      continue;
    }
    onset.push(on);
    duration.push(end - on);
    peak.push(peakIn(a, Math.min(n, b)));
  }
  return { onset: Float64Array.from(onset), duration: Float64Array.from(duration), peak: Float64Array.from(peak), highThreshold: d.highThreshold, dropped, unterminated: d.unterminated };
}
