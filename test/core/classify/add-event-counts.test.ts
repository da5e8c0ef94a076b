/** addEventCounts equals the column sums of binCounts (core/align, tested against hand counts). */
import { describe, expect, it } from 'vitest';
import { binCounts } from '../../../core/align/bin-counts';
import { addEventCounts } from '../../../core/classify';
import { Rng } from '../../../core/random/rng';
import { renewalTrain } from '../../../core/sim/renewal-train';

describe('addEventCounts', () => {
  it('sums binCounts over events, at an offset, including edge spikes and NaN events', () => {
    const st = renewalTrain(new Rng(4), 20, 0, 100, 1);
    const edges = Float64Array.of(...st.slice(0, 50), 10, 10.1, 10.2);
    const spikes = Float64Array.from([...edges].sort((a, b) => a - b));
    const align = Float64Array.of(10, 30.05, NaN, 55.5, 99.9);
    const m = binCounts(spikes, align, -0.3, 0.1, 13);
    const out = new Float64Array(20);
    addEventCounts(spikes, align, -0.3, 0.1, 13, out, 4);
    for (let j = 0; j < 13; j++) {
      let s = 0;
      for (let e = 0; e < align.length; e++) s += m[e * 13 + j];
      expect(out[4 + j]).toBe(s);
    }
    expect(out[0] + out[1] + out[2] + out[3] + out[17] + out[18] + out[19]).toBe(0);
  });
  it('sums binCounts over events on a fast train with long gaps between events (windows found from a rate guess), in and out of order', () => {
    const rng = new Rng(9);
    const spikes = renewalTrain(rng, 80, 0, 400, 1);
    for (const align of [Float64Array.from({ length: 60 }, (_, k) => 3 + 6.5 * k + rng.uniform()), Float64Array.from({ length: 60 }, () => 400 * rng.uniform())]) {
      const m = binCounts(spikes, align, -3, 0.1, 30);
      const out = new Float64Array(30);
      addEventCounts(spikes, align, -3, 0.1, 30, out);
      for (let j = 0; j < 30; j++) {
        let s = 0;
        for (let e = 0; e < align.length; e++) s += m[e * 30 + j];
        expect(out[j]).toBe(s);
      }
    }
  });
});

describe('rampCounts with a reused buffer', () => {
  it('gives the same counts as binCounts, unit after unit', async () => {
    const { rampCounts, rampPlan } = await import('../../../core/classify');
    const { DEFAULTS } = await import('../../../core/defaults');
    const { taskSession } = await import('../../helpers/task-session');
    const rec = taskSession({ nTrials: 30, units: [{ rateHz: 20, shape: 1 }, { rateHz: 5, shape: 2 }], seed: 9 });
    const plan = rampPlan(rec, DEFAULTS.ramp, 'standard');
    const buffer = new Float64Array(plan.nTrials * plan.centresS.length);
    for (const u of rec.units) {
      const want = binCounts(u.spikeTimes, plan.times, plan.startS, plan.binS, plan.centresS.length);
      expect(Array.from(rampCounts(u.spikeTimes, plan, buffer).counts)).toEqual(Array.from(want));
    }
  });
});
