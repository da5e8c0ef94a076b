/**
 * Benjamini-Hochberg adjustment.
 * Sources: Benjamini & Hochberg (1995) JRSS-B 57:289, the 15-p-value example
 * (verified; REFERENCES.md) and @stdlib/stats-padjust(p, 'bh').
 */
import padjust from '@stdlib/stats-padjust';
import { describe, expect, it } from 'vitest';
import { benjaminiHochberg } from '../../../core/stats';
import { Rng } from '../../../core/random/rng';
import { close } from '../../helpers/close';

const BH1995 = [0.0001, 0.0004, 0.0019, 0.0095, 0.0201, 0.0278, 0.0298, 0.0344, 0.0459, 0.324, 0.4262, 0.5719, 0.6528, 0.759, 1.0];

describe('benjaminiHochberg', () => {
  it('rejects 4 of the 15 hypotheses of Benjamini & Hochberg (1995) at q = 0.05; adjusted 4th, 5th = 0.035625, 0.0603', () => {
    const q = benjaminiHochberg(BH1995);
    expect(Array.from(q).filter((v) => v <= 0.05).length).toBe(4);
    close(q[3], 0.035625, 1e-12);
    close(q[4], 0.0603, 1e-12);
  });

  it('matches @stdlib/stats-padjust "bh" on the 1995 example and on shuffled random p-values', () => {
    const ref = padjust(BH1995, 'bh') as number[];
    const q = benjaminiHochberg(BH1995);
    ref.forEach((r, i) => close(q[i], r, 1e-14));
    const rng = new Rng(3);
    const p = Array.from({ length: 200 }, () => (rng.uniform() < 0.2 ? rng.uniform() * 1e-3 : rng.uniform()));
    const ref2 = padjust(p, 'bh') as number[];
    const q2 = benjaminiHochberg(p);
    ref2.forEach((r, i) => close(q2[i], r, 1e-14));
  });

  it('leaves NaN out of the family (m counts finite p only)', () => {
    const q = benjaminiHochberg([0.01, NaN, 0.04]);
    expect(q[1]).toBeNaN();
    close(q[0], 0.02, 1e-15);
    close(q[2], 0.04, 1e-15);
    expect(benjaminiHochberg([]).length).toBe(0);
  });
});
