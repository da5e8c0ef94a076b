import { describe, expect, it } from 'vitest';
import { extractRaster } from '../../../core/align/extract-raster';
import { groupTrials } from '../../../core/align/group-trials';
import { linkEventsToTrials } from '../../../core/align/link-events-to-trials';
import { orderTrials } from '../../../core/align/order-trials';
import { selectAlignment } from '../../../core/align/select-alignment';
import { InputError } from '../../../core/errors';
import { makeRecording } from '../../helpers/recording';

// Invented session: 4 trials of 10 s; rewards in trials 1, 2, 4; a jump of each kind.
const rec = makeRecording({
  trials: [
    { trial: 1, start: 0, stop: 10, condition: 'standard', covariates: { speed: 1.0, cue: 'low' } },
    { trial: 2, start: 10, stop: 20, condition: 'probe', covariates: { speed: 3.0, cue: 'high' } },
    { trial: 3, start: 20, stop: 30, condition: 'standard', covariates: { speed: 2.0, cue: 'low' } },
    { trial: 4, start: 30, stop: 40, condition: 'probe', covariates: { speed: NaN, cue: '' } },
  ],
  events: [
    { time: 4, label: 'reward' },
    { time: 12, label: 'jump', kind: 'forward' },
    { time: 14, label: 'reward' },
    // its trial column says trial 4 although it lies in trial 3's span: the column wins
    { time: 25, label: 'jump', kind: 'backward', trial: 4 },
    { time: 34, label: 'reward' },
    { time: 50, label: 'reward' }, // after every trial
  ],
  pulses: [{ onset: 41 }, { onset: 42, frequencyHz: 10, train: 7 }],
});

describe('linkEventsToTrials', () => {
  it('uses the trial column when given, else the trial whose [start, stop) holds the event', () => {
    const got = linkEventsToTrials(rec.events.time, rec.events.trial, rec.trials);
    expect([...got]).toEqual([0, 1, 1, 3, 3, -1]);
  });
  it('treats stop as exclusive, finds overlapping trials, and gives -1 for unknown numbers and NaN', () => {
    const trials = makeRecording({
      trials: [
        { trial: 1, start: 0, stop: 10 },
        { trial: 2, start: 5, stop: 6 },
        { trial: 3, start: 10, stop: 12 },
      ],
    }).trials;
    // 10 belongs to trial 3 (stop exclusive); 5.5 to trial 2 (latest start wins); 7 to trial 1 (found past trial 2).
    expect([...linkEventsToTrials([10, 5.5, 7, NaN, 3], [NaN, NaN, NaN, NaN, 99], trials)]).toEqual([2, 1, 0, -1, -1]);
  });
});

describe('selectAlignment', () => {
  it('selects one label with kind and condition', () => {
    const r = selectAlignment(rec, { event: 'reward' });
    expect([...r.times]).toEqual([4, 14, 34, 50]);
    expect(r.condition).toEqual(['standard', 'probe', 'probe', '']);
    expect([...selectAlignment(rec, { event: 'reward', condition: 'probe' }).times]).toEqual([14, 34]);
    const j = selectAlignment(rec, { event: 'jump', kind: 'backward' });
    expect([...j.times]).toEqual([25]);
    expect(j.condition).toEqual(['probe']); // trial 4 by its trial column
  });
  it('aligns on laser pulses with their train frequency as kind', () => {
    const p = selectAlignment(rec, { pulses: true });
    expect(p.source).toBe('pulses');
    expect(p.kind).toEqual(['single', '10 Hz']);
  });
  it('gives an empty set for an unknown label', () => {
    expect(selectAlignment(rec, { event: 'nope' }).times.length).toBe(0);
  });
});

describe('extractRaster', () => {
  it('matches a hand-made raster', () => {
    // Events at 10 and 20 s, window [-1, 1): spikes 9.0, 9.5, 10.2 (event 10; 11.0 excluded), 19.1, 20.7 (event 20).
    const spikes = [8.9, 9.0, 9.5, 10.2, 11.0, 19.1, 20.7, 21.0];
    const r = extractRaster(spikes, [10, 20, NaN], -1, 1);
    expect([...r.offsets]).toEqual([0, 3, 5, 5]);
    expect([...r.times].map((t) => Math.round(t * 1e9) / 1e9)).toEqual([-1, -0.5, 0.2, -0.9, 0.7]);
  });
  it('handles an empty train and no events', () => {
    expect([...extractRaster([], [1, 2], -1, 1).offsets]).toEqual([0, 0, 0]);
    expect(extractRaster([1], [], -1, 1).rows).toBe(0);
  });
});

describe('groupTrials and orderTrials', () => {
  const set = selectAlignment(rec, { event: 'reward' });
  it('groups by condition and by kind in text order', () => {
    const g = groupTrials(set, rec.trials, { by: 'condition' });
    expect(g.map((x) => [x.label, [...x.rows]])).toEqual([
      ['(none)', [3]],
      ['probe', [1, 2]],
      ['standard', [0]],
    ]);
    const jumps = selectAlignment(rec, { event: 'jump' });
    expect(groupTrials(jumps, rec.trials, { by: 'kind' }).map((x) => x.label)).toEqual(['backward', 'forward']);
    expect(groupTrials(set, rec.trials, { by: 'none' }).map((x) => [...x.rows])).toEqual([[0, 1, 2, 3]]);
  });
  it('bins a numeric covariate at quantiles or given edges, leaving out rows without a value', () => {
    // Rewards' trials: speed 1 (trial 1), 3 (trial 2), NaN (trial 4), none (t = 50).
    // Two distinct values, at most nBins: one group per value.
    const q = groupTrials(set, rec.trials, { by: 'covariate', name: 'speed', nBins: 2 });
    expect(q.map((x) => [x.label, [...x.rows]])).toEqual([
      ['speed = 1', [0]],
      ['speed = 3', [1]],
    ]);
    // More distinct values than bins: quantile bins. Speeds 1, 2, 3, 4:
    // numpy.quantile([1, 2, 3, 4], [0, 0.5, 1]) = [1, 2.5, 4] -> bins [1, 2.5) and [2.5, 4].
    const four = makeRecording({
      trials: [1, 2, 3, 4].map((k) => ({ trial: k, start: 10 * (k - 1), stop: 10 * k, covariates: { speed: k } })),
      events: [1, 2, 3, 4].map((k) => ({ time: 10 * k - 5, label: 'reward' })),
    });
    const qb = groupTrials(selectAlignment(four, { event: 'reward' }), four.trials, { by: 'covariate', name: 'speed', nBins: 2 });
    expect(qb.map((x) => [x.label, [...x.rows]])).toEqual([
      ['speed [1, 2.5)', [0, 1]],
      ['speed [2.5, 4]', [2, 3]],
    ]);
    const e = groupTrials(set, rec.trials, { by: 'covariate', name: 'speed', edges: [0, 1.5, 10] });
    expect(e.map((x) => [x.label, [...x.rows]])).toEqual([
      ['speed [0, 1.5)', [0]],
      ['speed [1.5, 10]', [1]],
    ]);
    expect(groupTrials(set, rec.trials, { by: 'covariate', name: 'cue' }).map((x) => x.label)).toEqual(['high', 'low']);
  });
  it('reports an unknown covariate as an input error naming trials.csv', () => {
    expect(() => groupTrials(set, rec.trials, { by: 'covariate', name: 'colour' })).toThrow(InputError);
    expect(() => orderTrials(set, rec.trials, { by: 'covariate', name: 'colour' })).toThrow(/trials\.csv.*colour.*speed, cue/);
  });
  it('orders by time, condition and covariate (missing values last, ties by time)', () => {
    expect([...orderTrials(set, rec.trials, { by: 'time' })]).toEqual([0, 1, 2, 3]);
    expect([...orderTrials(set, rec.trials, { by: 'condition' })]).toEqual([3, 1, 2, 0]);
    expect([...orderTrials(set, rec.trials, { by: 'covariate', name: 'speed' })]).toEqual([0, 1, 2, 3]);
    const order = orderTrials(set, rec.trials, { by: 'covariate', name: 'speed' });
    const rev = Int32Array.from([1, 0, 2, 3]);
    expect([...groupTrials(set, rec.trials, { by: 'condition' }, rev)[1].rows]).toEqual([1, 2]);
    expect(order.length).toBe(4);
  });
});
