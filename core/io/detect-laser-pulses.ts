/**
 * Finds laser pulses in a sampled TTL or analog laser-monitor trace by
 * threshold crossing with hysteresis and a minimum width.
 *
 * A pulse starts at the first sample >= `highThreshold` while off, and ends
 * at the first later sample < `lowThreshold` (hysteresis: noise between the
 * two levels cannot split a pulse or start one). Onset = start sample / rate
 * + startS; duration = (end - start) / rate. Time resolution: one sample.
 * Pulses shorter than `minWidthS` are dropped as glitches (counted in
 * `dropped`). A pulse still on at the last sample ends there (counted in
 * `unterminated`).
 *
 * Default thresholds (when not given): 60 % and 40 % of the way from the
 * trace's minimum to its maximum. A flat trace gives no pulses.
 * NaN samples count as "off". One pass, O(n), no allocation per sample.
 */
export interface LaserTraceOptions {
  readonly sampleRateHz: number;
  /** Time of sample 0 on the recording clock, s (default 0). */
  readonly startS?: number;
  /** Level that switches a pulse on (trace units). */
  readonly highThreshold?: number;
  /** Level below which a pulse switches off (trace units, <= high). */
  readonly lowThreshold?: number;
  /** Shortest pulse kept, s (default 0.0005). */
  readonly minWidthS?: number;
}

export interface DetectedPulses {
  readonly onsetS: Float64Array;
  readonly durationS: Float64Array;
  readonly highThreshold: number;
  readonly lowThreshold: number;
  readonly dropped: number;
  readonly unterminated: number;
}

export function detectLaserPulses(trace: ArrayLike<number>, o: LaserTraceOptions): DetectedPulses {
  const n = trace.length;
  const fs = o.sampleRateHz;
  const t0 = o.startS ?? 0;
  const minWidth = o.minWidthS ?? 0.0005;
  let lo = Infinity;
  let hi = -Infinity;
  if (o.highThreshold === undefined || o.lowThreshold === undefined) {
    for (let i = 0; i < n; i++) {
      const x = trace[i];
      if (x < lo) lo = x;
      if (x > hi) hi = x;
    }
  }
  const high = o.highThreshold ?? lo + 0.6 * (hi - lo);
  const low = o.lowThreshold ?? (o.highThreshold !== undefined ? o.highThreshold : lo + 0.4 * (hi - lo));
  const onsets: number[] = [];
  const durations: number[] = [];
  let dropped = 0;
  let unterminated = 0;
  if (!(hi > lo) && (o.highThreshold === undefined || o.lowThreshold === undefined)) {
    return { onsetS: new Float64Array(0), durationS: new Float64Array(0), highThreshold: high, lowThreshold: low, dropped, unterminated };
  }
  let on = false;
  let start = 0;
  const close = (end: number) => {
    const w = (end - start) / fs;
    if (w + 1e-12 < minWidth) dropped++;
    else {
      onsets.push(start / fs + t0);
      durations.push(w);
    }
  };
  for (let i = 0; i < n; i++) {
    const x = trace[i];
    if (!on) {
      if (x >= high) {
        on = true;
        start = i;
      }
    } else if (!(x >= low)) {
      on = false;
      close(i);
    }
  }
  if (on) {
    unterminated++;
    close(n);
  }
  return { onsetS: Float64Array.from(onsets), durationS: Float64Array.from(durations), highThreshold: high, lowThreshold: low, dropped, unterminated };
}
