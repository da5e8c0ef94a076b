/**
 * In-place iterative radix-2 complex FFT (Cooley-Tukey, decimation in time,
 * bit-reversed input order). re/im have the same power-of-two length.
 * Forward: X[k] = sum_n x[n] exp(-2 pi i k n / N). Inverse (inverse = true):
 * the conjugate transform divided by N, so fft(fft(x), inverse) = x.
 * Same conventions as fft.js (checked against it in the tests). Twiddles are
 * direct cos/sin values (not a recurrence, for accuracy), computed once per
 * size and kept (a pure cache: same input, same output).
 */
export function fft(re: Float64Array, im: Float64Array, inverse = false): void {
  const n = re.length;
  if (im.length !== n) throw new Error('fft: re and im lengths differ');
  if (n <= 1) return;
  if ((n & (n - 1)) !== 0) throw new Error(`fft: length ${n} is not a power of two`);
  // Bit reversal.
  for (let i = 1, j = 0; i < n; i++) {
    let bit = n >> 1;
    for (; j & bit; bit >>= 1) j ^= bit;
    j ^= bit;
    if (i < j) {
      let t = re[i];
      re[i] = re[j];
      re[j] = t;
      t = im[i];
      im[i] = im[j];
      im[j] = t;
    }
  }
  const sign = inverse ? 1 : -1;
  const { cosT, sinT } = twiddles(n);
  for (let size = 2; size <= n; size <<= 1) {
    const half = size >> 1;
    const step = n / size;
    for (let start = 0; start < n; start += size) {
      for (let k = 0, t = 0; k < half; k++, t += step) {
        const i = start + k;
        const j = i + half;
        const wr = cosT[t];
        const wi = sign * sinT[t];
        const xr = re[j] * wr - im[j] * wi;
        const xi = re[j] * wi + im[j] * wr;
        re[j] = re[i] - xr;
        im[j] = im[i] - xi;
        re[i] += xr;
        im[i] += xi;
      }
    }
  }
  if (inverse) {
    const s = 1 / n;
    for (let i = 0; i < n; i++) {
      re[i] *= s;
      im[i] *= s;
    }
  }
}

const TWIDDLES = new Map<number, { cosT: Float64Array; sinT: Float64Array }>();

function twiddles(n: number): { cosT: Float64Array; sinT: Float64Array } {
  let t = TWIDDLES.get(n);
  if (!t) {
    const cosT = new Float64Array(n >> 1);
    const sinT = new Float64Array(n >> 1);
    for (let k = 0; k < n >> 1; k++) {
      const a = (2 * Math.PI * k) / n;
      cosT[k] = Math.cos(a);
      sinT[k] = Math.sin(a);
    }
    t = { cosT, sinT };
    if (TWIDDLES.size > 32) TWIDDLES.clear();
    TWIDDLES.set(n, t);
  }
  return t;
}
