import type { Parameters } from '../defaults';
import type { Recording } from '../model/types';
import { benjaminiHochberg } from '../stats/benjamini-hochberg';
import { mannWhitney } from '../stats/mann-whitney';
import { formatP } from './format-p';
import { rampUnit, type RampUnitResult } from './ramp-unit';
import { rampCounts, rampPlan, type RampPlan } from './ramp-plan';
import { rampUnitFromSpikes } from './ramp-unit-from-spikes';

/** Per-condition ramp slopes, one entry per condition label present among the trials. */
export interface ConditionRamps {
  readonly condition: string;
  readonly nTrials: number;
  /** Mean per-trial slope per unit, Hz/s. */
  readonly slopeHzPerS: Float64Array;
  /** Two-sided rank-sum p of the per-trial slopes against the reference condition (NaN for the reference itself). */
  readonly diffP: Float64Array;
}

export interface RampClassification {
  /** Verdict per unit: up | down | flat. */
  readonly verdict: string[];
  readonly reason: string[];
  readonly q: Float64Array;
  readonly units: RampUnitResult[];
  readonly conditions: ConditionRamps[];
  /** Bin centres of the window, s relative to the event. */
  readonly centresS: Float64Array;
  /** How the trials were chosen (e.g. `no "reward" events`). */
  readonly note: string;
  readonly nTrials: number;
  /** "fixed" window around the event, or "warped" from the anchor event to it. */
  readonly mode: 'fixed' | 'warped';
}

/**
 * Ramp classification of every unit (issue 5): peri-event counts over
 * [windowStartS, windowEndS) around each `event` in trials of `condition`,
 * per-unit statistics (rampUnit), Benjamini-Hochberg across all units with a
 * p-value, verdict up/down when q < alpha (direction from the signed-rank
 * statistic), flat otherwise, each with a reason.
 *
 * Per condition (every non-empty condition label of the trial table): mean
 * per-trial slope and a two-sided Wilcoxon rank-sum (Mann-Whitney) test of
 * the per-trial slopes against the reference condition's (trials are
 * independent between conditions; no correction across units or conditions,
 * read them as descriptive unless you correct).
 *
 * With anchorEvent set, the window is each trial's stretch from that event
 * to the ramp event, time-warped (rampPlan); otherwise the fixed window.
 * Sessions without the event, or with fewer than minTrials trials: every unit
 * is flat with the reason, numbers NaN.
 */
export function classifyRamps(recording: Recording, params: Parameters['ramp']): RampClassification {
  const plan = rampPlan(recording, params, params.condition);
  const { centresS } = plan;
  const nUnits = recording.units.length;
  const units: RampUnitResult[] = [];
  const p = new Float64Array(nUnits);
  const buffer = plan.mode === 'fixed' ? new Float64Array(0) : new Float64Array(plan.nTrials * centresS.length);

  // Per-condition slopes and their difference from the reference condition
  // (warped windows use the reference template, so slopes compare per reference second).
  const labels = [...new Set(recording.trials.condition.filter((c) => c !== ''))].sort();
  const hasReference = params.condition !== '' && labels.includes(params.condition) && plan.nTrials > 0;
  const perCondition = labels.map((c) => {
    const isReference = c === params.condition && plan.nTrials > 0;
    const cp = isReference ? plan : rampPlan(recording, params, c, plan.template ?? undefined);
    return {
      condition: c,
      isReference,
      cp,
      cBuffer: cp.mode === 'fixed' ? new Float64Array(0) : new Float64Array(cp.nTrials * cp.centresS.length),
      slope: new Float64Array(nUnits).fill(NaN),
      diffP: new Float64Array(nUnits).fill(NaN),
      active: cp.nTrials > 0 && cp.centresS.length === centresS.length,
    };
  });

  // Unit by unit, every condition in turn: the unit's spike train is read
  // while it is still in the processor's cache.
  for (let u = 0; u < nUnits; u++) {
    const spikeTimes = recording.units[u].spikeTimes;
    const r = unitRamp(spikeTimes, plan, buffer, params.minTrials, params.exactMaxN);
    units.push(r);
    p[u] = r.p;
    for (const k of perCondition) {
      if (!k.active) continue;
      const rc = k.isReference ? r : unitRamp(spikeTimes, k.cp, k.cBuffer, Infinity, params.exactMaxN, false);
      k.slope[u] = rc.slopeHzPerS;
      // numerators over one common denominator: the same rank-sum test as on the slopes
      if (hasReference && !k.isReference && k.cp.nTrials >= 2 && plan.nTrials >= 2) k.diffP[u] = mannWhitney(rc.rankKeys, r.rankKeys).p;
    }
  }
  const q = benjaminiHochberg(p);
  const verdict: string[] = [];
  const reason: string[] = [];
  for (let u = 0; u < nUnits; u++) {
    const r = units[u];
    if (plan.nTrials === 0) {
      verdict.push('flat');
      reason.push(plan.note);
    } else if (!(r.p === r.p)) {
      verdict.push('flat');
      reason.push(
        r.nTrials < params.minTrials
          ? `only ${r.nTrials} trials (fewer than ${params.minTrials})`
          : 'no spikes in the window',
      );
    } else {
      const disp = r.glmDispersion > 1.5 ? `; counts overdispersed (Pearson X2/df ${r.glmDispersion.toFixed(2)}), GLM p too small, not used` : '';
      const stats = `signed-rank on ${r.nNonZero} per-trial slopes p ${formatP(r.p)}, q ${formatP(q[u])}`;
      if (q[u] < params.alpha && r.direction !== 0) {
        const up = r.direction > 0;
        verdict.push(up ? 'up' : 'down');
        reason.push(`${up ? 'rises' : 'falls'} (slope ${r.slopeHzPerS >= 0 ? '+' : ''}${r.slopeHzPerS.toPrecision(3)} Hz/s): ${stats} < ${params.alpha}${disp}`);
      } else {
        verdict.push('flat');
        reason.push(`${stats} >= ${params.alpha}${disp}`);
      }
    }
  }

  const conditions: ConditionRamps[] = perCondition.map((k) => ({ condition: k.condition, nTrials: k.cp.nTrials, slopeHzPerS: k.slope, diffP: k.diffP }));
  return { verdict, reason, q, units, conditions, centresS, note: plan.note, nTrials: plan.nTrials, mode: plan.mode };
}

/**
 * One unit's ramp statistics under a plan: straight from the spikes for the
 * fixed window, via counts and exposure when warped. tests = false: slopes
 * only (the other conditions' comparison uses no GLM and no signed-rank test).
 */
function unitRamp(spikeTimes: Float64Array, plan: RampPlan, buffer: Float64Array, minTrials: number, exactMaxN: number, tests = true): RampUnitResult {
  if (plan.mode === 'fixed') return rampUnitFromSpikes(spikeTimes, plan.times, plan.startS, plan.binS, plan.centresS, minTrials, exactMaxN, tests);
  const c = rampCounts(spikeTimes, plan, buffer);
  return rampUnit(c.counts, plan.nTrials, plan.centresS, plan.binS, minTrials, exactMaxN, c.exposureS, tests);
}
