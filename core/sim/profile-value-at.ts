import { lowerBound } from '../align/lower-bound';
import type { RateProfile } from './rate-profile';

/** Value of the profile at time t. O(log breaks). */
export function profileValueAt(p: RateProfile, t: number): number {
  // number of breaks <= t
  let i = lowerBound(p.breaks, t);
  if (i < p.breaks.length && p.breaks[i] === t) i++;
  return p.values[i];
}
