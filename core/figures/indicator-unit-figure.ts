import { eventLockedTrace } from '../kernels/event-locked-trace';
import { findKernelEntry } from '../kernels/kernel-library';
import { predictTrace } from '../kernels/predict-trace';
import type { Kernel } from '../kernels/types';
import { BASE_LAYOUT, GROUP_COLORS, type FigureSpec } from './theme';
import type { UnitFigure } from './types';

/**
 * "Indicator model" of one unit: the dF/F an indicator would report for this
 * unit's spikes (kernel parameters.align.kernel from the kernel library,
 * sampled at parameters.align.predictRateHz), averaged around
 * parameters.align.event by trial condition, +-1 SEM, over the event window
 * [windowStartS, windowStopS). The whole session is predicted once (exact
 * recursive filter, core/kernels/predict-trace) and cut around each event, as
 * a measured photometry trace would be. Without a published single-spike
 * amplitude the y axis is in single-spike peaks. null when the kernel is
 * unknown or the event never occurs.
 */
export const indicatorUnitFigure: UnitFigure = {
  id: 'indicator-trace',
  title: 'Predicted indicator trace',
  build({ recording, parameters }, unitIndex) {
    const a = parameters.align;
    const entry = findKernelEntry(a.kernel);
    const unit = recording.units[unitIndex];
    if (!entry || !unit || !(a.predictRateHz > 0)) return null;
    const idx: number[] = [];
    for (let i = 0; i < recording.events.time.length; i++) if (recording.events.label[i] === a.event) idx.push(i);
    if (idx.length === 0) return null;
    const kernel: Kernel = { kind: 'double-exponential', tauRiseS: entry.tauRiseS, tauDecayS: entry.tauDecayS, peakDff: entry.peakDff ?? 1 };
    const [t0, t1] = recording.span;
    const grid = { startS: t0, rateHz: a.predictRateHz, length: Math.max(1, Math.ceil((t1 - t0) * a.predictRateHz)) };
    const trace = predictTrace(unit.spikeTimes, kernel, grid);
    const condOf = new Map<number, string>();
    for (let i = 0; i < recording.trials.trial.length; i++) condOf.set(recording.trials.trial[i], recording.trials.condition[i]);
    const groups = new Map<string, number[]>();
    for (const i of idx) {
      const g = a.groupBy === 'condition' ? condOf.get(recording.events.trial[i]) || '(none)' : a.groupBy === 'kind' ? recording.events.kind[i] || '(none)' : 'all events';
      if (!groups.has(g)) groups.set(g, []);
      groups.get(g)!.push(recording.events.time[i]);
    }
    const yUnit = entry.peakDff === null ? 'single-spike peaks' : 'dF/F';
    const data: Record<string, unknown>[] = [];
    let gi = 0;
    for (const [name, times] of groups) {
      const color = GROUP_COLORS[gi++ % GROUP_COLORS.length];
      const e = eventLockedTrace(trace, t0, a.predictRateHz, times, a.windowStartS, a.windowStopS);
      const x = Array.from(e.offsetS, r6);
      data.push(
        { type: 'scatter', mode: 'lines', x, y: Array.from(e.mean, (v, i) => r6(v + e.sem[i])), line: { width: 0, color }, showlegend: false, hoverinfo: 'skip' },
        { type: 'scatter', mode: 'lines', x, y: Array.from(e.mean, (v, i) => r6(v - e.sem[i])), line: { width: 0, color }, fill: 'tonexty', fillcolor: `${color}33`, showlegend: false, hoverinfo: 'skip' },
        { type: 'scatter', mode: 'lines', name: `${name} (n = ${e.rows})`, x, y: Array.from(e.mean, r6), line: { color, width: 2 } },
      );
    }
    const spec: FigureSpec = {
      data,
      layout: {
        ...BASE_LAYOUT,
        title: { text: `Unit ${unit.id}: predicted ${entry.name} around "${a.event}" (mean +- SEM)`, font: { size: 13 } },
        height: 320,
        xaxis: { title: { text: `Time from ${a.event} (s)` }, zeroline: true, zerolinecolor: '#999' },
        yaxis: { title: { text: `Predicted ${yUnit}` } },
      },
    };
    return spec;
  },
};

function r6(x: number): number {
  return Number.isFinite(x) ? Math.round(x * 1e6) / 1e6 : NaN;
}
