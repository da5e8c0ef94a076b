/**
 * The ziggurat samplers of Rng (exponentialZiggurat, normalZiggurat, gammaZiggurat) and their
 * tables (core/random/ziggurat-tables.ts). Outside references:
 * - the layer constants r and v and every layer edge against test/fixtures/random/ziggurat.json,
 *   solved from the layer equations of Marsaglia & Tsang (2000, J Stat Softw 5(8)) by SciPy's
 *   brentq (generator beside the fixture, versions inside); tolerance: r and v to 1e-14 relative
 *   (both are the same doubles printed by Python), edges to 1e-10 relative (the recursion in two
 *   languages may differ in the last bits, amplified ~100x near the top layer);
 * - the distributions: Kolmogorov-Smirnov tests of @stdlib/stats-kstest against the exact CDFs of
 *   @stdlib (exponential, normal, gamma), n = 5,000 (its exact p-value is slow for larger n), two
 *   fixed seeds, pass at p > 0.001; and the same test rejecting a scale 1.2 times too large (p < 0.001), so
 *   it can fail; the moments over 200,000 draws as in rng.test.ts;
 * - the tails beyond r (the branches KS cannot see): share of draws beyond r against the exact
 *   tail mass e^-r (exponential) and 2(1 - Phi(r)) (normal, Phi from @stdlib), within 5 binomial
 *   standard errors over 2,000,000 draws.
 */
import { readFileSync } from 'node:fs';
import gammaCdf from '@stdlib/stats-base-dists-gamma-cdf';
import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import kstest from '@stdlib/stats-kstest';
import { describe, expect, it } from 'vitest';
import { Rng } from '../../../core/random/rng';
import { zigguratTables } from '../../../core/random/ziggurat-tables';

interface Layers {
  layers: number;
  r: number;
  v: number;
  closingResidual: number;
  edges: number[];
}
const fixture = JSON.parse(readFileSync(new URL('../../fixtures/random/ziggurat.json', import.meta.url), 'utf8')) as {
  generator: string;
  numpy: string;
  scipy: string;
  exponential: Layers;
  normal: Layers;
};

describe(`ziggurat tables vs ${fixture.generator} (SciPy ${fixture.scipy}, NumPy ${fixture.numpy})`, () => {
  const t = zigguratTables();
  it.each(['exponential', 'normal'] as const)('%s: r, v and every layer edge', (name) => {
    const want = fixture[name];
    const z = t[name];
    expect(Math.abs(want.closingResidual)).toBeLessThan(1e-12); // the fixture's root closes the top layer
    expect(z.n).toBe(want.layers);
    expect(Math.abs(z.r - want.r) / want.r).toBeLessThan(1e-14);
    // v is implied by the base strip: k[0] = r / (v / f(r)) * 2^24
    const f = name === 'exponential' ? (x: number) => Math.exp(-x) : (x: number) => Math.exp(-0.5 * x * x);
    const v = (z.r / (z.k[0] / 16777216)) * f(z.r);
    expect(Math.abs(v - want.v) / want.v).toBeLessThan(1e-14);
    expect(want.edges.length).toBe(z.n - 1);
    for (let k = 0; k < want.edges.length; k++) {
      const got = z.w[z.n - 1 - k] * 16777216;
      expect(Math.abs(got - want.edges[k]) / want.edges[k], `edge ${k}: ${got} vs ${want.edges[k]}`).toBeLessThan(1e-10);
      expect(z.f[z.n - 1 - k]).toBeCloseTo(f(want.edges[k]), 12);
    }
  });
});

describe('ziggurat samplers: distribution (KS test of @stdlib/stats-kstest against @stdlib CDFs)', () => {
  const n = 5_000;
  const sample = (seed: number, draw: (r: Rng) => number) => {
    const r = new Rng(seed);
    return Float64Array.from({ length: n }, () => draw(r));
  };
  it.each([
    ['exponentialZiggurat', (r: Rng) => r.exponentialZiggurat(), (x: number) => (x > 0 ? 1 - Math.exp(-x) : 0)],
    ['normalZiggurat', (r: Rng) => r.normalZiggurat(), (x: number) => normalCdf(x, 0, 1)],
    ['gammaZiggurat(4)', (r: Rng) => r.gammaZiggurat(4), (x: number) => gammaCdf(x, 4, 1)],
    ['gammaZiggurat(1)', (r: Rng) => r.gammaZiggurat(1), (x: number) => gammaCdf(x, 1, 1)],
    ['gammaZiggurat(0.25)', (r: Rng) => r.gammaZiggurat(0.25), (x: number) => gammaCdf(x, 0.25, 1)],
    ['gammaZiggurat(1.25)', (r: Rng) => r.gammaZiggurat(1.25), (x: number) => gammaCdf(x, 1.25, 1)],
    ['gammaZiggurat(30)', (r: Rng) => r.gammaZiggurat(30), (x: number) => gammaCdf(x, 30, 1)],
  ] as const)('%s follows its distribution (p > 0.001); a scale 1.2 times too large is rejected (p < 0.001)', (_name, draw, cdf) => {
    for (const seed of [17, 18]) {
      const x = sample(seed, draw);
      const ok = kstest(x, cdf);
      expect(ok.pValue, `seed ${seed}: KS statistic ${ok.statistic}`).toBeGreaterThan(0.001);
      const wrong = kstest(x, (v: number) => cdf(v / 1.2));
      expect(wrong.pValue).toBeLessThan(0.001);
    }
  });
  // Moments: textbook mean and variance (Gamma(k, 1): k and k), 5 SE on the mean, 3 % on the variance.
  it.each([
    ['exponentialZiggurat', (r: Rng) => r.exponentialZiggurat(), 1, 1],
    ['normalZiggurat', (r: Rng) => r.normalZiggurat(), 0, 1],
    ['gammaZiggurat(4)', (r: Rng) => r.gammaZiggurat(4), 4, 4],
    ['gammaZiggurat(0.25)', (r: Rng) => r.gammaZiggurat(0.25), 0.25, 0.25],
  ] as const)('%s has the textbook mean and variance', (_name, draw, mean, variance) => {
    const r = new Rng(7);
    const m = 200_000;
    let s = 0;
    let s2 = 0;
    for (let i = 0; i < m; i++) {
      const x = draw(r);
      s += x;
      s2 += x * x;
    }
    const mu = s / m;
    expect(Math.abs(mu - mean)).toBeLessThan(5 * Math.sqrt(variance / m));
    expect(Math.abs(s2 / m - mu * mu - variance) / variance).toBeLessThan(0.03);
  });
  it.each([1, 4, 0.25, 0.5])('fillGammaZiggurat(%s) gives the numbers of as many gammaZiggurat calls; fillUniform and fillNormalZiggurat likewise', (shape) => {
    const a = new Rng(11);
    const b = new Rng(11);
    const filled = new Float64Array(3000);
    a.fillGammaZiggurat(filled, shape);
    expect(Array.from(filled)).toEqual(Array.from({ length: 3000 }, () => b.gammaZiggurat(shape)));
    a.fillUniform(filled);
    expect(Array.from(filled)).toEqual(Array.from({ length: 3000 }, () => b.uniform()));
    a.fillNormalZiggurat(filled);
    expect(Array.from(filled)).toEqual(Array.from({ length: 3000 }, () => b.normalZiggurat()));
  });
  it('is reproducible for a seed, and leaves the existing streams alone', () => {
    const a = sample(3, (r) => r.gammaZiggurat(4));
    const b = sample(3, (r) => r.gammaZiggurat(4));
    expect(Array.from(b)).toEqual(Array.from(a));
    // Rng.gamma and Rng.exponential (the simulator's) are not the ziggurat streams.
    const old = new Rng(3);
    const zig = new Rng(3);
    expect(old.exponential()).not.toBe(zig.exponentialZiggurat());
  });
});

describe('ziggurat samplers: the tails beyond r', () => {
  const N = 2_000_000;
  const tails = zigguratTables();
  it.each([
    ['exponential', (r: Rng) => r.exponentialZiggurat(), tails.exponential.r, Math.exp(-tails.exponential.r)],
    ['normal (both sides)', (r: Rng) => Math.abs(r.normalZiggurat()), tails.normal.r, 2 * (1 - normalCdf(tails.normal.r, 0, 1))],
  ] as const)('%s: share beyond r within 5 binomial SE of the exact tail mass', (_name, draw, r, mass) => {
    const rng = new Rng(99);
    let beyond = 0;
    let far = 0;
    for (let i = 0; i < N; i++) {
      const x = draw(rng);
      if (x > r) beyond++;
      if (x > r + 1) far++;
    }
    const se = Math.sqrt((mass * (1 - mass)) / N);
    expect(Math.abs(beyond / N - mass), `${beyond / N} vs ${mass}`).toBeLessThan(5 * se);
    expect(far).toBeGreaterThan(0); // the tail branch reaches past r
  });
  it('normal draws are symmetric: share below 0 within 5 SE of 1/2', () => {
    const rng = new Rng(5);
    let neg = 0;
    for (let i = 0; i < N; i++) if (rng.normalZiggurat() < 0) neg++;
    expect(Math.abs(neg / N - 0.5)).toBeLessThan(5 * Math.sqrt(0.25 / N));
  });
});
