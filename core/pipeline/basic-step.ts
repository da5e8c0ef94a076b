import type { AnalysisStep } from './types';

/**
 * unit, n_spikes, rate_hz. rate_hz = spikes inside the recording span divided
 * by the span's length (DESIGN.md section 4), so it is comparable across
 * units however early a unit's first spike falls.
 */
export const basicStep: AnalysisStep = {
  name: 'basic',
  selfContained: true,
  run({ recording }) {
    const n = recording.units.length;
    const nSpikes = new Float64Array(n);
    const rate = new Float64Array(n);
    const [t0, t1] = recording.span;
    const len = t1 - t0;
    recording.units.forEach((u, i) => {
      nSpikes[i] = u.spikeTimes.length;
      rate[i] = len > 0 ? u.spikeTimes.length / len : NaN;
    });
    return {
      columns: [
        { name: 'unit', kind: 'string', values: recording.units.map((u) => u.id), description: 'Unit id as given by the spike sorter' },
        { name: 'n_spikes', kind: 'number', values: nSpikes, description: 'Number of spikes' },
        { name: 'rate_hz', kind: 'number', values: rate, digits: 5, description: 'Mean firing rate over the recording span, Hz' },
      ],
      summary: { units: n, spanS: [t0, t1] },
    };
  },
};
