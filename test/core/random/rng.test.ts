import { describe, expect, it } from 'vitest';
import { Rng } from '../../../core/random/rng';

describe('Rng', () => {
  it('is reproducible for a seed and differs between seeds', () => {
    const a = new Rng(1);
    const b = new Rng(1);
    const c = new Rng(2);
    const xa = Array.from({ length: 5 }, () => a.uniform());
    expect(Array.from({ length: 5 }, () => b.uniform())).toEqual(xa);
    expect(Array.from({ length: 5 }, () => c.uniform())).not.toEqual(xa);
  });

  // Moments checked against the textbook values of each distribution
  // (mean and variance of U(0,1), N(0,1), Exp(1), Gamma(k,1), Poisson(m));
  // tolerance 5 standard errors of the sample estimate, n = 200,000.
  const n = 200_000;
  const moments = (draw: () => number) => {
    let s = 0;
    let s2 = 0;
    for (let i = 0; i < n; i++) {
      const x = draw();
      s += x;
      s2 += x * x;
    }
    const mean = s / n;
    return { mean, variance: s2 / n - mean * mean };
  };
  it.each([
    ['uniform', (r: Rng) => r.uniform(), 0.5, 1 / 12],
    ['normal', (r: Rng) => r.normal(), 0, 1],
    ['exponential', (r: Rng) => r.exponential(), 1, 1],
    ['gamma(0.5)', (r: Rng) => r.gamma(0.5), 0.5, 0.5],
    ['gamma(4)', (r: Rng) => r.gamma(4), 4, 4],
    ['poisson(3)', (r: Rng) => r.poisson(3), 3, 3],
    ['poisson(80)', (r: Rng) => r.poisson(80), 80, 80],
  ] as const)('%s has the textbook mean and variance', (_name, draw, mean, variance) => {
    const r = new Rng(7);
    const m = moments(() => draw(r));
    const se = Math.sqrt(variance / n);
    expect(Math.abs(m.mean - mean)).toBeLessThan(5 * se);
    expect(Math.abs(m.variance - variance) / variance).toBeLessThan(0.03);
  });
  it('uniform stays in [0, 1)', () => {
    const r = new Rng(3);
    for (let i = 0; i < 10_000; i++) {
      const u = r.uniform();
      expect(u >= 0 && u < 1).toBe(true);
    }
  });
});
