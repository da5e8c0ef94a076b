/**
 * Shape of a mean spike waveform: trough-to-peak duration and half-width.
 *
 * - Baseline: median of the first fifth of the samples (at least one sample),
 *   subtracted first.
 * - Polarity: if the largest excursion from baseline is positive, the
 *   waveform is flipped so the main phase is a trough (as for spikes recorded
 *   with inverted polarity).
 * - Trough: the minimum sample. Peak: the maximum sample after the trough.
 *   Trough-to-peak = (peak index - trough index) / sample rate.
 * - Half-width: width of the trough at half its depth, the two crossings
 *   found by linear interpolation between samples.
 *
 * These definitions are common practice (e.g. narrow vs wide spikes split near
 * 0.4-0.5 ms trough-to-peak, from memory). Units: samples at sampleRateHz in,
 * ms out. NaN when the waveform has fewer than 3 samples, the rate is not
 * positive and finite, the waveform is flat, the trough is the last sample
 * (no peak after it), or a half-depth crossing lies outside the waveform.
 */
export interface WaveformShape {
  readonly troughToPeakMs: number;
  readonly halfWidthMs: number;
}

export function waveformShape(waveform: ArrayLike<number>, sampleRateHz: number): WaveformShape {
  const none = { troughToPeakMs: NaN, halfWidthMs: NaN };
  const n = waveform.length;
  if (n < 3 || !(sampleRateHz > 0) || !Number.isFinite(sampleRateHz)) return none;
  const head = Array.from({ length: Math.max(1, Math.floor(n / 5)) }, (_, i) => waveform[i]).sort((a, b) => a - b);
  const m = head.length;
  const base = m % 2 ? head[(m - 1) / 2] : (head[m / 2 - 1] + head[m / 2]) / 2;
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = waveform[i] - base;
    if (!Number.isFinite(v)) return none;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  if (lo === 0 && hi === 0) return none;
  const sign = hi > -lo ? -1 : 1;
  const w = Float64Array.from({ length: n }, (_, i) => sign * (waveform[i] - base));
  let trough = 0;
  for (let i = 1; i < n; i++) if (w[i] < w[trough]) trough = i;
  let peak = -1;
  for (let i = trough + 1; i < n; i++) if (peak < 0 || w[i] > w[peak]) peak = i;
  const msPerSample = 1000 / sampleRateHz;
  const troughToPeakMs = peak > trough ? (peak - trough) * msPerSample : NaN;
  const half = w[trough] / 2;
  let left = NaN;
  for (let i = trough; i > 0; i--) {
    if (w[i - 1] >= half) {
      left = i - 1 + (half - w[i - 1]) / (w[i] - w[i - 1]);
      break;
    }
  }
  let right = NaN;
  for (let i = trough; i < n - 1; i++) {
    if (w[i + 1] >= half) {
      right = i + (half - w[i]) / (w[i + 1] - w[i]);
      break;
    }
  }
  return { troughToPeakMs, halfWidthMs: (right - left) * msPerSample };
}
