/**
 * Per-pulse measures on hand-made spike trains (exact values worked by hand), the count
 * test against @stdlib/stats-base-dists-poisson-cdf (P(X >= k) = 1 - cdf(k - 1)), and the
 * excess-spike latency on simulated units. Tolerance 1e-12 absolute unless stated.
 */
import normalCdfRef from '@stdlib/stats-base-dists-normal-cdf';
import poissonCdfRef from '@stdlib/stats-base-dists-poisson-cdf';
import { describe, expect, it } from 'vitest';
import { lightResponse } from '../../../core/light/light-response';
import { lightSchedule } from '../../../core/light/light-schedule';
import { Rng } from '../../../core/random/rng';
import { lightParams, makePulses, simulateUnit } from './helpers';

describe('lightResponse on a hand-made train', () => {
  const p = lightParams({ saltBaselineMs: 500 });
  const { pulses } = makePulses({ single: 4, periodS: 1, startS: 10 });
  const sch = lightSchedule(pulses, [0, 20], p);
  // pulse 0: spikes at +2 ms and +7 ms; pulse 1: +4 ms; pulse 2: none (+12 ms is outside);
  // pulse 3: +3 ms. One spontaneous spike in every pulse's baseline: 5.5 s, 9.7 s, 10.6 s, 11.8 s, 12.65 s.
  const spikes = Float64Array.from([5.5, 9.7, 10.002, 10.007, 10.6, 11.004, 11.8, 12.012, 12.65, 13.003]).sort();
  const r = lightResponse(spikes, sch, p, true);
  it('latency, reliability, jitter, spikes per pulse', () => {
    expect(r.pulses).toBe(4);
    expect(r.answered).toBe(3);
    expect(r.reliability).toBe(0.75);
    expect(r.meanLatencyS * 1000).toBeCloseTo(3, 9);
    expect(r.medianLatencyS * 1000).toBeCloseTo(3, 9);
    expect(r.jitterS * 1000).toBeCloseTo(1, 9); // SD of 2, 4, 3 ms (n - 1)
    expect(r.evokedPerPulse).toBe(1);
    expect(Array.from(r.latencyS!, (x) => (Number.isNaN(x) ? -1 : Math.round(x * 1e6) / 1e3))).toEqual([2, 4, -1, 3]);
  });
  it('baseline from the SALT windows (light-free, before each pulse)', () => {
    expect(r.saltWindows).toBe(50);
    expect(r.saltPulses).toBe(4);
    // spikes inside [onset - 0.5 s, onset): 9.7 (pulse 0), 10.6 (pulse 1), 11.8 (pulse 2), 12.65 (pulse 3)
    expect(r.baselineHz).toBeCloseTo(4 / (4 * 0.5), 12);
    expect(r.baselineReliability).toBeCloseTo(4 / (4 * 50), 12);
    expect(r.evokedMinusBaselineHz).toBeCloseTo(1 / 0.01 - 2, 9);
  });
  it('count test equals the exact Poisson tail of @stdlib', () => {
    const want = 1 - poissonCdfRef(4 - 1, 2 * 4 * 0.01);
    expect(Math.abs(r.countP - want)).toBeLessThan(1e-12 + 1e-10 * want);
  });
  it('per-frequency reliability and latency', () => {
    expect(Array.from(r.frequencyReliability!)).toEqual([0.75]);
    expect(r.frequencyLatencyS![0] * 1000).toBeCloseTo(3, 9);
  });
  it('no spikes: reliability 0, NaN latencies; detail off allocates no per-pulse output', () => {
    const e = lightResponse(new Float64Array(0), sch, p, false);
    expect(e.reliability).toBe(0);
    expect(e.meanLatencyS).toBeNaN();
    expect(e.baselineHz).toBe(0);
    expect(e.latencyS).toBeUndefined();
  });
});

describe('count test vs @stdlib/stats-base-dists-poisson-cdf on simulated units', () => {
  it.each([0.5, 3, 25])('rate %s Hz', (rate) => {
    const p = lightParams();
    const { pulses, endS } = makePulses({ single: 120 });
    const sch = lightSchedule(pulses, [0, endS], p);
    const spikes = simulateUnit(new Rng(rate * 10), pulses, endS, rate, 1, { reliability: 0.1, latencyMs: 5, jitterMs: 2 });
    const r = lightResponse(spikes, sch, p, false);
    const k = Math.round(r.evokedPerPulse * r.pulses);
    const lam = r.baselineHz * r.pulses * 0.01;
    const want = k === 0 ? 1 : 1 - poissonCdfRef(k - 1, lam);
    // relative 1e-9 (1 - cdf loses digits when the tail is tiny; both are double precision)
    expect(Math.abs(r.countP - want)).toBeLessThanOrEqual(1e-9 * Math.max(want, 1e-300) + 1e-15);
  });
});

describe('excess-spike latency', () => {
  // Expected: moments of the normal truncated to the test window [0, 10] ms (textbook
  // truncated-normal formulas, e.g. Johnson, Kotz & Balakrishnan 1994, ch. 13; Phi from
  // @stdlib/stats-base-dists-normal-cdf), since every in-window measure is truncated there.
  const truncated = (mu: number, sd: number) => {
    const phi = (x: number) => Math.exp(-x * x / 2) / Math.sqrt(2 * Math.PI);
    const a = (0 - mu) / sd;
    const b = (10 - mu) / sd;
    const z = normalCdfRef(b, 0, 1) - normalCdfRef(a, 0, 1);
    const m = mu + (sd * (phi(a) - phi(b))) / z;
    const v = sd * sd * (1 + (a * phi(a) - b * phi(b)) / z - ((phi(a) - phi(b)) / z) ** 2);
    return { m, s: Math.sqrt(v) };
  };
  const p = lightParams();
  const { pulses, endS } = makePulses({ single: 400 });
  const sch = lightSchedule(pulses, [0, endS], p);
  it.each([
    [3, 0.7, 2],
    [4, 1, 30],
    [8, 1, 30],
    [7, 2.5, 5],
  ])('answer at %s +- %s ms on %s Hz firing: within 0.4 ms of the truncated moments', (lat, jit, rate) => {
    const spikes = simulateUnit(new Rng(lat * 100 + rate), pulses, endS, rate, 1, { reliability: 0.5, latencyMs: lat, jitterMs: jit });
    const r = lightResponse(spikes, sch, p, false);
    const want = truncated(lat, jit);
    expect(Math.abs(r.evokedLatencyS * 1000 - want.m)).toBeLessThan(0.4);
    // The excess second moment is noisy when many spontaneous spikes share the window
    // (baseline spikes' squared latencies dominate its variance): check jitter at low rates.
    if (rate <= 5) expect(Math.abs(r.evokedJitterS * 1000 - want.s)).toBeLessThan(0.4);
    // first-spike statistics of a fast-firing unit are pulled toward early spontaneous spikes
    if (rate >= 30 && lat > 5) expect(r.meanLatencyS * 1000).toBeLessThan(want.m - 0.5);
  });
});
