/**
 * The allocation-free ranking inside wilcoxonSignedRank (issue 9) against the
 * implementation it replaced (mid-ranks of |d| from midRanks, kept below as
 * the reference): every field identical (Object.is) on random differences
 * with many ties, zeros, NaN, on both the exact and the normal branch. The
 * test itself is checked against published and library values in
 * wilcoxon-signed-rank.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { Rng } from '../../../core/random/rng';
import { normalCdf } from '../../../core/stats/distributions';
import { midRanks } from '../../../core/stats/mid-ranks';
import { wilcoxonSignedRank } from '../../../core/stats/wilcoxon-signed-rank';

// The implementation before the change, verbatim.
function referenceSignedRank(d: ArrayLike<number>, exactMaxN = 50): ReturnType<typeof wilcoxonSignedRank> {
  let zeros = 0;
  const nz: number[] = [];
  for (let i = 0; i < d.length; i++) {
    const v = d[i];
    if (v === 0) zeros++;
    else if (v === v) nz.push(v);
  }
  const n = nz.length;
  if (n === 0) {
    return { statistic: 0, n: 0, zeros, p: NaN, pGreater: NaN, pLess: NaN, direction: 0, method: 'exact' };
  }
  const abs = new Float64Array(n);
  for (let i = 0; i < n; i++) abs[i] = Math.abs(nz[i]);
  const { ranks, tieSum } = midRanks(abs);
  let v = 0;
  for (let i = 0; i < n; i++) if (nz[i] > 0) v += ranks[i];
  const mean = (n * (n + 1)) / 4;
  const direction = v > mean ? 1 : v < mean ? -1 : 0;
  let pLess: number;
  let pGreater: number;
  let method: 'exact' | 'normal';
  if (n <= exactMaxN) {
    method = 'exact';
    // Doubled mid-ranks are integers; count sign patterns by their doubled V.
    const r2 = new Int32Array(n);
    let total = 0;
    for (let i = 0; i < n; i++) {
      r2[i] = Math.round(2 * ranks[i]);
      total += r2[i];
    }
    // Frequencies as probabilities (each step halves), avoiding overflow of 2^n.
    let dist = new Float64Array(total + 1);
    dist[0] = 1;
    let reach = 0;
    for (let i = 0; i < n; i++) {
      const next = new Float64Array(total + 1);
      const r = r2[i];
      for (let s = 0; s <= reach; s++) {
        const f = dist[s];
        if (f === 0) continue;
        next[s] += 0.5 * f;
        next[s + r] += 0.5 * f;
      }
      reach += r;
      dist = next;
    }
    const v2 = Math.round(2 * v);
    let le = 0;
    for (let s = 0; s <= v2; s++) le += dist[s];
    let ge = 0;
    for (let s = v2; s <= total; s++) ge += dist[s];
    pLess = Math.min(1, le);
    pGreater = Math.min(1, ge);
  } else {
    method = 'normal';
    const sd = Math.sqrt((n * (n + 1) * (2 * n + 1)) / 24 - tieSum / 48);
    if (!(sd > 0)) {
      pLess = 1;
      pGreater = 1;
    } else {
      pGreater = normalCdf(-(v - mean - 0.5) / sd);
      pLess = normalCdf((v - mean + 0.5) / sd);
    }
  }
  let p: number;
  if (method === 'normal') {
    // Continuity correction toward the mean, as R / @stdlib: z = (V - mean - 0.5 sign) / sd.
    const sd = Math.sqrt((n * (n + 1) * (2 * n + 1)) / 24 - tieSum / 48);
    const z = sd > 0 ? (v - mean - 0.5 * Math.sign(v - mean)) / sd : 0;
    p = Math.min(1, 2 * normalCdf(-Math.abs(z)));
  } else {
    p = Math.min(1, 2 * Math.min(pLess, pGreater));
  }
  return { statistic: v, n, zeros, p, pGreater, pLess, direction, method };
}


describe('wilcoxonSignedRank equals its midRanks-based form', () => {
  it('on random samples with ties, zeros and NaN, exact and normal branches', () => {
    const rng = new Rng(12);
    for (let rep = 0; rep < 200; rep++) {
      const n = [1, 2, 5, 12, 30, 31, 70, 348][rep % 8];
      const grid = [0, 0.5, 3, 1e-3][rep % 4]; // 0: continuous values; otherwise rounded to a grid (ties)
      const d = Array.from({ length: n }, () => {
        const v = rng.normal() + 0.2;
        return grid > 0 ? Math.round(v / grid) * grid : v;
      });
      if (rep % 9 === 0) d.push(NaN, 0, -0);
      const exactMaxN = rep % 3 === 0 ? 50 : 30;
      const a = wilcoxonSignedRank(d, exactMaxN);
      const b = referenceSignedRank(d, exactMaxN);
      for (const k of Object.keys(b) as (keyof typeof b)[]) expect(Object.is(a[k], b[k]), `rep ${rep} ${String(k)}: ${a[k]} vs ${b[k]}`).toBe(true);
    }
  });
});
