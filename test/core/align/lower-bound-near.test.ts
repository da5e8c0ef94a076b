/**
 * lowerBoundNear against lowerBound (binary search, the definition "first
 * index >= x") for every hint, on sorted arrays with ties, NaN and empty
 * input. Exact equality.
 */
import { describe, expect, it } from 'vitest';
import { lowerBound } from '../../../core/align/lower-bound';
import { lowerBoundNear } from '../../../core/align/lower-bound-near';
import { Rng } from '../../../core/random/rng';

describe('lowerBoundNear', () => {
  it('equals lowerBound for any hint (short gaps, long gaps, ties, before and after the hint)', () => {
    const rng = new Rng(5);
    for (const n of [0, 1, 2, 31, 32, 33, 100, 1000]) {
      const a = Float64Array.from({ length: n }, () => Math.floor(rng.uniform() * 200) / 4).sort();
      const xs = [-1, 0, 0.25, 3, 10.5, 25, 49.75, 50, 60, NaN, ...Array.from(a.slice(0, 20))];
      for (const x of xs) {
        const want = lowerBound(a, x);
        for (let h = -2; h <= n + 2; h += n > 100 ? 7 : 1) expect(lowerBoundNear(a, x, h)).toBe(want);
      }
    }
  });
});
