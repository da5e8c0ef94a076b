import { lowerBound } from '../../align/lower-bound';
import { formatNumber } from '../../table/format-number';
import { lightSchedule } from '../../light/light-schedule';
import { BASE_LAYOUT, OKABE_ITO, type FigureSpec } from '../theme';
import type { UnitFigure } from '../types';

/** Time shown around each pulse, ms. */
const BEFORE_MS = 20;
const AFTER_MS = 40;

/**
 * Raster aligned on pulse onsets: one row per pulse (grouped by train
 * frequency, single pulses first, then in time order), spikes from -20 to
 * +40 ms; the test window and the light (median pulse duration) are shaded.
 * Pure: spikes and pulses in, Plotly JSON out. null when there are no pulses.
 */
export const lightRasterFigure: UnitFigure = {
  id: 'light-raster',
  title: 'Light response: raster aligned on pulses',
  build(ctx, unitIndex): FigureSpec | null {
    const pulses = ctx.recording.pulses;
    if (pulses.onset.length === 0) return null;
    const p = ctx.parameters.light;
    const sch = lightSchedule(pulses, ctx.recording.span, p);
    const spikes = ctx.recording.units[unitIndex].spikeTimes;
    const order = Array.from({ length: sch.n }, (_, i) => i).sort((a, b) => sch.frequencyIndex[a] - sch.frequencyIndex[b] || a - b);
    const data: Record<string, unknown>[] = [];
    const colors = [OKABE_ITO.black, OKABE_ITO.blue, OKABE_ITO.vermillion, OKABE_ITO.bluishGreen, OKABE_ITO.reddishPurple, OKABE_ITO.orange];
    let row = 0;
    for (let f = 0; f < sch.frequencyKeys.length; f++) {
      const x: number[] = [];
      const y: number[] = [];
      for (const i of order) {
        if (sch.frequencyIndex[i] !== f) continue;
        const o = sch.onset[i];
        for (let j = lowerBound(spikes, o - BEFORE_MS / 1000); j < spikes.length && spikes[j] < o + AFTER_MS / 1000; j++) {
          x.push(Math.round((spikes[j] - o) * 1e6) / 1e3);
          y.push(row);
        }
        row++;
      }
      const key = sch.frequencyKeys[f];
      data.push({
        type: 'scattergl',
        mode: 'markers',
        name: key === 'single' ? 'single pulses' : key.replace('p', '.').replace('hz', ' Hz trains'),
        x,
        y,
        marker: { symbol: 'line-ns-open', size: 5, color: colors[f % colors.length] },
      });
    }
    const durations = Array.from(pulses.duration).filter((d) => Number.isFinite(d)).sort((a, b) => a - b);
    const dMs = durations.length ? durations[Math.floor(durations.length / 2)] * 1000 : NaN;
    const shapes: Record<string, unknown>[] = [
      { type: 'rect', xref: 'x', yref: 'paper', x0: p.windowStartMs, x1: p.windowEndMs, y0: 0, y1: 1, fillcolor: OKABE_ITO.skyBlue, opacity: 0.15, line: { width: 0 } },
    ];
    if (Number.isFinite(dMs)) shapes.push({ type: 'rect', xref: 'x', yref: 'paper', x0: 0, x1: dMs, y0: 1, y1: 1.03, fillcolor: OKABE_ITO.blue, line: { width: 0 } });
    return {
      data,
      layout: {
        ...BASE_LAYOUT,
        title: { text: `Unit ${ctx.recording.units[unitIndex].id}: spikes around each pulse` },
        xaxis: { title: { text: 'time from pulse onset (ms)' }, range: [-BEFORE_MS, AFTER_MS], zeroline: true },
        yaxis: { title: { text: 'pulse' }, autorange: 'reversed' },
        shapes,
        annotations: [
          // a key at the top right, clear of the pulse bar and the title
          {
            xref: 'x',
            yref: 'paper',
            x: AFTER_MS,
            xanchor: 'right',
            y: 1,
            yanchor: 'bottom',
            text: Number.isFinite(dMs) ? `bar: light pulse (${formatNumber(dMs, 3)} ms) · shaded: test window` : 'shaded: test window',
            showarrow: false,
          },
        ],
      },
    };
  },
};
