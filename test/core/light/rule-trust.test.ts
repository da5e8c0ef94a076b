/**
 * The trust simulation (false-identification rate and smallest detectable reliability of
 * the rule on a session's own pulses). Checks: grid nodes and weights by hand; determinism;
 * the compressed-time null simulation (test windows, then baseline blocks and offset windows)
 * agrees with an independent simulation of whole spike trains (core/sim/renewal-train.ts over
 * the full span) within binomial error (3 SE) under a deliberately loose rule that makes false
 * calls common; power grows with pulse count.
 */
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
