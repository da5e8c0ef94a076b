import { fft } from './fft';

/**
 * Full linear convolution of a long signal with a shorter kernel by FFT
 * overlap-add: blocks of the signal are transformed with a zero-padded
 * power-of-two size nfft >= 2 x kernel length, multiplied by the kernel's
 * spectrum and added back. Same result as convolveDirect (numpy.convolve,
 * mode 'full') to rounding (~1e-12 relative to the output's scale).
 * Memory O(nfft) besides the output; time O(n log nfft).
 */
export function convolveFft(signal: ArrayLike<number>, kernel: ArrayLike<number>): Float64Array {
  const n = signal.length;
  const m = kernel.length;
  if (n === 0 || m === 0) return new Float64Array(0);
  if (m > n) return convolveFft(kernel, signal);
  const out = new Float64Array(n + m - 1);
  let nfft = 1;
  while (nfft < 2 * m) nfft <<= 1;
  // Long signals: blocks of up to 2^15 points amortise each FFT (cost per output ~ log nfft).
  nfft = Math.max(nfft, Math.min(1 << 15, nextPow2(n + m - 1)), 64);
  const block = nfft - m + 1;
  const kr = new Float64Array(nfft);
  const ki = new Float64Array(nfft);
  for (let j = 0; j < m; j++) kr[j] = kernel[j];
  fft(kr, ki);
  const xr = new Float64Array(nfft);
  const xi = new Float64Array(nfft);
  for (let start = 0; start < n; start += block) {
    const len = Math.min(block, n - start);
    xr.fill(0);
    xi.fill(0);
    for (let j = 0; j < len; j++) xr[j] = signal[start + j];
    fft(xr, xi);
    for (let k = 0; k < nfft; k++) {
      const r = xr[k] * kr[k] - xi[k] * ki[k];
      xi[k] = xr[k] * ki[k] + xi[k] * kr[k];
      xr[k] = r;
    }
    fft(xr, xi, true);
    const end = Math.min(len + m - 1, out.length - start);
    for (let j = 0; j < end; j++) out[start + j] += xr[j];
  }
  return out;
}

function nextPow2(x: number): number {
  let p = 1;
  while (p < x) p <<= 1;
  return p;
}
