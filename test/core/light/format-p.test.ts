/**
 * formatP: a p-value never reads "0"; values at the resolution show the resolution, rounded
 * up so the inequality stays true (worked by hand: 1/101 = 0.00990099..., 1/4950 =
 * 0.000202..., 1/91 = 0.010989...).
 */
import { describe, expect, it } from 'vitest';
import { formatP } from '../../../core/light/format-p';

describe('formatP', () => {
  it('ordinary values', () => {
    expect(formatP(0.0342)).toBe('p=0.034');
    expect(formatP(1)).toBe('p=1');
    expect(formatP(NaN)).toBe('p n/a');
  });
  it('an underflowed tail probability is never "0"', () => {
    expect(formatP(0)).toBe('p<1e-300');
  });
  it('at the resolution: the bound, rounded up, with its fraction', () => {
    expect(formatP(1 / 101, 1 / 101, 101)).toBe('p<=0.01 (1/101)');
    expect(formatP(1 / 91, 1 / 91)).toBe('p<=0.011');
    expect(formatP(0, 1 / 4950, 4950, true)).toBe('p<0.00021 (1/4950)');
    expect(formatP(0, 1 / 1225, 0, true)).toBe('p<0.00082');
    // above the resolution: the value itself
    expect(formatP(2 / 101, 1 / 101, 101)).toBe('p=0.02');
  });
});
