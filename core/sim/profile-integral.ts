import { lowerBound } from '../align/lower-bound';
import type { RateProfile } from './rate-profile';

/**
 * Integral of the profile over [a, b) (for a rate: the expected spike count).
 * O(log breaks + breaks inside [a, b)). Returns 0 when b <= a.
 */
export function profileIntegral(p: RateProfile, a: number, b: number): number {
  if (!(b > a)) return 0;
  const br = p.breaks;
  let i = lowerBound(br, a);
  if (i < br.length && br[i] === a) i++;
  // value on [a, next break) is values[i]
  let sum = 0;
  let t = a;
  while (i < br.length && br[i] < b) {
    sum += p.values[i] * (br[i] - t);
    t = br[i];
    i++;
  }
  sum += p.values[i] * (b - t);
  return sum;
}
