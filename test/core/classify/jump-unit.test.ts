// One unit's jump statistics (core/classify/jump-unit.ts): the tests of the answer, the late change
// and the decay against reference-trial samples. Reference values: SciPy 1.17.1,
// scipy.stats.mannwhitneyu(x, y, alternative='two-sided', use_continuity=True,
// method='asymptotic') on the same changes (exact rationals count / window length, rounded to
// 1e-6 Hz as jumpUnit rounds them), computed 2026-12-02.
import { describe, expect, it } from 'vitest';
import { jumpUnit } from '../../../core/classify/jump-unit';

const rate = (counts: number[], lengthS: number) => Float64Array.from(counts, (c) => c / lengthS);
const window = { postStartS: 0, postEndS: 0.3, preStartS: -0.3, preEndS: 0 };
const opts = { minEvents: 6, exactMaxN: 30, zThreshold: 2, runBins: 2 };

describe('jumpUnit', () => {
  // counts in the pre (0.3 s), answer (0.3 s) and late (0.5 s) windows of 8 jumps and 12 reference samples
  const input = {
    pre: rate([2, 1, 3, 0, 2, 1, 2, 3], 0.3),
    post: rate([5, 4, 6, 2, 5, 3, 4, 7], 0.3),
    late: rate([3, 2, 4, 1, 2, 2, 3, 3], 0.5),
    controlPost: new Float64Array(8).fill(0.25),
    controlLate: new Float64Array(8).fill(0.5),
    refPre: rate([2, 1, 2, 3, 1, 2, 0, 2, 1, 3, 2, 1], 0.3),
    refPost: rate([2, 2, 1, 3, 1, 3, 1, 2, 2, 2, 1, 1], 0.3),
    refLate: rate([3, 2, 2, 4, 2, 3, 1, 3, 2, 4, 3, 2], 0.5),
    psth: new Float64Array(60),
    psthStartS: -0.3,
    binS: 0.01,
    size: new Float64Array(8).fill(NaN),
  };
  const r = jumpUnit(input, window, opts);

  it('rank-sum of the events\' changes against the reference samples (SciPy mannwhitneyu)', () => {
    expect(r.test).toBe('rank-sum');
    expect(r.nReference).toBe(12);
    expect(r.p).toBeCloseTo(0.00018945311000383595, 12); // U = 96 of 96: every jump change above every reference change
    expect(r.direction).toBe(1);
    expect(r.lateP).toBeCloseTo(0.6621086743332107, 12);
    expect(r.decayP).toBeCloseTo(0.0002397205283209355, 12);
    expect(r.decayDirection).toBe(1);
  });

  it('runs the late and decay tests only below shapeTestsBelowP (classifyJumps: the FDR level)', () => {
    const below = jumpUnit(input, window, { ...opts, shapeTestsBelowP: 0.05 });
    expect(below.lateP).toBe(r.lateP);
    expect(below.decayP).toBe(r.decayP);
    const above = jumpUnit(input, window, { ...opts, shapeTestsBelowP: 1e-4 }); // p = 1.9e-4
    expect(above.p).toBe(r.p);
    expect(above.lateP).toBeNaN();
    expect(above.decayP).toBeNaN();
  });

  it('effect sizes are net of the matched control', () => {
    // mean (post - pre) = (3+3+3+2+3+2+2+4) / 8 / 0.3 s = 22 / 2.4 Hz, minus the control's 0.25 Hz
    expect(r.deltaHz).toBeCloseTo(22 / 2.4 - 0.25, 12);
    // mean (late - pre) = 20 / 8 / 0.5 s - 14 / 8 / 0.3 s = 5 - 35 / 6 Hz, minus the control's 0.5 Hz
    expect(r.lateDeltaHz).toBeCloseTo(5 - 35 / 6 - 0.5, 12);
  });

  it('without reference samples: the signed-rank test of the events\' own changes', () => {
    const none = jumpUnit({ ...input, refPre: new Float64Array(0), refPost: new Float64Array(0), refLate: new Float64Array(0), controlPost: new Float64Array(8), controlLate: new Float64Array(8) }, window, opts);
    expect(none.test).toBe('signed-rank');
    expect(none.nReference).toBe(0);
    // 8 changes, all positive: of the 2^8 equally likely sign patterns only this one reaches the
    // largest V (ties do not matter), so the exact two-sided p is 2 / 256 (by hand)
    expect(none.direction).toBe(1);
    expect(none.p).toBeCloseTo(2 / 256, 14);
  });
});
