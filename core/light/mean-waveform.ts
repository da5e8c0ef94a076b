import type { RawSource } from '../model/types';

/** Mean waveform of a set of spikes on every channel of a raw recording. */
export interface MeanWaveform {
  /** Frames per snippet (pre + post + 1) and channels. */
  readonly frames: number;
  readonly channels: number;
  /** Mean voltage, microvolts, row-major frames x channels (interleaved like the file). */
  readonly mean: Float64Array;
  /** Snippets averaged (snippets running off the file's ends are skipped). */
  readonly count: number;
}

/**
 * Cuts a snippet around each spike time from a raw interleaved int16 source
 * and averages them: frames [f - preFrames, f + postFrames] with
 * f = round((t - startS) x sampleRate). Each snippet is read by offset
 * (readFrames), never the whole file; each snippet's per-channel mean is
 * subtracted first (removes slow offsets; common practice on high-pass
 * filtered data), then samples are scaled by gainUvPerBit.
 *
 * Edge cases: no spike times or no full snippet -> count 0 and a mean of NaN.
 */
export function meanWaveform(raw: RawSource, times: ArrayLike<number>, preFrames: number, postFrames: number): MeanWaveform {
  const frames = preFrames + postFrames + 1;
  const ch = raw.channelCount;
  const sum = new Float64Array(frames * ch);
  const chMean = new Float64Array(ch);
  let count = 0;
  for (let k = 0; k < times.length; k++) {
    const f = Math.round((times[k] - raw.startS) * raw.sampleRateHz);
    const start = f - preFrames;
    if (start < 0 || start + frames > raw.frameCount) continue;
    const snip = raw.readFrames(start, frames);
    if (snip.length < frames * ch) continue;
    chMean.fill(0);
    for (let i = 0; i < frames; i++) for (let c = 0; c < ch; c++) chMean[c] += snip[i * ch + c];
    for (let c = 0; c < ch; c++) chMean[c] /= frames;
    for (let i = 0; i < frames; i++) for (let c = 0; c < ch; c++) sum[i * ch + c] += snip[i * ch + c] - chMean[c];
    count++;
  }
  const mean = new Float64Array(frames * ch);
  for (let i = 0; i < mean.length; i++) mean[i] = count > 0 ? (sum[i] / count) * raw.gainUvPerBit : NaN;
  return { frames, channels: ch, mean, count };
}
