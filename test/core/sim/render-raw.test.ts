/**
 * renderRaw: cutting snippets from the rendered int16 recording at a unit's
 * spike times and averaging them must give back the unit's mean waveform
 * (averaging n snippets shrinks the noise SD by sqrt(n); common practice of
 * spike-triggered averaging), and an artefact unit's light-evoked snippets
 * must look unlike its spontaneous waveform (Pearson r computed directly).
 */
import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../../core/sim/default-scenario';
import { renderRaw } from '../../../core/sim/render-raw';
import { simulateSession } from '../../../core/sim/simulate-session';
import { unitSpec } from '../../../core/sim/unit-spec';

function pearson(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const n = a.length;
  let ma = 0;
  let mb = 0;
  for (let i = 0; i < n; i++) {
    ma += a[i] / n;
    mb += b[i] / n;
  }
  let ab = 0;
  let aa = 0;
  let bb = 0;
  for (let i = 0; i < n; i++) {
    ab += (a[i] - ma) * (b[i] - mb);
    aa += (a[i] - ma) ** 2;
    bb += (b[i] - mb) ** 2;
  }
  return ab / Math.sqrt(aa * bb);
}

describe('renderRaw', () => {
  const sim = simulateSession(
    defaultScenario({
      seed: 8,
      task: null,
      preTaskS: 20,
      light: { ...defaultScenario().light!, leadS: 0, singles: { count: 40, intervalS: [0.4, 0.6] }, trains: [] },
      units: [
        unitSpec({ id: '1', channel: 2, rateHz: 20, waveform: { kind: 'narrow', amplitudeUv: 120, troughToPeakMs: 0.35 } }),
        unitSpec({ id: '2', channel: 5, rateHz: 0.2, light: { kind: 'artefact', onsetLatencyMs: 0.2, offsetLatencyMs: 0.2, jitterMs: 0.01, reliability: 1 } }),
      ],
    }),
  );
  const raw = renderRaw(sim, { channels: [0, 1, 2, 3, 4, 5], startS: 18, stopS: 38 });
  const c = raw.channels.length;
  const ns = sim.spec.waveformSamples;
  const lead = Math.round(ns / 3);
  const average = (times: number[], ch: number) => {
    const acc = new Float64Array(ns);
    let n = 0;
    for (const t of times) {
      const f0 = Math.round((t - raw.startS) * raw.sampleRateHz) - lead;
      if (f0 < 0 || f0 + ns > raw.frameCount) continue;
      for (let j = 0; j < ns; j++) acc[j] += raw.data[(f0 + j) * c + ch] * raw.gainUvPerBit;
      n++;
    }
    return acc.map((x) => x / n);
  };
  it('has the asked shape: frames x channels, int16', () => {
    expect(raw.data).toBeInstanceOf(Int16Array);
    expect(raw.frameCount).toBe(20 * 30000);
    expect(raw.data.length).toBe(raw.frameCount * 6);
  });
  it('spike-triggered averages give back the mean waveform on the unit channel, smaller on far ones', () => {
    const u = sim.recording.units[0];
    const times = [...u.spikeTimes].filter((t) => t >= 18 && t < 38);
    const avg = average(times, 2);
    const w = sim.waveforms.subarray(0, ns);
    expect(pearson(avg, w)).toBeGreaterThan(0.97);
    const trough = Math.min(...avg);
    // within noise: 8 uV / sqrt(n) per sample, other unit's spikes add a little
    expect(Math.abs(trough - Math.min(...w))).toBeLessThan(10);
    const far = average(times, 5);
    expect(Math.abs(Math.min(...far))).toBeLessThan(Math.abs(trough) * 0.3);
  });
  it('artefact events carry the artefact shape on every channel', () => {
    const k = 1;
    const u = sim.recording.units[k];
    const mask = sim.evoked[k];
    const ev = [...u.spikeTimes].filter((t, i) => mask[i] === 1 && t >= 18 && t < 38);
    expect(ev.length).toBeGreaterThan(40);
    const spont = sim.waveforms.subarray(k * ns, (k + 1) * ns);
    for (const ch of [0, 5]) {
      const avg = average(ev, ch);
      expect(pearson(avg, sim.evokedWaveforms.subarray(k * ns, (k + 1) * ns))).toBeGreaterThan(0.9);
      expect(pearson(avg, spont)).toBeLessThan(0.5);
    }
  });
});
