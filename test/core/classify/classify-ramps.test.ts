/**
 * Ramp classification on simulated sessions (test/helpers/task-session.ts:
 * our own model with varied ISI shapes, rates, trial counts and trial gains).
 * Criteria (issue 5): flat units called up/down at no more than the nominal
 * rate; ramps of >= 40 % change over the 3 s window found in >= 90 % of units.
 * Binomial slack: a count of false calls among N flat units is compared with
 * the nominal 5 % plus 3 binomial standard deviations.
 */
import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import { classifyRamps } from '../../../core/classify';
import { taskSession, type UnitModel } from '../../helpers/task-session';

const P = DEFAULTS.ramp;
const shapes = [0.6, 1, 2.5, 5];
const rates = [3, 6, 12, 25];

function flatUnits(n: number, offset = 0): UnitModel[] {
  return Array.from({ length: n }, (_, i) => ({
    rateHz: rates[(i + offset) % rates.length],
    shape: shapes[Math.floor((i + offset) / rates.length) % shapes.length],
    gainSd: i % 3 === 0 ? 0.3 : 0,
  }));
}

describe('classifyRamps on simulated sessions', () => {
  it('calls flat units up/down at no more than the nominal rate; per-unit p is calibrated', () => {
    let calls = 0;
    let small = 0;
    let total = 0;
    for (const [seed, nTrials] of [[11, 60], [12, 150], [13, 240]] as const) {
      const rec = taskSession({ nTrials, units: flatUnits(120, seed), seed });
      const r = classifyRamps(rec, P);
      calls += r.verdict.filter((v) => v !== 'flat').length;
      small += r.units.filter((u) => u.p < 0.05).length;
      total += r.units.length;
      for (const reason of r.reason) expect(reason.length).toBeGreaterThan(10);
    }
    const bound = total * 0.05 + 3 * Math.sqrt(total * 0.05 * 0.95);
    expect(calls).toBeLessThanOrEqual(bound);
    expect(small).toBeLessThanOrEqual(bound);
    // Not absurdly conservative either (p < 0.05 in at least 1 % of null units).
    expect(small).toBeGreaterThanOrEqual(total * 0.01);
  });

  it('finds >= 90 % of ramps with >= 40 % change, with the right sign, among flat units', () => {
    const units: UnitModel[] = [];
    const truth: string[] = [];
    for (let i = 0; i < 80; i++) {
      const up = i % 2 === 0;
      const change = 0.4 + 0.4 * ((i % 5) / 4);
      units.push({ rateHz: [4, 8, 15, 30][i % 4], shape: shapes[i % shapes.length], rampChange: up ? change : -change / (1 + change), gainSd: i % 4 === 1 ? 0.25 : 0 });
      truth.push(up ? 'up' : 'down');
    }
    for (const u of flatUnits(80)) {
      units.push(u);
      truth.push('flat');
    }
    const rec = taskSession({ nTrials: 100, probeFraction: 0.2, units, seed: 21 });
    const r = classifyRamps(rec, P);
    expect(r.nTrials).toBeGreaterThan(60);
    const ramps = truth.map((t, i) => [t, r.verdict[i]] as const).filter(([t]) => t !== 'flat');
    const found = ramps.filter(([t, v]) => t === v).length;
    expect(found / ramps.length).toBeGreaterThanOrEqual(0.9);
    expect(ramps.some(([t, v]) => v !== 'flat' && v !== t)).toBe(false);
    const flatCalls = truth.filter((t, i) => t === 'flat' && r.verdict[i] !== 'flat').length;
    expect(flatCalls).toBeLessThanOrEqual(80 * 0.05 + 3 * Math.sqrt(80 * 0.05 * 0.95));
    // Effect sizes: a +80 % ramp at 15 Hz rises ~0.27 * 15 = 4 Hz/s; relative slope and late/early agree in sign.
    for (let i = 0; i < 80; i++) {
      const u = r.units[i];
      if (r.verdict[i] === 'up') expect(u.lateEarlyRatio).toBeGreaterThan(1);
      if (r.verdict[i] === 'down') expect(u.slopeRelPerS).toBeLessThan(0);
    }
  });

  it('estimates the slope: a linear +60 % ramp over 3 s at 10 Hz rises 2 Hz/s', () => {
    const units = Array.from({ length: 20 }, () => ({ rateHz: 10, shape: 1, rampChange: 0.6 }));
    const r = classifyRamps(taskSession({ nTrials: 200, units, seed: 5 }), P);
    const mean = r.units.reduce((s, u) => s + u.slopeHzPerS, 0) / 20;
    // 20 units x 200 trials: SE of the mean slope ~0.05 Hz/s; tolerance 0.2 Hz/s.
    expect(Math.abs(mean - 2)).toBeLessThan(0.2);
    for (const u of r.units) {
      expect(u.r2).toBeGreaterThan(0.5);
      expect(u.glmSlopePerS).toBeGreaterThan(0);
      expect(u.glmDispersion).toBeGreaterThan(0.8);
      expect(u.glmDispersion).toBeLessThan(1.3);
    }
  });

  it('reports overdispersion for trial-to-trial gain variability and bursty trains', () => {
    const units = [{ rateHz: 10, shape: 0.4, gainSd: 0.5 }];
    const r = classifyRamps(taskSession({ nTrials: 100, units, seed: 6 }), P);
    expect(r.units[0].glmDispersion).toBeGreaterThan(1.5);
  });

  it('selects the reference condition and compares conditions', () => {
    const units: UnitModel[] = Array.from({ length: 30 }, (_, i) => ({
      rateHz: 12,
      shape: [1, 3][i % 2],
      rampByCondition: { standard: 0.2, fast: 1.2 },
    }));
    const rec = taskSession({ nTrials: 200, otherConditions: [{ label: 'fast', fraction: 0.5 }], units, seed: 31 });
    const r = classifyRamps(rec, P);
    const nStd = Array.from(rec.trials.condition).filter((c) => c === 'standard').length;
    expect(r.nTrials).toBe(nStd);
    const fast = r.conditions.find((c) => c.condition === 'fast')!;
    const std = r.conditions.find((c) => c.condition === 'standard')!;
    expect(Array.from(std.diffP).every((p) => Number.isNaN(p))).toBe(true);
    const sig = Array.from(fast.diffP).filter((p) => p < 0.05).length;
    expect(sig).toBeGreaterThanOrEqual(27);
    for (let u = 0; u < 30; u++) expect(fast.slopeHzPerS[u]).toBeGreaterThan(std.slopeHzPerS[u]);
  });

  it('uses all trials when the trials carry no condition, and says so', () => {
    const rec = taskSession({ nTrials: 30, standardLabel: '', units: flatUnits(2), seed: 41 });
    const r = classifyRamps(rec, P);
    expect(r.nTrials).toBe(30);
    expect(r.note).toContain('no condition labels');
  });

  it('without reward events every unit is flat with the reason and NaN numbers', () => {
    const rec = taskSession({ nTrials: 10, units: flatUnits(3), seed: 42 });
    const noReward = { ...rec, events: { ...rec.events, label: rec.events.label.map((l) => (l === 'reward' ? 'other' : l)) } };
    const r = classifyRamps(noReward, P);
    expect(r.verdict).toEqual(['flat', 'flat', 'flat']);
    expect(r.reason[0]).toBe('no "reward" events');
    expect(r.units[0].p).toBeNaN();
    expect(r.units[0].slopeHzPerS).toBeNaN();
    expect(r.q[0]).toBeNaN();
  });

  it('with fewer than minTrials trials the verdict is flat with the reason', () => {
    const rec = taskSession({ nTrials: 4, units: [{ rateHz: 20, shape: 1, rampChange: 2 }], seed: 43 });
    const r = classifyRamps(rec, P);
    expect(r.verdict[0]).toBe('flat');
    expect(r.reason[0]).toContain('only 4 trials');
    expect(r.units[0].slopeHzPerS).toBeGreaterThan(0);
  });
});
