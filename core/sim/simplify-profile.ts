import type { RateProfile } from './rate-profile';

/** Drops breakpoints where the value does not change. */
export function simplifyProfile(p: RateProfile): RateProfile {
  const nb = p.breaks.length;
  const breaks = new Float64Array(nb);
  const values = new Float64Array(nb + 1);
  values[0] = p.values[0];
  let m = 0;
  for (let i = 0; i < nb; i++) {
    if (p.values[i + 1] === values[m]) continue;
    breaks[m] = p.breaks[i];
    values[m + 1] = p.values[i + 1];
    m++;
  }
  return { breaks: breaks.slice(0, m), values: values.slice(0, m + 1) };
}
