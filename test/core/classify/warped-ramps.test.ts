/**
 * Ramp window anchored on two events with time-warping (ramp.anchorEvent),
 * on the project simulator, whose ramps follow the sweep's progress from
 * sweep_on to reward (core/sim/task-profile.ts). Conditions differ in sweep
 * duration (standard 4 s, fast 2.5 s). Expected:
 * - fixed window [-3, 0) s: the fast condition's ramp is steeper per second,
 *   so the rank-sum test of per-trial slopes separates the conditions;
 * - warped window (sweep_on -> reward, fast trials warped onto the standard
 *   template): slopes per template second agree, so the difference test is
 *   at its nominal rate, and the ramps are still found.
 */
import { describe, expect, it } from 'vitest';
import { classifyRamps } from '../../../core/classify';
import { DEFAULTS } from '../../../core/defaults';
import { DEFAULT_TASK, defaultScenario, simulateSession, unitSpec } from '../../../core/sim';

const bound = (n: number) => n * 0.05 + 3 * Math.sqrt(n * 0.05 * 0.95);

describe('time-warped ramp window', () => {
  const units = Array.from({ length: 40 }, (_, i) =>
    unitSpec({ id: `r${i + 1}`, rateHz: [6, 12, 20][i % 3], shape: [1, 2.5][i % 2], ramp: { gain: i % 4 === 3 ? -0.6 : 1.2, power: 1 } }),
  );
  const task = {
    ...DEFAULT_TASK,
    trials: 260,
    conditions: [
      { name: 'standard', weight: 0.5, sweepS: 4 },
      { name: 'fast', weight: 0.5, sweepS: 2.5 },
    ],
  };
  const sim = simulateSession(defaultScenario({ seed: 515, light: null, task, units }));

  it('fixed window: conditions of different sweep speed differ in slope', () => {
    const r = classifyRamps(sim.recording, DEFAULTS.ramp);
    expect(r.mode).toBe('fixed');
    const fast = r.conditions.find((c) => c.condition === 'fast')!;
    const sig = Array.from(fast.diffP).filter((p) => p < 0.05).length;
    expect(sig).toBeGreaterThanOrEqual(30);
  });

  it('warped window: ramps found, per-template-second slopes agree across conditions', () => {
    const r = classifyRamps(sim.recording, { ...DEFAULTS.ramp, anchorEvent: 'sweep_on' });
    expect(r.mode).toBe('warped');
    expect(r.note).toContain('time-warped onto 4.00 s');
    // Template 4 s in bins of ~0.1 s; the axis ends at the reward.
    expect(r.centresS.length).toBe(40);
    expect(r.centresS[r.centresS.length - 1]).toBeCloseTo(-0.05, 10);
    const found = r.verdict.filter((v, i) => v === (i % 4 === 3 ? 'down' : 'up')).length;
    expect(found / 40).toBeGreaterThanOrEqual(0.9);
    const fast = r.conditions.find((c) => c.condition === 'fast')!;
    const std = r.conditions.find((c) => c.condition === 'standard')!;
    expect(fast.nTrials).toBeGreaterThan(100);
    const sig = Array.from(fast.diffP).filter((p) => p < 0.05).length;
    expect(sig).toBeLessThanOrEqual(bound(40));
    // Expected slope per template second: gain x rate / 4 s (linear ramp over the sweep).
    for (let i = 0; i < 40; i++) {
      const expected = (units[i].ramp!.gain * units[i].rateHz) / 4;
      expect(Math.abs(std.slopeHzPerS[i] - expected)).toBeLessThan(Math.max(0.6, 0.35 * Math.abs(expected)));
    }
  });

  it('says why there is no warped window without the anchor event', () => {
    const r = classifyRamps(sim.recording, { ...DEFAULTS.ramp, anchorEvent: 'no_such_event' });
    expect(r.nTrials).toBe(0);
    expect(r.verdict.every((v) => v === 'flat')).toBe(true);
    expect(r.reason[0]).toBe('no trials of condition "standard" with "no_such_event" before "reward"');
  });
});
