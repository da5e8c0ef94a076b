import { binCounts } from '../align/bin-counts';
import type { Parameters } from '../defaults';
import type { Recording } from '../model/types';
import { benjaminiHochberg } from '../stats/benjamini-hochberg';
import { mannWhitney } from '../stats/mann-whitney';
import { formatP } from './format-p';
import { rampUnit, type RampUnitResult } from './ramp-unit';
import { selectEvents } from './select-events';

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
 * Sessions without the event, or with fewer than minTrials trials: every unit
 * is flat with the reason, numbers NaN.
 */
export function classifyRamps(recording: Recording, params: Parameters['ramp']): RampClassification {
  const { windowStartS, windowEndS, binS } = params;
  const nBins = Math.max(1, Math.round((windowEndS - windowStartS) / binS));
  const centresS = Float64Array.from({ length: nBins }, (_, j) => windowStartS + (j + 0.5) * binS);
  const sel = selectEvents(recording, params.event, params.condition);
  const nUnits = recording.units.length;
  const units: RampUnitResult[] = [];
  const p = new Float64Array(nUnits);
  for (let u = 0; u < nUnits; u++) {
    const counts = binCounts(recording.units[u].spikeTimes, sel.times, windowStartS, binS, nBins);
    const r = rampUnit(counts, sel.times.length, centresS, binS, params.minTrials, params.exactMaxN);
    units.push(r);
    p[u] = r.p;
  }
  const q = benjaminiHochberg(p);
  const verdict: string[] = [];
  const reason: string[] = [];
  for (let u = 0; u < nUnits; u++) {
    const r = units[u];
    if (sel.times.length === 0) {
      verdict.push('flat');
      reason.push(sel.note);
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
        reason.push(`${up ? 'rises' : 'falls'} ${Math.abs(r.slopeHzPerS).toPrecision(3)} Hz/s: ${stats} < ${params.alpha}${disp}`);
      } else {
        verdict.push('flat');
        reason.push(`${stats} >= ${params.alpha}${disp}`);
      }
    }
  }

  // Per-condition slopes and their difference from the reference condition.
  const conditions: ConditionRamps[] = [];
  const labels = [...new Set(recording.trials.condition.filter((c) => c !== ''))].sort();
  if (labels.length > 0) {
    const all = selectEvents(recording, params.event, null);
    const byCondition = new Map<string, number[]>();
    all.conditions.forEach((c, i) => {
      if (c === '') return;
      if (!byCondition.has(c)) byCondition.set(c, []);
      byCondition.get(c)!.push(all.times[i]);
    });
    const refTimes = params.condition !== '' && byCondition.has(params.condition) ? Float64Array.from(byCondition.get(params.condition)!) : null;
    for (const c of labels) {
      const times = Float64Array.from(byCondition.get(c) ?? []);
      const slope = new Float64Array(nUnits).fill(NaN);
      const diffP = new Float64Array(nUnits).fill(NaN);
      for (let u = 0; u < nUnits; u++) {
        if (times.length === 0) continue;
        const st = recording.units[u].spikeTimes;
        const r =
          c === params.condition && sel.times.length === times.length
            ? units[u]
            : rampUnit(binCounts(st, times, windowStartS, binS, nBins), times.length, centresS, binS, Infinity);
        slope[u] = r.slopeHzPerS;
        if (refTimes && c !== params.condition && times.length >= 2 && refTimes.length >= 2) {
          diffP[u] = mannWhitney(r.trialSlopes, units[u].trialSlopes).p;
        }
      }
      conditions.push({ condition: c, nTrials: times.length, slopeHzPerS: slope, diffP });
    }
  }
  return { verdict, reason, q, units, conditions, centresS, note: sel.note, nTrials: sel.times.length };
}
