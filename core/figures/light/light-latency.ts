import { lightResponse } from '../../light/light-response';
import { lightSchedule } from '../../light/light-schedule';
import { BASE_LAYOUT, OKABE_ITO, type FigureSpec } from '../theme';
import type { UnitFigure } from '../types';

/** Histogram bin of the latency figure, ms. */
const BIN_MS = 0.25;

/**
 * First-spike latency histogram over the test window (0.25 ms bins, share of
 * pulses), with the share expected from spontaneous firing alone (baseline
 * rate, first spike of a Poisson process: density lambda exp(-lambda t))
 * drawn as a line, and the mean latency and the rule's latency limit marked.
 * null when there are no pulses.
 */
export const lightLatencyFigure: UnitFigure = {
  id: 'light-latency',
  title: 'Light response: first-spike latency',
  build(ctx, unitIndex): FigureSpec | null {
    if (ctx.recording.pulses.onset.length === 0) return null;
    const p = ctx.parameters.light;
    const sch = lightSchedule(ctx.recording.pulses, ctx.recording.span, p);
    const r = lightResponse(ctx.recording.units[unitIndex].spikeTimes, sch, p, true);
    const nb = Math.max(1, Math.round((p.windowEndMs - p.windowStartMs) / BIN_MS));
    const x: number[] = [];
    const y = new Array(nb).fill(0);
    for (let b = 0; b < nb; b++) x.push(p.windowStartMs + (b + 0.5) * BIN_MS);
    for (const l of r.latencyS!) {
      if (l !== l) continue;
      const b = Math.min(nb - 1, Math.floor((l * 1000 - p.windowStartMs) / BIN_MS));
      y[b] += 1 / sch.n;
    }
    const lam = r.baselineHz / 1000;
    const expected = x.map((t) => (lam > 0 ? lam * Math.exp(-lam * (t - p.windowStartMs)) * BIN_MS : 0));
    return {
      data: [
        { type: 'bar', name: 'first spikes (share of pulses)', x, y, marker: { color: OKABE_ITO.blue }, width: BIN_MS },
        { type: 'scatter', mode: 'lines', name: 'expected from baseline firing', x, y: expected, line: { color: OKABE_ITO.vermillion, dash: 'dash' } },
      ],
      layout: {
        ...BASE_LAYOUT,
        title: { text: `Unit ${ctx.recording.units[unitIndex].id}: first-spike latency (reliability ${r.reliability.toFixed(2)})` },
        xaxis: { title: { text: 'first-spike latency after onset (ms)' }, range: [p.windowStartMs, p.windowEndMs] },
        yaxis: { title: { text: 'share of pulses' }, rangemode: 'tozero' },
        bargap: 0,
        shapes: [
          { type: 'line', xref: 'x', yref: 'paper', x0: p.maxLatencyMs, x1: p.maxLatencyMs, y0: 0, y1: 1, line: { color: '#7f7f7f', dash: 'dot' } },
          ...(Number.isFinite(r.meanLatencyS) ? [{ type: 'line', xref: 'x', yref: 'paper', x0: r.meanLatencyS * 1000, x1: r.meanLatencyS * 1000, y0: 0, y1: 1, line: { color: OKABE_ITO.black } }] : []),
        ],
        annotations: [
          { xref: 'x', yref: 'paper', x: p.maxLatencyMs, y: 1.04, text: `latency limit ${p.maxLatencyMs} ms`, showarrow: false },
        ],
      },
    };
  },
};
