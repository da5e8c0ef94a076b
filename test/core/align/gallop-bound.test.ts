/** gallopBound must equal the lower bound found by plain binary search (core/align/lower-bound.ts) for every hint. */
import { describe, expect, it } from 'vitest';
import { lowerBound } from '../../../core/align/lower-bound';
import { gallopBound } from '../../../core/align/gallop-bound';
import { Rng } from '../../../core/random/rng';

describe('gallopBound', () => {
  it.each([0, 1, 2, 7, 100])('matches lowerBound on %i elements with ties, for every hint and target', (n) => {
    const rng = new Rng(n + 1);
    const a = Float64Array.from({ length: n }, () => Math.floor(rng.uniform() * 20)).sort();
    for (const x of [-1, 0, 0.5, 3, 7, 19, 19.5, 25, NaN]) {
      for (let h = -2; h <= n + 2; h++) expect(gallopBound(a, x, h), `x ${x} hint ${h}`).toBe(lowerBound(a, x));
    }
  });
});
