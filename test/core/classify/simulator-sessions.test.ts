/**
 * Ramp and jump verdicts judged against the project's session simulator
 * (core/sim, written independently of the classifiers: time-rescaled renewal
 * trains, ramps that follow the sweep's progress with curvature, bursts,
 * dips and steps to jumps, reward answers, slow drift). Truth comes from the
 * simulator's record per unit. Criteria (issue 5):
 * - units without an effect are called at no more than the nominal rate
 *   (5 % plus 3 binomial SD);
 * - clear ramps (expected change >= 40 % of the spontaneous rate over the
 *   3 s window, from the truth's exact slope) found in >= 90 %, never with
 *   the wrong sign;
 * - clear jump answers (expected change at least 4 standard errors of a
 *   Poisson paired difference: |delta| >= 4 sqrt(2 rate / 0.3 s / events))
 *   found in >= 90 %;
 * - lasting steps are not reported as transients.
 */
import { describe, expect, it } from 'vitest';
import { classifyJumps, classifyRamps } from '../../../core/classify';
import { DEFAULTS } from '../../../core/defaults';
import { DEFAULT_TASK, defaultScenario, nullUnits, populationUnits, simulateSession } from '../../../core/sim';

const bound = (n: number) => n * 0.05 + 3 * Math.sqrt(n * 0.05 * 0.95);

describe('verdicts on sessions from the project simulator', () => {
  const seed = 2024;
  const mix = {
    direct: 0, indirect: 0, inhibited: 0, artefact: 0, rampUp: 40, rampDown: 40, jumpBurst: 30, jumpDip: 30, jumpStep: 30,
    reward: 20, maxDrift: 0.2, channels: 64, pitchUm: 20, otherMedianHz: 5,
  };
  const task = {
    ...DEFAULT_TASK,
    trials: 320,
    conditions: [
      { name: 'standard', weight: 0.6, sweepS: 4 },
      { name: 'fast', weight: 0.1, sweepS: 2.5 },
      { name: 'probe', weight: 0.3, sweepS: 4, probe: true },
    ],
  };
  const sim = simulateSession(defaultScenario({ seed, light: null, task, units: [...nullUnits(80, seed), ...populationUnits(150, seed, mix)] }));
  const isNull = sim.truth.map((t) => t.unit.startsWith('n'));

  it('ramps: null units at the nominal rate; clear ramps found with the right sign', () => {
    const r = classifyRamps(sim.recording, DEFAULTS.ramp);
    const nulls = sim.truth.flatMap((_, i) => (isNull[i] ? [i] : []));
    expect(nulls.filter((i) => r.verdict[i] !== 'flat').length).toBeLessThanOrEqual(bound(nulls.length));
    expect(nulls.filter((i) => r.units[i].p < 0.05).length).toBeLessThanOrEqual(bound(nulls.length));
    const clear = sim.truth.flatMap((t, i) => (t.ramp !== 'flat' && (Math.abs(t.rampSlopeHzPerS) * 3) / t.rateHz >= 0.4 ? [i] : []));
    expect(clear.length).toBeGreaterThan(30);
    const found = clear.filter((i) => r.verdict[i] === sim.truth[i].ramp).length;
    expect(found / clear.length).toBeGreaterThanOrEqual(0.9);
    expect(clear.some((i) => r.verdict[i] !== 'flat' && r.verdict[i] !== sim.truth[i].ramp)).toBe(false);
  });

  it('jumps: null units at the nominal rate; clear answers found; steps not called transient', () => {
    const j = classifyJumps(sim.recording, DEFAULTS.jump);
    expect(j.kinds.map((k) => k.kind)).toEqual(['backward', 'forward']);
    for (const k of j.kinds) {
      expect(k.nEvents).toBeGreaterThan(30);
      const nulls = sim.truth.flatMap((_, i) => (isNull[i] ? [i] : []));
      expect(nulls.filter((i) => k.verdict[i] !== 'none').length, `null calls, ${k.kind}`).toBeLessThanOrEqual(bound(nulls.length));
      expect(nulls.filter((i) => k.units[i].p < 0.05).length, `null p < 0.05, ${k.kind}`).toBeLessThanOrEqual(bound(nulls.length));
      const se = (rate: number) => Math.sqrt((2 * rate) / 0.3 / k.nEvents);
      const clear = sim.truth.flatMap((t, i) => {
        const a = t.jump[k.kind];
        return a && a.answer !== 'none' && Math.abs(a.expectedDeltaHz) >= 4 * se(t.rateHz) ? [i] : [];
      });
      expect(clear.length).toBeGreaterThan(15);
      const found = clear.filter((i) => k.verdict[i] === sim.truth[i].jump[k.kind].answer).length;
      expect(found / clear.length, `clear ${k.kind} answers found`).toBeGreaterThanOrEqual(0.9);
      const steps = sim.truth.flatMap((t, i) => (t.jump[k.kind]?.mechanism === 'step' && k.verdict[i] !== 'none' ? [i] : []));
      expect(steps.filter((i) => k.shape[i] === 'transient').length).toBeLessThanOrEqual(bound(steps.length));
    }
  });
});
