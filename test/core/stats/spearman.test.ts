/**
 * Spearman rank correlation. Source: SciPy 1.17 scipy.stats.spearmanr
 * (test/fixtures/stats/spearman.json, generator beside it). Tolerance 1e-10
 * relative: same definitions, double precision on both sides.
 */
import { describe, expect, it } from 'vitest';
import { spearman } from '../../../core/stats';
import { close } from '../../helpers/close';
import { loadFixture } from '../../helpers/fixtures';

const fx = loadFixture<{ x: number[]; y: number[]; rho: number; p: number }>('stats/spearman.json');

describe('spearman', () => {
  it.each(fx.cases.map((c, i) => [i, c] as const))('SciPy spearmanr case %i', (_i, c) => {
    const r = spearman(c.x, c.y);
    close(r.rho, c.rho, 1e-10, 1e-14);
    close(r.p, c.p, 1e-9, 1e-15);
  });

  it('edge cases: too few pairs, constant sample, perfect monotone relation, NaN pairs dropped', () => {
    expect(spearman([1, 2], [3, 4]).rho).toBeNaN();
    expect(spearman([1, 1, 1, 1], [1, 2, 3, 4]).rho).toBeNaN();
    const perfect = spearman([1, 2, 3, 4, 5], [10, 20, 30, 40, 1000]);
    expect(perfect.rho).toBe(1);
    expect(perfect.p).toBe(0);
    expect(spearman([1, 2, NaN, 3, 4], [2, 1, 5, 4, 3]).n).toBe(4);
  });
});
