import type { Recording } from '../model/types';
import { BASE_LAYOUT, GROUP_COLORS, OKABE_ITO, type FigureSpec } from './theme';

/**
 * Timeline of a session: trials as bars on one row per condition, each event
 * label on its own row of ticks, and the laser pulses on a row of their own,
 * over the recording span. Pure: Recording in, Plotly JSON out. Rows with
 * nothing to show are left out; an empty session gives the span alone.
 */
export function sessionTimelineFigure(recording: Recording): FigureSpec {
  const data: Record<string, unknown>[] = [];
  const rows: string[] = [];
  const { trials, events, pulses } = recording;

  const conditions = [...new Set(trials.condition.map((c) => c || '(none)'))];
  conditions.forEach((cond, ci) => {
    const x: (number | null)[] = [];
    const y: (string | null)[] = [];
    for (let i = 0; i < trials.trial.length; i++) {
      if ((trials.condition[i] || '(none)') !== cond) continue;
      x.push(trials.start[i], trials.stop[i], null);
      y.push(`trials: ${cond}`, `trials: ${cond}`, null);
    }
    rows.push(`trials: ${cond}`);
    data.push({ type: 'scatter', mode: 'lines', x, y, name: `trials (${cond})`, line: { width: 10, color: GROUP_COLORS[ci % GROUP_COLORS.length] }, hoverinfo: 'x+name' });
  });

  const labels = [...new Set(events.label)];
  for (const label of labels) {
    const x: number[] = [];
    for (let i = 0; i < events.time.length; i++) if (events.label[i] === label) x.push(events.time[i]);
    rows.push(`event: ${label}`);
    data.push({
      type: 'scatter',
      mode: 'markers',
      x,
      y: x.map(() => `event: ${label}`),
      name: label,
      marker: { symbol: 'line-ns-open', size: 12, color: '#444', line: { width: 1 } },
      hoverinfo: 'x+name',
    });
  }

  if (pulses.onset.length > 0) {
    rows.push('laser pulses');
    data.push({
      type: 'scatter',
      mode: 'markers',
      x: Array.from(pulses.onset),
      y: Array.from(pulses.onset, () => 'laser pulses'),
      name: `laser pulses (${pulses.onset.length})`,
      marker: { symbol: 'line-ns-open', size: 12, color: OKABE_ITO.skyBlue, line: { width: 1, color: OKABE_ITO.blue } },
      hoverinfo: 'x+name',
    });
  }

  const [t0, t1] = recording.span;
  return {
    data,
    layout: {
      ...BASE_LAYOUT,
      title: { text: 'Session timeline', font: { size: 13 } },
      height: Math.max(180, 70 + 34 * rows.length),
      showlegend: false,
      margin: { ...BASE_LAYOUT.margin, l: 140 },
      xaxis: { title: { text: 'Time (s)' }, range: [t0, t1], zeroline: false },
      yaxis: { type: 'category', categoryorder: 'array', categoryarray: [...rows].reverse(), automargin: true },
    },
  };
}
