import type { RateProfile } from './rate-profile';
import { profileIntegral } from './profile-integral';

/**
 * Least-squares slope (Hz/s) of the expected rate across bins aligned on
 * `alignS` (e.g. reward times): the rate in bin j is the mean over events of
 * integral(profile, a + start + j*bin, a + start + (j+1)*bin) / bin, computed
 * exactly from the rate profile (no sampling noise); bins of `binS` over
 * [startS, endS) relative to each event; slope against bin centres. NaN with
 * no events or fewer than 2 bins.
 */
export function expectedRampSlope(
  profile: RateProfile,
  alignS: ArrayLike<number>,
  startS: number,
  endS: number,
  binS: number,
): number {
  const nb = Math.round((endS - startS) / binS);
  if (alignS.length === 0 || nb < 2) return NaN;
  let sx = 0;
  let sy = 0;
  let sxx = 0;
  let sxy = 0;
  for (let j = 0; j < nb; j++) {
    let y = 0;
    for (let k = 0; k < alignS.length; k++) {
      const a = alignS[k] + startS + j * binS;
      y += profileIntegral(profile, a, a + binS) / binS;
    }
    y /= alignS.length;
    const x = startS + (j + 0.5) * binS;
    sx += x;
    sy += y;
    sxx += x * x;
    sxy += x * y;
  }
  const den = nb * sxx - sx * sx;
  return (nb * sxy - sx * sy) / den;
}
