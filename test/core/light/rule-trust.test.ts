/**
 * The trust simulation (false-identification rate and smallest detectable reliability of
 * the rule on a session's own pulses). Checks: grid rounding by hand; determinism; the
 * compressed-time null simulation agrees with an independent simulation of whole spike
 * trains (core/sim/renewal-train.ts over the full span) within binomial error (3 SE) under
 * a deliberately loose rule that makes false calls common; power grows with pulse count.
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

describe('trustCell', () => {
  it('rounds rate to powers of sqrt 2 and CV to quarters', () => {
    expect(trustCell(5, 0.8)).toEqual({ rateHz: Math.pow(2, 5 / 2), cv: 0.75 });
    expect(trustCell(1, 1)).toEqual({ rateHz: 1, cv: 1 });
    expect(trustCell(0, NaN)).toEqual({ rateHz: 0, cv: 1 });
    expect(trustCell(NaN, 9)).toEqual({ rateHz: 0, cv: 3 });
    expect(trustCell(1e6, 0.01)).toEqual({ rateHz: 400, cv: 0.25 });
  });
});

describe('ruleTrust', () => {
  const p = lightParams({ trustNullSimulations: 100, trustPowerSimulations: 20 });
  const { pulses, endS } = makePulses({ single: 150, trainFrequencies: [20], trains: 5 });
  const sch = lightSchedule(pulses, [0, endS], p);
  const iv = simulationIntervals(sch, p.offsetWindowMs / 1000);
  it('is deterministic and low for the default rule', () => {
    const a = ruleTrust(sch, iv, 4, 1.1, p);
    const b = ruleTrust(sch, iv, 4.1, 0.95, p, createLightScratch());
    expect(JSON.stringify(b)).toBe(JSON.stringify(a)); // same cell, same numbers
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
    expect(ruleTrust(none, new Float64Array(0), 5, 1, p).falseRate).toBeNaN();
    expect(ruleTrust(sch, iv, 0, NaN, p).falseTagged).toBe(0);
  });
});
