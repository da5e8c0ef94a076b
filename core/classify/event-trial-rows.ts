import type { Events, Trials } from '../model/types';

/**
 * Row of the trial table each event belongs to (-1 when none): by the event's
 * `trial` number when given and known, otherwise the trial whose
 * [start, stop) holds the event time (trials are sorted by start).
 * O(events log trials).
 */
export function eventTrialRows(events: Events, trials: Trials): Int32Array {
  const out = new Int32Array(events.time.length).fill(-1);
  if (trials.trial.length === 0) return out;
  const byNumber = new Map<number, number>();
  for (let r = 0; r < trials.trial.length; r++) byNumber.set(trials.trial[r], r);
  for (let e = 0; e < events.time.length; e++) {
    const tn = events.trial[e];
    if (tn === tn && byNumber.has(tn)) {
      out[e] = byNumber.get(tn)!;
      continue;
    }
    const t = events.time[e];
    // Last trial starting at or before t (first start > t, minus one).
    let lo = 0;
    let hi = trials.start.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (trials.start[mid] <= t) lo = mid + 1;
      else hi = mid;
    }
    const r = lo - 1;
    if (r >= 0 && t >= trials.start[r] && t < trials.stop[r]) out[e] = r;
  }
  return out;
}
