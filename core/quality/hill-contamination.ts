/**
 * Contamination estimate from refractory violations, after Hill, Mehta &
 * Kleinfeld (2011), J Neurosci 31:8699 (citation verified; the formula is
 * written here from memory, see /work/shared/REFERENCES.md).
 *
 * Model: a fraction F of a unit's N spikes come from independent Poisson
 * contaminants. Over a recording of length T, the expected number of ISIs in
 * the window [censored, refractory) is
 *     r = 2 (tau_r - tau_c) N^2 F (1 - F) / T,
 * solved for the smaller root:
 *     F = 1/2 - sqrt(1/4 - r T / (2 (tau_r - tau_c) N^2)).
 *
 * When the radicand is negative there are more violations than any F <= 1/2
 * explains: the estimate is undefined and the unit is at least half
 * contamination. That case returns `{ value: NaN, atLeastHalf: true }`, so a
 * table shows an empty cell and a reason says ">= 0.5", never a made-up number.
 *
 * Units: seconds for T, tau_r, tau_c. Returns NaN (atLeastHalf false) when
 * N = 0, T <= 0, or tau_r <= tau_c (no window to count in).
 */
export interface Contamination {
  /** Estimated contaminating fraction F in [0, 0.5]; NaN when undefined. */
  readonly value: number;
  /** True when violations exceed what F = 0.5 predicts (report ">= 0.5"). */
  readonly atLeastHalf: boolean;
}

export function hillContamination(
  violations: number,
  nSpikes: number,
  durationS: number,
  refractoryS: number,
  censoredS: number,
): Contamination {
  const window = refractoryS - censoredS;
  if (!(nSpikes > 0) || !(durationS > 0) || !(window > 0) || !(violations >= 0)) {
    return { value: NaN, atLeastHalf: false };
  }
  const radicand = 0.25 - (violations * durationS) / (2 * window * nSpikes * nSpikes);
  if (radicand < 0) return { value: NaN, atLeastHalf: true };
  return { value: 0.5 - Math.sqrt(radicand), atLeastHalf: false };
}
