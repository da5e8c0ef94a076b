import { autocorrelogram } from '../../quality/autocorrelogram';
import { BASE_LAYOUT, OKABE_ITO } from '../theme';
import type { UnitFigure } from '../types';

/**
 * Autocorrelogram of a unit, both sides (it is symmetric), bins of
 * quality.acgBinMs up to +-quality.acgWindowMs, counts of spike pairs. The
 * refractory period is shaded so violations stand out.
 */
export const autocorrelogramFigure: UnitFigure = {
  id: 'quality-autocorrelogram',
  title: 'Autocorrelogram',
  build({ recording, parameters }, i) {
    const q = parameters.quality;
    const binS = q.acgBinMs / 1000;
    const counts = autocorrelogram(recording.units[i].spikeTimes, binS, q.acgWindowMs / 1000);
    const nb = counts.length;
    if (nb === 0) return null;
    const x: number[] = [];
    const y: number[] = [];
    for (let k = nb - 1; k >= 0; k--) {
      x.push(-(k + 0.5) * q.acgBinMs);
      y.push(counts[k]);
    }
    for (let k = 0; k < nb; k++) {
      x.push((k + 0.5) * q.acgBinMs);
      y.push(counts[k]);
    }
    return {
      data: [{ type: 'bar', x, y, marker: { color: OKABE_ITO.blue }, width: q.acgBinMs, name: 'spike pairs', hovertemplate: 'lag %{x} ms: %{y} pairs<extra></extra>' }],
      layout: {
        ...BASE_LAYOUT,
        title: { text: `Autocorrelogram, unit ${recording.units[i].id}` },
        showlegend: false,
        bargap: 0,
        xaxis: { title: { text: 'Lag (ms)' }, zeroline: false },
        yaxis: { title: { text: `Spike pairs per ${q.acgBinMs} ms` }, rangemode: 'tozero' },
        shapes: [
          {
            type: 'rect', xref: 'x', yref: 'paper', x0: -q.refractoryMs, x1: q.refractoryMs, y0: 0, y1: 1,
            fillcolor: OKABE_ITO.vermillion, opacity: 0.15, line: { width: 0 },
          },
        ],
        annotations: [{ xref: 'x', yref: 'paper', x: q.refractoryMs, y: 1, xanchor: 'left', yanchor: 'top', showarrow: false, text: `refractory ${q.refractoryMs} ms` }],
      },
    };
  },
};
