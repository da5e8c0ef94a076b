import type { WaveformSpec } from './types';

/**
 * A plausible mean extracellular spike waveform on the peak channel,
 * microvolts, `samples` long at `sampleRateHz`, trough at 1/3 of the window.
 * Built from Gaussian bumps (our own parametrisation; shapes follow the
 * common textbook picture of somatic extracellular spikes):
 * - wide: trough (SD 0.15 ms) then a broad positive peak (SD 0.35 ms,
 *   35 % of the trough) `troughToPeakMs` later (slow, regular cells);
 * - narrow: sharper trough (SD 0.08 ms) and peak (SD 0.15 ms, 50 %);
 * - triphasic: a small early positive bump (20 %) 0.25 ms before the trough,
 *   then as `wide`;
 * - positive: `wide` inverted (the main deflection is positive).
 */
export function waveformShape(spec: WaveformSpec, samples: number, sampleRateHz: number): Float64Array {
  const out = new Float64Array(samples);
  const t0 = samples / 3 / sampleRateHz * 1000; // ms
  const a = spec.amplitudeUv;
  const ttp = spec.troughToPeakMs;
  const g = (t: number, mu: number, sd: number) => Math.exp(-((t - mu) ** 2) / (2 * sd * sd));
  for (let i = 0; i < samples; i++) {
    const t = (i / sampleRateHz) * 1000;
    let v: number;
    switch (spec.kind) {
      case 'narrow':
        v = -a * g(t, t0, 0.08) + 0.5 * a * g(t, t0 + ttp, 0.15);
        break;
      case 'triphasic':
        v = 0.2 * a * g(t, t0 - 0.25, 0.08) - a * g(t, t0, 0.15) + 0.35 * a * g(t, t0 + ttp, 0.35);
        break;
      case 'positive':
        v = a * g(t, t0, 0.15) - 0.35 * a * g(t, t0 + ttp, 0.35);
        break;
      default:
        v = -a * g(t, t0, 0.15) + 0.35 * a * g(t, t0 + ttp, 0.35);
    }
    out[i] = v;
  }
  return out;
}
