import { zigguratTables } from './ziggurat-tables';

const ZIG = zigguratTables();
const ZE = ZIG.exponential;
const ZN = ZIG.normal;

/**
 * Seeded pseudo-random numbers for simulation, bootstrap and permutation.
 * Core never uses unseeded randomness: every caller passes a seed, so every
 * result is bit-for-bit reproducible.
 *
 * Generator: xoshiro128** (Blackman & Vigna, 2018), 32-bit state words,
 * seeded through splitmix32. Doubles use 53 random bits. Reference stream for
 * seed 1 is pinned in test/core/random/rng.test.ts.
 */
export class Rng {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  private spareNormal = NaN;

  constructor(seed: number) {
    let x = (seed >>> 0) ^ 0x9e3779b9;
    const next = () => {
      x = (x + 0x9e3779b9) | 0;
      let z = x;
      z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
      z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
      return (z ^ (z >>> 16)) >>> 0;
    };
    this.s0 = next();
    this.s1 = next();
    this.s2 = next();
    this.s3 = next();
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1;
  }

  /** Next 32-bit unsigned integer. */
  nextUint32(): number {
    const result = Math.imul(rotl(Math.imul(this.s1, 5), 7), 9) >>> 0;
    const t = this.s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return result;
  }

  /** Uniform double in [0, 1) with 53 random bits. */
  uniform(): number {
    const a = this.nextUint32() >>> 5; // 27 bits
    const b = this.nextUint32() >>> 6; // 26 bits
    return (a * 67108864 + b) / 9007199254740992;
  }

  /** Uniform integer in [0, n). */
  int(n: number): number {
    return Math.floor(this.uniform() * n);
  }

  /** Standard normal (Marsaglia polar method). */
  normal(): number {
    if (!Number.isNaN(this.spareNormal)) {
      const s = this.spareNormal;
      this.spareNormal = NaN;
      return s;
    }
    let u: number, v: number, s: number;
    do {
      u = 2 * this.uniform() - 1;
      v = 2 * this.uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const m = Math.sqrt((-2 * Math.log(s)) / s);
    this.spareNormal = v * m;
    return u * m;
  }

  /** Exponential with mean 1. */
  exponential(): number {
    return -Math.log(1 - this.uniform());
  }

  /** Gamma(shape, scale 1) by Marsaglia & Tsang (2000); shape > 0. */
  gamma(shape: number): number {
    if (shape < 1) {
      const u = this.uniform();
      return this.gamma(1 + shape) * Math.pow(u, 1 / shape);
    }
    const d = shape - 1 / 3;
    const c = 1 / Math.sqrt(9 * d);
    for (;;) {
      let x: number, v: number;
      do {
        x = this.normal();
        v = 1 + c * x;
      } while (v <= 0);
      v = v * v * v;
      const u = this.uniform();
      if (u < 1 - 0.0331 * x * x * x * x) return d * v;
      if (Math.log(u) < 0.5 * x * x + d * (1 - v + Math.log(v))) return d * v;
    }
  }

  /**
   * Exponential with mean 1 by the ziggurat method (Marsaglia & Tsang 2000;
   * tables in ziggurat-tables.ts): one 32-bit draw (8 bits choose the layer,
   * 24 bits the position) and no logarithm for ~98.9 % of draws; the tail
   * beyond r = 7.697 by r + Exp(1) (memoryless). A different stream from
   * exponential(), which existing callers keep. About 4x faster here.
   */
  exponentialZiggurat(): number {
    const a = this.nextUint32();
    const j = a >>> 8;
    if (j < ZE.k[a & 255]) return j * ZE.w[a & 255];
    return this.exponentialRest(a);
  }

  /** exponentialZiggurat after a first draw `a` that missed its layer's rectangle (the rare path). */
  private exponentialRest(a: number): number {
    for (;;) {
      const i = a & 255;
      const j = a >>> 8;
      if (j < ZE.k[i]) return j * ZE.w[i];
      if (i === 0) return ZE.r - Math.log(1 - this.uniform());
      const x = j * ZE.w[i];
      if (ZE.f[i] + this.uniform() * (ZE.f[i - 1] - ZE.f[i]) < Math.exp(-x)) return x;
      a = this.nextUint32();
    }
  }

  /**
   * Standard normal by the ziggurat method (Marsaglia & Tsang 2000): one
   * 32-bit draw (7 bits layer, 1 bit sign, 24 bits position) for ~98.8 % of
   * draws; tail beyond r = 3.443 by Marsaglia's exponential rejection. A
   * different stream from normal().
   */
  normalZiggurat(): number {
    const a = this.nextUint32();
    const j = a >>> 8;
    if (j < ZN.k[a & 127]) return (a & 128 ? -j : j) * ZN.w[a & 127];
    return this.normalRest(a);
  }

  /** normalZiggurat after a first draw `a` that missed its layer's rectangle (the rare path). */
  private normalRest(a: number): number {
    for (;;) {
      const i = a & 127;
      const s = a & 128 ? -1 : 1;
      const j = a >>> 8;
      if (j < ZN.k[i]) return (a & 128 ? -j : j) * ZN.w[i];
      if (i === 0) {
        let x: number;
        let y: number;
        do {
          x = -Math.log(1 - this.uniform()) / ZN.r;
          y = -Math.log(1 - this.uniform());
        } while (y + y < x * x);
        return s * (ZN.r + x);
      }
      const x = j * ZN.w[i];
      if (ZN.f[i] + this.uniform() * (ZN.f[i - 1] - ZN.f[i]) < Math.exp(-0.5 * x * x)) return s * x;
      a = this.nextUint32();
    }
  }

  /**
   * Gamma(shape, scale 1) by Marsaglia & Tsang (2000, ACM TOMS 26:363) on
   * ziggurat normals; shape 1 is exponentialZiggurat(); shape < 1 by
   * Gamma(shape + 1) x U^(1/shape) with U^(1/shape) = exp(-E / shape),
   * E ~ Exp(1) (the same paper's boost). A different stream from gamma().
   */
  gammaZiggurat(shape: number): number {
    if (shape === 1) return this.exponentialZiggurat();
    const a = shape < 1 ? shape + 1 : shape;
    const d = a - 1 / 3;
    const g = this.marsagliaTsang(d, 1 / Math.sqrt(9 * d));
    return shape < 1 ? g * Math.exp(-this.exponentialZiggurat() / shape) : g;
  }

  /**
   * Fills `out` with gammaZiggurat(shape) draws, in order (the same numbers as
   * out.length calls): the loop runs inside the generator, so no draw is
   * boxed on its way to the caller (a simulation's hot loop reads them from
   * the array).
   */
  fillGammaZiggurat(out: Float64Array, shape: number): void {
    // The fast paths of exponentialZiggurat, normalZiggurat and marsagliaTsang written
    // out here (no double crosses a call on ~99 % of draws); the same draws in the same
    // order as gammaZiggurat (test/core/random/ziggurat.test.ts checks it).
    const len = out.length;
    if (shape === 1) {
      for (let i = 0; i < len; i++) {
        const a = this.nextUint32();
        const j = a >>> 8;
        out[i] = j < ZE.k[a & 255] ? j * ZE.w[a & 255] : this.exponentialRest(a);
      }
      return;
    }
    const small = shape < 1;
    const d = (small ? shape + 1 : shape) - 1 / 3;
    const c = 1 / Math.sqrt(9 * d);
    for (let i = 0; i < len; i++) {
      let g: number;
      for (;;) {
        let x: number;
        let v: number;
        do {
          const a = this.nextUint32();
          const j = a >>> 8;
          x = j < ZN.k[a & 127] ? (a & 128 ? -j : j) * ZN.w[a & 127] : this.normalRest(a);
          v = 1 + c * x;
        } while (v <= 0);
        v = v * v * v;
        const u = this.uniform();
        const x2 = x * x;
        if (u < 1 - 0.0331 * x2 * x2 || Math.log(u) < 0.5 * x2 + d * (1 - v + Math.log(v))) {
          g = d * v;
          break;
        }
      }
      if (small) {
        const a = this.nextUint32();
        const j = a >>> 8;
        g *= Math.exp(-(j < ZE.k[a & 255] ? j * ZE.w[a & 255] : this.exponentialRest(a)) / shape);
      }
      out[i] = g;
    }
  }

  /** Fills `out` with uniform() draws, in order (a loop inside the generator: nothing boxed). */
  fillUniform(out: Float64Array): void {
    for (let i = 0; i < out.length; i++) out[i] = this.uniform();
  }

  /** Fills `out` with normalZiggurat() draws, in order (a loop inside the generator: nothing boxed). */
  fillNormalZiggurat(out: Float64Array): void {
    for (let i = 0; i < out.length; i++) out[i] = this.normalZiggurat();
  }

  /** Marsaglia & Tsang's rejection step for Gamma(d + 1/3), c = 1 / sqrt(9 d). */
  private marsagliaTsang(d: number, c: number): number {
    for (;;) {
      let x: number;
      let v: number;
      do {
        x = this.normalZiggurat();
        v = 1 + c * x;
      } while (v <= 0);
      v = v * v * v;
      const u = this.uniform();
      const x2 = x * x;
      if (u < 1 - 0.0331 * x2 * x2) return d * v;
      if (Math.log(u) < 0.5 * x2 + d * (1 - v + Math.log(v))) return d * v;
    }
  }

  /** Poisson count with the given mean (inversion below 30, else PTRS of Hormann 1993). */
  poisson(mean: number): number {
    if (!(mean > 0)) return 0;
    if (mean < 30) {
      const l = Math.exp(-mean);
      let k = 0;
      let p = this.uniform();
      while (p > l) {
        k++;
        p *= this.uniform();
      }
      return k;
    }
    const slam = Math.sqrt(mean);
    const loglam = Math.log(mean);
    const b = 0.931 + 2.53 * slam;
    const a = -0.059 + 0.02483 * b;
    const invalpha = 1.1239 + 1.1328 / (b - 3.4);
    const vr = 0.9277 - 3.6224 / (b - 2);
    for (;;) {
      const u = this.uniform() - 0.5;
      const v = this.uniform();
      const us = 0.5 - Math.abs(u);
      const k = Math.floor(((2 * a) / us + b) * u + mean + 0.43);
      if (us >= 0.07 && v <= vr) return k;
      if (k < 0 || (us < 0.013 && v > us)) continue;
      if (Math.log(v) + Math.log(invalpha) - Math.log(a / (us * us) + b) <= -mean + k * loglam - logFactorial(k)) return k;
    }
  }
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

function logFactorial(k: number): number {
  let s = 0;
  for (let i = 2; i <= k; i++) s += Math.log(i);
  return s;
}
