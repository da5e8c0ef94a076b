import { lightResponse } from '../../light/light-response';
import { lightSchedule } from '../../light/light-schedule';
import { BASE_LAYOUT, GROUP_COLORS, type FigureSpec } from '../theme';
import type { UnitFigure } from '../types';

/**
 * Frequency following: reliability (top) and mean first-spike latency
 * (bottom) by pulse index in the train, one line per train frequency (single
 * pulses as one point at index 1). A light-gated channel's answer fades and
 * slows with rate; indirect answers fade faster. null without pulses.
 */
export const lightFollowingFigure: UnitFigure = {
  id: 'light-following',
  title: 'Light response: frequency following',
  build(ctx, unitIndex): FigureSpec | null {
    if (ctx.recording.pulses.onset.length === 0) return null;
    const p = ctx.parameters.light;
    const sch = lightSchedule(ctx.recording.pulses, ctx.recording.span, p);
    const r = lightResponse(ctx.recording.units[unitIndex].spikeTimes, sch, p, true);
    const data: Record<string, unknown>[] = [];
    for (let f = 0; f < sch.frequencyKeys.length; f++) {
      let maxIdx = 0;
      for (let i = 0; i < sch.n; i++) if (sch.frequencyIndex[i] === f) maxIdx = Math.max(maxIdx, sch.indexInTrain[i]);
      const single = sch.frequencyKeys[f] === 'single';
      const size = single ? 1 : maxIdx + 1;
      const pulses = new Array(size).fill(0);
      const answered = new Array(size).fill(0);
      const sum = new Array(size).fill(0);
      for (let i = 0; i < sch.n; i++) {
        if (sch.frequencyIndex[i] !== f) continue;
        const k = single ? 0 : sch.indexInTrain[i];
        pulses[k]++;
        const l = r.latencyS![i];
        if (l === l) {
          answered[k]++;
          sum[k] += l * 1000;
        }
      }
      const x = pulses.map((_, k) => k + 1);
      const name = single ? 'single pulses' : sch.frequencyKeys[f].replace('p', '.').replace('hz', ' Hz');
      const color = GROUP_COLORS[f % GROUP_COLORS.length];
      const rel = pulses.map((n, k) => (n > 0 ? answered[k] / n : null));
      const lat = answered.map((a, k) => (a > 0 ? sum[k] / a : null));
      data.push({ type: 'scatter', mode: 'lines+markers', name, legendgroup: name, x, y: rel, line: { color }, xaxis: 'x', yaxis: 'y' });
      data.push({ type: 'scatter', mode: 'lines+markers', name, legendgroup: name, showlegend: false, x, y: lat, line: { color, dash: 'dot' }, xaxis: 'x', yaxis: 'y2' });
    }
    return {
      data,
      layout: {
        ...BASE_LAYOUT,
        title: { text: `Unit ${ctx.recording.units[unitIndex].id}: following by pulse in train` },
        grid: { rows: 2, columns: 1, pattern: 'independent' },
        xaxis: { title: { text: 'pulse in train' }, dtick: 1 },
        yaxis: { title: { text: 'reliability' }, range: [0, 1.05], domain: [0.55, 1] },
        yaxis2: { title: { text: 'latency (ms)' }, domain: [0, 0.45], anchor: 'x' },
      },
    };
  },
};
