/**
 * The verdict rule and artefact flags on constructed cases. The expectations follow the rule
 * in DESIGN.md section 4 and the criteria of REFERENCES.md (latency <= 6 ms; waveform r >= 0.9,
 * common practice; artefacts: near-zero jitter, locked to light edges, waveform unlike the
 * unit's own, verified general optogenetics resource); the SALT pitfall is REFERENCES.md's.
 */
import { describe, expect, it } from 'vitest';
import { artefactFlags } from '../../../core/light/artefact-flags';
import { lightResponse } from '../../../core/light/light-response';
import { lightSchedule } from '../../../core/light/light-schedule';
import { tagVerdict } from '../../../core/light/tag-verdict';
import { emptyPulses } from '../../../core/model/empty';
import type { Pulses } from '../../../core/model/types';
import { Rng } from '../../../core/random/rng';
import { renewalTrain } from '../../../core/sim/renewal-train';
import { lightParams, makePulses, mergeSorted, simulateUnit } from './helpers';

const { pulses, endS } = makePulses({ single: 300, jitterPeriodS: 0.3, trainFrequencies: [20], trains: 10 });

function judge(spikes: Float64Array, over = {}, waveformR = NaN, ps: Pulses = pulses, end = endS) {
  const p = lightParams(over);
  const sch = lightSchedule(ps, [0, end], p);
  const r = lightResponse(spikes, sch, p, false);
  const flags = artefactFlags(r, waveformR, p);
  return { r, flags, v: tagVerdict(r, waveformR, flags, p, sch.saltProblem) };
}

/** Spikes locked to each pulse at onset + latencyMs with a tiny spread (an artefact-like answer). */
function locked(latencyMs: number, spreadMs: number, reliability: number, seed: number): Float64Array {
  const rng = new Rng(seed);
  const out: number[] = [];
  for (const o of pulses.onset) if (rng.uniform() < reliability) out.push(o + (latencyMs + spreadMs * (rng.uniform() - 0.5)) / 1000);
  return Float64Array.from(out);
}

describe('tagVerdict', () => {
  it('a clean direct answer is tagged with the reason format of the issue', () => {
    const { v } = judge(simulateUnit(new Rng(1), pulses, endS, 4, 1, { reliability: 0.6, latencyMs: 3, jitterMs: 0.6 }));
    expect(v.tag).toBe('tagged');
    // ~1.15 s between single pulses: J = 90 windows, 4,005 null distances; the calibrated p
    // cannot go below 1/91 > 0.01, so 'auto' uses the published p and the reason says why.
    expect(v.reason).toMatch(
      /^p<0\.00025 \(published SALT; resolution 1\/4005\), latency 3\.\d+ ms, jitter 0\.\d+ ms, reliability 0\.\d+; published SALT p used: too few light-free baseline windows for a calibrated p < 0\.01 \(J = 90, calibrated p >= 1\/91 = 0\.011\)$/,
    );
  });
  it('light.saltP = calibrated on the same schedule: no unit can be tagged, and the reason says so', () => {
    const { v, r } = judge(simulateUnit(new Rng(1), pulses, endS, 4, 1, { reliability: 0.6, latencyMs: 3, jitterMs: 0.6 }), { saltP: 'calibrated' });
    expect(r.salt.pCalibrated).toBe(1 / 91);
    // As when SALT cannot run: the count test's clear answer makes it borderline, never tagged.
    expect(v.tag).toBe('borderline');
    expect(v.reason).toMatch(/^SALT cannot decide; count test p=[0-9.e-]+; p<=0\.011 \(calibrated SALT; resolution 1\/91\), .*; too few light-free baseline windows for p < 0\.01: J = 90 \(calibrated p >= 1\/91 = 0\.011\)$/);
  });
  it('sparse pulses (2 s apart): the calibrated p is used and an identified unit sits at its floor 1/(J + 1)', () => {
    const sparse = makePulses({ single: 150, periodS: 2, seed: 8 });
    const { v, r } = judge(simulateUnit(new Rng(6), sparse.pulses, sparse.endS, 4, 1, { reliability: 0.6, latencyMs: 3, jitterMs: 0.6 }), {}, NaN, sparse.pulses, sparse.endS);
    expect(r.saltWindows).toBe(100);
    expect(r.salt.pCalibrated).toBe(1 / 101);
    expect(v.tag).toBe('tagged');
    expect(v.reason).toMatch(/^p<=0\.00991 \(calibrated SALT; resolution 1\/101\), latency 3(\.\d+)? ms, jitter 0\.\d+ ms, reliability 0\.\d+$/);
  });
  it('no pulses: untagged, "no laser pulses"', () => {
    const { v } = judge(renewalTrain(new Rng(2), 5, 0, 100), {}, NaN, emptyPulses(), 100);
    expect(v).toEqual({ tag: 'untagged', reason: 'no laser pulses' });
  });
  it('a late (indirect) answer is borderline, never tagged', () => {
    const { v } = judge(simulateUnit(new Rng(3), pulses, endS, 4, 1, { reliability: 0.7, latencyMs: 9, jitterMs: 1.5 }));
    expect(v.tag).toBe('borderline');
    expect(v.reason).toMatch(/late answer/);
  });
  it('a light-inhibited unit is untagged with the reason', () => {
    const { v, r } = judge(simulateUnit(new Rng(4), pulses, endS, 25, 1, { reliability: 0, latencyMs: 0, jitterMs: 0, inhibit: 1, inhibitMs: 30 }));
    expect(r.salt.p).toBeLessThan(0.01);
    expect(v.tag).toBe('untagged');
    expect(v.reason).toMatch(/^light-inhibited/);
  });
  it('a poor waveform match demotes to borderline; a missing one is ignored', () => {
    const spikes = simulateUnit(new Rng(5), pulses, endS, 4, 1, { reliability: 0.6, latencyMs: 3, jitterMs: 0.6 });
    const bad = judge(spikes, {}, 0.55);
    expect(bad.v.tag).toBe('borderline');
    expect(bad.v.reason).toMatch(/waveform match r=0\.55 < 0\.9/);
    expect(bad.flags.map((f) => f.code)).toEqual(['waveform-mismatch']);
    expect(judge(spikes, {}, 0.97).v.tag).toBe('tagged');
    expect(judge(spikes, {}, NaN).v.tag).toBe('tagged');
  });
  it('the rule is configurable (maxLatencyMs 2.5 makes a 3 ms answer late)', () => {
    const spikes = simulateUnit(new Rng(6), pulses, endS, 4, 1, { reliability: 0.6, latencyMs: 3, jitterMs: 0.6 });
    expect(judge(spikes, { maxLatencyMs: 2.5 }).v.tag).toBe('borderline');
  });
  it('an unreliable but significant answer is borderline', () => {
    const spikes = simulateUnit(new Rng(7), pulses, endS, 0.5, 1, { reliability: 0.07, latencyMs: 3, jitterMs: 0.5 });
    const { v, r } = judge(spikes);
    expect(r.salt.p).toBeLessThan(0.01);
    expect(v.tag).toBe('borderline');
    expect(v.reason).toMatch(/unreliable/);
  });
  it('SALT cannot run (too little light-free time): a strong answer is at most borderline, with the reason', () => {
    const short = makePulses({ single: 200, periodS: 0.2, startS: 0.1 });
    const spikes = simulateUnit(new Rng(8), short.pulses, short.endS, 4, 1, { reliability: 0.8, latencyMs: 3, jitterMs: 0.6 });
    const { v } = judge(spikes, {}, NaN, short.pulses, short.endS);
    expect(v.tag).toBe('borderline');
    expect(v.reason).toMatch(/too little light-free time/);
  });
});

describe('the documented SALT pitfall, handled on purpose', () => {
  it('a reliable answer of a near-silent unit: SALT blind (p >= 0.01), count test stands in -> tagged with the explanation', () => {
    const rng = new Rng(9);
    const answer = simulateUnit(rng, pulses, endS, 0.01, 1, { reliability: 1, latencyMs: 3.5, jitterMs: 0.8 });
    const { r, v } = judge(answer);
    expect(r.salt.p).toBeGreaterThanOrEqual(0.01);
    expect(r.salt.testDistance).toBeLessThanOrEqual(r.salt.nullMedian);
    expect(v.tag).toBe('tagged');
    expect(v.reason).toMatch(/SALT blind/);
  });
  it('zero jitter in one bin (SALT p can reach 1): borderline as an artefact suspect, never tagged', () => {
    const spikes = mergeSorted(renewalTrain(new Rng(10), 0.02, 0, endS), locked(3.55, 0.02, 1, 11));
    const { r, v, flags } = judge(spikes);
    expect(r.salt.p).toBe(1);
    expect(flags.map((f) => f.code)).toContain('zero-jitter');
    expect(v.tag).toBe('borderline');
    expect(v.reason).toMatch(/artefact suspect: near-zero jitter/);
  });
});

describe('artefactFlags', () => {
  it('sub-millisecond locked "spikes" on a firing unit: zero-jitter and too-early', () => {
    const spikes = mergeSorted(renewalTrain(new Rng(12), 8, 0, endS), locked(0.4, 0.03, 0.9, 13));
    const { flags, v } = judge(spikes);
    expect(flags.map((f) => f.code).sort()).toEqual(['too-early', 'zero-jitter']);
    expect(v.tag).toBe('borderline');
  });
  it('answers locked to the offset of long pulses are flagged', () => {
    const long = makePulses({ single: 200, durationS: 0.02, periodS: 1.5 });
    const rng = new Rng(14);
    const extra: number[] = [];
    for (const o of long.pulses.onset) if (rng.uniform() < 0.8) extra.push(o + 0.02 + 0.0003 + 0.00005 * rng.uniform());
    const spikes = mergeSorted(renewalTrain(new Rng(15), 5, 0, long.endS), Float64Array.from(extra));
    const { flags } = judge(spikes, {}, NaN, long.pulses, long.endS);
    expect(flags.map((f) => f.code)).toContain('offset-locked');
  });
  it('a real answer with 1 ms jitter raises no flag; no answer, no flag', () => {
    expect(judge(simulateUnit(new Rng(16), pulses, endS, 10, 1, { reliability: 0.5, latencyMs: 4, jitterMs: 1 })).flags).toEqual([]);
    expect(judge(renewalTrain(new Rng(17), 10, 0, endS)).flags).toEqual([]);
  });
});
