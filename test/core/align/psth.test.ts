import { describe, expect, it } from 'vitest';
import { baselineZScore } from '../../../core/align/baseline-z-score';
import { computePsth } from '../../../core/align/compute-psth';
import { populationMatrix } from '../../../core/align/population-matrix';
import { psthByGroup } from '../../../core/align/psth-by-group';
import { smoothRows } from '../../../core/align/smooth-rows';
import { smoothingKernel } from '../../../core/align/smoothing-kernel';
import { Rng } from '../../../core/random/rng';
import { renewalTrain } from '../../../core/sim/renewal-train';
import { expectClose, maxAbsDiff } from '../../helpers/close';
import { FIXTURES } from '../kernels/fixtures';

const sum = (a: ArrayLike<number>) => Array.from(a).reduce((s, x) => s + x, 0);

describe('smoothingKernel', () => {
  it.each([
    ['gaussian', 25],
    ['gaussian', 3],
    ['exponential', 40],
    ['boxcar', 50],
    ['boxcar', 40],
  ] as const)('%s %s ms is normalised to sum 1', (kind, w) => {
    expectClose(sum(smoothingKernel({ kind, widthMs: w }, 0.01).weights), 1, 1e-14, 'sum of weights');
  });
  it('Gaussian weights equal scipy.ndimage.gaussian_filter1d of an impulse (truncate 4; fixture)', () => {
    const f = FIXTURES.gaussian_impulse;
    // sigma 2.5 bins = 25 ms at 10 ms bins
    const { weights, center } = smoothingKernel({ kind: 'gaussian', widthMs: 25 }, 0.01);
    expect(center).toBe(10);
    f.out.forEach((want, i) => {
      const j = i - f.center + center;
      expectClose(j >= 0 && j < weights.length ? weights[j] : 0, want, 1e-15, `weight at lag ${i - f.center}`);
    });
  });
  it('causal exponential only looks back; boxcar rounds its width to bins', () => {
    const e = smoothingKernel({ kind: 'exponential', widthMs: 20 }, 0.01);
    expect(e.center).toBe(0);
    expectClose(e.weights[1] / e.weights[0], Math.exp(-0.5), 1e-15, 'decay per bin');
    const b = smoothingKernel({ kind: 'boxcar', widthMs: 50 }, 0.01);
    expect([b.weights.length, b.center]).toEqual([5, 2]);
    expect(smoothingKernel({ kind: 'none', widthMs: 0 }, 0.01).weights.length).toBe(1);
    expect(() => smoothingKernel({ kind: 'gaussian', widthMs: -1 }, 0.01)).toThrow();
  });
  it('smoothing keeps a flat row flat up to its edges and moves an impulse causally', () => {
    const flat = new Float64Array(20).fill(7);
    const g = smoothingKernel({ kind: 'gaussian', widthMs: 30 }, 0.01);
    expect(maxAbsDiff(smoothRows(flat, 1, 20, g.weights, g.center), flat)).toBeLessThanOrEqual(1e-12);
    const imp = new Float64Array(10);
    imp[5] = 1;
    const e = smoothingKernel({ kind: 'exponential', widthMs: 10 }, 0.01);
    const out = smoothRows(imp, 1, 10, e.weights, e.center);
    expect(sum(out.subarray(0, 5))).toBe(0);
    expect(out[5]).toBeGreaterThan(out[6]);
  });
});

describe('computePsth', () => {
  it('turns a hand-made raster into rates', () => {
    // Events at 10 and 20 s; bins of 500 ms from -1 s (4 bins). Counts by hand (as in bin-counts.test.ts):
    // event 10: 2, 1, 2, 1; event 20: 1, 0, 0, 1 -> mean counts 1.5, 0.5, 1, 1 -> rates / 0.5 s = 3, 1, 2, 2 Hz.
    const spikes = [9.0, 9.4, 9.5, 10.0, 10.2, 10.99, 11.0, 19.1, 20.7];
    const p = computePsth(spikes, [10, 20], { windowStartS: -1, windowStopS: 1, binMs: 500 });
    expect([...p.rateHz]).toEqual([3, 1, 2, 2]);
    expect([...p.binCenterS]).toEqual([-0.75, -0.25, 0.25, 0.75]);
    // SEM over 2 trials of rates (4, 2) Hz: sd = sqrt(2), sem = 1.
    expectClose(p.semHz[0], 1, 1e-12, 'SEM');
    expect([p.lowerHz[0], p.upperHz[0]]).toEqual([2, 4]);
    expect(p.nTrials).toBe(2);
  });

  // Homogeneous Poisson train (seeded; core/sim/renewal-train with shape 1 and no dead time):
  // its PSTH is flat at its rate. 500 trials, 30 bins of 100 ms: SE per bin = sqrt(20 / (0.1 x 500)) = 0.632 Hz.
  const rng = new Rng(2024);
  const rate = 20;
  const train = renewalTrain(rng, rate, 0, 2600, 1, 0);
  const align = Float64Array.from({ length: 500 }, (_, k) => 5 + 5 * k);
  const opts = { windowStartS: -1, windowStopS: 2, binMs: 100 } as const;
  it('is flat at the rate of a homogeneous Poisson train, inside its bootstrap band', () => {
    const p = computePsth(train, align, { ...opts, band: 'bootstrap', nBoot: 400, seed: 3 });
    const se = Math.sqrt(rate / (0.1 * 500));
    let covered = 0;
    for (let j = 0; j < p.rateHz.length; j++) {
      expect(Math.abs(p.rateHz[j] - rate), `bin ${j} within 4 SE`).toBeLessThan(4 * se);
      if (p.lowerHz[j] <= rate && rate <= p.upperHz[j]) covered++;
      // band half-width ~1.96 SE (bootstrap of a mean), within 25 %
      expectClose((p.upperHz[j] - p.lowerHz[j]) / 2, 1.96 * se, 0.25 * 1.96 * se, `band half-width bin ${j}`);
    }
    // 95 % bands: expect ~28.5 of 30 to cover; fewer than 25 has binomial probability < 0.3 %.
    expect(covered).toBeGreaterThanOrEqual(25);
    expectClose(sum(p.rateHz) / p.rateHz.length, rate, 3 * se / Math.sqrt(30), 'mean rate over bins');
  });
  it('gives SEM close to sqrt(rate / (bin x trials)) for Poisson counts', () => {
    const p = computePsth(train, align, opts);
    const se = Math.sqrt(rate / (0.1 * 500));
    for (const s of p.semHz) expectClose(s, se, 0.15 * se, 'SEM');
  });
  it('bootstrap bands are reproducible for a seed and differ between seeds', () => {
    const a = computePsth(train, align.subarray(0, 40), { ...opts, band: 'bootstrap', nBoot: 200, seed: 5 });
    const b = computePsth(train, align.subarray(0, 40), { ...opts, band: 'bootstrap', nBoot: 200, seed: 5 });
    const c = computePsth(train, align.subarray(0, 40), { ...opts, band: 'bootstrap', nBoot: 200, seed: 6 });
    expect([...a.lowerHz]).toEqual([...b.lowerHz]);
    expect([...a.lowerHz]).not.toEqual([...c.lowerHz]);
  });
  it('z-scores against the baseline: baseline bins have mean 0 and SD 1', () => {
    const p = computePsth(train, align, { ...opts, smoothing: { kind: 'gaussian', widthMs: 50 }, baselineStartS: -1, baselineStopS: 0 });
    const zb = Array.from(p.zScore!).filter((_, j) => p.binCenterS[j] < 0);
    expect(zb.length).toBe(10);
    expectClose(sum(zb) / 10, 0, 1e-12, 'baseline z mean');
    const sd = Math.sqrt(zb.reduce((s, z) => s + z * z, 0) / 9);
    expectClose(sd, 1, 1e-12, 'baseline z SD');
    expectClose(p.baselineMeanHz, sum(Array.from(p.rateHz).slice(0, 10)) / 10, 1e-12, 'baseline mean');
  });
  it('handles the edge cases: no trials, one trial, empty train, NaN alignment times', () => {
    const none = computePsth(train, [], opts);
    expect(none.nTrials).toBe(0);
    expect(none.rateHz.every(Number.isNaN)).toBe(true);
    const one = computePsth([0.05], [0], { ...opts, band: 'bootstrap' });
    expect(one.rateHz[10]).toBe(10);
    expect(one.semHz.every(Number.isNaN)).toBe(true);
    expect(one.lowerHz.every(Number.isNaN)).toBe(true);
    const empty = computePsth([], [1, 2], { ...opts, baselineStartS: -1, baselineStopS: 0 });
    expect(empty.rateHz.every((v) => v === 0)).toBe(true);
    expect(empty.zScore!.every(Number.isNaN)).toBe(true); // flat baseline: z undefined
    expect(empty.baselineSdHz).toBeNaN();
    const withNaN = computePsth(train, [5, NaN, 10], opts);
    expect(withNaN.nTrials).toBe(2);
    expect([...withNaN.rateHz]).toEqual([...computePsth(train, [5, 10], opts).rateHz]);
    expect(() => computePsth(train, [1], { ...opts, binMs: 0 })).toThrow(/bin width/);
  });
});

describe('baselineZScore', () => {
  it('needs two baseline bins and a non-flat baseline', () => {
    expect(baselineZScore([1, 2, 3], [0, 1, 2], 0, 1).sdHz).toBeNaN();
    const z = baselineZScore([1, 3, 5], [0, 1, 2], 0, 2);
    // baseline 1, 3: mean 2, sd sqrt(2)
    expectClose(z.z[2], 3 / Math.SQRT2, 1e-15, 'z of 5');
  });
});

describe('psthByGroup and populationMatrix', () => {
  const rng = new Rng(8);
  const trains = [renewalTrain(rng, 10, 0, 200, 1, 0), renewalTrain(rng, 30, 0, 200, 1, 0), new Float64Array(0)];
  const align = Float64Array.from({ length: 30 }, (_, k) => 3 + 6 * k);
  const o = { windowStartS: -0.5, windowStopS: 1, binMs: 50, smoothing: { kind: 'gaussian' as const, widthMs: 40 } };
  it('each population row equals that unit PSTH', () => {
    const m = populationMatrix(trains, align, o);
    expect([m.rows, m.cols, m.nTrials]).toEqual([3, 30, 30]);
    trains.forEach((t, u) => {
      const p = computePsth(t, align, o);
      expect(maxAbsDiff(m.values.subarray(u * 30, (u + 1) * 30), p.rateHz)).toBeLessThanOrEqual(1e-9);
    });
    const z = populationMatrix(trains, align, { ...o, normalise: 'zscore', baselineStartS: -0.5, baselineStopS: 0 });
    const p1 = computePsth(trains[1], align, { ...o, baselineStartS: -0.5, baselineStopS: 0 });
    expect(maxAbsDiff(z.values.subarray(30, 60), p1.zScore!)).toBeLessThanOrEqual(1e-9);
    expect(z.values.subarray(60, 90).every(Number.isNaN)).toBe(true); // silent unit
    const pk = populationMatrix(trains, align, { ...o, normalise: 'peak' });
    expect(Math.max(...pk.values.subarray(0, 30))).toBe(1);
  });
  it('per-group PSTHs use the rows of each group', () => {
    const set = { source: 'x', times: align, trialRow: new Int32Array(30).fill(-1), kind: [], condition: [] };
    const groups = [
      { label: 'a', rows: Int32Array.from([0, 2, 4]) },
      { label: 'b', rows: Int32Array.from([1, 3]) },
    ];
    const g = psthByGroup(trains[0], set, groups, o);
    expect(g.map((x) => [x.label, x.psth.nTrials])).toEqual([
      ['a', 3],
      ['b', 2],
    ]);
    expect([...g[1].psth.rateHz]).toEqual([...computePsth(trains[0], [align[1], align[3]], o).rateHz]);
  });
});
