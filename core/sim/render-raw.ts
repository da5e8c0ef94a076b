import { Rng } from '../random/rng';
import { streamSeed } from './stream-seed';
import type { SimulatedSession } from './types';

export interface RawOptions {
  /** Probe channels to render, in file order (default: 0 .. 7). */
  readonly channels?: readonly number[];
  /** Time window rendered, s (default: the first 10 s of the light block, or of the session). */
  readonly startS?: number;
  readonly stopS?: number;
  /** Sample rate of the raw file, Hz (default the waveforms' rate). */
  readonly sampleRateHz?: number;
  /** SD of the white background noise, microvolts (default 8). */
  readonly noiseUv?: number;
  /** Microvolts per integer step (default 0.195, a common headstage gain). */
  readonly gainUvPerBit?: number;
  /** Spatial decay of a unit's amplitude across channels, micrometres (default 40). */
  readonly spreadUm?: number;
}

/** A rendered raw recording: frames x channels, interleaved int16. */
export interface RawRecording {
  readonly data: Int16Array;
  readonly channels: readonly number[];
  readonly sampleRateHz: number;
  readonly gainUvPerBit: number;
  /** Time of frame 0, s. */
  readonly startS: number;
  readonly frameCount: number;
}

/**
 * A small raw extracellular recording of a simulated session, for waveform
 * cutting tests: white Gaussian noise plus every spike of every unit drawn
 * with its mean waveform on its channel, scaled on the other channels by
 * exp(-distance / spreadUm) (distance from channel numbers and the probe's
 * pitch). Light-evoked events of artefact units are drawn with the artefact
 * shape (session.evokedWaveforms) on every rendered channel at full size,
 * since photoelectric artefacts appear on many channels at once. Spikes are
 * placed at the nearest sample (waveform trough at 1/3 of its window, as
 * in waveformShape). Values are rounded to int16 steps of gainUvPerBit and
 * clipped. Deterministic (noise from the session's seed).
 */
export function renderRaw(sim: SimulatedSession, options: RawOptions = {}): RawRecording {
  const rec = sim.recording;
  const channels = options.channels ?? [0, 1, 2, 3, 4, 5, 6, 7];
  const fs = options.sampleRateHz ?? sim.spec.waveformSampleRateHz;
  const firstPulse = rec.pulses.onset.length > 0 ? rec.pulses.onset[0] - 1 : rec.span[0];
  const startS = options.startS ?? Math.max(rec.span[0], firstPulse);
  const stopS = options.stopS ?? Math.min(rec.span[1], startS + 10);
  const gain = options.gainUvPerBit ?? 0.195;
  const noise = options.noiseUv ?? 8;
  const spread = options.spreadUm ?? 40;
  const pitch = sim.spec.probe.pitchUm;
  const c = channels.length;
  const frames = Math.max(0, Math.floor((stopS - startS) * fs));
  const uv = new Float64Array(frames * c);
  const rng = new Rng(streamSeed(sim.spec.seed, 0x7a3));
  for (let i = 0; i < uv.length; i++) uv[i] = noise * rng.normal();
  const ns = sim.spec.waveformSamples;
  const lead = Math.round(ns / 3) * (fs / sim.spec.waveformSampleRateHz);
  const resample = sim.spec.waveformSampleRateHz / fs;
  rec.units.forEach((u, k) => {
    const ch = sim.spec.units[k].channel;
    const isArtefact = sim.spec.units[k].light.kind === 'artefact';
    const scale = channels.map((x) => Math.exp(-(Math.abs(x - ch) * pitch) / spread));
    const w = sim.waveforms.subarray(k * ns, (k + 1) * ns);
    const we = sim.evokedWaveforms.subarray(k * ns, (k + 1) * ns);
    const mask = sim.evoked[k];
    const t = u.spikeTimes;
    for (let i = 0; i < t.length; i++) {
      if (t[i] < startS - 0.01 || t[i] >= stopS + 0.01) continue;
      const evokedArtefact = isArtefact && mask[i] === 1;
      const shape = evokedArtefact ? we : w;
      const f0 = Math.round((t[i] - startS) * fs - lead);
      const len = Math.floor(ns / resample);
      for (let j = 0; j < len; j++) {
        const f = f0 + j;
        if (f < 0 || f >= frames) continue;
        const v = shape[Math.min(ns - 1, Math.round(j * resample))];
        for (let q = 0; q < c; q++) uv[f * c + q] += v * (evokedArtefact ? 1 : scale[q]);
      }
    }
  });
  const data = new Int16Array(uv.length);
  for (let i = 0; i < uv.length; i++) data[i] = Math.max(-32768, Math.min(32767, Math.round(uv[i] / gain)));
  return { data, channels, sampleRateHz: fs, gainUvPerBit: gain, startS, frameCount: frames };
}
