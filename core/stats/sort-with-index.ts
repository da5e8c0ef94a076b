/**
 * Sorts keys[from, to) ascending in place and applies the same permutation to
 * index[from, to) (e.g. original positions), so ranks can be assigned in one
 * pass afterwards. Introsort: median-of-three quicksort with Hoare
 * partitioning (many equal keys cost O(n log n), not O(n^2)), insertion sort
 * below 16 elements, heapsort when the recursion gets too deep, so the worst
 * case is O(n log n). Not stable (equal keys may swap; their rank is the
 * same). No allocation.
 *
 * Why not TypedArray.prototype.sort: in Node 20 it costs ~200 ns per element
 * for a few hundred doubles (measured by bench/classify-bench.ts's session),
 * several times this, and it cannot carry the index along.
 *
 * Edge cases: NaN keys are a caller bug (comparisons with NaN are false, so
 * they end up anywhere); -0 and +0 compare equal. Reference: Musser (1997),
 * "Introspective sorting and selection algorithms"; checked against
 * Float64Array.prototype.sort on random inputs with many ties in
 * test/core/stats/sort-with-index.test.ts.
 */
export function sortWithIndex(keys: Float64Array, index: Int32Array, from = 0, to = keys.length): void {
  let depth = 0;
  for (let n = to - from; n > 1; n >>= 1) depth += 2;
  sortRange(keys, index, from, to - 1, depth);
}

function sortRange(a: Float64Array, ix: Int32Array, lo: number, hi: number, depth: number): void {
  while (hi - lo >= 16) {
    if (depth-- <= 0) {
      heapSort(a, ix, lo, hi);
      return;
    }
    // Median of three to a[lo]; Hoare partition around it.
    const mid = (lo + hi) >>> 1;
    if (a[mid] < a[lo]) swap(a, ix, mid, lo);
    if (a[hi] < a[lo]) swap(a, ix, hi, lo);
    if (a[hi] < a[mid]) swap(a, ix, hi, mid);
    const pivot = a[mid];
    let i = lo - 1;
    let j = hi + 1;
    for (;;) {
      do i++; while (a[i] < pivot);
      do j--; while (a[j] > pivot);
      if (i >= j) break;
      swap(a, ix, i, j);
    }
    // Recurse into the smaller side, loop on the larger (stack depth O(log n)).
    if (j - lo < hi - j - 1) {
      sortRange(a, ix, lo, j, depth);
      lo = j + 1;
    } else {
      sortRange(a, ix, j + 1, hi, depth);
      hi = j;
    }
  }
  for (let i = lo + 1; i <= hi; i++) {
    const v = a[i];
    const w = ix[i];
    let j = i - 1;
    while (j >= lo && a[j] > v) {
      a[j + 1] = a[j];
      ix[j + 1] = ix[j];
      j--;
    }
    a[j + 1] = v;
    ix[j + 1] = w;
  }
}

function swap(a: Float64Array, ix: Int32Array, i: number, j: number): void {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
  const u = ix[i];
  ix[i] = ix[j];
  ix[j] = u;
}

function heapSort(a: Float64Array, ix: Int32Array, lo: number, hi: number): void {
  const n = hi - lo + 1;
  const sift = (root: number, end: number) => {
    for (;;) {
      let child = 2 * root + 1;
      if (child >= end) return;
      if (child + 1 < end && a[lo + child + 1] > a[lo + child]) child++;
      if (!(a[lo + child] > a[lo + root])) return;
      swap(a, ix, lo + root, lo + child);
      root = child;
    }
  };
  for (let s = (n >> 1) - 1; s >= 0; s--) sift(s, n);
  for (let end = n - 1; end > 0; end--) {
    swap(a, ix, lo, lo + end);
    sift(0, end);
  }
}
