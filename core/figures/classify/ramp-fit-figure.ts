import { rampUnit } from '../../classify/ramp-unit';
import { rampCounts, rampPlan } from '../../classify/ramp-plan';
import { BASE_LAYOUT, GROUP_COLORS, VERDICT_STYLE, type FigureSpec } from '../theme';
import type { FigureContext, UnitFigure } from '../types';

/**
 * "Ramp before reward": the trial-averaged binned rate (mean +- SEM across
 * trials) over the ramp window of the reference condition, the least-squares
 * line through it (coloured by the verdict, labelled with it), and the
 * trial-averaged rate of every other condition as thin lines. Null when the
 * session has no ramp trials. With ramp.anchorEvent set the axis is the
 * time-warped approach (template seconds before the event). Recomputes the unit's profile from the
 * recording with the same code as the ramp step (core/classify/ramp-unit.ts).
 */
export const rampFitFigure: UnitFigure = {
  id: 'ramp-fit',
  title: 'Ramp before reward',
  build(ctx: FigureContext, unitIndex: number): FigureSpec | null {
    const p = ctx.parameters.ramp;
    const plan = rampPlan(ctx.recording, p, p.condition);
    if (plan.nTrials === 0) return null;
    const st = ctx.recording.units[unitIndex].spikeTimes;
    const k = rampCounts(st, plan);
    const r = rampUnit(k.counts, plan.nTrials, plan.centresS, plan.binS, p.minTrials, p.exactMaxN, k.exposureS);
    const col = (name: string) => ctx.table.columns.find((c) => c.name === name);
    const verdictCol = col('ramp');
    const verdict = verdictCol && verdictCol.kind === 'string' ? verdictCol.values[unitIndex] : '';
    const qCol = col('ramp_q');
    const q = qCol && qCol.kind === 'number' ? qCol.values[unitIndex] : NaN;
    const style = VERDICT_STYLE[verdict] ?? VERDICT_STYLE.flat;
    const x = Array.from(plan.centresS);
    const condLabel = p.condition === '' ? 'all trials' : `condition ${p.condition}`;
    const data: Record<string, unknown>[] = [
      {
        type: 'scatter',
        mode: 'markers',
        name: `${condLabel} (${r.nTrials} trials), mean +- SEM`,
        x,
        y: Array.from(r.meanRate),
        error_y: { type: 'data', array: Array.from(r.semRate), visible: true, color: '#555' },
        marker: { color: '#333', size: 5 },
      },
      {
        type: 'scatter',
        mode: 'lines',
        name: `fit ${r.slopeHzPerS.toPrecision(3)} Hz/s: ${verdict || 'no verdict'}${q === q ? ` (q ${q.toPrecision(2)})` : ''}`,
        x: [x[0], x[x.length - 1]],
        y: [r.interceptHz + r.slopeHzPerS * x[0], r.interceptHz + r.slopeHzPerS * x[x.length - 1]],
        line: { color: style.color, width: 3 },
      },
    ];
    const others = [...new Set(ctx.recording.trials.condition.filter((c) => c !== '' && c !== p.condition))].sort();
    others.forEach((c, i) => {
      const cp = rampPlan(ctx.recording, p, c, plan.template ?? undefined);
      if (cp.nTrials === 0 || cp.centresS.length !== plan.centresS.length) return;
      const kc = rampCounts(st, cp);
      const rc = rampUnit(kc.counts, cp.nTrials, cp.centresS, cp.binS, Infinity, p.exactMaxN, kc.exposureS);
      data.push({
        type: 'scatter',
        mode: 'lines',
        name: `condition ${c} (${cp.nTrials} trials)`,
        x,
        y: Array.from(rc.meanRate),
        line: { color: GROUP_COLORS[(i + 1) % GROUP_COLORS.length], width: 1.5, dash: 'dot' },
      });
    });
    return {
      data,
      layout: {
        ...BASE_LAYOUT,
        title: { text: `Unit ${ctx.recording.units[unitIndex].id}: ramp before "${p.event}": ${verdict || 'not classified'}` },
        xaxis: {
          title: { text: plan.mode === 'warped' ? `time from ${p.event} (s, warped from ${p.anchorEvent})` : `time from ${p.event} (s)` },
          zeroline: false,
        },
        yaxis: { title: { text: 'rate (Hz)' }, rangemode: 'tozero' },
      },
    };
  },
};
