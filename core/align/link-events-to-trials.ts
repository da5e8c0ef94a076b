import type { Trials } from '../model/types';

/**
 * The trial row (index into `trials`) of each event time, -1 when none.
 * Events with a finite trial number are linked by it (the events file's
 * `trial` column wins when present; pass null when there is none); the others
 * by which trial's [start, stop) holds the event: binary search for the last
 * trial starting at or before the event, then a scan back over trials that
 * could still overlap it (the latest-starting holder wins). A trial number
 * missing from the trial table, or a NaN time, gives -1.
 */
export function linkEventsToTrials(times: ArrayLike<number>, trialNumbers: ArrayLike<number> | null, trials: Trials): Int32Array {
  const out = new Int32Array(times.length).fill(-1);
  const nT = trials.start.length;
  const byNumber = new Map<number, number>();
  let maxDur = 0;
  for (let r = 0; r < nT; r++) {
    if (!byNumber.has(trials.trial[r])) byNumber.set(trials.trial[r], r);
    const d = trials.stop[r] - trials.start[r];
    if (d > maxDur) maxDur = d;
  }
  for (let i = 0; i < times.length; i++) {
    const tn = trialNumbers ? trialNumbers[i] : NaN;
    if (Number.isFinite(tn)) {
      out[i] = byNumber.get(tn) ?? -1;
      continue;
    }
    const t = times[i];
    if (!Number.isFinite(t)) continue;
    let lo = 0;
    let hi = nT;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (trials.start[mid] <= t) lo = mid + 1;
      else hi = mid;
    }
    for (let r = lo - 1; r >= 0 && t - trials.start[r] <= maxDur; r--) {
      if (t < trials.stop[r]) {
        out[i] = r;
        break;
      }
    }
  }
  return out;
}
