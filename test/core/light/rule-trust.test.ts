/**
 * The trust simulation (false-identification rate and smallest detectable reliability of
 * the rule on a session's own pulses). Checks: grid nodes and weights by hand; determinism;
 * the compressed-time null simulation (test windows, then baseline blocks and offset windows)
 * agrees with an independent simulation of whole spike trains (core/sim/renewal-train.ts over
 * the full span) within binomial error (3 SE) under a deliberately loose rule that makes false
 * calls common; power grows with pulse count.
 */
import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import { describe, expect, it } from 'vitest';
import { artefactFlags } from '../../../core/light/artefact-flags';
import { createLightScratch, lightResponse } from '../../../core/light/light-response';
import { lightSchedule } from '../../../core/light/light-schedule';
import { POWER_GRID, ruleTrust } from '../../../core/light/rule-trust';
import { simulationIntervals } from '../../../core/light/simulation-intervals';
import { tagVerdict } from '../../../core/light/tag-verdict';
import { trustCell } from '../../../core/light/trust-cell';
import { Rng } from '../../../core/random/rng';
import { renewalTrain } from '../../../core/sim/renewal-train';
import { lightParams, makePulses } from './helpers';
import { referenceIntervals, ruleTrustReference } from './rule-trust-reference';

describe('trustCell (grid nodes and bilinear weights, worked by hand)', () => {
  const w = (c: { rateHz: number; cv: number; weight: number }[]) => c.map((x) => [x.rateHz, x.cv, Number(x.weight.toFixed(12))]);
  it('a unit on a node has that node alone', () => {
    expect(w(trustCell(4, 1))).toEqual([[4, 1, 1]]);
    expect(w(trustCell(0.125, 0.5))).toEqual([[0.125, 0.5, 1]]);
  });
  it('between nodes: weights in log2 rate and log2 CV', () => {
    // rate 4 * sqrt 2: halfway between 4 and 8 in log2; CV 1.5: log2 1.5 = 0.585 of the way from 1 to 2
    const f = Math.log2(1.5);
    expect(w(trustCell(4 * Math.SQRT2, 1.5))).toEqual([
      [4, 1, Number((0.5 * (1 - f)).toFixed(12))],
      [4, 2, Number((0.5 * f).toFixed(12))],
      [8, 1, Number((0.5 * (1 - f)).toFixed(12))],
      [8, 2, Number((0.5 * f).toFixed(12))],
    ]);
    expect(trustCell(3, 0.7).reduce((a, c) => a + c.weight, 0)).toBeCloseTo(1, 12);
  });
  it('clamps outside the grid; silent or unknown units', () => {
    expect(w(trustCell(0.01, 5))).toEqual([[0.125, 2, 1]]);
    expect(w(trustCell(1e6, 0.1))).toEqual([[256, 0.5, 1]]);
    expect(w(trustCell(0, NaN))).toEqual([[0, 1, 1]]);
    expect(w(trustCell(NaN, 1))).toEqual([[0, 1, 1]]);
  });
});

describe('ruleTrust', () => {
  const p = lightParams({ trustNullSimulations: 100, trustPowerSimulations: 20 });
  const { pulses, endS } = makePulses({ single: 150, trainFrequencies: [20], trains: 5 });
  const sch = lightSchedule(pulses, [0, endS], p);
  const iv = simulationIntervals(sch, p.offsetWindowMs / 1000);
  it('is deterministic and low for the default rule', () => {
    const a = ruleTrust(sch, iv, 4, 1, p);
    const b = ruleTrust(sch, iv, 4, 1, p, createLightScratch());
    expect(JSON.stringify(b)).toBe(JSON.stringify(a)); // same node, same numbers
    // 4 Hz: test-window reliability ~0.04 < 0.1, so every null unit past the power ones stops at the screen.
    expect(a.screenedOut).toBe(100 - 20);
    expect(a.falseRate).toBeLessThanOrEqual(0.02);
    expect(a.nullSimulations).toBe(100);
    expect(POWER_GRID).toContain(a.minDetectableReliability);
    expect(a.minDetectableReliability).toBeLessThanOrEqual(0.3);
    for (let k = 1; k < a.power.length; k++) expect(a.power[k].power).toBeGreaterThanOrEqual(a.power[k - 1].power - 0.1);
  });
  it('matches an independent whole-train simulation of false calls under a loose rule', () => {
    const loose = lightParams({ alphaSalt: 0.6, minEvokedReliability: -1, maxLatencyMs: 10, trustNullSimulations: 300, trustPowerSimulations: 0 });
    const t = ruleTrust(sch, iv, 8, 1, loose);
    expect(t.rateHz).toBe(8);
    const rng = new Rng(5150);
    const scratch = createLightScratch();
    let calls = 0;
    const n = 300;
    for (let k = 0; k < n; k++) {
      const spikes = renewalTrain(rng, 8, 0, endS, 1, 0.002);
      const r = lightResponse(spikes, sch, loose, false, scratch);
      if (tagVerdict(r, NaN, artefactFlags(r, NaN, loose), loose).tag === 'tagged') calls++;
    }
    const a = t.falseRate;
    const b = calls / n;
    expect(a).toBeGreaterThan(0.05); // the loose rule does make false calls
    const se = Math.sqrt((a * (1 - a)) / 300 + (b * (1 - b)) / n);
    expect(Math.abs(a - b)).toBeLessThanOrEqual(3 * se);
  });
  it('fewer pulses need a stronger answer', () => {
    const few = makePulses({ single: 25 });
    const s2 = lightSchedule(few.pulses, [0, few.endS], p);
    const t2 = ruleTrust(s2, simulationIntervals(s2, 0.002), 15, 1, p);
    const t1 = ruleTrust(sch, iv, 15, 1, p);
    expect(t1.minDetectableReliability).toBeLessThan(t2.minDetectableReliability);
  });
  it('a schedule without pulses gives NaN rates, a silent unit no false calls', () => {
    const none = lightSchedule({ onset: new Float64Array(0), duration: new Float64Array(0), train: new Int32Array(0), frequencyHz: new Float64Array(0), powerMw: new Float64Array(0) }, [0, 10], p);
    expect(ruleTrust(none, simulationIntervals(none, 0.002), 5, 1, p).falseRate).toBeNaN();
    expect(ruleTrust(sch, iv, 0, NaN, p).falseTagged).toBe(0);
  });
});

/**
 * The current model (baseline stretches shared by <= 5 null units, ziggurat draws, responders on
 * their null stretch's SALT half) against the earlier one (test/core/light/rule-trust-reference.ts:
 * a stretch per unit, other samplers), same schedules and rules, independent random numbers.
 * Test: two-proportion z-test on the false calls (pooled SE), |z| < 3.29 (two-sided, alpha 0.001
 * per comparison; seeds fixed, so each comparison is one deterministic draw of that test).
 * Spread: the false rate over 20 seeds against the binomial spread p(1 - p) / N, by the
 * chi-square dispersion test ((K - 1) s^2 / (p(1 - p) / N) ~ chi-square(K - 1) under binomial
 * sampling; upper tail from @stdlib/stats-base-dists-chisquare-cdf), pass at p > 0.001: sharing
 * stretches must not inflate the spread noticeably.
 */
describe('ruleTrust vs the earlier model (a baseline stretch per null unit)', () => {
  const { pulses, endS } = makePulses({ single: 150, trainFrequencies: [20], trains: 5 });
  const z = (a: number, b: number, n: number) => {
    const pool = (a + b) / (2 * n);
    const se = Math.sqrt(pool * (1 - pool) * (2 / n));
    return se > 0 ? (a / n - b / n) / se : 0;
  };
  // loose: no screens (every unit through the whole rule); screened: the excess screen decides often.
  const rules = {
    loose: lightParams({ alphaSalt: 0.6, minEvokedReliability: -1, maxLatencyMs: 10, trustNullSimulations: 400, trustPowerSimulations: 0 }),
    screened: lightParams({ alphaSalt: 0.6, minEvokedReliability: 0.01, maxLatencyMs: 10, trustNullSimulations: 400, trustPowerSimulations: 0 }),
  };
  it.each([
    ['loose', 2, 0.5],
    ['loose', 8, 1],
    ['loose', 32, 2],
    ['screened', 8, 1],
    ['screened', 30, 0.5],
    ['screened', 60, 2],
  ] as const)('%s rule, %s Hz, CV %s: false calls within the z-test', (rule, rate, cv) => {
    const p = rules[rule];
    const sch = lightSchedule(pulses, [0, endS], p);
    const now = ruleTrust(sch, simulationIntervals(sch, p.offsetWindowMs / 1000), rate, cv, p);
    const before = ruleTrustReference(sch, referenceIntervals(sch, p.offsetWindowMs / 1000), rate, cv, p);
    expect(now.nullSimulations).toBe(400);
    expect(before.falseTagged + now.falseTagged).toBeGreaterThan(20); // the rule does make false calls here
    if (rule === 'screened') expect(now.screenedOut).toBeGreaterThan(40); // and the screen decides for many
    expect(Math.abs(z(now.falseTagged, before.falseTagged, 400)), `${now.falseTagged} vs ${before.falseTagged} of 400`).toBeLessThan(3.29);
  });
  it('offset windows reaching into baseline blocks (long pulses, no guard): whole trains, same agreement', () => {
    const long = makePulses({ single: 150, durationS: 0.02, periodS: 0.505 });
    const p = lightParams({ ...rules.loose, lightGuardMs: 0, offsetWindowMs: 8, saltBaselineMs: 480 });
    const sch = lightSchedule(long.pulses, [0, long.endS], p);
    const iv = simulationIntervals(sch, p.offsetWindowMs / 1000);
    // the case is what it claims: an offset window overlaps a baseline block
    let overlap = false;
    for (let i = 0; i < iv.offset.length; i += 2) for (let k = 0; k < iv.base.length; k += 2) if (iv.offset[i] < iv.base[k + 1] && iv.base[k] < iv.offset[i + 1]) overlap = true;
    expect(overlap).toBe(true);
    const now = ruleTrust(sch, iv, 10, 1, p);
    const before = ruleTrustReference(sch, referenceIntervals(sch, p.offsetWindowMs / 1000), 10, 1, p);
    expect(before.falseTagged + now.falseTagged).toBeGreaterThan(20);
    expect(Math.abs(z(now.falseTagged, before.falseTagged, 400))).toBeLessThan(3.29);
  });
  it('power: the smallest detectable reliability agrees within one grid step on every node', () => {
    const p = lightParams({ trustNullSimulations: 100, trustPowerSimulations: 40 });
    const sch = lightSchedule(pulses, [0, endS], p);
    const iv = simulationIntervals(sch, p.offsetWindowMs / 1000);
    const riv = referenceIntervals(sch, p.offsetWindowMs / 1000);
    let same = 0;
    const nodes = [[1, 1], [4, 0.5], [16, 2], [64, 1]] as const;
    for (const [rate, cv] of nodes) {
      const a = POWER_GRID.indexOf(ruleTrust(sch, iv, rate, cv, p).minDetectableReliability as (typeof POWER_GRID)[number]);
      const b = POWER_GRID.indexOf(ruleTrustReference(sch, riv, rate, cv, p).minDetectableReliability as (typeof POWER_GRID)[number]);
      expect(a).toBeGreaterThanOrEqual(0);
      expect(Math.abs(a - b), `${rate} Hz CV ${cv}: ${POWER_GRID[a]} vs ${POWER_GRID[b]}`).toBeLessThanOrEqual(1);
      if (a === b) same++;
    }
    expect(same).toBeGreaterThanOrEqual(nodes.length - 1);
  });
  it('the false rate over 20 seeds spreads like a binomial (chi-square dispersion test)', () => {
    const p0 = rules.screened;
    const sch = lightSchedule(pulses, [0, endS], p0);
    const iv = simulationIntervals(sch, p0.offsetWindowMs / 1000);
    const N = 200;
    const rates: number[] = [];
    for (let seed = 1; seed <= 20; seed++) rates.push(ruleTrust(sch, iv, 16, 1, { ...p0, seed, trustNullSimulations: N }).falseRate);
    const mean = rates.reduce((a, b) => a + b, 0) / rates.length;
    const s2 = rates.reduce((a, b) => a + (b - mean) ** 2, 0) / (rates.length - 1);
    expect(mean).toBeGreaterThan(0.05);
    const stat = ((rates.length - 1) * s2) / ((mean * (1 - mean)) / N);
    expect(1 - chisquareCdf(stat, rates.length - 1), `dispersion ${stat / (rates.length - 1)}`).toBeGreaterThan(0.001);
  });
});
