import { waveformShape } from '../../quality/waveform-shape';
import { BASE_LAYOUT, OKABE_ITO } from '../theme';
import type { UnitFigure } from '../types';

/** Mean waveform of a unit (when the inputs have one) with its trough-to-peak and half-width. */
export const waveformFigure: UnitFigure = {
  id: 'quality-waveform',
  title: 'Mean waveform',
  build({ recording }, i) {
    const u = recording.units[i];
    const w = u.waveformMean;
    const sr = recording.waveformSampleRateHz;
    if (!w || w.length < 3 || !(sr > 0)) return null;
    const s = waveformShape(w, sr);
    const f = (x: number) => (Number.isFinite(x) ? `${x.toFixed(3)} ms` : 'n/a');
    return {
      data: [{ type: 'scatter', mode: 'lines', x: Array.from({ length: w.length }, (_, k) => (k * 1000) / sr), y: Array.from(w), name: 'mean waveform', line: { color: OKABE_ITO.black, width: 2 } }],
      layout: {
        ...BASE_LAYOUT,
        showlegend: false,
        title: { text: `Mean waveform, unit ${u.id}<br><sup>trough-to-peak ${f(s.troughToPeakMs)}, half-width ${f(s.halfWidthMs)}</sup>` },
        xaxis: { title: { text: 'Time (ms)' } },
        yaxis: { title: { text: 'Amplitude (µV)' } },
      },
    };
  },
};
