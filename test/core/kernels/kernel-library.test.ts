import { describe, expect, it } from 'vitest';
import { doubleExponentialPeakTime } from '../../../core/kernels/double-exponential-peak-time';
import { findKernelEntry, KERNEL_LIBRARY } from '../../../core/kernels/kernel-library';
import { kernelTiming } from '../../../core/kernels/kernel-timing';
import { kernelValue } from '../../../core/kernels/kernel-value';
import { solveDoubleExponential } from '../../../core/kernels/solve-double-exponential';
import { expectClose } from '../../helpers/close';
import { FIXTURES } from './fixtures';

describe('doubleExponentialPeakTime', () => {
  // Formula t_peak = tr td ln(td/tr) / (td - tr): REFERENCES.md "Indicator kernels" (verified).
  // Checked against a brute-force argmax of the kernel on a 1 us grid (tolerance 1 us).
  it.each([
    [0.0106, 0.0809],
    [0.05, 0.7],
    [0.002, 0.004],
  ])('tr %s s, td %s s matches the brute-force argmax', (tr, td) => {
    const h = kernelValue({ kind: 'double-exponential', tauRiseS: tr, tauDecayS: td, peakDff: 1 });
    let best = 0;
    let arg = 0;
    for (let t = 0; t < 10 * td; t += 1e-6) {
      const v = h(t);
      if (v > best) {
        best = v;
        arg = t;
      }
    }
    expectClose(doubleExponentialPeakTime(tr, td), arg, 1e-6, 'peak time');
    // The grid misses the true peak by <= 0.5 us: the sampled maximum is below 1 by ~h''/2 (0.5 us)^2 < 1e-7.
    expectClose(best, 1, 1e-7, 'normalised peak');
  });
  it('gives the alpha limit for equal constants and NaN for bad ones', () => {
    expect(doubleExponentialPeakTime(0.1, 0.1)).toBe(0.1);
    expect(doubleExponentialPeakTime(0, 0.1)).toBeNaN();
    expect(doubleExponentialPeakTime(NaN, 0.1)).toBeNaN();
  });
});

describe('solveDoubleExponential', () => {
  // Check values: REFERENCES.md (computed with SciPy): jGCaMP8f 10.6/80.9 ms, 8m 9.8/156.0,
  // 8s 17.1/417.3, jGCaMP7f 66.5/158.6 (one decimal given, so tolerance 0.05 ms).
  it.each([
    [24.8, 67.4, 10.6, 80.9],
    [29.0, 118.3, 9.8, 156.0],
    [57.0, 306.7, 17.1, 417.3],
    [99.5, 181.9, 66.5, 158.6],
  ])('time to peak %s ms, half-decay %s ms -> %s / %s ms', (tp, hd, tr, td) => {
    const s = solveDoubleExponential({ timeToPeakS: tp / 1000, halfDecayS: hd / 1000 });
    expectClose(s.tauRiseS * 1000, tr, 0.05, 'tau rise (ms)');
    expectClose(s.tauDecayS * 1000, td, 0.05, 'tau decay (ms)');
  });
  // Full precision against scipy.optimize.fsolve (fixture), tolerance 1e-6 relative.
  it.each(FIXTURES.double_exponential_solutions.map((s) => [s.name, s] as const))('%s matches SciPy fsolve', (_n, s) => {
    const got = solveDoubleExponential({ timeToPeakS: s.time_to_peak_ms / 1000, halfDecayS: s.half_decay_ms / 1000 });
    expectClose(got.tauRiseS * 1000, s.tau_rise_ms, 1e-6 * s.tau_rise_ms, 'tau rise (ms)');
    expectClose(got.tauDecayS * 1000, s.tau_decay_ms, 1e-6 * s.tau_decay_ms, 'tau decay (ms)');
  });
  it('solves the half-rise + half-decay pair', () => {
    // Round trip: the half-rise and half-decay of jGCaMP8f's fitted kernel (SciPy fixture) give back its constants.
    const s = FIXTURES.double_exponential_solutions[0];
    const got = solveDoubleExponential({ halfRiseS: s.half_rise_ms / 1000, halfDecayS: s.half_decay_ms / 1000 });
    expectClose(got.tauRiseS * 1000, s.tau_rise_ms, 1e-6 * s.tau_rise_ms, 'tau rise (ms)');
    expectClose(got.tauDecayS * 1000, s.tau_decay_ms, 1e-6 * s.tau_decay_ms, 'tau decay (ms)');
  });
  it('refuses targets no difference of exponentials can produce', () => {
    // Half-decay below 1.678 x time to peak is faster than the alpha-function limit.
    expect(solveDoubleExponential({ timeToPeakS: 0.1, halfDecayS: 0.15 }).tauRiseS).toBeNaN();
    expect(solveDoubleExponential({ timeToPeakS: -1, halfDecayS: 0.15 }).tauRiseS).toBeNaN();
  });
});

describe('KERNEL_LIBRARY', () => {
  it('holds the indicators the issue names', () => {
    const names = KERNEL_LIBRARY.map((e) => e.name);
    for (const n of ['GCaMP6s', 'GCaMP6m', 'GCaMP6f', 'jGCaMP7f', 'jGCaMP7s', 'jGCaMP8f', 'jGCaMP8m', 'jGCaMP8s', 'dLight1', 'GRAB-DA2m']) expect(names).toContain(n);
    expect(findKernelEntry('dlight1.2')?.name).toBe('dLight1');
    expect(findKernelEntry(' JGCAMP8F ')?.name).toBe('jGCaMP8f');
    expect(findKernelEntry('nope')).toBeUndefined();
  });
  // Each kernel reproduces the two published quantities it was fitted to (tolerance 1e-6 ms)
  // and cites a source, a preparation and a marker.
  it.each(KERNEL_LIBRARY.map((e) => [e.name, e] as const))('%s reproduces the quantities it cites', (_n, e) => {
    expect(e.source.length).toBeGreaterThan(10);
    expect(e.preparation.length).toBeGreaterThan(5);
    expect(['verified', 'from memory', 'illustrative']).toContain(e.status);
    expect(e.tauDecayS).toBeGreaterThan(e.tauRiseS);
    const t = kernelTiming({ kind: 'double-exponential', tauRiseS: e.tauRiseS, tauDecayS: e.tauDecayS, peakDff: 1 });
    const p = e.published;
    if (e.matched === 'timeToPeak+halfDecay') {
      expectClose(t.timeToPeakS * 1000, p.timeToPeakMs!, 1e-6, `${e.name} time to peak (ms)`);
      expectClose(t.halfDecayS * 1000, p.halfDecayMs!, 1e-6, `${e.name} half-decay (ms)`);
    } else if (e.matched === 'tauOn+tauOff') {
      expect(e.tauRiseS * 1000).toBe(p.tauOnMs);
      expect(e.tauDecayS * 1000).toBe(p.tauOffMs);
    } else throw new Error(`untested pair ${e.matched}`);
  });
  it('marks the Zhang et al. (2023) kernels verified with their published 1-AP amplitudes', () => {
    // REFERENCES.md: peak dF/F jGCaMP7f 0.21, 8f 0.41, 8m 0.76, 8s 1.11 (verified).
    expect(Object.fromEntries(KERNEL_LIBRARY.filter((e) => e.status === 'verified').map((e) => [e.name, e.peakDff]))).toEqual({
      jGCaMP8f: 0.41,
      jGCaMP8m: 0.76,
      jGCaMP8s: 1.11,
      jGCaMP7f: 0.21,
    });
  });
  it('keeps the half-rise a two-constant fit cannot match visible (8f: fitted 5.1 ms vs published 7.1 ms)', () => {
    // Two constants cannot match three quantities (REFERENCES.md). Fitted value from the SciPy fixture.
    const e = findKernelEntry('jGCaMP8f')!;
    const t = kernelTiming({ kind: 'double-exponential', tauRiseS: e.tauRiseS, tauDecayS: e.tauDecayS, peakDff: 1 });
    expectClose(t.halfRiseS * 1000, FIXTURES.double_exponential_solutions[0].half_rise_ms, 1e-6, 'half-rise (ms)');
    expect(e.published.halfRiseMs).toBe(7.1);
  });
});

describe('kernelTiming', () => {
  it('times an alpha function: peak at tau, half-points from t e^(1-t) = 1/2', () => {
    // Roots of x e^(1-x) = 1/2 via Lambert W (computed with SciPy: -lambertw(-1/(2e), k), k = 0, -1):
    // x = 0.23196095298653444 and 2.6783469900166605; tolerance 1e-12 s (bisection to ~1e-15).
    const t = kernelTiming({ kind: 'alpha', tauS: 0.1, peakDff: 2 });
    expectClose(t.timeToPeakS, 0.1, 1e-15, 'time to peak');
    expectClose(t.peak, 2, 1e-12, 'peak');
    expectClose(t.halfRiseS, 0.023196095298653444, 1e-12, 'half-rise');
    expectClose(t.halfDecayS, 0.26783469900166605 - 0.1, 1e-12, 'half-decay');
  });
  it('times a sampled kernel by linear interpolation', () => {
    // Hand-made triangle 0, 1, 2, 4, 2, 1, 0 at 1 kHz: peak 4 at 3 ms; half (2) reached at 2 ms and 4 ms.
    const t = kernelTiming({ kind: 'sampled', values: Float64Array.of(0, 1, 2, 4, 2, 1, 0), sampleRateHz: 1000, gain: 1 });
    expectClose(t.timeToPeakS, 0.003, 1e-15, 'time to peak');
    expectClose(t.halfRiseS, 0.002, 1e-15, 'half-rise');
    expectClose(t.halfDecayS, 0.001, 1e-15, 'half-decay');
  });
  it('gives NaN for a sampled kernel that never falls to half its peak, or has no positive peak', () => {
    expect(kernelTiming({ kind: 'sampled', values: Float64Array.of(0, 1, 1), sampleRateHz: 10, gain: 1 }).halfDecayS).toBeNaN();
    expect(kernelTiming({ kind: 'sampled', values: Float64Array.of(0, 0), sampleRateHz: 10, gain: 1 }).timeToPeakS).toBeNaN();
  });
});
