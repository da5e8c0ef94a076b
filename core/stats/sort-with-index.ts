/**
 * Sorts keys[from, to) ascending in place and applies the same permutation to
 * index[from, to) (e.g. original positions), so ranks can be assigned in one
 * pass afterwards. Introsort: median-of-three quicksort with a three-way
 * partition (keys equal to the pivot are done at once, so samples with many
 * ties, such as per-trial slopes of small counts, sort in about n log(distinct
 * values)), insertion sort below 16 elements, heapsort when the recursion gets
 * too deep, so the worst case is O(n log n). Not stable (equal keys may swap; their rank is the
 * same). No allocation.
 *
 * Why not TypedArray.prototype.sort: in Node 20 it costs ~200 ns per element
 * for a few hundred doubles (measured by bench/classify-bench.ts's session),
 * several times this, and it cannot carry the index along.
 *
 * Whole-number keys within a small range (at most 4 n + 256 values apart,
 * e.g. counts, or the integer numerators of the ramp test's per-trial
 * slopes) are sorted by counting instead: one pass to check and find the
 * range, one to count, one to place (stable), O(n + range).
 *
 * Edge cases: NaN keys are a caller bug (comparisons with NaN are false, so
 * they end up anywhere); -0 and +0 compare equal. Reference: Musser (1997),
 * "Introspective sorting and selection algorithms"; checked against
 * Float64Array.prototype.sort on random inputs with many ties in
 * test/core/stats/sort-with-index.test.ts.
 */
export function sortWithIndex(keys: Float64Array, index: Int32Array, from = 0, to = keys.length): void {
  if (to - from >= 32 && countingSort(keys, index, from, to)) return;
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
    // Median of three as pivot; three-way partition (Dijkstra): < pivot, = pivot, > pivot.
    const mid = (lo + hi) >>> 1;
    const x = a[lo];
    const y = a[mid];
    const z = a[hi];
    const pivot = x < y ? (y < z ? y : x < z ? z : x) : x < z ? x : y < z ? z : y;
    let lt = lo;
    let i = lo;
    let gt = hi;
    while (i <= gt) {
      const v = a[i];
      if (v < pivot) swap(a, ix, lt++, i++);
      else if (v > pivot) swap(a, ix, i, gt--);
      else i++;
    }
    // [lo, lt) < pivot, [lt, gt] = pivot, (gt, hi] > pivot. Recurse into the
    // smaller side, loop on the larger (stack depth O(log n)).
    if (lt - lo < hi - gt) {
      sortRange(a, ix, lo, lt - 1, depth);
      lo = gt + 1;
    } else {
      sortRange(a, ix, gt + 1, hi, depth);
      hi = lt - 1;
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

let counting = { count: new Int32Array(0), keys: new Float64Array(0), index: new Int32Array(0) };

/** Counting sort of whole-number keys in a small range; false (nothing done) otherwise. */
function countingSort(a: Float64Array, ix: Int32Array, from: number, to: number): boolean {
  const n = to - from;
  let min = Infinity;
  let max = -Infinity;
  for (let i = from; i < to; i++) {
    const v = a[i];
    if (!Number.isInteger(v)) return false; // NaN, infinities and fractions take the comparison sort
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const range = max - min + 1;
  if (!(range <= 4 * n + 256)) return false;
  if (counting.count.length < range + 1 || counting.keys.length < n) {
    counting = { count: new Int32Array(Math.max(range + 1, counting.count.length)), keys: new Float64Array(Math.max(n, counting.keys.length)), index: new Int32Array(Math.max(n, counting.index.length)) };
  }
  const { count, keys, index } = counting; // reused across calls (not re-entrant; nothing escapes)
  count.fill(0, 0, range + 1);
  for (let i = from; i < to; i++) count[a[i] - min + 1]++;
  for (let r = 1; r <= range; r++) count[r] += count[r - 1]; // count[r] = first slot of value min + r
  for (let i = from; i < to; i++) {
    const slot = count[a[i] - min]++;
    keys[slot] = a[i]; // the key itself, so -0 stays -0
    index[slot] = ix[i];
  }
  for (let k = 0; k < n; k++) {
    a[from + k] = keys[k];
    ix[from + k] = index[k];
  }
  return true;
}
