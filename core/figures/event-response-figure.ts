import { binCounts } from '../align/bin-counts';
import { lowerBound } from '../align/lower-bound';
import type { Events, Trials } from '../model/types';
import { gaussianSmooth } from './gaussian-smooth';
import { BASE_LAYOUT, GROUP_COLORS, type FigureSpec } from './theme';

/** Display options of the event response (raster + PSTH). */
export interface EventResponseOptions {
  /** Event label to align on, e.g. "reward". */
  readonly event: string;
  /** Window around each event, s (start < end). */
  readonly windowStartS: number;
  readonly windowEndS: number;
  /** PSTH bin, ms. */
  readonly binMs: number;
  /** Gaussian smoothing sd, ms (0 = none). */
  readonly smoothMs: number;
  /** Split trials by the trial table's condition, by the event's kind, or not at all. */
  readonly groupBy: 'condition' | 'kind' | 'none';
}

export const DEFAULT_EVENT_RESPONSE: EventResponseOptions = {
  event: 'reward',
  windowStartS: -3,
  windowEndS: 1,
  binMs: 50,
  smoothMs: 75,
  groupBy: 'condition',
};

/** Most raster ticks drawn (later events are left out of the raster, never of the PSTH). */
export const MAX_RASTER_TICKS = 20000;

/**
 * Event response of one unit: raster (one row per event, grouped) above the
 * PSTH (spikes/s per group, mean over the group's events, optionally smoothed
 * with a Gaussian). Pure: spike times and tables in, Plotly JSON out.
 * Returns null when the event label never occurs or the window is empty.
 * Edge cases: events without a trial (or trials without a condition) fall in
 * the group "(none)"; groups are ordered by first appearance.
 */
export function eventResponseFigure(
  spikeTimes: Float64Array,
  events: Events,
  trials: Trials,
  opts: EventResponseOptions,
  unitLabel: string,
): FigureSpec | null {
  const { windowStartS: w0, windowEndS: w1 } = opts;
  if (!(w1 > w0) || !(opts.binMs > 0)) return null;
  const idx: number[] = [];
  for (let i = 0; i < events.time.length; i++) if (events.label[i] === opts.event) idx.push(i);
  if (idx.length === 0) return null;

  const conditionOfTrial = new Map<number, string>();
  for (let i = 0; i < trials.trial.length; i++) conditionOfTrial.set(trials.trial[i], trials.condition[i]);
  const groupOf = (i: number): string => {
    if (opts.groupBy === 'kind') return events.kind[i] || '(none)';
    if (opts.groupBy === 'condition') return conditionOfTrial.get(events.trial[i]) || '(none)';
    return 'all events';
  };
  const groups = new Map<string, number[]>();
  for (const i of idx) {
    const g = groupOf(i);
    if (!groups.has(g)) groups.set(g, []);
    groups.get(g)!.push(events.time[i]);
  }

  const binS = opts.binMs / 1000;
  const nBins = Math.max(1, Math.round((w1 - w0) / binS));
  const centres = Array.from({ length: nBins }, (_, j) => w0 + (j + 0.5) * binS);
  const data: Record<string, unknown>[] = [];
  let row = 0;
  let ticks = 0;
  let gi = 0;
  for (const [name, times] of groups) {
    const color = GROUP_COLORS[gi++ % GROUP_COLORS.length];
    const rx: (number | null)[] = [];
    const ry: (number | null)[] = [];
    for (const a of times) {
      row++;
      const end = a + w1;
      for (let k = lowerBound(spikeTimes, a + w0); k < spikeTimes.length && spikeTimes[k] < end; k++) {
        if (ticks >= MAX_RASTER_TICKS) break;
        rx.push(round6(spikeTimes[k] - a));
        ry.push(row);
        ticks++;
      }
    }
    data.push({
      type: 'scatter',
      mode: 'markers',
      x: rx,
      y: ry,
      name,
      legendgroup: name,
      showlegend: false,
      marker: { symbol: 'line-ns-open', size: 5, color, line: { width: 1, color } },
      xaxis: 'x',
      yaxis: 'y2',
      hoverinfo: 'skip',
    });
    const counts = binCounts(spikeTimes, Float64Array.from(times), w0, binS, nBins);
    const rate = new Float64Array(nBins);
    for (let e = 0; e < times.length; e++) for (let j = 0; j < nBins; j++) rate[j] += counts[e * nBins + j];
    for (let j = 0; j < nBins; j++) rate[j] /= times.length * binS;
    const smooth = gaussianSmooth(rate, opts.smoothMs / opts.binMs);
    data.push({
      type: 'scatter',
      mode: 'lines',
      x: centres.map(round6),
      y: Array.from(smooth, round6),
      name: `${name} (n = ${times.length})`,
      legendgroup: name,
      line: { color, width: 2, shape: opts.smoothMs > 0 ? 'linear' : 'hvh' },
      xaxis: 'x',
      yaxis: 'y',
    });
  }
  return {
    data,
    layout: {
      ...BASE_LAYOUT,
      title: { text: `Unit ${unitLabel}: response to "${opts.event}"`, font: { size: 13 } },
      height: 420,
      xaxis: { title: { text: `Time from ${opts.event} (s)` }, range: [w0, w1], zeroline: true, zerolinecolor: '#999' },
      yaxis: { title: { text: 'Rate (spikes/s)' }, domain: [0, 0.45], rangemode: 'tozero' },
      yaxis2: { title: { text: 'Event' }, domain: [0.52, 1], autorange: 'reversed', showgrid: false, zeroline: false },
      shapes: [{ type: 'line', x0: 0, x1: 0, yref: 'paper', y0: 0, y1: 1, line: { color: '#777', width: 1, dash: 'dot' } }],
    },
  };
}

function round6(x: number): number {
  return Math.round(x * 1e6) / 1e6;
}
