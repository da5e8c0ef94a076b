/**
 * The ramp over a sampled behavioural variable (progress ramp, issue 5).
 * Sources: occupancy and spike counts are checked against values worked out
 * by hand on piecewise-linear paths (the definition in progressOccupancy's
 * header); the occupancy-weighted slope against ordinary least squares on
 * points repeated by their integer weights (a weighted fit with integer
 * weights equals the unweighted fit of the repeated data: textbook identity,
 * e.g. Draper & Smith, Applied Regression Analysis, weighted least squares,
 * from memory), with linearFit itself checked on NIST StRD Norris. The
 * Poisson GLM with offset is checked in test/core/stats/poisson-glm.test.ts
 * (SciPy fixture). Simulations: our own approach model below (varied speeds,
 * gamma ISI shapes, trial gains); criteria of issue 5: flat units called at
 * no more than the nominal 5 % (+ 3 binomial SD), >= 90 % of clear
 * position-dependent units found with the right sign.
 */
import { describe, expect, it } from 'vitest';
import { classifyProgressRamps, progressOccupancy, progressRampUnit, progressSpikeCounts, rampStep } from '../../../core/classify';
import { DEFAULTS, type Parameters } from '../../../core/defaults';
import { InputError } from '../../../core/errors';
import { emptyPulses } from '../../../core/model/empty';
import type { Recording, Unit } from '../../../core/model/types';
import { Rng } from '../../../core/random/rng';
import { renewalTrain } from '../../../core/sim/renewal-train';
import { linearFit } from '../../../core/stats';
import { close } from '../../helpers/close';

const EPS = 1e-12;

describe('progressOccupancy and progressSpikeCounts (worked by hand)', () => {
  // Path: x = 0 at 0 s, 1 at 1 s, stays 1 until 2 s, 0.5 at 3 s. Bins of 0.25 over [0, 1].
  const time = Float64Array.from([0, 1, 2, 3]);
  const x = Float64Array.from([0, 1, 1, 0.5]);

  it('splits each linear segment by the share of its value range in each bin', () => {
    const o = progressOccupancy(time, x, [0], [3], 0, 0.25, 4);
    // 0-1 s: 0.25 s per bin; 1-2 s at x = 1 (top edge, last bin closed): 1 s in bin 4;
    // 2-3 s from 1 to 0.5: 0.5 s in bin 3 and 0.5 s in bin 4.
    [0.25, 0.25, 0.75, 1.75].forEach((v, j) => close(o[j], v, 0, EPS, `bin ${j}`));
  });

  it('counts nothing outside the samples or the range; windows are rows', () => {
    const o = progressOccupancy(time, x, [-1, 0.5, 5], [0.5, 1.5, 6], 0, 0.25, 2); // range [0, 0.5]
    // Window 1: [-1, 0.5) -> only [0, 0.5): 0.25 s in each bin.
    close(o[0], 0.25, 0, EPS);
    close(o[1], 0.25, 0, EPS);
    // Window 2: [0.5, 1.5): x from 0.5 up: only the instant at 0.5, no time inside [0, 0.5].
    close(o[2], 0, 0, EPS);
    close(o[3], 0, 0, EPS);
    // Window 3: after the last sample.
    expect(o[4] + o[5]).toBe(0);
  });

  it('gives each spike the interpolated value at its time', () => {
    const spikes = Float64Array.from([0.1, 0.6, 1.5, 2.5, 2.9, 3.5]);
    const c = progressSpikeCounts(spikes, time, x, [0], [4], 0, 0.25, 4, new Float64Array(4));
    // 0.1 -> 0.1 (bin 1); 0.6 -> 0.6 (bin 3); 1.5 -> 1 (bin 4, closed); 2.5 -> 0.75 (bin 4);
    // 2.9 -> 0.55 (bin 3); 3.5 after the last sample: not counted.
    expect(Array.from(c)).toEqual([1, 0, 2, 2]);
  });
});

describe('progressSpikeCounts on irregular samples', () => {
  it('equals a brute-force count (every sample scanned for every spike), with and without window hints', () => {
    const rng = new Rng(9);
    const st: number[] = [];
    for (let t = 0; t < 200; t += 0.005 + 0.06 * rng.uniform() + (rng.uniform() < 0.01 ? 2 : 0)) st.push(t); // irregular, with gaps
    const time = Float64Array.from(st);
    const x = Float64Array.from(time, (t) => Math.sin(t / 3) + 0.1 * rng.normal());
    const spikes = Float64Array.from({ length: 3000 }, () => -5 + 210 * rng.uniform()).sort();
    const starts = Float64Array.from({ length: 40 }, (_, k) => -2 + 5 * k);
    const stops = Float64Array.from(starts, (a) => a + 3);
    const [lo, w, nb] = [-0.8, 0.2, 8];
    const want = new Float64Array(starts.length * nb);
    starts.forEach((a, k) => {
      for (const t of spikes) {
        if (t < a || t >= stops[k] || t < time[0] || t > time[time.length - 1]) continue;
        let i = 0;
        while (i < time.length - 2 && time[i + 1] <= t) i++;
        const v = x[i] + ((x[i + 1] - x[i]) * (t - time[i])) / (time[i + 1] - time[i]);
        if (v < lo || v > lo + nb * w) continue;
        want[k * nb + Math.min(nb - 1, Math.floor((v - lo) / w))]++;
      }
    });
    const got = progressSpikeCounts(spikes, time, x, starts, stops, lo, w, nb, new Float64Array(want.length));
    expect(Array.from(got)).toEqual(Array.from(want));
    const hints = Int32Array.from(starts, (a) => Math.max(0, time.findIndex((t) => t >= a)));
    expect(Array.from(progressSpikeCounts(spikes, time, x, starts, stops, lo, w, nb, new Float64Array(want.length), hints))).toEqual(Array.from(want));
  });
});

describe('progressRampUnit', () => {
  it('per-trial slope = OLS on points repeated by their integer occupancy; pooled slope likewise', () => {
    const centres = Float64Array.from([0.5, 1.5, 2.5, 3.5]);
    // Two trials; occupancy in whole seconds so the repeated-points identity applies.
    const occ = Float64Array.from([1, 2, 3, 0, 2, 1, 1, 4]);
    const counts = Float64Array.from([2, 3, 9, 0, 10, 4, 3, 2]);
    const r = progressRampUnit(counts, occ, 2, centres, 1);
    for (let k = 0; k < 2; k++) {
      const xs: number[] = [];
      const ys: number[] = [];
      for (let j = 0; j < 4; j++) for (let m = 0; m < occ[k * 4 + j]; m++) {
        xs.push(centres[j]);
        ys.push(counts[k * 4 + j] / occ[k * 4 + j]);
      }
      close(r.trialSlopes[k], linearFit(xs, ys).slope, 1e-12, 1e-12, `trial ${k}`);
    }
    const xs: number[] = [];
    const ys: number[] = [];
    for (let j = 0; j < 4; j++) {
      const w = occ[j] + occ[4 + j];
      for (let m = 0; m < w; m++) {
        xs.push(centres[j]);
        ys.push((counts[j] + counts[4 + j]) / w);
      }
    }
    close(r.slopeHzPerUnit, linearFit(xs, ys).slope, 1e-12, 1e-12, 'pooled');
    close(r.meanRateHz, 33 / 14, 1e-15);
    expect(r.nTrials).toBe(2);
  });

  it('edge cases: a trial in one bin has no slope; silent units have slope 0 and no test', () => {
    const centres = Float64Array.from([0.5, 1.5]);
    const one = progressRampUnit(Float64Array.from([3, 0, 1, 2]), Float64Array.from([1, 0, 1, 1]), 2, centres, 1);
    expect(one.trialSlopes[0]).toBeNaN();
    close(one.trialSlopes[1], 1, 1e-15);
    expect(one.nTrials).toBe(1);
    const silent = progressRampUnit(new Float64Array(8), new Float64Array(8).fill(1), 4, centres, 1);
    expect(Array.from(silent.trialSlopes)).toEqual([0, 0, 0, 0]);
    expect(silent.p).toBeNaN();
    expect(silent.glmSlopePerUnit).toBeNaN();
  });
});

// ---- simulation ------------------------------------------------------------------------------

interface ApproachUnit {
  rateHz: number;
  shape: number;
  /** Rate = rateHz (1 + change * progress): change per unit of progress (0 = flat). */
  change: number;
  gainSd: number;
}

/**
 * Our own approach model: each trial, progress runs 0 -> 1 at constant speed
 * over 2-6 s (drawn per trial) and reward comes at 1; progress stays 1 until
 * the trial ends (1 s later) and is 0 elsewhere. Progress is sampled
 * irregularly near 30 Hz (+-30 % jitter), and also as `position` in cm (x 180).
 * A unit's rate depends on progress, not on time; spikes by time rescaling of
 * a gamma renewal train (4 ms grid).
 */
function approachSession(seed: number, nTrials: number, units: ApproachUnit[]): Recording {
  const rng = new Rng(seed);
  const starts: number[] = [];
  const stops: number[] = [];
  const rewards: number[] = [];
  const durations: number[] = [];
  let t = 2;
  for (let k = 0; k < nTrials; k++) {
    const d = 2 + 4 * rng.uniform();
    starts.push(t);
    rewards.push(t + 0.5 + d);
    durations.push(d);
    stops.push(t + 1.5 + d);
    t = t + 1.5 + d + 1 + 2 * rng.uniform();
  }
  const spanStop = t + 2;
  let trial = 0;
  const progress = (s: number): number => {
    while (trial > 0 && s < starts[trial]) trial--;
    while (trial < nTrials - 1 && s >= starts[trial + 1]) trial++;
    if (s < starts[trial] || s >= stops[trial]) return 0;
    const a = rewards[trial] - durations[trial];
    return s < a ? 0 : s >= rewards[trial] ? 1 : (s - a) / durations[trial];
  };
  const st: number[] = [];
  for (let s = 0; s < spanStop; s += (1 / 30) * (0.7 + 0.6 * rng.uniform())) st.push(s);
  const sampleTime = Float64Array.from(st);
  trial = 0;
  const prog = Float64Array.from(sampleTime, progress);
  const dt = 0.004;
  const nGrid = Math.ceil(spanStop / dt);
  trial = 0;
  const pGrid = Float64Array.from({ length: nGrid }, (_, g) => progress((g + 0.5) * dt));
  const out: Unit[] = units.map((m, ui) => {
    const rate = new Float64Array(nGrid);
    let k = 0;
    let gain = 1;
    for (let g = 0; g < nGrid; g++) {
      const s = g * dt;
      if (k < nTrials && s >= starts[k]) {
        gain = m.gainSd ? Math.exp(m.gainSd * rng.normal() - (m.gainSd * m.gainSd) / 2) : 1;
        k++;
      }
      rate[g] = m.rateHz * (k > 0 && s < stops[k - 1] ? gain : 1) * (1 + m.change * pGrid[g]);
    }
    const cum = new Float64Array(nGrid + 1);
    for (let g = 0; g < nGrid; g++) cum[g + 1] = cum[g] + rate[g] * dt;
    const s = renewalTrain(new Rng(seed * 1000 + ui + 1), 1, 0, cum[nGrid], m.shape, 0);
    const times = new Float64Array(s.length);
    let g = 0;
    for (let i = 0; i < s.length; i++) {
      while (g < nGrid && cum[g + 1] <= s[i]) g++;
      const frac = rate[g] > 0 ? (s[i] - cum[g]) / (rate[g] * dt) : 0;
      times[i] = (g + Math.min(1, Math.max(0, frac))) * dt;
    }
    return { id: `u${ui + 1}`, spikeTimes: times, meta: {} };
  });
  return {
    units: out,
    pulses: emptyPulses(),
    events: { time: Float64Array.from(rewards), label: rewards.map(() => 'reward'), trial: Float64Array.from(rewards, (_, i) => i + 1), kind: rewards.map(() => '') },
    trials: { trial: Float64Array.from(starts, (_, i) => i + 1), start: Float64Array.from(starts), stop: Float64Array.from(stops), condition: starts.map(() => 'standard'), covariates: {} },
    span: [0, spanStop],
    spanSource: 'inputs',
    waveformSampleRateHz: NaN,
    behaviour: { time: sampleTime, variables: new Map([['progress', prog], ['position', Float64Array.from(prog, (v) => 180 * v)]]) },
  };
}

const shapes = [0.6, 1, 2.5, 5];
const params = (over: Partial<Parameters['ramp']>): Parameters['ramp'] => ({ ...DEFAULTS.ramp, progressVariable: 'progress', ...over });

describe('classifyProgressRamps on simulated approaches', () => {
  it('calls flat units up/down at no more than the nominal rate', () => {
    let calls = 0;
    let small = 0;
    let total = 0;
    for (const [seed, nTrials] of [[31, 40], [32, 90]] as const) {
      const units = Array.from({ length: 100 }, (_, i) => ({ rateHz: [3, 7, 15, 30][i % 4], shape: shapes[Math.floor(i / 4) % 4], change: 0, gainSd: i % 3 === 0 ? 0.3 : 0 }));
      const r = classifyProgressRamps(approachSession(seed, nTrials, units), params({}))!;
      calls += r.verdict.filter((v) => v !== 'flat').length;
      small += r.units.filter((u) => u.p < 0.05).length;
      total += r.units.length;
    }
    const bound = total * 0.05 + 3 * Math.sqrt(total * 0.05 * 0.95);
    if (process.env.SHOW) console.log({ calls, small, total, bound });
    expect(calls).toBeLessThanOrEqual(bound);
    expect(small).toBeLessThanOrEqual(bound);
    expect(small).toBeGreaterThanOrEqual(total * 0.01); // not absurdly conservative
  });

  it('finds >= 90 % of position-dependent units with the right sign, and estimates their slope', () => {
    const units: ApproachUnit[] = [];
    for (let i = 0; i < 60; i++) {
      const up = i % 2 === 0;
      const size = 0.5 + 0.5 * ((i % 3) / 2); // 50-100 % change from progress 0 to 1
      units.push({ rateHz: [5, 10, 20][i % 3], shape: shapes[i % 4], change: up ? size : -size / (1 + size), gainSd: i % 4 === 1 ? 0.25 : 0 });
    }
    const rec = approachSession(41, 80, units);
    const r = classifyProgressRamps(rec, params({}))!;
    let found = 0;
    const relErr: number[] = [];
    units.forEach((m, i) => {
      if (r.verdict[i] === (m.change > 0 ? 'up' : 'down')) found++;
      relErr.push(Math.abs(r.units[i].slopeHzPerUnit / (m.rateHz * m.change) - 1));
    });
    if (process.env.SHOW) console.log({ found, n: units.length, median: relErr.slice().sort((a, b) => a - b)[30] });
    expect(found).toBeGreaterThanOrEqual(0.9 * units.length);
    relErr.sort((a, b) => a - b);
    // Median relative error of the pooled slope (true slope = rate x change Hz per unit of progress).
    expect(relErr[relErr.length >> 1]).toBeLessThan(0.2);
    // The variable's units only scale the slope: position = 180 x progress gives the same
    // bins, counts and p, and slopes 180 times smaller.
    const byCm = classifyProgressRamps(rec, params({ progressVariable: 'position' }))!;
    expect(byCm.verdict).toEqual(r.verdict);
    for (let i = 0; i < 5; i++) {
      close(byCm.units[i].p, r.units[i].p, 1e-9);
      close(byCm.units[i].slopeHzPerUnit * 180, r.units[i].slopeHzPerUnit, 1e-9);
    }
    close(byCm.range[1], 180 * r.range[1], 1e-12);
  });

  it('range: percentiles by default, or given; the step adds the progress_ramp columns and summary', () => {
    const rec = approachSession(51, 30, [{ rateHz: 10, shape: 1, change: 1, gainSd: 0 }, { rateHz: 4, shape: 2, change: 0, gainSd: 0 }]);
    const r = classifyProgressRamps(rec, params({}))!;
    expect(r.rangeSource).toBe('percentiles');
    expect(r.range[0]).toBeGreaterThanOrEqual(0);
    expect(r.range[1]).toBeLessThanOrEqual(1);
    const given = classifyProgressRamps(rec, params({ progressMin: 0, progressMax: 1, progressBins: 5 }))!;
    expect(given.rangeSource).toBe('parameters');
    [0.1, 0.3, 0.5, 0.7, 0.9].forEach((c, j) => close(given.centres[j], c, 1e-15, 1e-15));
    const step = rampStep.run({ recording: rec, parameters: { ...DEFAULTS, ramp: params({}) }, columns: new Map() });
    const names = step.columns.map((c) => c.name);
    expect(names.slice(0, 4)).toEqual(['ramp', 'ramp_slope_hz_per_s', 'ramp_p', 'ramp_q']);
    expect(names).toEqual(expect.arrayContaining(['progress_ramp', 'progress_ramp_slope_hz_per_unit', 'progress_ramp_p', 'progress_ramp_q', 'progress_ramp_reason']));
    expect((step.summary as { progress: { variable: string } }).progress.variable).toBe('progress');
    // Without the parameter: no progress columns at all (the time ramp's columns are unchanged).
    const plain = rampStep.run({ recording: rec, parameters: DEFAULTS, columns: new Map() });
    expect(plain.columns.some((c) => c.name.startsWith('progress_'))).toBe(false);
  });

  it('warped windows (anchorEvent): each trial from its approach start to reward', () => {
    const rec = approachSession(71, 40, [{ rateHz: 12, shape: 1, change: 1, gainSd: 0 }, { rateHz: 6, shape: 2, change: 0, gainSd: 0 }]);
    // Approach starts 0.5 s after each trial start (approachSession's layout).
    const onsets = Array.from(rec.trials.start, (s) => s + 0.5);
    const all = [...Array.from(rec.events.time, (t, i) => ({ t, label: rec.events.label[i], trial: rec.events.trial[i] })), ...onsets.map((t, k) => ({ t, label: 'approach_on', trial: k + 1 }))].sort((a, b) => a.t - b.t);
    const warped: Recording = {
      ...rec,
      events: { time: Float64Array.from(all, (e) => e.t), label: all.map((e) => e.label), trial: Float64Array.from(all, (e) => e.trial), kind: all.map(() => '') },
    };
    const r = classifyProgressRamps(warped, params({ anchorEvent: 'approach_on' }))!;
    expect(r.nWindows).toBe(40);
    // Every window runs over the whole approach, so the percentiles span almost all of [0, 1].
    expect(r.range[0]).toBeLessThan(0.02);
    expect(r.range[1]).toBeGreaterThan(0.98);
    expect(r.verdict[0]).toBe('up');
    close(r.units[0].slopeHzPerUnit, 12, 0.25); // rate 12 (1 + progress): 12 Hz per unit of progress
  });

  it('names the parameter when the variable is missing', () => {
    const rec = approachSession(61, 6, [{ rateHz: 5, shape: 1, change: 0, gainSd: 0 }]);
    expect(() => classifyProgressRamps(rec, params({ progressVariable: 'speed' }))).toThrow(InputError);
    expect(() => classifyProgressRamps(rec, params({ progressVariable: 'speed' }))).toThrow(/ramp\.progressVariable.*they hold: progress, position.*\(value "speed"\)/);
    expect(() => classifyProgressRamps({ ...rec, behaviour: undefined }, params({}))).toThrow(/no behavioural samples/);
    expect(() => classifyProgressRamps(rec, params({ progressBins: 1 }))).toThrow(/ramp\.progressBins/);
    expect(() => classifyProgressRamps(rec, params({ progressMin: 1, progressMax: 0 }))).toThrow(/minimum below its maximum/);
    expect(classifyProgressRamps(rec, DEFAULTS.ramp)).toBeNull();
  });
});
