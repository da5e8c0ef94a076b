import { describe, expect, it } from 'vitest';
import { binCounts } from '../../../core/align/bin-counts';
import { countInWindow } from '../../../core/align/count-in-window';
import { lowerBound } from '../../../core/align/lower-bound';

describe('lowerBound', () => {
  // Reference: the semantics of C++ std::lower_bound / NumPy searchsorted(side='left').
  const t = [0.1, 0.2, 0.2, 0.5];
  it.each([
    [0, 0],
    [0.1, 0],
    [0.15, 1],
    [0.2, 1],
    [0.3, 3],
    [0.5, 3],
    [9, 4],
    [NaN, 4],
  ])('searchsorted(left) of %s is %s', (x, want) => {
    expect(lowerBound(t, x)).toBe(want);
  });
  it('handles an empty array', () => expect(lowerBound([], 1)).toBe(0));
});

describe('countInWindow', () => {
  it('counts half-open windows by hand', () => {
    const t = new Float64Array([1, 2, 2, 3, 4]);
    expect(countInWindow(t, 2, 3)).toBe(2); // 2, 2 (3 excluded)
    expect(countInWindow(t, 0, 10)).toBe(5);
    expect(countInWindow(t, 3, 3)).toBe(0);
    expect(countInWindow(t, 4, 1)).toBe(0);
  });
});

describe('binCounts', () => {
  it('matches a hand-counted raster', () => {
    // Hand-made raster: events at 10 s and 20 s, bins of 0.5 s from -1 s.
    const spikes = new Float64Array([9.0, 9.4, 9.5, 10.0, 10.2, 10.99, 11.0, 19.1, 20.7]);
    const got = binCounts(spikes, new Float64Array([10, 20]), -1, 0.5, 4);
    // event 10: [9,9.5): 9.0, 9.4 -> 2; [9.5,10): 9.5 -> 1; [10,10.5): 10.0, 10.2 -> 2; [10.5,11): 10.99 -> 1; 11.0 excluded
    // event 20: [19,19.5): 19.1 -> 1; [20.5,21): 20.7 -> 1
    expect([...got]).toEqual([2, 1, 2, 1, 1, 0, 0, 1]);
  });
  it('leaves rows of non-finite alignment times at zero', () => {
    const got = binCounts(new Float64Array([1]), new Float64Array([NaN]), -1, 1, 2);
    expect([...got]).toEqual([0, 0]);
  });
});
