/**
 * Mean shape of a photoelectric light artefact as a spike sorter would cut
 * it, microvolts, `samples` long at `sampleRateHz`, aligned like
 * waveformShape (event at 1/3 of the window): a fast positive step
 * (rise time constant 0.05 ms) that relaxes slowly (decay 1.5 ms). Nothing
 * like a somatic spike, so the light-evoked vs spontaneous waveform
 * correlation of an artefact is low. Shape: our own, after the general
 * description of electrode photoelectric (Becquerel) artefacts.
 */
export function artefactWaveform(amplitudeUv: number, samples: number, sampleRateHz: number): Float64Array {
  const out = new Float64Array(samples);
  const t0 = samples / 3 / sampleRateHz * 1000;
  for (let i = 0; i < samples; i++) {
    const t = (i / sampleRateHz) * 1000 - t0;
    out[i] = t <= 0 ? 0 : amplitudeUv * (1 - Math.exp(-t / 0.05)) * Math.exp(-t / 1.5);
  }
  return out;
}
