import { lloydKMeans } from './lloyd-k-means';

export interface KMeansFit {
  /** Cluster of each point, 0..k-1, numbered by decreasing cluster size (ties: first member first). */
  readonly labels: Int32Array;
  /** Cluster centres, row-major (k x dim), in label order. */
  readonly centres: Float64Array;
  /** Members per cluster, in label order. */
  readonly sizes: Int32Array;
  /** Within-cluster sum of squared Euclidean distances (the k-means objective). */
  readonly withinSs: number;
  /** Restarts run and the seed of the winning one. */
  readonly restarts: number;
  readonly bestSeed: number;
}

/**
 * k-means (Lloyd's algorithm with k-means++ starts: lloydKMeans, the same
 * labels as ml-kmeans 7.0.1 for the same seed, on typed arrays) run
 * `restarts` times with seeds seed, seed + 1, ...; the partition with the
 * smallest within-cluster sum of squares wins (a restart that leaves a
 * cluster empty is discarded). Labels are renumbered by decreasing size so
 * the result does not depend on the library's internal numbering.
 *
 * Input: points row-major (n x dim). Requires 1 <= k <= n. Deterministic for
 * a given seed.
 * Reference: Iris data set, k = 3: the same minimum within-cluster sum of
 * squares as SciPy 1.17 scipy.cluster.vq.kmeans2 over many seeded starts
 * (test/fixtures/iris-kmeans.json).
 */
export function kMeansRestarts(points: ArrayLike<number>, dim: number, k: number, restarts = 10, seed = 1): KMeansFit {
  const n = Math.floor(points.length / dim);
  if (!(k >= 1 && k <= n)) throw new Error(`k-means needs 1 <= k <= n, got k = ${k}, n = ${n}`);
  const flat = points instanceof Float64Array ? points : Float64Array.from(points);
  let best: { labels: Int32Array; ss: number; seed: number } | null = null;
  for (let r = 0; r < restarts; r++) {
    const s = seed + r;
    const labels = lloydKMeans(flat, dim, k, s, 300, 1e-12);
    const { ss, sizes } = withinSs(points, dim, labels, k);
    if (sizes.some((c) => c === 0)) continue;
    if (!best || ss < best.ss - 1e-12 * Math.abs(best.ss)) best = { labels, ss, seed: s };
  }
  if (!best) throw new Error(`k-means left a cluster empty in every restart (k = ${k}, n = ${n})`);
  // Renumber by decreasing size, ties by first member.
  const raw = best.labels;
  const sizesRaw = new Int32Array(k);
  const first = new Int32Array(k).fill(n);
  for (let i = 0; i < n; i++) {
    sizesRaw[raw[i]]++;
    if (first[raw[i]] === n) first[raw[i]] = i;
  }
  const order = Array.from({ length: k }, (_, c) => c).sort((a, b) => sizesRaw[b] - sizesRaw[a] || first[a] - first[b]);
  const map = new Int32Array(k);
  order.forEach((c, newC) => (map[c] = newC));
  const labels = new Int32Array(n);
  for (let i = 0; i < n; i++) labels[i] = map[raw[i]];
  const { ss, sizes, centres } = withinSs(points, dim, labels, k);
  return { labels, centres, sizes, withinSs: ss, restarts, bestSeed: best.seed };
}

function withinSs(points: ArrayLike<number>, dim: number, labels: Int32Array, k: number): { ss: number; sizes: Int32Array; centres: Float64Array } {
  const n = labels.length;
  const centres = new Float64Array(k * dim);
  const sizes = new Int32Array(k);
  for (let i = 0; i < n; i++) {
    sizes[labels[i]]++;
    for (let t = 0; t < dim; t++) centres[labels[i] * dim + t] += points[i * dim + t];
  }
  for (let c = 0; c < k; c++) for (let t = 0; t < dim; t++) centres[c * dim + t] /= sizes[c] || 1;
  let ss = 0;
  for (let i = 0; i < n; i++) {
    for (let t = 0; t < dim; t++) {
      const d = points[i * dim + t] - centres[labels[i] * dim + t];
      ss += d * d;
    }
  }
  return { ss, sizes, centres };
}
