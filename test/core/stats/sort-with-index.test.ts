/**
 * sortWithIndex and midRanks. Sources: the order is checked against the
 * engine's own Float64Array.prototype.sort (ECMAScript numeric order); the
 * mid-ranks against their definition (Hollander & Wolfe 1973, ch. 3: rank =
 * number of smaller values + (number of equal values + 1) / 2), computed by
 * brute force. Exact equality: both sides are exact in double precision.
 */
import { describe, expect, it } from 'vitest';
import { midRanks } from '../../../core/stats';
import { sortWithIndex } from '../../../core/stats/sort-with-index';
import { Rng } from '../../../core/random/rng';

const rng = new Rng(11);
function sample(n: number, distinct: number): Float64Array {
  return Float64Array.from({ length: n }, () => (distinct > 0 ? rng.int(distinct) - distinct / 2 : rng.normal()));
}

describe('sortWithIndex', () => {
  it.each([0, 1, 2, 3, 15, 16, 17, 100, 1000, 5000])('n = %i: same order as TypedArray sort, index follows its key', (n) => {
    for (const distinct of [0, 2, 7, 1000]) {
      const x = sample(n, distinct);
      const keys = x.slice();
      const index = Int32Array.from({ length: n }, (_, i) => i);
      sortWithIndex(keys, index);
      expect(Array.from(keys)).toEqual(Array.from(x.slice().sort()));
      for (let i = 0; i < n; i++) expect(keys[i]).toBe(x[index[i]]);
      expect(Array.from(index).sort((a, b) => a - b)).toEqual(Array.from({ length: n }, (_, i) => i));
    }
  });

  it('whole-number keys in a small range (the counting path): ordered, stable, index follows its key, -0 kept', () => {
    for (const [n, spread, offset] of [[32, 5, 0], [200, 900, -450], [1000, 4256, 7], [500, 3, 2 ** 60], [64, 1e6, 0]] as const) {
      const x = Float64Array.from({ length: n }, (_, i) => (i % 17 === 0 && offset === 0 ? -0 : offset + rng.int(spread) * (offset === 2 ** 60 ? 256 : 1)));
      const keys = x.slice();
      const index = Int32Array.from({ length: n }, (_, i) => i);
      sortWithIndex(keys, index);
      for (let i = 0; i < n; i++) expect(Object.is(keys[i], x[index[i]]), `n ${n} slot ${i}`).toBe(true);
      const counted = keys[n - 1] - keys[0] + 1 <= 4 * n + 256; // the counting path, which is stable
      if (spread < 1000) expect(counted).toBe(true);
      for (let i = 1; i < n; i++) {
        expect(keys[i - 1] <= keys[i]).toBe(true);
        if (keys[i - 1] === keys[i] && counted) expect(index[i - 1]).toBeLessThan(index[i]);
      }
      expect(Array.from(index).sort((a, b) => a - b)).toEqual(Array.from({ length: n }, (_, i) => i));
    }
  });

  it('sorted, reversed, constant and organ-pipe inputs (the usual quicksort traps), and a sub-range', () => {
    const n = 3000;
    const inputs = [
      Float64Array.from({ length: n }, (_, i) => i),
      Float64Array.from({ length: n }, (_, i) => n - i),
      new Float64Array(n).fill(4),
      Float64Array.from({ length: n }, (_, i) => Math.min(i, n - i)),
    ];
    for (const x of inputs) {
      const keys = x.slice();
      const index = Int32Array.from({ length: n }, (_, i) => i);
      sortWithIndex(keys, index);
      expect(Array.from(keys)).toEqual(Array.from(x.slice().sort()));
    }
    const keys = Float64Array.from([9, 3, 2, 1, 0]);
    const index = Int32Array.from([0, 1, 2, 3, 4]);
    sortWithIndex(keys, index, 1, 4);
    expect(Array.from(keys)).toEqual([9, 1, 2, 3, 0]);
    expect(Array.from(index)).toEqual([0, 3, 2, 1, 4]);
  });
});

describe('midRanks', () => {
  it('equals the definition (smaller + (equal + 1) / 2) and the tie term sum(t^3 - t)', () => {
    for (const n of [1, 2, 5, 40, 300]) {
      for (const distinct of [0, 3, 20]) {
        const x = sample(n, distinct);
        const { ranks, tieSum } = midRanks(x);
        let expectedTie = 0;
        const counts = new Map<number, number>();
        for (const v of x) counts.set(v, (counts.get(v) ?? 0) + 1);
        for (const t of counts.values()) expectedTie += t * t * t - t;
        expect(tieSum).toBe(expectedTie);
        for (let i = 0; i < n; i++) {
          let less = 0;
          let equal = 0;
          for (let j = 0; j < n; j++) {
            if (x[j] < x[i]) less++;
            else if (x[j] === x[i]) equal++;
          }
          expect(ranks[i]).toBe(less + (equal + 1) / 2);
        }
      }
    }
  });

  it('empty input, one value, and a worked example with ties', () => {
    expect(midRanks([])).toEqual({ ranks: new Float64Array(0), tieSum: 0 });
    expect(Array.from(midRanks([7]).ranks)).toEqual([1]);
    // SciPy rankdata([10, 20, 10, 30, 20, 20]) = [1.5, 4, 1.5, 6, 4, 4] (definition, by hand).
    const r = midRanks([10, 20, 10, 30, 20, 20]);
    expect(Array.from(r.ranks)).toEqual([1.5, 4, 1.5, 6, 4, 4]);
    expect(r.tieSum).toBe(6 + 24);
  });
});
