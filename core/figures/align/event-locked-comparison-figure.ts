import type { EventLockedTrace } from '../../kernels/event-locked-trace';
import { BASE_LAYOUT, OKABE_ITO, type FigureSpec } from '../theme';

/**
 * Event-locked averages of the measured and the predicted trace side by side
 * (two panels sharing the time axis), each with a +-1 SEM band, so their
 * shapes can be compared around the same event. Plain Plotly JSON.
 */
export function eventLockedComparisonFigure(p: {
  readonly event: string;
  readonly measured: EventLockedTrace;
  readonly predicted: EventLockedTrace;
  readonly measuredUnit: string;
  readonly predictedUnit: string;
  readonly kernelName: string;
}): FigureSpec {
  const panel = (e: EventLockedTrace, name: string, color: string, xaxis: string, yaxis: string) => {
    const x = Array.from(e.offsetS);
    return [
      { type: 'scatter', mode: 'lines', x, y: Array.from(e.mean, (v, i) => v + e.sem[i]), line: { width: 0, color }, showlegend: false, hoverinfo: 'skip', xaxis, yaxis },
      { type: 'scatter', mode: 'lines', x, y: Array.from(e.mean, (v, i) => v - e.sem[i]), line: { width: 0, color }, fill: 'tonexty', fillcolor: `${color}33`, showlegend: false, hoverinfo: 'skip', xaxis, yaxis },
      { type: 'scatter', mode: 'lines', name: `${name} (n = ${e.rows})`, x, y: Array.from(e.mean), line: { color, width: 2 }, xaxis, yaxis },
    ];
  };
  return {
    data: [
      ...panel(p.measured, 'measured', OKABE_ITO.black, 'x', 'y'),
      ...panel(p.predicted, `predicted, ${p.kernelName}`, OKABE_ITO.vermillion, 'x2', 'y2'),
    ],
    layout: {
      ...BASE_LAYOUT,
      title: { text: `Aligned on ${p.event}: measured vs predicted` },
      xaxis: { domain: [0, 0.47], title: { text: `Time from ${p.event} (s)` } },
      xaxis2: { domain: [0.53, 1], title: { text: `Time from ${p.event} (s)` }, matches: 'x' },
      yaxis: { title: { text: `measured (${p.measuredUnit})` }, anchor: 'x' },
      yaxis2: { title: { text: `predicted (${p.predictedUnit})` }, anchor: 'x2' },
      shapes: [
        { type: 'line', xref: 'x', yref: 'paper', x0: 0, x1: 0, y0: 0, y1: 1, line: { color: '#555', width: 1, dash: 'dot' } },
        { type: 'line', xref: 'x2', yref: 'paper', x0: 0, x1: 0, y0: 0, y1: 1, line: { color: '#555', width: 1, dash: 'dot' } },
      ],
    },
  };
}
