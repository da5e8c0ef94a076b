import type { LightResponse } from './light-response';

/**
 * The SALT p of a response that the identification rule uses: the
 * rank-calibrated p or the published one (saltPChoice decides which, from the
 * schedule). NaN when SALT did not run.
 */
export function ruleSaltP(r: LightResponse, kind: 'calibrated' | 'published'): number {
  return kind === 'calibrated' ? r.salt.pCalibrated : r.salt.p;
}
