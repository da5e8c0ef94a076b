import FFT from 'fft.js';
import { describe, expect, it } from 'vitest';
import { convolveDirect } from '../../../core/kernels/convolve-direct';
import { convolveFft } from '../../../core/kernels/convolve-fft';
import { fft } from '../../../core/kernels/fft';
import { Rng } from '../../../core/random/rng';
import { maxAbs, maxAbsDiff } from '../../helpers/close';
import { FIXTURES } from './fixtures';

describe('fft', () => {
  // Reference library: fft.js 4.0.4 (interleaved complex; inverse includes 1/N).
  it.each([2, 8, 64, 1024, 4096])('matches fft.js forward and inverse for N = %s', (n) => {
    const rng = new Rng(n);
    const re = Float64Array.from({ length: n }, () => rng.normal());
    const im = Float64Array.from({ length: n }, () => rng.normal());
    const lib = new FFT(n);
    const input = lib.createComplexArray();
    for (let i = 0; i < n; i++) {
      input[2 * i] = re[i];
      input[2 * i + 1] = im[i];
    }
    const out = lib.createComplexArray();
    lib.transform(out, input);
    const r = re.slice();
    const m = im.slice();
    fft(r, m);
    const libRe = out.filter((_: number, i: number) => i % 2 === 0);
    const libIm = out.filter((_: number, i: number) => i % 2 === 1);
    const scale = maxAbs(libRe) + maxAbs(libIm);
    expect(maxAbsDiff(r, libRe)).toBeLessThanOrEqual(1e-12 * scale);
    expect(maxAbsDiff(m, libIm)).toBeLessThanOrEqual(1e-12 * scale);
    const back = lib.createComplexArray();
    lib.inverseTransform(back, out);
    fft(r, m, true);
    expect(maxAbsDiff(r, back.filter((_: number, i: number) => i % 2 === 0))).toBeLessThanOrEqual(1e-12);
    expect(maxAbsDiff(r, re)).toBeLessThanOrEqual(1e-12);
  });
  it('matches numpy.fft.fft (fixture)', () => {
    const f = FIXTURES.fft;
    const re = Float64Array.from(f.re);
    const im = Float64Array.from(f.im);
    fft(re, im);
    expect(maxAbsDiff(re, f.out_re)).toBeLessThanOrEqual(1e-12 * maxAbs(f.out_re));
    expect(maxAbsDiff(im, f.out_im)).toBeLessThanOrEqual(1e-12 * maxAbs(f.out_re));
  });
  it('rejects lengths that are not powers of two and leaves length 1 alone', () => {
    expect(() => fft(new Float64Array(6), new Float64Array(6))).toThrow(/power of two/);
    const one = Float64Array.of(3);
    fft(one, new Float64Array(1));
    expect(one[0]).toBe(3);
  });
});

describe('convolution', () => {
  it('direct and FFT overlap-add both match numpy.convolve(mode="full") (fixture)', () => {
    const c = FIXTURES.convolve;
    const tol = 1e-12 * maxAbs(c.full) * 10;
    expect(maxAbsDiff(convolveDirect(c.a, c.b), c.full)).toBeLessThanOrEqual(tol);
    expect(maxAbsDiff(convolveFft(c.a, c.b), c.full)).toBeLessThanOrEqual(tol);
  });
  it('FFT equals direct for long signals spanning many blocks, and either argument order', () => {
    const rng = new Rng(9);
    const a = Float64Array.from({ length: 70000 }, () => rng.normal());
    const b = Float64Array.from({ length: 257 }, () => rng.normal());
    const d = convolveDirect(a, b);
    expect(maxAbsDiff(convolveFft(a, b), d)).toBeLessThanOrEqual(1e-11 * maxAbs(d));
    expect(maxAbsDiff(convolveFft(b, a), d)).toBeLessThanOrEqual(1e-11 * maxAbs(d));
  });
  it('empty inputs give an empty result', () => {
    expect(convolveDirect([], [1]).length).toBe(0);
    expect(convolveFft([1, 2], []).length).toBe(0);
  });
});
