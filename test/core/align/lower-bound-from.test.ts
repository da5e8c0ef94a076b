/**
 * lowerBoundFrom equals lowerBound (binary search, checked in
 * bin-counts.test.ts and lower-bound-near.test.ts) for every start index,
 * target and density guess: right, far too small, far too large, zero,
 * NaN and infinite; on Poisson-like trains, trains with long gaps and bursts,
 * duplicates, and NaN targets.
 */
import { describe, expect, it } from 'vitest';
import { lowerBound } from '../../../core/align/lower-bound';
import { lowerBoundFrom } from '../../../core/align/lower-bound-from';
import { Rng } from '../../../core/random/rng';

describe('lowerBoundFrom', () => {
  it('equals lowerBound for any start, target and density guess', () => {
    const rng = new Rng(8);
    for (const rate of [0.5, 20, 400]) {
      const t: number[] = [];
      for (let x = 0; x < 200; x += rng.exponential() / rate) {
        t.push(x);
        if (rng.uniform() < 0.02) t.push(x, x); // duplicates
        if (rng.uniform() < 0.001) x += 30; // long silent gaps
      }
      const st = Float64Array.from(t);
      const n = st.length;
      for (let trial = 0; trial < 3000; trial++) {
        const x = -5 + 215 * rng.uniform();
        const from = Math.floor((n + 2) * rng.uniform()) - 1; // -1 .. n
        const exact = lowerBound(st, x);
        for (const guess of [rate, rate / 100, rate * 100, 0, NaN, Infinity, -rate]) {
          expect(lowerBoundFrom(st, x, from, guess), `rate ${rate} x ${x} from ${from} guess ${guess}`).toBe(exact);
        }
      }
      // targets exactly on values, and NaN
      for (let i = 0; i < n; i += 37) expect(lowerBoundFrom(st, st[i], 0, rate)).toBe(lowerBound(st, st[i]));
      expect(lowerBoundFrom(st, NaN, 0, rate)).toBe(n);
    }
    expect(lowerBoundFrom(new Float64Array(0), 1, 0, 1)).toBe(0);
  });
});
