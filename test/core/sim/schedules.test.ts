/**
 * Pulse and trial schedules against the protocol they are asked for
 * (DESIGN.md section 6: ~300 single 5 ms pulses near 1 Hz, then 10-pulse
 * trains at 10 and 20 Hz; the auditory countdown's 4 s sweep then reward).
 * Exact checks except where stated.
 */
import { describe, expect, it } from 'vitest';
import { Rng } from '../../../core/random/rng';
import { DEFAULT_LIGHT, DEFAULT_TASK } from '../../../core/sim/default-scenario';
import { lightSchedule } from '../../../core/sim/light-schedule';
import { taskSchedule } from '../../../core/sim/task-schedule';
import { lightFollow } from '../../../core/sim/light-follow';

describe('lightSchedule', () => {
  const s = lightSchedule(DEFAULT_LIGHT, 100, new Rng(3));
  const p = s.pulses;
  it('delivers the single pulses and the trains asked for', () => {
    expect(p.onset.length).toBe(300 + 100 + 100);
    expect(p.onset[0]).toBe(100);
    for (let i = 1; i < p.onset.length; i++) expect(p.onset[i]).toBeGreaterThan(p.onset[i - 1] + p.duration[i - 1]);
    expect(p.duration.every((d) => d === 0.005)).toBe(true);
    expect(p.powerMw.every((d) => d === 5)).toBe(true);
    // singles: own train ids, no frequency, 0.8-1.2 s apart
    for (let i = 0; i < 300; i++) {
      expect(p.train[i]).toBe(i);
      expect(Number.isNaN(p.frequencyHz[i])).toBe(true);
      if (i > 0) {
        const ipi = p.onset[i] - p.onset[i - 1];
        expect(ipi).toBeGreaterThanOrEqual(0.8);
        expect(ipi).toBeLessThanOrEqual(1.2);
      }
    }
    // trains: 10 pulses sharing an id, period 1/f
    const ids = new Map<number, number[]>();
    for (let i = 300; i < p.onset.length; i++) ids.set(p.train[i], [...(ids.get(p.train[i]) ?? []), i]);
    expect(ids.size).toBe(20);
    let k = 0;
    for (const members of ids.values()) {
      const f = k < 10 ? 10 : 20;
      expect(members.length).toBe(10);
      members.forEach((i, j) => {
        expect(p.frequencyHz[i]).toBe(f);
        expect(s.indexInTrain[i]).toBe(j);
        if (j > 0) expect(p.onset[i] - p.onset[i - 1]).toBeCloseTo(1 / f, 12);
      });
      k++;
    }
    expect(s.endS).toBeCloseTo(p.onset[p.onset.length - 1] + 0.005, 12);
    // about six minutes
    expect(s.endS - 100).toBeGreaterThan(330);
    expect(s.endS - 100).toBeLessThan(400);
  });
});

describe('lightFollow', () => {
  it('answers the first pulse like a single pulse and fades along fast trains', () => {
    expect(lightFollow(0, NaN, 0.8, 20, 0.8, 2)).toEqual({ probability: 0.8, latencyShiftMs: 0 });
    expect(lightFollow(0, 40, 0.8, 20, 0.8, 2)).toEqual({ probability: 0.8, latencyShiftMs: 0 });
    // f = followHalf: steady fraction 1/2; pulse 9: w = 0.8^9
    const w = 0.8 ** 9;
    const r = lightFollow(9, 20, 0.8, 20, 0.8, 2);
    expect(r.probability).toBeCloseTo(0.8 * (0.5 + 0.5 * w), 14);
    expect(r.latencyShiftMs).toBeCloseTo(2 * 0.5 * (1 - w), 14);
    expect(lightFollow(9, 40, 0.8, 20, 0.8, 2).probability).toBeLessThan(r.probability);
  });
});

describe('taskSchedule', () => {
  const s = taskSchedule(DEFAULT_TASK, 60, new Rng(4));
  it('lays out sweep_on, jump and reward per trial as specified', () => {
    const n = DEFAULT_TASK.trials;
    expect(s.trials.trial.length).toBe(n);
    const sweep: Record<string, number> = { standard: 4, fast: 2.5, probe: 4 };
    for (let i = 0; i < n; i++) {
      const c = s.trials.condition[i];
      expect(s.sweepOnS[i] - s.trials.start[i]).toBeCloseTo(0.5, 12);
      expect(s.rewardS[i] - s.sweepOnS[i]).toBeCloseTo(sweep[c] - s.jumpShiftS[i], 12);
      expect(s.trials.stop[i] - s.rewardS[i]).toBeCloseTo(1.5, 12);
      if (i > 0) {
        const iti = s.trials.start[i] - s.trials.stop[i - 1];
        expect(iti).toBeGreaterThanOrEqual(2);
        expect(iti).toBeLessThanOrEqual(4);
      }
      if (c === 'probe') {
        expect(['forward', 'backward']).toContain(s.jumpKind[i]);
        const after = s.jumpS[i] - s.sweepOnS[i];
        expect(after).toBeGreaterThanOrEqual(1);
        expect(after).toBeLessThanOrEqual(2);
        expect(s.jumpShiftS[i]).toBe(s.jumpKind[i] === 'forward' ? 1.5 : -1.5);
      } else {
        expect(s.jumpKind[i]).toBe('');
        expect(Number.isNaN(s.jumpS[i])).toBe(true);
      }
    }
    // every condition occurs; events are sorted and labelled
    expect(new Set(s.trials.condition)).toEqual(new Set(['standard', 'fast', 'probe']));
    for (let i = 1; i < s.events.time.length; i++) expect(s.events.time[i]).toBeGreaterThan(s.events.time[i - 1]);
    const labels = new Set(s.events.label);
    expect(labels).toEqual(new Set(['sweep_on', 'jump', 'reward']));
    const jumps = s.events.label.filter((l) => l === 'jump').length;
    expect(jumps).toBe(s.trials.condition.filter((c) => c === 'probe').length);
    s.events.label.forEach((l, i) => expect(s.events.kind[i] !== '').toBe(l === 'jump'));
  });
  it('refuses a forward jump that would end the sweep', () => {
    expect(() => taskSchedule({ ...DEFAULT_TASK, jumpShiftS: 3 }, 0, new Rng(1))).toThrow(/forward jump/);
  });
});
