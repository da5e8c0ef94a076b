/**
 * Waveform cutting against a hand-made raw recording with known spikes: an in-memory
 * RawSource over an Int16Array (interleaved frames x channels), a known template added at
 * known times, small seeded noise. Expected means are the template itself (hand-made,
 * exact up to noise / sqrt(n)); Pearson r of identical shapes is 1 by definition.
 */
import { describe, expect, it } from 'vitest';
import { meanWaveform } from '../../../core/light/mean-waveform';
import { waveformMatch } from '../../../core/light/waveform-match';
import type { RawSource } from '../../../core/model/types';
import { Rng } from '../../../core/random/rng';
import { lightParams } from './helpers';

const FS = 30000;
const CH = 6;
const GAIN = 0.5; // uV per bit

/** Template in bits: a negative trough then a positive bump, scaled per channel. */
const SHAPE = [0, -10, -40, -120, -200, -150, -60, 10, 50, 60, 45, 25, 10, 0];
const SCALE = [0.05, 0.3, 1, 0.5, 0.2, 0];
const ARTEFACT = [0, 80, 80, 80, 80, 80, 80, 80, 80, 80, 0, 0, 0, 0]; // a step on every channel

function makeRaw(spikes: number[], artefacts: number[], seconds: number): { raw: RawSource; reads: number[] } {
  const frames = seconds * FS;
  const data = new Int16Array(frames * CH);
  const rng = new Rng(2024);
  for (let i = 0; i < data.length; i++) data[i] = Math.round(3 * rng.normal()) + 7; // noise + DC offset
  const add = (t: number, shape: number[], scale: number[]) => {
    const f0 = Math.round(t * FS) - 4; // the trough lands 0 frames after the spike time
    for (let k = 0; k < shape.length; k++) for (let c = 0; c < CH; c++) {
      const f = f0 + k;
      if (f >= 0 && f < frames) data[f * CH + c] += Math.round(shape[k] * scale[c]);
    }
  };
  for (const t of spikes) add(t, SHAPE, SCALE);
  for (const t of artefacts) add(t, ARTEFACT, new Array(CH).fill(1));
  const reads: number[] = [];
  const raw: RawSource = {
    file: 'memory.bin',
    channelCount: CH,
    sampleRateHz: FS,
    gainUvPerBit: GAIN,
    frameCount: frames,
    startS: 0,
    readFrames(start, count) {
      reads.push(count);
      const a = Math.max(0, start);
      const b = Math.min(frames, start + count);
      return data.slice(a * CH, Math.max(a, b) * CH);
    },
  };
  return { raw, reads };
}

const spont = Array.from({ length: 60 }, (_, i) => 0.5 + i * 0.3137);
const evoked = Array.from({ length: 40 }, (_, i) => 0.6 + i * 0.4513);

describe('meanWaveform', () => {
  it('recovers the known template on every channel (offset removed, scaled to uV)', () => {
    const { raw, reads } = makeRaw(spont, [], 20);
    const pre = 4;
    const post = 9;
    const w = meanWaveform(raw, spont, pre, post);
    expect(w.count).toBe(60);
    expect(w.frames).toBe(14);
    for (let c = 0; c < CH; c++) {
      const tpl = SHAPE.map((v) => v * SCALE[c]);
      const m = tpl.reduce((a, b) => a + b, 0) / tpl.length;
      for (let i = 0; i < 14; i++) {
        // noise SD 3 bits / sqrt(60) ~ 0.4 bit, rounding of the scaled template 0.5 bit
        expect(Math.abs(w.mean[i * CH + c] - (tpl[i] - m) * GAIN)).toBeLessThan(1.5 * GAIN);
      }
    }
    // read by offset: one snippet per spike, never the whole file
    expect(reads.length).toBe(60);
    expect(Math.max(...reads)).toBe(14);
  });
  it('skips snippets running off the file and returns NaN when none is left', () => {
    const { raw } = makeRaw(spont, [], 20);
    const w = meanWaveform(raw, [0.00001, 19.99999, 5], 4, 9);
    expect(w.count).toBe(1);
    const none = meanWaveform(raw, [], 4, 9);
    expect(none.count).toBe(0);
    expect(none.mean[0]).toBeNaN();
  });
});

describe('waveformMatch', () => {
  const p = lightParams();
  it('same unit evoked and spontaneous: r near 1, best channel first', () => {
    const { raw } = makeRaw([...spont, ...evoked].sort((a, b) => a - b), [], 20);
    const m = waveformMatch(raw, evoked, spont, p);
    expect(m.channels[0]).toBe(2);
    expect(m.channels.length).toBe(4);
    expect(m.channels.slice(1).sort()).toEqual([1, 3, 4]);
    expect(m.r).toBeGreaterThan(0.98);
    expect(m.evokedCount).toBe(40);
    expect(m.timeMs[0]).toBeCloseTo(-1, 9);
  });
  it('"evoked" spikes that are a light artefact: r far below 0.9', () => {
    const { raw } = makeRaw(spont, evoked, 20);
    const m = waveformMatch(raw, evoked, spont, p);
    expect(m.r).toBeLessThan(0.5);
  });
  it('a preferred channel from the unit metadata comes first', () => {
    const { raw } = makeRaw([...spont, ...evoked].sort((a, b) => a - b), [], 20);
    const m = waveformMatch(raw, evoked, spont, { ...p, waveformChannels: 2 }, 4);
    expect(m.channels).toEqual([4, 2]);
  });
  it('too few spikes: NaN with the reason', () => {
    const { raw } = makeRaw(spont, [], 20);
    const m = waveformMatch(raw, evoked.slice(0, 3), spont, p);
    expect(m.r).toBeNaN();
    expect(m.problem).toMatch(/too few spikes/);
  });
  it('at most waveformMaxSpikes snippets per mean', () => {
    const { raw, reads } = makeRaw(spont, [], 20);
    waveformMatch(raw, spont, spont, { ...p, waveformMaxSpikes: 15 });
    expect(reads.length).toBe(30);
  });
});
