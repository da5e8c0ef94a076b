import type { RateProfile } from './rate-profile';
import { profileIntegral } from './profile-integral';

/**
 * Expected change of rate (Hz) between a post window [postStartS, postEndS)
 * and a pre window [preStartS, preEndS) around each alignment time, averaged
 * over events, computed exactly from the rate profile. NaN with no events.
 */
export function expectedWindowChange(
  profile: RateProfile,
  alignS: ArrayLike<number>,
  preStartS: number,
  preEndS: number,
  postStartS: number,
  postEndS: number,
): number {
  if (alignS.length === 0) return NaN;
  let d = 0;
  for (let k = 0; k < alignS.length; k++) {
    const a = alignS[k];
    d += profileIntegral(profile, a + postStartS, a + postEndS) / (postEndS - postStartS);
    d -= profileIntegral(profile, a + preStartS, a + preEndS) / (preEndS - preStartS);
  }
  return d / alignS.length;
}
