import { describe, expect, it } from 'vitest';
import { trialAnchors } from '../../../core/align/trial-anchors';
import { unwarpTime } from '../../../core/align/unwarp-time';
import { warpSpikes } from '../../../core/align/warp-spikes';
import { warpTemplate } from '../../../core/align/warp-template';
import { warpTime } from '../../../core/align/warp-time';
import { warpedPsth } from '../../../core/align/warped-psth';
import { Rng } from '../../../core/random/rng';
import { renewalTrain } from '../../../core/sim/renewal-train';
import { expectClose } from '../../helpers/close';
import { makeRecording } from '../../helpers/recording';

// Invented trials of different durations: tone_on at trial start + 0.5 s, reward 3-5 s later, lick after reward.
const rec = makeRecording({
  trials: [
    { trial: 1, start: 0, stop: 10 },
    { trial: 2, start: 10, stop: 20 },
    { trial: 3, start: 20, stop: 30 },
    { trial: 4, start: 30, stop: 40 },
  ],
  events: [
    { time: 0.5, label: 'tone_on' },
    { time: 3.5, label: 'reward' },
    { time: 3.9, label: 'lick' },
    { time: 10.5, label: 'tone_on' },
    { time: 15.5, label: 'reward' },
    { time: 15.7, label: 'lick' },
    { time: 20.5, label: 'tone_on' },
    { time: 24.5, label: 'reward' },
    { time: 25.0, label: 'lick' },
    { time: 30.5, label: 'tone_on' }, // no reward in trial 4
  ],
});

describe('trialAnchors and warpTemplate', () => {
  const a = trialAnchors(rec, ['tone_on', 'reward', 'lick']);
  it('takes the first event of each label per trial and marks incomplete trials invalid', () => {
    expect([...a.times.subarray(0, 3)]).toEqual([0.5, 3.5, 3.9]);
    expect([...a.valid]).toEqual([1, 1, 1, 0]);
  });
  it('templates each anchor at the median offset from the first anchor', () => {
    // reward - tone_on: 3, 5, 4 -> median 4; lick - tone_on: 3.4, 5.2, 4.5 -> 4.5.
    const t = warpTemplate(a);
    expect(t[0]).toBe(0);
    expectClose(t[1], 4, 1e-12, 'reward');
    expectClose(t[2], 4.5, 1e-12, 'lick');
  });
  it('knows trial_start / trial_stop and rejects non-increasing anchors', () => {
    const b = trialAnchors(rec, ['trial_start', 'reward']);
    expect([...b.times.subarray(0, 2)]).toEqual([0, 3.5]);
    const c = trialAnchors(rec, ['reward', 'tone_on']);
    expect([...c.valid]).toEqual([0, 0, 0, 0]);
    expect(trialAnchors(rec, ['reward']).valid.every((v) => v === 0)).toBe(true); // one anchor cannot warp
  });
});

describe('warpTime', () => {
  const a = trialAnchors(rec, ['tone_on', 'reward', 'lick']);
  const t = warpTemplate(a);
  it('maps every anchor of every trial exactly onto the template', () => {
    for (let r = 0; r < 3; r++) for (let k = 0; k < 3; k++) expect(warpTime(a.times[r * 3 + k], a.times, r * 3, t)).toBe(t[k]);
  });
  it('is linear between anchors, a shift outside them, and inverted by unwarpTime', () => {
    // Trial 2: tone 10.5 -> 0, reward 15.5 -> 4 (slope 4/5); 13 s -> 2.0; before: 10 s -> -0.5; after lick 15.7: 16.7 -> 5.5.
    expectClose(warpTime(13, a.times, 3, t), 2, 1e-12, 'mid segment');
    expectClose(warpTime(10, a.times, 3, t), -0.5, 1e-12, 'pre');
    expectClose(warpTime(16.7, a.times, 3, t), 5.5, 1e-12, 'post');
    for (const x of [9.7, 10.5, 12.1, 15.55, 15.7, 18]) expectClose(unwarpTime(warpTime(x, a.times, 3, t), a.times, 3, t), x, 1e-12, `round trip ${x}`);
  });
});

describe('warpSpikes and warpedPsth', () => {
  it('warps a hand-made raster', () => {
    const a = trialAnchors(rec, ['tone_on', 'reward']);
    const t = warpTemplate(a); // [0, 4]
    // Trial 1 (tone 0.5, reward 3.5, slope 4/3): spikes 0.2 -> -0.3, 2.0 -> 2.0, 3.5 -> 4 (anchor), 3.6 -> 4.1.
    const w = warpSpikes([0.2, 2.0, 3.5, 3.6, 9], a, t, 0.5, 0.5);
    expect(w.rows).toBe(3);
    expect([...w.trialRow]).toEqual([0, 1, 2]);
    expect(w.offsets[1]).toBe(4);
    [-0.3, 2, 4, 4.1].forEach((v, i) => expectClose(w.times[i], v, 1e-12, `spike ${i}`));
    expect(w.times[2]).toBe(4);
  });
  it('keeps a homogeneous Poisson train flat at its rate after warping', () => {
    // Seeded Poisson train, 300 trials whose tone->reward gap varies from 2 to 6 s.
    const rng = new Rng(77);
    const trials = [];
    const events = [];
    for (let k = 0; k < 300; k++) {
      const s = 10 * k;
      trials.push({ trial: k + 1, start: s, stop: s + 10 });
      events.push({ time: s + 1, label: 'tone_on' }, { time: s + 1 + 2 + 4 * rng.uniform(), label: 'reward' });
    }
    const r = makeRecording({ trials, events });
    const train = renewalTrain(rng, 15, 0, 3000, 1, 0);
    const a = trialAnchors(r, ['tone_on', 'reward']);
    const tpl = warpTemplate(a);
    const w = warpSpikes(train, a, tpl, 0.5, 0.5);
    const p = warpedPsth(w, a, tpl, 250);
    // Exposure per bin >= 300 x 0.25 x (2/4) s: SE <= sqrt(15 / 37.5) = 0.63 Hz; allow 4 SE.
    for (let j = 0; j < p.rateHz.length; j++) expect(Math.abs(p.rateHz[j] - 15), `bin ${j}`).toBeLessThan(4 * 0.63);
    // Exposure of each trial sums to its real window length (pre + anchors span + post).
    const nb = p.binStartS.length;
    let e0 = 0;
    for (let j = 0; j < nb; j++) e0 += p.exposureS[j];
    expectClose(e0, 0.5 + (a.times[1] - a.times[0]) + 0.5 + (nb * 0.25 - (tpl[1] + 1)), 1e-9, 'exposure of trial 1');
  });
});

describe('warpedResponse', () => {
  it('shares one template across conditions and counts the trials left out', async () => {
    const { warpedResponse } = await import('../../../core/align/warped-response');
    const r = makeRecording({
      units: [{ id: 'u', spikes: [1.0, 3.0, 11.0, 21.0] }],
      trials: [
        { trial: 1, start: 0, stop: 10, condition: 'a' },
        { trial: 2, start: 10, stop: 20, condition: 'b' },
        { trial: 3, start: 20, stop: 30, condition: 'a' },
        { trial: 4, start: 30, stop: 40, condition: 'b' },
      ],
      events: [
        { time: 0.5, label: 'tone_on' },
        { time: 3.5, label: 'reward' },
        { time: 10.5, label: 'tone_on' },
        { time: 15.5, label: 'reward' },
        { time: 20.5, label: 'tone_on' },
        { time: 24.5, label: 'reward' },
        { time: 30.5, label: 'tone_on' },
      ],
    });
    const w = warpedResponse(r, 0, ['tone_on', 'reward'], { binMs: 500, preS: 0.5, postS: 0.5, groupBy: 'condition' });
    expect(w.invalidTrials).toBe(1);
    expectClose(w.template[1], 4, 1e-12, 'median of 3, 5, 4');
    expect(w.groups.map((g) => [g.label, g.nTrials])).toEqual([
      ['a', 2],
      ['b', 1],
    ]);
    // Trial 2 (b): tone 10.5 -> 0, reward 15.5 -> 4; its spike at 11.0 maps to 0.4 s (slope 4/5) -> bin [0, 0.5) = bin 1.
    expect([...w.groups[1].psth.counts.subarray(0, 3)]).toEqual([0, 1, 0]);
  });
});
