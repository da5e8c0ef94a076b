/**
 * lightFreeSpikes: spikes outside half-open light intervals, and the ISI CV over ISIs that no
 * light interval separates. Reference: a naive per-spike filter written here, with the CV from
 * simple-statistics (sampleStandardDeviation / mean; npm reference library). Tolerance 1e-9
 * relative (sums in a different order).
 */
import { mean, sampleStandardDeviation } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { lightFreeSpikes } from '../../../core/light/light-free-spikes';
import { Rng } from '../../../core/random/rng';

function naive(t: Float64Array, iv: Float64Array) {
  const inLight = (x: number) => {
    for (let k = 0; k < iv.length; k += 2) if (x >= iv[k] && x < iv[k + 1]) return k;
    return -1;
  };
  const free: number[] = [];
  const isi: number[] = [];
  let prev = NaN;
  for (const x of t) {
    if (inLight(x) >= 0) {
      prev = NaN;
      continue;
    }
    // separated by a light interval lying between prev and x?
    let sep = false;
    for (let k = 0; k < iv.length; k += 2) if (iv[k] > prev && iv[k] <= x) sep = true;
    if (prev === prev && !sep) isi.push(x - prev);
    free.push(x);
    prev = x;
  }
  return { free, isi };
}

describe('lightFreeSpikes', () => {
  it('hand-made: edges are half-open, light splits the ISIs', () => {
    // light [1, 2) and [3, 3.5); spikes at 0.5, 1 (light), 1.5 (light), 2 (free), 2.5, 3.2 (light), 4, 4.5
    const t = Float64Array.from([0.5, 1, 1.5, 2, 2.5, 3.2, 4, 4.5]);
    const r = lightFreeSpikes(t, Float64Array.from([1, 2, 3, 3.5]));
    expect(Array.from(r.spikes)).toEqual([0.5, 2, 2.5, 4, 4.5]);
    expect(r.isiCount).toBe(2); // 2 -> 2.5 and 4 -> 4.5
    expect(r.isiCv).toBe(0);
    expect(lightFreeSpikes(t, Float64Array.from([1, 2, 3, 3.5]), false).spikes.length).toBe(0);
  });
  it.each([1, 2, 3])('random trains and intervals (seed %i) against a naive filter and simple-statistics', (seed) => {
    const rng = new Rng(seed);
    const t = Float64Array.from({ length: 3000 }, () => rng.uniform() * 100).sort();
    const iv: number[] = [];
    let x = rng.uniform();
    while (x < 100) {
      const a = x;
      const b = a + 0.05 + rng.uniform() * 0.5;
      iv.push(a, b);
      x = b + 0.1 + rng.uniform() * 2;
    }
    const ivs = Float64Array.from(iv);
    const r = lightFreeSpikes(t, ivs);
    const ref = naive(t, ivs);
    expect(Array.from(r.spikes)).toEqual(ref.free);
    expect(r.isiCount).toBe(ref.isi.length);
    const cv = sampleStandardDeviation(ref.isi) / mean(ref.isi);
    expect(Math.abs(r.isiCv - cv) / cv).toBeLessThan(1e-9);
    expect(lightFreeSpikes(t, ivs, false).isiCv).toBe(r.isiCv);
  });
  // The single forward walk (issue 9) against the naive filter, bit for bit: the CV formula of
  // the doc (sums of d and d^2 in time order, then SD (n - 1) / mean) applied to the naive ISIs.
  // Spikes exactly on interval starts and ends, ties, spikes only inside light, one spike.
  it.each([4, 5])('bit for bit against the naive filter with spikes on every edge (seed %i)', (seed) => {
    const rng = new Rng(seed);
    const iv: number[] = [];
    let x = 0.5;
    while (x < 50) {
      const a = x;
      const b = a + 0.05 + rng.uniform() * 0.3;
      iv.push(a, b);
      x = b + (rng.uniform() < 0.2 ? 0 : 0.1 + rng.uniform()); // some intervals touch
    }
    const ivs = Float64Array.from(iv);
    const t = Float64Array.from([...Array.from({ length: 800 }, () => rng.uniform() * 55), ...iv, ...iv.slice(0, 10)]).sort();
    const cvOf = (isi: number[]) => {
      let s = 0;
      let s2 = 0;
      for (const d of isi) {
        s += d;
        s2 += d * d;
      }
      const m = isi.length;
      const mu = s / m;
      return m >= 2 && mu > 0 ? Math.sqrt(Math.max(0, (s2 - m * mu * mu) / (m - 1))) / mu : NaN;
    };
    for (const train of [t, t.subarray(0, 1), Float64Array.from([iv[0], iv[2]]), new Float64Array(0)]) {
      const r = lightFreeSpikes(train, ivs);
      const ref = naive(train, ivs);
      expect(Array.from(r.spikes)).toEqual(ref.free);
      expect(r.isiCount).toBe(ref.isi.length);
      expect(Object.is(r.isiCv, cvOf(ref.isi)) || r.isiCv === cvOf(ref.isi)).toBe(true);
    }
  });
  it('no intervals: all spikes; fewer than 2 ISIs: NaN CV', () => {
    expect(lightFreeSpikes(Float64Array.from([1, 2, 4]), new Float64Array(0)).isiCv).toBeCloseTo(Math.SQRT1_2 / 1.5, 12);
    expect(lightFreeSpikes(Float64Array.from([1, 2]), new Float64Array(0)).isiCv).toBeNaN();
    expect(lightFreeSpikes(new Float64Array(0), Float64Array.from([0, 1])).spikes.length).toBe(0);
  });
});
