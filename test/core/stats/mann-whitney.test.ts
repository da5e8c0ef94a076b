/**
 * Wilcoxon rank-sum / Mann-Whitney test.
 * Sources: Hollander & Wolfe (1973) p. 69 (verified; REFERENCES.md) and SciPy
 * 1.17 scipy.stats.mannwhitneyu (test/fixtures/stats/mann-whitney.json).
 */
import { describe, expect, it } from 'vitest';
import { mannWhitney } from '../../../core/stats';
import { close } from '../../helpers/close';
import { loadFixture } from '../../helpers/fixtures';

describe('mannWhitney', () => {
  it('reproduces Hollander & Wolfe (1973) p. 69: W = 35, one-sided p = 382/3003, two-sided 0.2544122544', () => {
    // The published W = 35 is the count form U of x (as R reports it): rank sum of x minus nX(nX+1)/2.
    const x = [0.8, 0.83, 1.89, 1.04, 1.45, 1.38, 1.91, 1.64, 0.73, 1.46];
    const y = [1.15, 0.88, 0.9, 0.74, 1.21];
    const r = mannWhitney(x, y);
    expect(r.uX).toBe(35);
    expect(r.rankSumY).toBe(30);
    expect(r.method).toBe('exact');
    close(r.pXGreater, 382 / 3003, 1e-12);
    close(r.p, 0.2544122544, 1e-9);
  });

  const fx = loadFixture<{ x: number[]; y: number[]; u: number; p: number; method: string }>('stats/mann-whitney.json');
  it.each(fx.cases.map((c, i) => [i, c] as const))('SciPy mannwhitneyu case %i', (_i, c) => {
    const r = mannWhitney(c.x, c.y);
    expect(r.method).toBe(c.method);
    close(r.uX, c.u, 1e-12);
    close(r.p, c.p, 1e-9, 1e-15);
  });

  it('returns NaN for an empty sample', () => {
    expect(mannWhitney([], [1, 2]).p).toBeNaN();
    expect(mannWhitney([1, NaN], [NaN]).p).toBeNaN();
  });
});
