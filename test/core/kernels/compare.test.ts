import { describe, expect, it } from 'vitest';
import { eventLockedTrace } from '../../../core/kernels/event-locked-trace';
import { fitAmplitudeOffset } from '../../../core/kernels/fit-amplitude-offset';
import { gridSearchKernel } from '../../../core/kernels/grid-search-kernel';
import { hillSaturation } from '../../../core/kernels/hill-saturation';
import { predictTrace } from '../../../core/kernels/predict-trace';
import { resampleLinear } from '../../../core/kernels/resample-linear';
import { Rng } from '../../../core/random/rng';
import { expectClose } from '../../helpers/close';
import { FIXTURES } from './fixtures';

describe('resampleLinear', () => {
  it('matches numpy.interp inside the range and gives NaN outside (fixture)', () => {
    const f = FIXTURES.interp;
    const got = resampleLinear(f.times, f.values, { startS: f.grid_start_s, rateHz: f.rate_hz, length: f.length });
    f.out.forEach((want, k) => {
      if (want === null) expect(got[k], `sample ${k}`).toBeNaN();
      else expectClose(got[k], want, 1e-12, `sample ${k}`);
    });
  });
  it('handles repeated times (later sample wins), one sample, and no samples', () => {
    // Hand-made: times 0, 1, 1, 2 with values 0, 10, 20, 30 -> at 1: 20; at 0.5: 5; at 1.5: 25.
    const g = { startS: 0, rateHz: 2, length: 5 };
    expect([...resampleLinear([0, 1, 1, 2], [0, 10, 20, 30], g)]).toEqual([0, 5, 20, 25, 30]);
    expect([...resampleLinear([0.5], [7], g)].map((v) => (Number.isNaN(v) ? null : v))).toEqual([null, 7, null, null, null]);
    expect(resampleLinear([], [], g).every(Number.isNaN)).toBe(true);
  });
});

describe('fitAmplitudeOffset', () => {
  it('matches numpy.polyfit(x, y, 1) and scipy.stats.pearsonr (fixture)', () => {
    const f = FIXTURES.polyfit;
    const fit = fitAmplitudeOffset(f.x, f.y);
    expectClose(fit.amplitude, f.slope, 1e-12, 'slope');
    expectClose(fit.offset, f.intercept, 1e-12, 'intercept');
    expectClose(fit.r, f.r, 1e-12, 'r');
    expectClose(fit.r2, f.r * f.r, 1e-12, 'r2');
    expect(fit.n).toBe(200);
  });
  it('recovers an exact line with zero residual and skips NaN pairs', () => {
    const x = [0, 1, 2, 3, NaN];
    const fit = fitAmplitudeOffset(x, [1, 3, 5, 7, 100]);
    expect([fit.amplitude, fit.offset, fit.r, fit.residualRms, fit.n]).toEqual([2, 1, 1, 0, 4]);
  });
  it('returns NaN for a constant prediction or fewer than 3 pairs', () => {
    expect(fitAmplitudeOffset([1, 1, 1], [1, 2, 3]).amplitude).toBeNaN();
    expect(fitAmplitudeOffset([1, 2], [1, 2]).n).toBe(2);
  });
});

describe('gridSearchKernel', () => {
  // Simulation check (invented data): a trace made from known constants plus noise is best
  // explained by those constants on a grid that contains them.
  it('recovers the constants that generated a noisy trace', () => {
    const rng = new Rng(11);
    const spikes = Float64Array.from({ length: 300 }, () => 60 * rng.uniform()).sort();
    const grid = { startS: 0, rateHz: 20, length: 1200 };
    const truth = predictTrace(spikes, { kind: 'double-exponential', tauRiseS: 0.05, tauDecayS: 0.4, peakDff: 0.3 }, grid);
    const measured = truth.map((v) => 2 * v + 0.1 + 0.02 * rng.normal());
    const res = gridSearchKernel(spikes, measured, grid, [0.01, 0.05, 0.2], [0.1, 0.4, 1.6]);
    expect([res.best.tauRiseS, res.best.tauDecayS]).toEqual([0.05, 0.4]);
    // amplitude: 2 x 0.3 (unit-peak prediction); offset 0.1; tolerances ~5 SE of the noise.
    expectClose(res.best.fit.amplitude, 0.6, 0.01, 'amplitude');
    expectClose(res.best.fit.offset, 0.1, 0.005, 'offset');
    expect(Number.isNaN(res.r[2 * 3 + 0])).toBe(true); // rise 0.2 >= decay 0.1 is skipped
  });
});

describe('eventLockedTrace', () => {
  it('cuts hand-checkable segments and averages them', () => {
    // Trace v[n] = n sampled at 10 Hz from 0 s: value = 10 t. Events at 1.0 and 2.05 s, window [-0.2, 0.2).
    const trace = Float64Array.from({ length: 50 }, (_, n) => n);
    const e = eventLockedTrace(trace, 0, 10, [1.0, 2.05, NaN], -0.2, 0.2);
    expect(e.offsetS.length).toBe(4);
    const row0 = [...e.values.subarray(0, 4)];
    const row1 = [...e.values.subarray(4, 8)];
    row0.forEach((v, i) => expectClose(v, [8, 9, 10, 11][i], 1e-12, 'row 0'));
    row1.forEach((v, i) => expectClose(v, [18.5, 19.5, 20.5, 21.5][i], 1e-12, 'row 1 (interpolated)'));
    expect(e.values.subarray(8, 12).every(Number.isNaN)).toBe(true);
    expectClose(e.mean[0], 13.25, 1e-12, 'mean');
    expectClose(e.sem[0], 5.25, 1e-12, 'sem = sd/sqrt(2) = |8 - 18.5| / 2');
    expect(e.count[0]).toBe(2);
  });
  it('leaves NaN where the trace does not reach', () => {
    const e = eventLockedTrace([1, 2, 3], 0, 1, [0], -1, 2);
    expect(Number.isNaN(e.values[0])).toBe(true);
    expect(e.values[1]).toBe(1);
  });
});

describe('hillSaturation', () => {
  it('follows y = max x^n / (x^n + K^n) (hand values)', () => {
    // n = 2, K = 1, max = 4: x = 1 -> 2; x = 3 -> 4 * 9 / 10 = 3.6; x <= 0 -> 0; NaN stays NaN.
    const y = hillSaturation([1, 3, 0, -1, NaN, Infinity], { n: 2, halfDff: 1, maxDff: 4 });
    expect([...y].map((v) => (Number.isNaN(v) ? 'NaN' : v))).toEqual([2, 3.6, 0, 0, 'NaN', 4]);
    expect(() => hillSaturation([1], { n: 0, halfDff: 1, maxDff: 1 })).toThrow();
  });
});
