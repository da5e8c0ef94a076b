/**
 * Refractory-period violations of one spike train.
 *
 * A violation is an inter-spike interval (ISI) shorter than `refractoryS`
 * (consecutive spikes only, the usual count). ISIs shorter than a sorter's
 * censored period should not exist; if they do (e.g. duplicated spikes) they
 * are counted too, which errs on the side of flagging the unit.
 *
 * Units: seconds in, counts out. `fraction` = violations / ISIs (NaN with
 * fewer than two spikes). Spike times must be sorted ascending. O(n).
 */
export interface IsiViolations {
  /** Number of ISIs shorter than the refractory period. */
  readonly count: number;
  /** Number of ISIs (spikes - 1, or 0). */
  readonly isiCount: number;
  /** count / isiCount; NaN when there is no ISI. */
  readonly fraction: number;
}

export function isiViolations(spikeTimes: ArrayLike<number>, refractoryS: number): IsiViolations {
  const n = spikeTimes.length;
  let count = 0;
  for (let i = 1; i < n; i++) if (spikeTimes[i] - spikeTimes[i - 1] < refractoryS) count++;
  const isiCount = Math.max(0, n - 1);
  return { count, isiCount, fraction: isiCount > 0 ? count / isiCount : NaN };
}
