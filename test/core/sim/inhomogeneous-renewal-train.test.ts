/**
 * Inhomogeneous renewal trains. Outside checks:
 * - time-rescaling theorem (Brown, Barbieri, Ventura, Kass & Frank 2002,
 *   Neural Comput 14:325): intervals of a Poisson process mapped through its
 *   integrated intensity are Exponential(1); tested with the one-sample
 *   Kolmogorov-Smirnov test of @stdlib/stats-kstest (reference library);
 * - renewal moments (Cox 1962, Renewal Theory): mean ISI = refractory +
 *   shape x theta, var = shape x theta^2, as for the stationary primitive.
 * Tolerances: 4 standard errors (false-alarm chance ~1e-4 per check; the
 * seeds are fixed, so the tests are deterministic).
 */
import kstest from '@stdlib/stats-kstest';
import { describe, expect, it } from 'vitest';
import { Rng } from '../../../core/random/rng';
import { constantProfile } from '../../../core/sim/constant-profile';
import { inhomogeneousRenewalTrain } from '../../../core/sim/inhomogeneous-renewal-train';
import { profileIntegral } from '../../../core/sim/profile-integral';
import { windowProfile } from '../../../core/sim/window-profile';
import { multiplyProfiles } from '../../../core/sim/multiply-profiles';

describe('inhomogeneousRenewalTrain', () => {
  it('Poisson case: rescaled intervals are Exponential(1) (time-rescaling theorem, KS test)', () => {
    // rate 5 Hz with windows at 40 Hz and at 0 Hz
    const starts: number[] = [];
    const stops: number[] = [];
    const gains: number[] = [];
    for (let k = 0; k < 200; k++) {
      starts.push(10 * k + 2, 10 * k + 6);
      stops.push(10 * k + 3, 10 * k + 7);
      gains.push(8, 0);
    }
    const profile = multiplyProfiles(constantProfile(5), windowProfile(starts, stops, gains));
    const t = inhomogeneousRenewalTrain(new Rng(5), profile, 0, 2000, 1, 0);
    const z: number[] = [];
    for (let i = 1; i < t.length; i++) z.push(profileIntegral(profile, t[i - 1], t[i]));
    const res = kstest(z, 'exponential', 1);
    expect(res.pValue).toBeGreaterThan(0.01);
    // no spikes in the silent windows
    let silent = 0;
    for (const s of t) if (s % 10 >= 6 && s % 10 < 7) silent++;
    expect(silent).toBe(0);
  });
  it('counts in each stretch match the integrated rate (4 SE)', () => {
    const profile = multiplyProfiles(constantProfile(4), windowProfile([100, 300], [200, 400], [5, 0.25]));
    const t = inhomogeneousRenewalTrain(new Rng(9), profile, 0, 500, 1, 0.002);
    const count = (a: number, b: number) => t.filter((x) => x >= a && x < b).length;
    for (const [a, b] of [
      [0, 100],
      [100, 200],
      [200, 300],
      [300, 400],
    ]) {
      const want = profileIntegral(profile, a, b);
      // refractory dead time makes counts less variable than Poisson, so sqrt(mean) is a safe SE
      expect(Math.abs(count(a, b) - want)).toBeLessThan(4 * Math.sqrt(want));
    }
  });
  it('a constant profile reproduces the gamma renewal moments with refractory period (Cox 1962)', () => {
    for (const [rate, shape, refr] of [
      [10, 1, 0.002],
      [3, 6, 0.002],
      [30, 0.5, 0.0015],
    ]) {
      const t = inhomogeneousRenewalTrain(new Rng(21), constantProfile(rate), 0, 3000, shape, refr);
      const isi = Array.from(t.subarray(1), (x, i) => x - t[i]);
      const n = isi.length;
      const mean = isi.reduce((a, b) => a + b, 0) / n;
      const v = isi.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1);
      const theta = (1 / rate - refr) / shape;
      const wantVar = shape * theta * theta;
      expect(Math.abs(mean - 1 / rate)).toBeLessThan(4 * Math.sqrt(wantVar / n));
      expect(Math.abs(v - wantVar) / wantVar).toBeLessThan(0.06);
      expect(Math.min(...isi)).toBeGreaterThanOrEqual(refr);
    }
  });
  it('keeps the refractory period across rate changes and is sorted and reproducible', () => {
    const profile = windowProfile([1, 1.5], [1.5, 3], [400, 0], 20);
    const a = inhomogeneousRenewalTrain(new Rng(2), profile, 0, 50, 1, 0.002);
    const b = inhomogeneousRenewalTrain(new Rng(2), profile, 0, 50, 1, 0.002);
    expect([...a]).toEqual([...b]);
    for (let i = 1; i < a.length; i++) expect(a[i] - a[i - 1]).toBeGreaterThanOrEqual(0.002);
    expect(a[0]).toBeGreaterThanOrEqual(0);
    expect(a[a.length - 1]).toBeLessThan(50);
  });
  it('handles empty windows, silence for ever and bad parameters', () => {
    expect(inhomogeneousRenewalTrain(new Rng(1), constantProfile(5), 3, 3).length).toBe(0);
    expect(inhomogeneousRenewalTrain(new Rng(1), constantProfile(0), 0, 100).length).toBe(0);
    const t = inhomogeneousRenewalTrain(new Rng(1), windowProfile([0], [10], [1], 0), 0, 100);
    expect(t.length).toBeGreaterThan(0);
    expect(t[t.length - 1]).toBeLessThan(10);
    expect(() => inhomogeneousRenewalTrain(new Rng(1), constantProfile(5), 0, 1, 0)).toThrow(/shape/);
  });
});
