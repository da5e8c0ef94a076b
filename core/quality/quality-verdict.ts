import type { Parameters } from '../defaults';
import { formatNumber } from '../table/format-number';
import type { UnitQuality } from './unit-quality';

/** Verdict words of the quality screen: our own plain words. */
export const QUALITY_VERDICTS = ['pass', 'review'] as const;
export type QualityVerdict = (typeof QUALITY_VERDICTS)[number];

/**
 * Screens one unit's quality metrics against the thresholds of the `quality`
 * parameters (all common practice or our choice, see core/defaults.ts):
 * enough spikes, contamination defined and at most maxContamination,
 * presence ratio at least minPresenceRatio, rate drift CV at most
 * maxRateDriftCv. `pass` when every screen is met, otherwise `review` with
 * every failed screen named in the reason (numbers with 3 significant
 * digits). Units with too few spikes are not judged on the other screens
 * (their estimates are too noisy to mean anything).
 *
 * A screen, not a proof: a `review` unit may be a fine neuron that fired
 * rarely or stopped firing, and a `pass` unit may still be two neurons.
 */
export function qualityVerdict(m: UnitQuality, q: Parameters['quality']): { verdict: QualityVerdict; reason: string } {
  const f = (x: number) => formatNumber(x, 3);
  if (!(m.nSpikes >= q.minSpikes)) {
    return { verdict: 'review', reason: `too few spikes to judge (${m.nSpikes} < ${q.minSpikes})` };
  }
  const fails: string[] = [];
  if (m.contaminationAtLeastHalf) {
    fails.push(`contamination >= 0.5 (${m.isiViolationCount} ISIs < ${f(q.refractoryMs)} ms, more than half-contamination predicts)`);
  } else if (Number.isNaN(m.contamination)) {
    fails.push('contamination undefined (check refractoryMs > censoredMs)');
  } else if (m.contamination > q.maxContamination) {
    fails.push(`contamination ${f(m.contamination)} > ${f(q.maxContamination)}`);
  }
  if (!(m.presenceRatio >= q.minPresenceRatio)) {
    fails.push(`presence ratio ${f(m.presenceRatio)} < ${f(q.minPresenceRatio)}`);
  }
  if (!(m.rateDriftCv <= q.maxRateDriftCv)) {
    fails.push(`rate drift CV ${f(m.rateDriftCv)} > ${f(q.maxRateDriftCv)}`);
  }
  if (fails.length) return { verdict: 'review', reason: fails.join('; ') };
  return {
    verdict: 'pass',
    reason: `contamination ${f(m.contamination)}, presence ratio ${f(m.presenceRatio)}, rate drift CV ${f(m.rateDriftCv)} within thresholds`,
  };
}
