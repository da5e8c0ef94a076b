/**
 * The session simulator against the statistics it is asked to produce.
 * Outside sources: sample mean and SD of normal draws have standard errors
 * sigma/sqrt(n) and sigma/sqrt(2(n-1)) (any statistics handbook); a binomial
 * proportion has SE sqrt(p(1-p)/n). Tolerances: 4 standard errors plus the
 * 1/30 ms rounding to the 30 kHz sample clock where times are compared.
 */
import { describe, expect, it } from 'vitest';
import { lowerBound } from '../../../core/align/lower-bound';
import { defaultScenario } from '../../../core/sim/default-scenario';
import { demoScenario } from '../../../core/sim/demo-scenario';
import { nullUnits } from '../../../core/sim/null-units';
import { simulateSession } from '../../../core/sim/simulate-session';
import type { UnitSpec } from '../../../core/sim/types';
import { unitSpec } from '../../../core/sim/unit-spec';

const direct: UnitSpec['light'] = {
  kind: 'direct',
  latencyMs: 3.5,
  jitterMs: 0.8,
  reliability: 0.7,
  followHalfHz: 20,
  decayPerPulse: 0.8,
  latencyGrowthMs: 2,
  extraSpikes: 0,
};

function firstSpikeLatenciesMs(times: Float64Array, onsets: ArrayLike<number>, windowMs: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < onsets.length; i++) {
    const j = lowerBound(times, onsets[i]);
    if (j < times.length && times[j] < onsets[i] + windowMs / 1000) out.push((times[j] - onsets[i]) * 1000);
  }
  return out;
}
const mean = (x: number[]) => x.reduce((a, b) => a + b, 0) / x.length;
const sd = (x: number[]) => {
  const m = mean(x);
  return Math.sqrt(x.reduce((a, b) => a + (b - m) ** 2, 0) / (x.length - 1));
};

describe('simulateSession', () => {
  const spec = defaultScenario({
    seed: 11,
    units: [
      unitSpec({ id: 'd', rateHz: 0.5, shape: 4, light: direct }),
      unitSpec({
        id: 'i',
        rateHz: 1,
        light: { kind: 'indirect', latencyMs: 14, jitterMs: 4, reliability: 0.5, followHalfHz: 6, decayPerPulse: 0.6, latencyGrowthMs: 5, extraSpikes: 0 },
      }),
      unitSpec({ id: 'x', rateHz: 20, light: { kind: 'inhibited', gain: 0, delayMs: 1, afterMs: 30 } }),
      unitSpec({ id: 'a', rateHz: 0.3, light: { kind: 'artefact', onsetLatencyMs: 0.2, offsetLatencyMs: 0.3, jitterMs: 0.02, reliability: 0.95 } }),
      unitSpec({ id: 'up', rateHz: 5, ramp: { gain: 1, power: 1 } }),
      unitSpec({ id: 'down', rateHz: 8, ramp: { gain: -0.5, power: 1 } }),
      unitSpec({ id: 'flat', rateHz: 6 }),
      unitSpec({
        id: 'j',
        rateHz: 6,
        jump: { forward: { type: 'burst', gain: 4, latencyS: 0.03, durationS: 0.1 }, backward: { type: 'dip', gain: 0, latencyS: 0.02, durationS: 0.2 } },
      }),
    ],
  });
  const sim = simulateSession(spec);
  const rec = sim.recording;
  const unit = (id: string) => rec.units.find((u) => u.id === id)!;
  const truth = (id: string) => sim.truth.find((u) => u.unit === id)!;
  const singles: number[] = [];
  for (let i = 0; i < rec.pulses.onset.length; i++) if (Number.isNaN(rec.pulses.frequencyHz[i])) singles.push(rec.pulses.onset[i]);

  it('direct responder: latency, jitter and reliability on single pulses as specified', () => {
    const lat = firstSpikeLatenciesMs(unit('d').spikeTimes, singles, 10);
    const n = singles.length;
    const rel = lat.length / n;
    // spontaneous spikes in the 10 ms window add ~0.5 Hz x 10 ms = 0.5 % to the answer rate
    expect(Math.abs(rel - 0.7)).toBeLessThan(4 * Math.sqrt((0.7 * 0.3) / n) + 0.005);
    const m = mean(lat);
    const s = sd(lat);
    expect(Math.abs(m - 3.5)).toBeLessThan((4 * 0.8) / Math.sqrt(lat.length) + 0.05);
    expect(Math.abs(s - 0.8)).toBeLessThan((4 * 0.8) / Math.sqrt(2 * (lat.length - 1)) + 0.05);
    expect(truth('d')).toMatchObject({ lightClass: 'direct', latencyMs: 3.5, jitterMs: 0.8, reliability: 0.7 });
  });
  it('direct responder fades along 20 Hz trains; indirect responder is later and more variable', () => {
    const onsets = (f: number, k: number) => {
      const out: number[] = [];
      let idx = 0;
      for (let i = 0; i < rec.pulses.onset.length; i++) {
        if (rec.pulses.frequencyHz[i] !== f) continue;
        if (i > 0 && rec.pulses.train[i] !== rec.pulses.train[i - 1]) idx = 0;
        if (idx === k) out.push(rec.pulses.onset[i]);
        idx++;
      }
      return out;
    };
    const first = firstSpikeLatenciesMs(unit('d').spikeTimes, onsets(20, 0), 10).length;
    const last = firstSpikeLatenciesMs(unit('d').spikeTimes, onsets(20, 9), 10).length;
    expect(last).toBeLessThan(first);
    const ind = firstSpikeLatenciesMs(unit('i').spikeTimes, singles, 40);
    expect(mean(ind)).toBeGreaterThan(10);
    expect(sd(ind)).toBeGreaterThan(2.5);
    expect(truth('i').lightClass).toBe('indirect');
  });
  it('inhibited unit is silent during light; artefact is locked to onset and offset with near-zero jitter', () => {
    let inWindow = 0;
    for (let i = 0; i < rec.pulses.onset.length; i++) {
      const o = rec.pulses.onset[i];
      const t = unit('x').spikeTimes;
      inWindow += lowerBound(t, o + 0.031) - lowerBound(t, o + 0.0011);
    }
    expect(inWindow).toBe(0);
    const on = firstSpikeLatenciesMs(unit('a').spikeTimes, singles, 2);
    expect(on.length / singles.length).toBeGreaterThan(0.9);
    expect(sd(on)).toBeLessThan(0.05);
    expect(Math.abs(mean(on) - 0.2)).toBeLessThan(0.03);
    // the evoked mask marks exactly the light-locked events of the artefact unit
    const mask = sim.evoked[rec.units.indexOf(unit('a'))];
    const evokedCount = mask.reduce((a, b) => a + b, 0);
    expect(evokedCount).toBeGreaterThan(1.8 * rec.pulses.onset.length);
    // its evoked waveform is unlike its spontaneous one
    const ns = spec.waveformSamples;
    const k = rec.units.indexOf(unit('a'));
    const w = sim.waveforms.subarray(k * ns, (k + 1) * ns);
    const e = sim.evokedWaveforms.subarray(k * ns, (k + 1) * ns);
    expect(pearson(w, e)).toBeLessThan(0.5);
  });
  it('ramp truth: signs and exact expected slopes; a flat, driftless unit has slope 0 and no jump answer', () => {
    expect(truth('up').ramp).toBe('up');
    // up: 5 Hz x (1 + p), p = (t - on)/4 over [-3, 0) before reward: slope 5/4 Hz/s (up to the 50 ms steps)
    expect(truth('up').rampSlopeHzPerS).toBeCloseTo(1.25, 2);
    expect(truth('down').rampSlopeHzPerS).toBeCloseTo(-1, 2);
    expect(Math.abs(truth('flat').rampSlopeHzPerS)).toBeLessThan(1e-12);
    expect(truth('flat').jump.forward).toEqual({ answer: 'none', mechanism: 'none', expectedDeltaHz: 0 });
    expect(truth('j').jump.forward.answer).toBe('excited');
    expect(truth('j').jump.backward.answer).toBe('suppressed');
    // burst: x4 for 100 ms of the 300 ms window on 6 Hz: +6*3*0.1/0.3 = +6 Hz
    expect(truth('j').jump.forward.expectedDeltaHz).toBeCloseTo(6, 10);
    expect(truth('j').jump.backward.expectedDeltaHz).toBeCloseTo((-6 * 0.2) / 0.3, 10);
    // an up-ramp follows a forward jump with a lasting step
    expect(truth('up').jump.forward.answer).toBe('excited');
    expect(truth('up').jump.forward.mechanism).toBe('ramp');
  });
  it('realised rates of plain units match the spec (4 SE of a Poisson count)', () => {
    const T = rec.span[1] - rec.span[0];
    const t = truth('flat');
    expect(Math.abs(t.realisedRateHz - 6)).toBeLessThan(4 * Math.sqrt(6 / T));
  });
  it('is deterministic, and each unit has its own random streams', () => {
    const again = simulateSession(spec);
    expect(again.recording.units.map((u) => [...u.spikeTimes])).toEqual(rec.units.map((u) => [...u.spikeTimes]));
    const changed = simulateSession({ ...spec, units: spec.units.map((u) => (u.id === 'up' ? { ...u, rateHz: 9 } : u)) });
    expect([...changed.recording.units[0].spikeTimes]).toEqual([...rec.units[0].spikeTimes]);
    expect(changed.recording.units[4].spikeTimes.length).not.toBe(rec.units[4].spikeTimes.length);
  });
  it('rounds spike times to the 30 kHz clock, keeps them sorted and inside the span', () => {
    for (const u of rec.units) {
      for (let i = 0; i < u.spikeTimes.length; i++) {
        const s = u.spikeTimes[i] * 30000;
        expect(Math.abs(s - Math.round(s))).toBeLessThan(1e-6);
        if (i > 0) expect(u.spikeTimes[i]).toBeGreaterThan(u.spikeTimes[i - 1]);
      }
      expect(u.spikeTimes[0]).toBeGreaterThanOrEqual(0);
      expect(u.spikeTimes[u.spikeTimes.length - 1]).toBeLessThanOrEqual(rec.span[1]);
    }
  });
  it('rejects duplicate unit ids', () => {
    expect(() => simulateSession(defaultScenario({ units: [unitSpec({ id: '1' }), unitSpec({ id: '1' })] }))).toThrow(/duplicate/);
  });
});

describe('nullUnits and the demo population', () => {
  it('null units span the requested rates and regularity and answer nothing', () => {
    const us = nullUnits(300, 5);
    expect(us.length).toBe(300);
    const rates = us.map((u) => u.rateHz);
    const shapes = us.map((u) => u.shape);
    expect(Math.min(...rates)).toBeGreaterThanOrEqual(0.5);
    expect(Math.max(...rates)).toBeLessThanOrEqual(40);
    expect(Math.max(...rates) / Math.min(...rates)).toBeGreaterThan(20);
    expect(Math.min(...shapes)).toBeLessThan(0.7);
    expect(Math.max(...shapes)).toBeGreaterThan(5);
    expect(us.every((u) => u.light.kind === 'none' && u.ramp === null && Object.keys(u.jump).length === 0)).toBe(true);
  });
  it('the demo scenario has 48 units with the designed classes', () => {
    const d = demoScenario();
    expect(d.units.length).toBe(48);
    const count = (k: string) => d.units.filter((u) => u.light.kind === k).length;
    expect([count('direct'), count('indirect'), count('inhibited'), count('artefact')]).toEqual([7, 4, 3, 1]);
    expect(d.units.filter((u) => u.ramp && u.ramp.gain > 0).length).toBe(6);
    expect(d.units.filter((u) => u.ramp && u.ramp.gain < 0).length).toBe(5);
  });
});

function pearson(a: ArrayLike<number>, b: ArrayLike<number>): number {
  const n = a.length;
  let ma = 0;
  let mb = 0;
  for (let i = 0; i < n; i++) {
    ma += a[i] / n;
    mb += b[i] / n;
  }
  let sab = 0;
  let saa = 0;
  let sbb = 0;
  for (let i = 0; i < n; i++) {
    sab += (a[i] - ma) * (b[i] - mb);
    saa += (a[i] - ma) ** 2;
    sbb += (b[i] - mb) ** 2;
  }
  return sab / Math.sqrt(saa * sbb);
}
