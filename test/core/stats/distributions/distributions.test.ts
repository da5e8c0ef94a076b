/**
 * Distribution functions against reference libraries from npm (@stdlib, an
 * independent implementation) and against SciPy 1.17 norm.ppf values.
 * Tolerance: relative 1e-12 unless stated (both sides are double-precision
 * implementations of the same special functions; observed agreement ~1e-14).
 */
import binomialCdfRef from '@stdlib/stats-base-dists-binomial-cdf';
import chisqCdfRef from '@stdlib/stats-base-dists-chisquare-cdf';
import normalCdfRef from '@stdlib/stats-base-dists-normal-cdf';
import poissonCdfRef from '@stdlib/stats-base-dists-poisson-cdf';
import tCdfRef from '@stdlib/stats-base-dists-t-cdf';
import gammaincRef from '@stdlib/math-base-special-gammainc';
import gammalnRef from '@stdlib/math-base-special-gammaln';
import betaincRef from '@stdlib/math-base-special-betainc';
import { describe, expect, it } from 'vitest';
import {
  binomialCdf,
  binomialSf,
  chiSquareSf,
  logGamma,
  normalCdf,
  normalQuantile,
  normalSf,
  poissonCdf,
  poissonSf,
  regularizedBeta,
  regularizedGammaP,
  regularizedGammaQ,
  studentTCdf,
  studentTTwoSided,
} from '../../../../core/stats/distributions';

function close(got: number, want: number, rel: number, abs = 0): void {
  const diff = Math.abs(got - want);
  const tol = Math.max(rel * Math.abs(want), abs);
  if (!(diff <= tol)) {
    throw new Error(`value ${got}, expected ${want}, difference ${diff}, tolerance ${tol}`);
  }
}

describe('logGamma vs @stdlib/math-base-special-gammaln', () => {
  it.each([0.001, 0.1, 0.5, 1, 1.5, 2, 3.7, 10, 57.3, 171, 1e4])('x = %s', (x) => {
    close(logGamma(x), gammalnRef(x), 1e-13, 1e-14);
  });
});

describe('regularized incomplete gamma vs @stdlib/math-base-special-gammainc', () => {
  const cases: [number, number][] = [
    [0.5, 0.01], [0.5, 2], [1, 1], [3, 0.5], [3, 10], [10, 9.5], [10, 30], [100, 90], [100, 120], [0.01, 0.001], [500, 480],
  ];
  it.each(cases)('a = %s, x = %s', (a, x) => {
    close(regularizedGammaP(a, x), gammaincRef(x, a), 1e-12, 1e-300);
    close(regularizedGammaQ(a, x), gammaincRef(x, a, true, true), 1e-12, 1e-300);
  });
  it('handles the edges', () => {
    expect(regularizedGammaP(2, 0)).toBe(0);
    expect(regularizedGammaQ(2, 0)).toBe(1);
    expect(regularizedGammaP(2, Infinity)).toBe(1);
    expect(regularizedGammaP(-1, 1)).toBeNaN();
    expect(regularizedGammaP(1, NaN)).toBeNaN();
  });
});

describe('regularized incomplete beta vs @stdlib/math-base-special-betainc', () => {
  const cases: [number, number, number][] = [
    [0.1, 2, 3], [0.5, 0.5, 0.5], [0.9, 10, 2], [0.3, 50, 70], [0.001, 1, 1], [0.999, 0.2, 5],
  ];
  it.each(cases)('x = %s, a = %s, b = %s', (x, a, b) => {
    close(regularizedBeta(x, a, b), betaincRef(x, a, b), 1e-11, 1e-300);
  });
});

describe('normal distribution', () => {
  it.each([-38, -10, -3, -1.96, -0.5, 0, 0.3, 1.644853626951, 5, 9])('Phi(%s) vs @stdlib', (z) => {
    close(normalCdf(z), normalCdfRef(z, 0, 1), 1e-12, 1e-300);
    close(normalSf(z), normalCdfRef(-z, 0, 1), 1e-12, 1e-300);
  });
  // SciPy 1.17 scipy.stats.norm.ppf, printed with repr().
  it.each([
    [1e-10, -6.361340902404056],
    [0.001, -3.090232306167813],
    [0.025, -1.9599639845400545],
    [0.3, -0.5244005127080409],
    [0.5, 0],
    [0.9, 1.2815515655446004],
    [0.999, 3.090232306167813],
  ])('quantile(%s) vs SciPy norm.ppf', (p, z) => {
    close(normalQuantile(p), z, 1e-13, 1e-15);
  });
  it('quantile edges', () => {
    expect(normalQuantile(0)).toBe(-Infinity);
    expect(normalQuantile(1)).toBe(Infinity);
    expect(normalQuantile(1.5)).toBeNaN();
  });
});

describe('chi-square upper tail vs @stdlib/stats-base-dists-chisquare-cdf', () => {
  it.each([
    [0.5, 1], [3.841458820694124, 1], [5.4523, 4], [10.5814, 8], [100, 3],
  ])('x = %s, k = %s', (x, k) => {
    // 1 - cdf of the reference loses everything below ~1e-15: compare absolutely there.
    const want = 1 - chisqCdfRef(x, k);
    close(chiSquareSf(x, k), want, 1e-11, 1e-15);
  });
  it('far tail: chi-square(3) at 100 equals its closed form', () => {
    // For 3 df, P(X >= x) = 2 Phi(-sqrt(x)) + sqrt(2x/pi) exp(-x/2) (Abramowitz & Stegun 26.4.4).
    const x = 100;
    const want = 2 * normalCdf(-Math.sqrt(x)) + Math.sqrt((2 * x) / Math.PI) * Math.exp(-x / 2);
    close(chiSquareSf(x, 3), want, 1e-12);
  });
  it('is 0.05 at the textbook critical value 3.841 for 1 df', () => {
    // Critical value of chi-square(1) at alpha 0.05 = 1.959964^2 (any statistics handbook table).
    close(chiSquareSf(1.959963984540054 ** 2, 1), 0.05, 1e-12);
  });
});

describe('Poisson tails vs @stdlib/stats-base-dists-poisson-cdf', () => {
  it.each([
    [0, 0.5], [3, 2.5], [10, 4], [50, 30], [200, 250], [1, 1e-4],
  ])('k = %s, lambda = %s', (k, lambda) => {
    close(poissonCdf(k, lambda), poissonCdfRef(k, lambda), 1e-12, 1e-300);
    const sf = k === 0 ? 1 : 1 - poissonCdfRef(k - 1, lambda);
    close(poissonSf(k, lambda), sf, sf < 1e-6 ? 1e-6 : 1e-11, 1e-300);
  });
  it('hand value: P(X >= 2 | lambda = 1) = 1 - 2/e', () => {
    close(poissonSf(2, 1), 1 - 2 / Math.E, 1e-14);
  });
  it('lambda = 0 puts all mass at zero', () => {
    expect(poissonCdf(0, 0)).toBe(1);
    expect(poissonSf(1, 0)).toBe(0);
    expect(poissonSf(0, 0)).toBe(1);
  });
});

describe('binomial tails vs @stdlib/stats-base-dists-binomial-cdf', () => {
  it.each([
    [0, 10, 0.1], [3, 10, 0.3], [50, 100, 0.5], [290, 300, 0.95], [5, 300, 0.001],
  ])('k = %s, n = %s, p = %s', (k, n, p) => {
    close(binomialCdf(k, n, p), binomialCdfRef(k, n, p), 1e-11, 1e-300);
    const sf = k === 0 ? 1 : 1 - binomialCdfRef(k - 1, n, p);
    close(binomialSf(k, n, p), sf, sf < 1e-6 ? 1e-5 : 1e-10, 1e-300);
  });
  it('hand value: P(X >= 1 | n = 3, p = 0.5) = 7/8', () => close(binomialSf(1, 3, 0.5), 0.875, 1e-14));
});

describe('Student t vs @stdlib/stats-base-dists-t-cdf', () => {
  it.each([
    [-3, 2], [0.5, 5], [2.228138851986, 10], [10, 34], [-0.1, 1],
  ])('t = %s, nu = %s', (t, nu) => {
    close(studentTCdf(t, nu), tCdfRef(t, nu), 1e-11);
  });
  it('two-sided 0.05 at the handbook critical value t(10) = 2.228', () => {
    close(studentTTwoSided(2.228138851986, 10), 0.05, 1e-9);
  });
});
