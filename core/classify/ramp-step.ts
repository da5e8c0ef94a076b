import type { AnalysisStep } from '../pipeline/types';
import type { Column } from '../table/types';
import { classifyProgressRamps } from './classify-progress-ramps';
import { classifyRamps } from './classify-ramps';
import { columnSafe } from './column-safe';

/**
 * Pipeline step "ramp": the contract columns ramp, ramp_slope_hz_per_s,
 * ramp_p, ramp_q, then ramp_reason and the effect sizes, then per-condition
 * slopes (ramp_slope_<condition>_hz_per_s) and, for conditions other than the
 * reference, ramp_diff_<condition>_p. Without reward events every unit is
 * `flat` with the reason and empty numbers.
 * With ramp.progressVariable set, the ramp over that behavioural variable
 * follows (classifyProgressRamps): progress_ramp, progress_ramp_slope_hz_per_unit,
 * progress_ramp_p, progress_ramp_q, progress_ramp_reason and the rest.
 */
export const rampStep: AnalysisStep = {
  name: 'ramp',
  selfContained: true,
  run({ recording, parameters }) {
    const rp = parameters.ramp;
    const r = classifyRamps(recording, rp);
    const num = (name: string, description: string, pick: (i: number) => number, digits = 6): Column => ({
      name,
      kind: 'number',
      values: Float64Array.from(r.units, (_, i) => pick(i)),
      digits,
      description,
    });
    const columns: Column[] = [
      { name: 'ramp', kind: 'string', values: r.verdict, description: `Ramp before "${rp.event}": up, down or flat (BH q < ${rp.alpha})` },
      num('ramp_slope_hz_per_s', 'Least-squares slope of the trial-averaged rate over the ramp window, Hz/s', (i) => r.units[i].slopeHzPerS),
      num('ramp_p', 'Two-sided Wilcoxon signed-rank p of the per-trial slopes', (i) => r.units[i].p),
      num('ramp_q', 'Benjamini-Hochberg adjustment of ramp_p across all units', (i) => r.q[i]),
      { name: 'ramp_reason', kind: 'string', values: r.reason, description: 'Why the ramp verdict was given' },
      num('ramp_n_trials', 'Trials in the ramp test', (i) => r.units[i].nTrials),
      num('ramp_mean_rate_hz', 'Mean rate over the ramp window, Hz', (i) => r.units[i].meanRateHz),
      num('ramp_slope_rel_per_s', 'Ramp slope relative to the mean rate in the window, 1/s', (i) => r.units[i].slopeRelPerS),
      num('ramp_r2', 'R^2 of the straight line fitted to the trial-averaged rate', (i) => r.units[i].r2),
      num('ramp_late_early_ratio', 'Mean rate in the last third of the window over the first third', (i) => r.units[i].lateEarlyRatio),
      num('ramp_glm_slope_per_s', 'Poisson GLM slope of log rate, 1/s', (i) => r.units[i].glmSlopePerS),
      num('ramp_glm_lrt_p', 'Poisson GLM likelihood-ratio p (assumes Poisson counts)', (i) => r.units[i].glmLrtP),
      num('ramp_glm_dispersion', 'Pearson chi-square / df of the Poisson GLM (> 1: overdispersed)', (i) => r.units[i].glmDispersion),
    ];
    for (const c of r.conditions) {
      const safe = columnSafe(c.condition);
      columns.push({
        name: `ramp_slope_${safe}_hz_per_s`,
        kind: 'number',
        values: c.slopeHzPerS,
        description: `Ramp slope in trials of condition "${c.condition}", Hz/s`,
      });
      if (c.condition !== rp.condition && rp.condition !== '' && r.conditions.some((x) => x.condition === rp.condition)) {
        columns.push({
          name: `ramp_diff_${safe}_p`,
          kind: 'number',
          values: c.diffP,
          description: `Rank-sum p of per-trial slopes, condition "${c.condition}" vs "${rp.condition}" (uncorrected)`,
        });
      }
    }
    const pr = classifyProgressRamps(recording, rp);
    if (pr) {
      const v = pr.variable;
      const pnum = (name: string, description: string, pick: (i: number) => number, digits = 6): Column => ({
        name,
        kind: 'number',
        values: Float64Array.from(recording.units, (_, i) => (pr.units.length > 0 ? pick(i) : NaN)),
        digits,
        description,
      });
      columns.push(
        { name: 'progress_ramp', kind: 'string', values: pr.verdict, description: `Ramp over the behavioural variable "${v}": up, down or flat (BH q < ${rp.alpha})` },
        pnum('progress_ramp_slope_hz_per_unit', `Occupancy-weighted least-squares slope of the trial-pooled rate over "${v}", Hz per unit of ${v}`, (i) => pr.units[i].slopeHzPerUnit),
        pnum('progress_ramp_p', 'Two-sided Wilcoxon signed-rank p of the per-trial slopes over the variable', (i) => pr.units[i].p),
        pnum('progress_ramp_q', 'Benjamini-Hochberg adjustment of progress_ramp_p across all units', (i) => pr.q[i]),
        { name: 'progress_ramp_reason', kind: 'string', values: pr.reason, description: 'Why the progress ramp verdict was given' },
        pnum('progress_ramp_n_trials', 'Trials with a slope over the variable (at least two occupied bins)', (i) => pr.units[i].nTrials),
        pnum('progress_ramp_mean_rate_hz', 'Spikes / time inside the variable range in the ramp windows, Hz', (i) => pr.units[i].meanRateHz),
        pnum('progress_ramp_glm_slope_per_unit', `Poisson GLM slope of log rate per unit of ${v} (offset log occupancy)`, (i) => pr.units[i].glmSlopePerUnit),
        pnum('progress_ramp_glm_lrt_p', 'Poisson GLM likelihood-ratio p (assumes Poisson counts)', (i) => pr.units[i].glmLrtP),
        pnum('progress_ramp_glm_dispersion', 'Pearson chi-square / df of the progress GLM (> 1: overdispersed)', (i) => pr.units[i].glmDispersion),
      );
    }
    const count = (v: string) => r.verdict.filter((x) => x === v).length;
    return {
      columns,
      summary: {
        event: rp.event,
        condition: rp.condition,
        trials: r.nTrials,
        selection: r.note,
        window: r.mode === 'warped' ? `"${rp.anchorEvent}" to "${rp.event}", time-warped` : 'fixed',
        windowS: r.mode === 'warped' ? [r.centresS[0] - (r.centresS[1] - r.centresS[0]) / 2, 0] : [rp.windowStartS, rp.windowEndS],
        binS: rp.binS,
        alpha: rp.alpha,
        up: count('up'),
        down: count('down'),
        flat: count('flat'),
        conditions: r.conditions.map((c) => ({ condition: c.condition, trials: c.nTrials })),
        ...(pr
          ? {
              progress: {
                variable: pr.variable,
                windows: pr.nWindows,
                note: pr.note,
                range: pr.range,
                rangeSource: pr.rangeSource,
                bins: pr.centres.length,
                binWidth: pr.binWidth,
                timeInRangeS: pr.occupiedS,
                up: pr.verdict.filter((x) => x === 'up').length,
                down: pr.verdict.filter((x) => x === 'down').length,
                flat: pr.verdict.filter((x) => x === 'flat').length,
              },
            }
          : {}),
      },
      warnings:
        r.nTrials === 0 && recording.units.length > 0
          ? [{
              code: 'ramp-no-trials',
              message: `Ramp classification skipped: ${r.note}; every unit is reported flat.${
                r.conditions.length > 0
                  ? ` Conditions present: ${r.conditions.map((c) => c.condition).join(', ')}; set the parameter ramp.condition to one of them, or to "" for all trials.`
                  : ''
              }`,
              count: 1,
            }]
          : [],
    };
  },
};
