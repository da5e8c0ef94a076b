import type { RateProfile } from './rate-profile';
import { simplifyProfile } from './simplify-profile';

/**
 * Builds a gain profile from windows [start, stop) holding a gain; outside
 * every window the gain is `outside` (default 1). Windows must be sorted by
 * start; windows that overlap the previous one are cut to start where it
 * stops (the earlier window wins). Empty windows are skipped. O(windows).
 */
export function windowProfile(
  start: ArrayLike<number>,
  stop: ArrayLike<number>,
  gain: ArrayLike<number>,
  outside = 1,
): RateProfile {
  const n = start.length;
  const breaks = new Float64Array(2 * n);
  const values = new Float64Array(2 * n + 1);
  let m = 0; // breaks written
  values[0] = outside;
  let lastStop = -Infinity;
  for (let i = 0; i < n; i++) {
    const a = Math.max(start[i], lastStop);
    const b = stop[i];
    if (!(b > a)) continue;
    if (i > 0 && start[i] < start[i - 1]) throw new Error('windowProfile: windows must be sorted by start');
    if (m > 0 && a === breaks[m - 1]) {
      // adjoining the previous window: its closing break becomes this window's opening
      values[m] = gain[i];
    } else {
      breaks[m] = a;
      values[m + 1] = gain[i];
      m++;
    }
    breaks[m] = b;
    values[m + 1] = outside;
    m++;
    lastStop = b;
  }
  return simplifyProfile({ breaks: breaks.subarray(0, m), values: values.subarray(0, m + 1) });
}
