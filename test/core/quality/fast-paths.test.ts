/**
 * The quality step's fast paths (issue 9) against the per-spike loops they
 * replace, on the same inputs: countPerBin (presence ratio, rate drift),
 * the exclusion walk of rateDrift (plain merge and exclusionLookup table),
 * intervalMetrics (ISI violations, LV, CV2 in one pass). Results must be
 * identical bit for bit (Object.is: NaN and -0 count). The metrics'
 * definitions are checked against their published sources in
 * metrics.test.ts; here the reference is the straightforward per-spike loop,
 * written out below as it stood before the fast paths.
 */
import { describe, expect, it } from 'vitest';
import { countPerBin } from '../../../core/quality/count-per-bin';
import { cv2 } from '../../../core/quality/cv2';
import { driftSegments, type DriftSegments } from '../../../core/quality/drift-segments';
import { exclusionLookup } from '../../../core/quality/exclusion-lookup';
import { intervalMetrics } from '../../../core/quality/interval-metrics';
import { isiViolations } from '../../../core/quality/isi-violations';
import { lightWindows } from '../../../core/quality/light-windows';
import { localVariation } from '../../../core/quality/local-variation';
import { presenceRatio } from '../../../core/quality/presence-ratio';
import { rateDrift } from '../../../core/quality/rate-drift';
import { addIntervalOverlap } from '../../../core/quality/add-interval-overlap';
import { Rng } from '../../../core/random/rng';

/** The per-spike bin rule: spikes in [startS, stopS], bin min(bins - 1, floor((t - startS) / width)). */
function referenceCounts(t: ArrayLike<number>, startS: number, stopS: number, width: number, bins: number): Float64Array {
  const out = new Float64Array(bins);
  for (let i = 0; i < t.length; i++) {
    if (t[i] < startS || t[i] > stopS) continue;
    let b = Math.floor((t[i] - startS) / width);
    if (b >= bins) b = bins - 1;
    out[b]++;
  }
  return out;
}

/** rateDrift as one pass testing every spike (the implementation before the fast path). */
function referenceRateDrift(spikeTimes: Float64Array, segments: DriftSegments) {
  const { startS, stopS, count: k, widthS: width, timeLeftS: kept } = segments;
  if (k === 0) return { ratesHz: new Float64Array(0), cv: NaN, slopeHzPerMin: NaN };
  const len = stopS - startS;
  const counts = new Float64Array(k);
  const xs = segments.exclude.startS;
  const xe = segments.exclude.stopS;
  let x = 0;
  for (let i = 0; i < spikeTimes.length; i++) {
    const t = spikeTimes[i];
    if (t < startS || t > stopS) continue;
    while (x < xs.length && xe[x] <= t) x++;
    if (x < xs.length && xs[x] <= t) continue;
    let b = Math.floor((t - startS) / width);
    if (b >= k) b = k - 1;
    counts[b]++;
  }
  const ratesHz = new Float64Array(k);
  const centresS = new Float64Array(k);
  let m = 0;
  let mean = 0;
  let meanT = 0;
  for (let b = 0; b < k; b++) {
    ratesHz[b] = kept[b] > 0.01 * width ? counts[b] / kept[b] : NaN;
    centresS[b] = startS + (b + 0.5) * width;
    if (Number.isNaN(ratesHz[b])) continue;
    m++;
    mean += ratesHz[b];
    meanT += centresS[b];
  }
  if (m < 2) return { ratesHz, cv: NaN, slopeHzPerMin: NaN };
  mean /= m;
  meanT /= m;
  let ss = 0;
  let sxy = 0;
  let sxx = 0;
  for (let b = 0; b < k; b++) {
    if (Number.isNaN(ratesHz[b])) continue;
    const d = ratesHz[b] - mean;
    const dt = centresS[b] - meanT;
    ss += d * d;
    sxy += dt * d;
    sxx += dt * dt;
  }
  const cv = mean > 0 ? Math.sqrt(ss / m) / mean : NaN;
  let slopeHzPerMin = (sxy / sxx) * 60;
  if (Math.abs(slopeHzPerMin * (len / 60)) < 1e-12 * mean) slopeHzPerMin = 0;
  return { ratesHz, cv, slopeHzPerMin };
}

/** presenceRatio as one pass testing every spike (before the fast path). */
function referencePresence(spikeTimes: Float64Array, startS: number, stopS: number, nBins: number, observed?: ArrayLike<number>): number {
  const len = stopS - startS;
  const bins = Math.floor(nBins);
  if (!(len > 0) || !(bins >= 1)) return NaN;
  const width = len / bins;
  let eligible: Uint8Array | null = null;
  let nEligible = bins;
  if (observed) {
    const cover = new Float64Array(bins);
    for (let j = 0; j + 1 < observed.length; j += 2) addIntervalOverlap(cover, startS, width, Math.max(startS, observed[j]), Math.min(stopS, observed[j + 1]), 1);
    eligible = new Uint8Array(bins);
    nEligible = 0;
    for (let k = 0; k < bins; k++) if (cover[k] >= 0.5 * width) (eligible[k] = 1), nEligible++;
    if (nEligible === 0) return NaN;
  }
  let occupied = 0;
  let last = -1;
  for (let i = 0; i < spikeTimes.length; i++) {
    const t = spikeTimes[i];
    if (t < startS || t > stopS) continue;
    let b = Math.floor((t - startS) / width);
    if (b >= bins) b = bins - 1;
    if (b !== last) {
      if (eligible === null || eligible[b] === 1) occupied++;
      last = b;
    }
  }
  return occupied / nEligible;
}

/** Sorted random train: Poisson-like gaps, with bursts of exact duplicates and spikes placed exactly on bin edges. */
function train(rng: Rng, n: number, startS: number, stopS: number, edges: number[] = []): Float64Array {
  const t: number[] = [];
  for (let i = 0; i < n; i++) t.push(startS + (stopS - startS) * rng.uniform());
  for (let i = 0; i < n / 20; i++) {
    const d = t[Math.floor(rng.uniform() * t.length)];
    t.push(d, d); // zero ISIs
  }
  t.push(...edges);
  return Float64Array.from(t).sort();
}

const same = (a: ArrayLike<number>, b: ArrayLike<number>) => {
  expect(a.length).toBe(b.length);
  for (let i = 0; i < a.length; i++) expect(Object.is(a[i], b[i]), `index ${i}: ${a[i]} vs ${b[i]}`).toBe(true);
};

describe('countPerBin equals the per-spike bin rule', () => {
  it('on random trains, with spikes on bin edges, at the span ends and outside the span', () => {
    const rng = new Rng(91);
    for (const [startS, stopS, bins] of [[0, 100, 10], [0.1, 7.3, 100], [3, 3.0000001, 7], [-5, 1e4, 100], [0, 1, 3]] as const) {
      const width = (stopS - startS) / bins;
      const edges = [startS, stopS, startS - 1e-9, stopS + 1e-9];
      for (let b = 0; b <= bins; b++) edges.push(startS + b * width, startS + b * width - 1e-12 * Math.abs(width));
      for (const n of [0, 1, 2, 50, 3000]) {
        const t = train(rng, n, startS - 0.1 * (stopS - startS), stopS + 0.1 * (stopS - startS), n > 1 ? edges : []);
        const out = new Float64Array(bins);
        const counted = countPerBin(t, startS, stopS, width, out);
        const ref = referenceCounts(t, startS, stopS, width, bins);
        same(out, ref);
        expect(counted).toBe(ref.reduce((s, x) => s + x, 0));
      }
    }
  });
  it('puts a spike whose bin rounds past the last edge in the last bin', () => {
    // (0.3 - 0) / 0.1 = 2.9999999999999996 -> bin 2; 0.30000000000000004 / 0.1 = 3.0000000000000004 -> 3, clamped to 2
    const out = new Float64Array(3);
    countPerBin(Float64Array.of(0, 0.1, 0.3, 0.30000000000000004), 0, 0.30000000000000004, 0.1, out);
    same(out, referenceCounts(Float64Array.of(0, 0.1, 0.3, 0.30000000000000004), 0, 0.30000000000000004, 0.1, 3));
    expect(Array.from(out)).toEqual([1, 1, 2]);
  });
  it('adds to the counts it is given and handles an empty train', () => {
    const out = Float64Array.of(1, 1);
    expect(countPerBin(new Float64Array(0), 0, 2, 1, out)).toBe(0);
    countPerBin(Float64Array.of(0.5), 0, 2, 1, out);
    expect(Array.from(out)).toEqual([2, 1]);
  });
});

describe('presenceRatio equals the per-spike loop', () => {
  it('with and without observed intervals', () => {
    const rng = new Rng(5);
    for (const n of [0, 1, 3, 40, 400, 5000]) {
      const t = train(rng, n, -10, 1010, [0, 1000, 10, 500]);
      same([presenceRatio(t, 0, 1000, 100)], [referencePresence(t, 0, 1000, 100)]);
      const obs = [0, 120.2, 300, 650.05, 900, 2000];
      same([presenceRatio(t, 0, 1000, 100, obs)], [referencePresence(t, 0, 1000, 100, obs)]);
      same([presenceRatio(t, 3.3, 777.7, 37)], [referencePresence(t, 3.3, 777.7, 37)]);
    }
  });
});

describe('rateDrift equals the per-spike loop', () => {
  const rng = new Rng(17);
  // Light windows after irregular pulses in the second half of the span (as a light block), some past the span's end.
  const onsets: number[] = [];
  for (let t = 550; t < 1003; t += 0.05 + 0.4 * rng.uniform()) onsets.push(t);
  const light = lightWindows(onsets, 0, 10);
  it('with light windows excluded: first use (merge walk) and later uses (lookup table) agree with it', () => {
    const seg = driftSegments(0, 1000, 10, light);
    const edges = [...light.startS.slice(0, 50), ...light.stopS.slice(0, 50), 0, 1000, 999.999, 1000.0000001];
    for (const [n, rateScale] of [[0, 1], [1, 1], [2, 1], [300, 1], [3000, 1], [60000, 1]] as const) {
      const t = train(rng, n * rateScale, -5, 1005, n > 1 ? edges : []);
      const ref = referenceRateDrift(t, seg);
      for (let use = 0; use < 3; use++) {
        const d = rateDrift(t, seg);
        same(d.ratesHz, ref.ratesHz);
        same([d.cv, d.slopeHzPerMin], [ref.cv, ref.slopeHzPerMin]);
      }
    }
  });
  it('without exclusions, with one interval and with intervals covering a whole segment', () => {
    for (const ex of [undefined, { startS: [20], stopS: [20.5] }, { startS: [0, 150, 400], stopS: [100, 300, 401] }]) {
      const seg = driftSegments(0, 1000, 10, ex);
      for (const n of [0, 1, 500, 5000]) {
        const t = train(rng, n, 0, 1000, n > 1 ? [0, 100, 150, 300, 1000] : []);
        const ref = referenceRateDrift(t, seg);
        for (let use = 0; use < 2; use++) {
          const d = rateDrift(t, seg);
          same(d.ratesHz, ref.ratesHz);
          same([d.cv, d.slopeHzPerMin], [ref.cv, ref.slopeHzPerMin]);
        }
      }
    }
  });
});

describe('exclusionLookup', () => {
  it('gives the merge pointer of a merge from the first interval, or -1 only where no interval holds the time', () => {
    const rng = new Rng(3);
    const onsets = Array.from({ length: 500 }, () => 100 * rng.uniform());
    const w = lightWindows(onsets, 0, 10);
    const look = exclusionLookup(w.startS, w.stopS)!;
    expect(look).not.toBeNull();
    const times = [...Array.from({ length: 5000 }, () => w.startS[0] + (w.stopS[w.stopS.length - 1] - w.startS[0]) * rng.uniform()), ...w.startS, ...w.stopS.slice(0, -1)];
    for (const t of times) {
      // reference: merge from 0
      let x0 = 0;
      while (w.stopS[x0] <= t) x0++;
      const inside = w.startS[x0] <= t;
      const c = look.first[Math.floor((t - look.originS) * look.invCellS)];
      if (c < 0) {
        expect(inside, `t ${t}`).toBe(false);
        continue;
      }
      expect(c).toBeLessThanOrEqual(x0);
      let x = c;
      while (w.stopS[x] <= t) x++;
      expect(x).toBe(x0);
    }
  });
  it('is null without intervals', () => {
    expect(exclusionLookup([], [])).toBeNull();
  });
});

describe('intervalMetrics equals isiViolations, localVariation and cv2', () => {
  it('on random trains with zero ISIs, on regular trains and below three spikes', () => {
    const rng = new Rng(8);
    const cases: Float64Array[] = [new Float64Array(0), Float64Array.of(1), Float64Array.of(1, 1.001), Float64Array.of(1, 1, 1), Float64Array.of(0, 0.1, 0.3, 0.4, 0.8, 1.0)];
    cases.push(Float64Array.from({ length: 100 }, (_, i) => 5 + i * 0.01)); // regular
    for (const n of [3, 10, 1000, 20000]) cases.push(train(rng, n, 0, n / 5));
    cases.push(train(rng, 3000, 1e6, 1e6 + 600)); // large times, small ISIs relative to them
    for (const t of cases) {
      for (const refractoryS of [0.0015, 0.1, 0]) {
        const m = intervalMetrics(t, refractoryS);
        const v = isiViolations(t, refractoryS);
        same([m.violations.count, m.violations.isiCount, m.violations.fraction], [v.count, v.isiCount, v.fraction]);
        same([m.lv, m.cv2], [localVariation(t), cv2(t)]);
      }
    }
  });
});
