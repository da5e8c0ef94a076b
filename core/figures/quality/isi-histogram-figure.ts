import { BASE_LAYOUT, OKABE_ITO } from '../theme';
import type { UnitFigure } from '../types';
import { isiHistogram } from './isi-histogram';

/** ISI histogram of a unit, 0-100 ms in 1 ms bins, refractory period marked. */
export const isiHistogramFigure: UnitFigure = {
  id: 'quality-isi-histogram',
  title: 'ISI histogram',
  build({ recording, parameters }, i) {
    const u = recording.units[i];
    if (u.spikeTimes.length < 2) return null;
    const q = parameters.quality;
    const binMs = 1;
    const nBins = 100;
    const { counts, beyond } = isiHistogram(u.spikeTimes, binMs / 1000, nBins);
    return {
      data: [
        {
          type: 'bar',
          x: Array.from({ length: nBins }, (_, k) => (k + 0.5) * binMs),
          y: Array.from(counts),
          width: binMs,
          marker: { color: OKABE_ITO.blue },
          name: 'ISIs',
          hovertemplate: '%{x} ms: %{y} ISIs<extra></extra>',
        },
      ],
      layout: {
        ...BASE_LAYOUT,
        title: { text: `ISI histogram, unit ${u.id}<br><sup>${beyond} of ${u.spikeTimes.length - 1} ISIs are longer than ${nBins * binMs} ms (not shown)</sup>` },
        showlegend: false,
        bargap: 0,
        xaxis: { title: { text: 'Inter-spike interval (ms)' }, range: [0, nBins * binMs] },
        yaxis: { title: { text: `ISIs per ${binMs} ms` }, rangemode: 'tozero' },
        shapes: [{ type: 'line', xref: 'x', yref: 'paper', x0: q.refractoryMs, x1: q.refractoryMs, y0: 0, y1: 1, line: { color: OKABE_ITO.vermillion, dash: 'dash', width: 1.5 } }],
        annotations: [{ xref: 'x', yref: 'paper', x: q.refractoryMs, y: 1, xanchor: 'left', yanchor: 'top', showarrow: false, text: `refractory ${q.refractoryMs} ms` }],
      },
    };
  },
};
