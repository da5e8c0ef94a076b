/**
 * Wilcoxon signed-rank test.
 * Sources: Hollander & Wolfe (1973) Nonparametric Statistical Methods, p. 29
 * (verified; REFERENCES.md); @stdlib/stats-wilcoxon (reference library, exact
 * for n <= 50 without ties, normal approximation otherwise); SciPy 1.17
 * scipy.stats.wilcoxon and brute-force enumeration (test/fixtures/stats/signed-rank.json).
 */
import wilcoxonRef from '@stdlib/stats-wilcoxon';
import { describe, expect, it } from 'vitest';
import { wilcoxonSignedRank } from '../../../core/stats';
import { Rng } from '../../../core/random/rng';
import { close } from '../../helpers/close';
import { loadFixture } from '../../helpers/fixtures';

describe('wilcoxonSignedRank', () => {
  it('reproduces Hollander & Wolfe (1973) p. 29: V = 40, p(greater) = 10/512, two-sided 0.0390625', () => {
    const x = [1.83, 0.5, 1.62, 2.48, 1.68, 1.88, 1.55, 3.06, 1.3];
    const y = [0.878, 0.647, 0.598, 2.05, 1.06, 1.29, 1.06, 3.14, 1.29];
    const r = wilcoxonSignedRank(x.map((v, i) => v - y[i]));
    expect(r.statistic).toBe(40);
    expect(r.method).toBe('exact');
    close(r.pGreater, 10 / 512, 1e-14);
    close(r.p, 0.0390625, 1e-14);
    expect(r.direction).toBe(1);
  });

  it('matches @stdlib/stats-wilcoxon (exact, no ties, n <= 50)', () => {
    const rng = new Rng(7);
    for (const n of [5, 10, 17, 30, 50]) {
      const d = Array.from({ length: n }, () => rng.normal() + 0.3);
      const ours = wilcoxonSignedRank(d);
      const ref = wilcoxonRef(d);
      expect(ours.statistic).toBeCloseTo(ref.statistic, 12);
      close(ours.p, Math.min(1, ref.pValue), 1e-10, 1e-15, `n = ${n}`);
    }
  });

  it('matches @stdlib/stats-wilcoxon (normal approximation with continuity correction, n > 50, ties)', () => {
    const rng = new Rng(8);
    for (const n of [20, 51, 120, 400]) {
      const d = Array.from({ length: n }, () => Math.round(3 * rng.normal() + 0.4));
      // @stdlib switches to the approximation whenever there are ties or zeros; so do we here.
      const ours = wilcoxonSignedRank(d, 0);
      const ref = wilcoxonRef(d);
      expect(ours.method).toBe('normal');
      close(ours.p, Math.min(1, ref.pValue), 1e-10, 1e-15, `n = ${n}`);
    }
  });

  const fx = loadFixture<{ d: number[]; v: number; p: number; pGreater?: number; method: string; source: string }>('stats/signed-rank.json');
  it.each(fx.cases.map((c, i) => [i, c] as const))('fixture case %i (%s)', (_i, c) => {
    const r = wilcoxonSignedRank(c.d);
    expect(r.method).toBe(c.method);
    close(r.statistic, c.v, 1e-12);
    // Exact: both are sums of 2^-n terms (tolerance 1e-12). Normal: same formula, 1e-9 relative.
    close(r.p, c.p, c.method === 'exact' ? 1e-12 : 1e-9, 1e-15);
    if (c.pGreater !== undefined) close(r.pGreater, c.pGreater, 1e-12);
  });

  it('drops zeros and NaN, and handles empty input', () => {
    const r = wilcoxonSignedRank([0, 0, 1, 2, NaN, -0.5]);
    expect(r.zeros).toBe(2);
    expect(r.n).toBe(3);
    expect(wilcoxonSignedRank([]).p).toBeNaN();
    expect(wilcoxonSignedRank([0, 0]).p).toBeNaN();
    // One non-zero difference: two-sided p = 1 (2 x 1/2).
    expect(wilcoxonSignedRank([3]).p).toBe(1);
  });

  it('exact and normal agree closely at moderate n (continuity-corrected approximation)', () => {
    const rng = new Rng(9);
    const d = Array.from({ length: 40 }, () => rng.normal() + 0.35);
    const exact = wilcoxonSignedRank(d, 50).p;
    const approx = wilcoxonSignedRank(d, 0).p;
    close(approx, exact, 0.05);
  });
});
