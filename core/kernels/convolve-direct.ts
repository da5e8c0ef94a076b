/**
 * Full linear convolution by direct summation: out[n] = sum_k a[k] b[n - k],
 * length a.length + b.length - 1 (empty when either input is empty).
 * O(len(a) len(b)); the reference the FFT path is checked against
 * (matches numpy.convolve(a, b, mode='full')).
 */
export function convolveDirect(a: ArrayLike<number>, b: ArrayLike<number>): Float64Array {
  if (a.length === 0 || b.length === 0) return new Float64Array(0);
  const out = new Float64Array(a.length + b.length - 1);
  for (let i = 0; i < a.length; i++) {
    const ai = a[i];
    if (ai === 0) continue;
    for (let j = 0; j < b.length; j++) out[i + j] += ai * b[j];
  }
  return out;
}
