/**
 * Piecewise-constant profiles: hand-computed values (the integral of a step
 * function is the sum of value x length; common practice, exact arithmetic
 * on binary fractions so equality is exact).
 */
import { describe, expect, it } from 'vitest';
import { constantProfile } from '../../../core/sim/constant-profile';
import { multiplyProfiles } from '../../../core/sim/multiply-profiles';
import { profileIntegral } from '../../../core/sim/profile-integral';
import { profileValueAt } from '../../../core/sim/profile-value-at';
import { windowProfile } from '../../../core/sim/window-profile';

describe('rate profiles', () => {
  it('windowProfile builds breaks and values, joining adjoining windows and cutting overlaps', () => {
    const p = windowProfile([1, 2, 5, 5.5], [2, 3, 6, 7], [2, 4, 0.5, 8]);
    expect([...p.breaks]).toEqual([1, 2, 3, 5, 6, 7]);
    expect([...p.values]).toEqual([1, 2, 4, 1, 0.5, 8, 1]);
    expect(profileValueAt(p, 0.99)).toBe(1);
    expect(profileValueAt(p, 1)).toBe(2);
    expect(profileValueAt(p, 2.5)).toBe(4);
    expect(profileValueAt(p, 6)).toBe(8);
    expect(profileValueAt(p, 100)).toBe(1);
  });
  it('profileIntegral sums value x length inside [a, b)', () => {
    const p = windowProfile([1, 2], [2, 3], [2, 4]);
    expect(profileIntegral(p, 0, 4)).toBe(1 + 2 + 4 + 1);
    expect(profileIntegral(p, 1.5, 2.5)).toBe(0.5 * 2 + 0.5 * 4);
    expect(profileIntegral(p, 2, 2)).toBe(0);
    expect(profileIntegral(p, 3, 2)).toBe(0);
    expect(profileIntegral(constantProfile(3), -1, 1)).toBe(6);
  });
  it('multiplyProfiles is the pointwise product and drops breaks where nothing changes', () => {
    const a = windowProfile([1], [3], [2]);
    const b = windowProfile([2], [4], [0.5]);
    const p = multiplyProfiles(constantProfile(10), a, b);
    expect([...p.breaks]).toEqual([1, 2, 3, 4]);
    expect([...p.values]).toEqual([10, 20, 10, 5, 10]);
    const q = multiplyProfiles(windowProfile([1], [2], [2]), windowProfile([1], [2], [0.5]));
    expect(q.breaks.length).toBe(0);
    expect([...q.values]).toEqual([1]);
  });
  it('rejects unsorted windows and skips empty ones', () => {
    expect(() => windowProfile([2, 1], [3, 4], [1, 1])).toThrow(/sorted/);
    const p = windowProfile([1, 2], [1, 3], [5, 6]);
    expect([...p.breaks]).toEqual([2, 3]);
  });
});
