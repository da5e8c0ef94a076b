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
    // Two panels on one pulse axis: reliability on top, latency below; the
    // shared x axis sits under the lower panel, the legend above the plot, and
    // the axis titles make their own room (automargin), so nothing overlaps at
    // laptop size (460 px tall on screen: core/figures/draw/figure-height.ts).
    return {
      data,
      layout: {
        ...BASE_LAYOUT,
        height: 460,
        margin: { l: 64, r: 16, t: 64, b: 48 },
        title: { text: `Unit ${ctx.recording.units[unitIndex].id}: following by pulse in train`, y: 0.98, yanchor: 'top' },
        legend: { orientation: 'h', x: 0, xanchor: 'left', y: 1.02, yanchor: 'bottom' },
        xaxis: { title: { text: 'pulse in train' }, dtick: 1, anchor: 'y2', automargin: true },
        yaxis: { title: { text: 'reliability' }, range: [0, 1.05], domain: [0.56, 1], tickformat: '.1f', nticks: 4, automargin: true },
        yaxis2: { title: { text: 'latency (ms)' }, domain: [0, 0.44], anchor: 'x', rangemode: 'tozero', nticks: 4, automargin: true },
      },
    };
  },
};
