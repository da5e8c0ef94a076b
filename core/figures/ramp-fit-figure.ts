import { binCounts } from '../align/bin-counts';
import { rampUnit } from '../classify/ramp-unit';
import { selectEvents } from '../classify/select-events';
import { BASE_LAYOUT, GROUP_COLORS, VERDICT_STYLE, type FigureSpec } from './theme';
import type { FigureContext, UnitFigure } from './types';

/**
 * "Ramp before reward": the trial-averaged binned rate (mean +- SEM across
 * trials) over the ramp window of the reference condition, the least-squares
 * line through it (coloured by the verdict, labelled with it), and the
 * trial-averaged rate of every other condition as thin lines. Null when the
 * session has no ramp events. Recomputes the unit's profile from the
 * recording with the same code as the ramp step (core/classify/ramp-unit.ts).
 */
export const rampFitFigure: UnitFigure = {
  id: 'ramp-fit',
  title: 'Ramp before reward',
  build(ctx: FigureContext, unitIndex: number): FigureSpec | null {
    const p = ctx.parameters.ramp;
    const sel = selectEvents(ctx.recording, p.event, p.condition);
    if (sel.times.length === 0) return null;
    const nBins = Math.max(1, Math.round((p.windowEndS - p.windowStartS) / p.binS));
    const centres = Float64Array.from({ length: nBins }, (_, j) => p.windowStartS + (j + 0.5) * p.binS);
    const st = ctx.recording.units[unitIndex].spikeTimes;
    const r = rampUnit(binCounts(st, sel.times, p.windowStartS, p.binS, nBins), sel.times.length, centres, p.binS, p.minTrials, p.exactMaxN);
    const col = (name: string) => ctx.table.columns.find((c) => c.name === name);
    const verdictCol = col('ramp');
    const verdict = verdictCol && verdictCol.kind === 'string' ? verdictCol.values[unitIndex] : '';
    const qCol = col('ramp_q');
    const q = qCol && qCol.kind === 'number' ? qCol.values[unitIndex] : NaN;
    const style = VERDICT_STYLE[verdict] ?? VERDICT_STYLE.flat;
    const x = Array.from(centres);
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
      const s = selectEvents(ctx.recording, p.event, c);
      if (s.times.length === 0) return;
      const rc = rampUnit(binCounts(st, s.times, p.windowStartS, p.binS, nBins), s.times.length, centres, p.binS, Infinity);
      data.push({
        type: 'scatter',
        mode: 'lines',
        name: `condition ${c} (${s.times.length} trials)`,
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
        xaxis: { title: { text: `time from ${p.event} (s)` }, zeroline: false },
        yaxis: { title: { text: 'rate (Hz)' }, rangemode: 'tozero' },
      },
    };
  },
};
