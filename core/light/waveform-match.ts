import type { Parameters } from '../defaults';
import type { RawSource } from '../model/types';
import { meanWaveform } from './mean-waveform';

/** Evoked versus spontaneous mean waveform of one unit. */
export interface WaveformMatch {
  /** Pearson r of the two means over the compared channels (concatenated); NaN when not computable. */
  readonly r: number;
  /** Channels compared (0-based raw channel indices), best first. */
  readonly channels: readonly number[];
  /** Means on the compared channels, microvolts, channel-major (channel 0's frames, then channel 1's ...). */
  readonly evoked: Float64Array;
  readonly spontaneous: Float64Array;
  readonly frames: number;
  readonly evokedCount: number;
  readonly spontaneousCount: number;
  /** Sample times of a snippet relative to the spike, ms. */
  readonly timeMs: Float64Array;
  /** Why r is NaN ("" when it is not). */
  readonly problem: string;
}

/** Evenly thins sorted times to at most `max` (every k-th, deterministic). */
function thin(times: ArrayLike<number>, max: number): Float64Array {
  if (times.length <= max) return Float64Array.from(times);
  const out = new Float64Array(max);
  for (let i = 0; i < max; i++) out[i] = times[Math.floor((i * times.length) / max)];
  return out;
}

/**
 * Waveform match of light-evoked and spontaneous spikes, cut from the raw
 * recording (meanWaveform; never loaded whole). Channels: `preferredChannel`
 * (the unit's channel from its metadata, 0-based, when valid) first, then the
 * channels of largest peak-to-peak spontaneous mean, waveformChannels in all.
 * r = Pearson correlation of the two means concatenated over those channels
 * (>= 0.9 is the common-practice match criterion, DEFAULTS.light.minWaveformR).
 * At most waveformMaxSpikes spikes per mean (evenly spread); fewer than
 * waveformMinSpikes evoked or spontaneous spikes -> r = NaN with the reason.
 */
export function waveformMatch(
  raw: RawSource,
  evokedTimes: ArrayLike<number>,
  spontaneousTimes: ArrayLike<number>,
  p: Parameters['light'],
  preferredChannel = -1,
): WaveformMatch {
  const pre = Math.max(1, Math.round((p.waveformPreMs / 1000) * raw.sampleRateHz));
  const post = Math.max(1, Math.round((p.waveformPostMs / 1000) * raw.sampleRateHz));
  const frames = pre + post + 1;
  const timeMs = new Float64Array(frames);
  for (let i = 0; i < frames; i++) timeMs[i] = ((i - pre) / raw.sampleRateHz) * 1000;
  const empty = (problem: string, ec = 0, sc = 0): WaveformMatch => ({
    r: NaN, channels: [], evoked: new Float64Array(0), spontaneous: new Float64Array(0), frames, evokedCount: ec, spontaneousCount: sc, timeMs, problem,
  });
  const ev = meanWaveform(raw, thin(evokedTimes, p.waveformMaxSpikes), pre, post);
  const sp = meanWaveform(raw, thin(spontaneousTimes, p.waveformMaxSpikes), pre, post);
  if (ev.count < p.waveformMinSpikes || sp.count < p.waveformMinSpikes) {
    return empty(`too few spikes for a waveform match (${ev.count} evoked, ${sp.count} spontaneous; ${p.waveformMinSpikes} needed)`, ev.count, sp.count);
  }
  const ch = raw.channelCount;
  const p2p = new Float64Array(ch);
  for (let c = 0; c < ch; c++) {
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = 0; i < frames; i++) {
      const v = sp.mean[i * ch + c];
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    p2p[c] = hi - lo;
  }
  const order = Array.from({ length: ch }, (_, c) => c).sort((a, b) => p2p[b] - p2p[a] || a - b);
  const channels: number[] = [];
  if (Number.isInteger(preferredChannel) && preferredChannel >= 0 && preferredChannel < ch) channels.push(preferredChannel);
  for (const c of order) if (channels.length < Math.min(ch, Math.max(1, p.waveformChannels)) && !channels.includes(c)) channels.push(c);
  const len = channels.length * frames;
  const evoked = new Float64Array(len);
  const spontaneous = new Float64Array(len);
  channels.forEach((c, k) => {
    for (let i = 0; i < frames; i++) {
      evoked[k * frames + i] = ev.mean[i * ch + c];
      spontaneous[k * frames + i] = sp.mean[i * ch + c];
    }
  });
  let ma = 0;
  let mb = 0;
  for (let i = 0; i < len; i++) {
    ma += evoked[i];
    mb += spontaneous[i];
  }
  ma /= len;
  mb /= len;
  let sab = 0;
  let saa = 0;
  let sbb = 0;
  for (let i = 0; i < len; i++) {
    const a = evoked[i] - ma;
    const b = spontaneous[i] - mb;
    sab += a * b;
    saa += a * a;
    sbb += b * b;
  }
  const r = saa > 0 && sbb > 0 ? sab / Math.sqrt(saa * sbb) : NaN;
  return {
    r, channels, evoked, spontaneous, frames, evokedCount: ev.count, spontaneousCount: sp.count, timeMs,
    problem: Number.isNaN(r) ? 'flat mean waveform (zero variance)' : '',
  };
}
