import type { RateProfile } from './rate-profile';
import { constantProfile } from './constant-profile';
import { simplifyProfile } from './simplify-profile';

/**
 * Pointwise product of piecewise-constant profiles (rate x gains). One merge
 * pass over all breakpoints: O(total breakpoints x profiles).
 */
export function multiplyProfiles(...profiles: readonly RateProfile[]): RateProfile {
  if (profiles.length === 0) return constantProfile(1);
  if (profiles.length === 1) return profiles[0];
  let total = 0;
  for (const p of profiles) total += p.breaks.length;
  const breaks = new Float64Array(total);
  const values = new Float64Array(total + 1);
  const k = profiles.length;
  const idx = new Int32Array(k); // next break of each profile
  const cur = new Float64Array(k);
  let prod = 1;
  for (let j = 0; j < k; j++) {
    cur[j] = profiles[j].values[0];
  }
  const product = () => {
    prod = 1;
    for (let j = 0; j < k; j++) prod *= cur[j];
    return prod;
  };
  values[0] = product();
  let m = 0;
  for (;;) {
    let t = Infinity;
    for (let j = 0; j < k; j++) {
      const b = profiles[j].breaks;
      if (idx[j] < b.length && b[idx[j]] < t) t = b[idx[j]];
    }
    if (t === Infinity) break;
    for (let j = 0; j < k; j++) {
      const b = profiles[j].breaks;
      if (idx[j] < b.length && b[idx[j]] === t) {
        idx[j]++;
        cur[j] = profiles[j].values[idx[j]];
      }
    }
    breaks[m] = t;
    values[m + 1] = product();
    m++;
  }
  return simplifyProfile({ breaks: breaks.subarray(0, m), values: values.subarray(0, m + 1) });
}
