/**
 * The k-th smallest value (0-based) of x[0..n), found in place by
 * Hoare's selection with median-of-three pivots (expected O(n); the order of
 * x is changed). Used for medians where a full sort would cost O(n log n).
 * NaN values must not be present. Throws when k is outside [0, n).
 */
export function selectKth(x: Float64Array, n: number, k: number): number {
  if (!(k >= 0 && k < n)) throw new Error(`selectKth: k=${k} outside [0, ${n})`);
  let lo = 0;
  let hi = n - 1;
  while (hi > lo) {
    const mid = (lo + hi) >>> 1;
    // median of three as pivot
    let a = x[lo];
    let b = x[mid];
    const c = x[hi];
    if (a > b) [a, b] = [b, a];
    const pivot = c < a ? a : c > b ? b : c;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (x[i] < pivot) i++;
      while (x[j] > pivot) j--;
      if (i <= j) {
        const t = x[i];
        x[i] = x[j];
        x[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return x[k];
  }
  return x[k];
}
