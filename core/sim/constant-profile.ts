import type { RateProfile } from './rate-profile';

/** A constant profile. */
export function constantProfile(value: number): RateProfile {
  return { breaks: new Float64Array(0), values: Float64Array.of(value) };
}
