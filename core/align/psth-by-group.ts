import { computePsth } from './compute-psth';
import type { AlignmentSet, Psth, PsthOptions, TrialGroup } from './types';

/**
 * One PSTH per trial group (groupTrials), same options for all. Group g's
 * bootstrap uses seed + g, so groups draw independent, reproducible resamples.
 */
export function psthByGroup(
  spikeTimes: ArrayLike<number>,
  set: AlignmentSet,
  groups: readonly TrialGroup[],
  o: PsthOptions,
): { label: string; psth: Psth }[] {
  return groups.map((g, k) => ({
    label: g.label,
    psth: computePsth(
      spikeTimes,
      Float64Array.from(g.rows, (r) => set.times[r]),
      { ...o, seed: (o.seed ?? 1) + k },
    ),
  }));
}
