import type { RateProfile } from './rate-profile';
import type { LightSchedule } from './light-schedule';
import { windowProfile } from './window-profile';

/**
 * Gain profile of a light-inhibited unit: `gain` on
 * [onset + delayMs, onset + duration + afterMs) of every pulse (windows of
 * one train merge when they overlap), 1 elsewhere.
 */
export function inhibitionProfile(schedule: LightSchedule, gain: number, delayMs: number, afterMs: number): RateProfile {
  const p = schedule.pulses;
  const n = p.onset.length;
  const start = new Float64Array(n);
  const stop = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const dur = Number.isFinite(p.duration[i]) ? p.duration[i] : 0;
    start[i] = p.onset[i] + delayMs / 1000;
    stop[i] = p.onset[i] + dur + afterMs / 1000;
  }
  return windowProfile(start, stop, new Float64Array(n).fill(Math.max(0, gain)));
}
