import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import { autocorrelogram } from '../../../core/quality/autocorrelogram';
import { cv2 } from '../../../core/quality/cv2';
import { hillContamination } from '../../../core/quality/hill-contamination';
import { isiViolations } from '../../../core/quality/isi-violations';
import { localVariation } from '../../../core/quality/local-variation';
import { lightWindows } from '../../../core/quality/light-windows';
import { presenceRatio } from '../../../core/quality/presence-ratio';
import { driftSegments } from '../../../core/quality/drift-segments';
import { rateDrift } from '../../../core/quality/rate-drift';
import { Rng } from '../../../core/random/rng';

const fromIsis = (isis: number[], start = 0) => {
  const t = new Float64Array(isis.length + 1);
  t[0] = start;
  isis.forEach((d, i) => (t[i + 1] = t[i] + d));
  return t;
};
/** Relative tolerance of a few ulps for closed-form arithmetic (k * EPS, k = 8). */
const REL = 8 * Number.EPSILON;
const close = (x: number, expected: number, tol = REL * Math.max(1, Math.abs(expected))) =>
  expect(Math.abs(x - expected), `value ${x}, expected ${expected}, diff ${x - expected}, tol ${tol}`).toBeLessThanOrEqual(tol);

describe('hillContamination: Hill, Mehta & Kleinfeld (2011) J Neurosci 31:8699 (formula from memory, REFERENCES.md)', () => {
  // F = 1/2 - sqrt(1/4 - r T / (2 (tau_r - tau_c) N^2)), values worked by hand:
  it.each([
    // r=50, N=20000, T=3600 s, tau_r=2 ms, tau_c=0.5 ms: r T = 180000; 2 * 0.0015 * 4e8 = 1.2e6;
    // radicand = 0.25 - 0.15 = 0.1, F = 0.5 - sqrt(0.1) = 0.18377223398316206
    [50, 20000, 3600, 0.002, 0.0005, 0.5 - Math.sqrt(0.1)],
    // r=25, N=5000, T=600 s, tau_r=1.5 ms, tau_c=0: r T = 15000; 2 * 0.0015 * 2.5e7 = 75000;
    // radicand = 0.25 - 0.2 = 0.05, F = 0.5 - sqrt(0.05) = 0.27639320225002106
    [25, 5000, 600, 0.0015, 0, 0.5 - Math.sqrt(0.05)],
    // r=10, N=10000, T=1000 s, tau_r=1.5 ms: radicand = 0.25 - 10000/300000 = 0.216666...,
    // F = 0.034525331874368625
    [10, 10000, 1000, 0.0015, 0, 0.034525331874368625],
    // no violations: F = 0
    [0, 1000, 100, 0.0015, 0, 0],
  ])('r=%d N=%d T=%d tau_r=%d tau_c=%d -> F=%d', (r, n, t, tr, tc, f) => {
    const c = hillContamination(r, n, t, tr, tc);
    close(c.value, f, 1e-15);
    expect(c.atLeastHalf).toBe(false);
    // and the published forward model gives back r: r = 2 (tau_r - tau_c) N^2 F (1 - F) / T
    close((2 * (tr - tc) * n * n * c.value * (1 - c.value)) / t, r, 1e-9 * Math.max(1, r));
  });
  it('reports >= 0.5 (undefined) when the root is negative, never a number', () => {
    // r=10, N=1000, T=1000 s, tau_r=1.5 ms: r T / (2 tau N^2) = 10000 / 3000 = 3.33 > 1/4
    expect(hillContamination(10, 1000, 1000, 0.0015, 0)).toEqual({ value: NaN, atLeastHalf: true });
    // radicand exactly 0 -> F = 0.5 (r = 2 * 0.0015 * 1e6 * 0.25 / 1000 = 0.75 violations in expectation)
    close(hillContamination(0.75, 1000, 1000, 0.0015, 0).value, 0.5, 1e-12);
  });
  it('is undefined without spikes, span or window', () => {
    expect(hillContamination(0, 0, 10, 0.0015, 0).value).toBeNaN();
    expect(hillContamination(0, 10, 0, 0.0015, 0).value).toBeNaN();
    expect(hillContamination(0, 10, 10, 0.001, 0.001).value).toBeNaN();
    expect(hillContamination(0, 10, 10, 0.001, 0.001).atLeastHalf).toBe(false);
  });
});

describe('isiViolations (count of consecutive ISIs < refractory period; common practice)', () => {
  it('counts hand-made violations', () => {
    // ISIs 1 ms, 10 ms, 1.4999 ms, 2 ms (not a violation), 0 ms (duplicate spike, counted)
    const t = fromIsis([0.001, 0.01, 0.0014999, 0.002, 0]);
    expect(isiViolations(t, 0.0015)).toEqual({ count: 3, isiCount: 5, fraction: 0.6 });
  });
  it('handles empty and single-spike trains', () => {
    expect(isiViolations(new Float64Array(0), 0.0015).fraction).toBeNaN();
    expect(isiViolations(Float64Array.of(3), 0.0015)).toEqual({ count: 0, isiCount: 0, fraction: NaN });
  });
});

describe('LV (Shinomoto et al. 2003, Neural Comput 15:2823) and CV2 (Holt et al. 1996, J Neurophysiol 75; formula from memory)', () => {
  it('match the hand check of REFERENCES.md: ISIs 0.1, 0.2, 0.1, 0.4, 0.2 s -> LV 0.52, CV2 0.80', () => {
    // Adjacent pairs (I_i, I_{i+1}): (0.1,0.2) (0.2,0.1) (0.1,0.4) (0.4,0.2)
    // (I_i - I_{i+1}) / (I_i + I_{i+1}) = -1/3, 1/3, -3/5, 1/3; squares 1/9, 1/9, 9/25, 1/9 sum to 1/3 + 9/25 = 52/75
    // LV = 3 / (n - 1) * sum = 3/4 * 52/75 = 0.52
    // CV2 = mean of 2|diff|/sum = mean(2/3, 2/3, 6/5, 2/3) = (2 + 6/5) / 4 = 0.8
    const t = fromIsis([0.1, 0.2, 0.1, 0.4, 0.2], 5);
    close(localVariation(t), 0.52, 1e-12);
    close(cv2(t), 0.8, 1e-12);
  });
  it('are 0 for a perfectly regular train and NaN below three spikes', () => {
    const t = fromIsis([0.1, 0.1, 0.1, 0.1]);
    close(localVariation(t), 0, 1e-12);
    close(cv2(t), 0, 1e-12);
    expect(localVariation(fromIsis([0.1]))).toBeNaN();
    expect(cv2(new Float64Array(0))).toBeNaN();
  });
  it('are about 1 for a seeded Poisson train (E[LV] = E[CV2] = 1, REFERENCES.md)', () => {
    const rng = new Rng(20240611);
    const isis = Array.from({ length: 40000 }, () => rng.exponential() / 8);
    const t = fromIsis(isis);
    // SD of LV for Poisson is about sqrt(2/(n)) ~ 0.007 at n = 40000 (Shinomoto et al. 2003 give
    // Var(LV) ~ 2/n, from memory); tolerance 0.04 is more than 5 SD.
    expect(Math.abs(localVariation(t) - 1)).toBeLessThan(0.04);
    expect(Math.abs(cv2(t) - 1)).toBeLessThan(0.04);
  });
});

describe('presenceRatio (fraction of equal bins holding a spike; common practice)', () => {
  it('counts occupied bins on a hand-made train', () => {
    // span [0, 10) s in 10 bins of 1 s; spikes in bins 0, 0, 3, 7, and 10 (= stop, goes to bin 9)
    const t = Float64Array.of(0, 0.5, 3.2, 7.999, 10);
    expect(presenceRatio(t, 0, 10, 10)).toBe(0.4);
    // spikes outside the span are ignored
    expect(presenceRatio(Float64Array.of(-1, 11), 0, 10, 10)).toBe(0);
    expect(presenceRatio(t, 0, 0, 10)).toBeNaN();
    expect(presenceRatio(t, 0, 10, 0)).toBeNaN();
  });
  it('counts only bins the unit was observed in, when observation intervals are given (our rule: at least half the bin)', () => {
    const t = Float64Array.of(0, 0.5, 3.2, 7.999, 10);
    // observed [0, 4.5) and [7.2, 10]: bins 0-3 fully, bin 4 half (counts), bin 7 0.8 (counts), bins 8-9:
    // eligible 0,1,2,3,4,7,8,9 = 8 bins; occupied among them: 0, 3, 7, 9 -> 4 / 8
    expect(presenceRatio(t, 0, 10, 10, Float64Array.of(0, 4.5, 7.2, 10))).toBe(0.5);
    // a bin 0.4 inside observed time does not count: [0, 4.4) -> bins 0-3 eligible; occupied 0 and 3 -> 2 / 4
    expect(presenceRatio(t, 0, 10, 10, Float64Array.of(0, 4.4))).toBe(0.5);
    // observed over the whole span = no intervals given
    expect(presenceRatio(t, 0, 10, 10, Float64Array.of(0, 10))).toBe(presenceRatio(t, 0, 10, 10));
    // never observed inside the span: undefined
    expect(presenceRatio(t, 0, 10, 10, Float64Array.of(20, 30))).toBeNaN();
  });
});

describe('autocorrelogram', () => {
  it('equals the brute-force histogram of all positive pairwise lags', () => {
    // Reference: every pair (i < j) binned by lag, O(n^2), as np.histogram of np.subtract.outer would.
    const rng = new Rng(7);
    const t = Float64Array.from(Array.from({ length: 600 }, () => rng.uniform() * 20).sort((a, b) => a - b));
    const bin = 0.002;
    const nb = 25;
    const ref = new Float64Array(nb);
    for (let i = 0; i < t.length; i++)
      for (let j = i + 1; j < t.length; j++) {
        const k = Math.floor((t[j] - t[i]) / bin);
        if (t[j] - t[i] < nb * bin) ref[Math.min(k, nb - 1)]++;
      }
    expect(Array.from(autocorrelogram(t, bin, nb * bin))).toEqual(Array.from(ref));
    expect(ref.reduce((a, b) => a + b, 0)).toBeGreaterThan(10); // the check is not vacuous
  });
  it('counts a hand-made train', () => {
    // lags: 0.0015 (bin 1), 0.0035 (bin 3), 0.002 (bin 2); 1 ms bins, 5 ms window
    expect(Array.from(autocorrelogram(Float64Array.of(0, 0.0015, 0.0035), 0.001, 0.005))).toEqual([0, 1, 1, 1, 0]);
    expect(autocorrelogram(Float64Array.of(0, 1), 0, 1).length).toBe(0);
  });
});

describe('rateDrift (our definition: CV and slope of segment rates)', () => {
  it('computes rates, CV and slope on a hand-made train', () => {
    // span [0, 40) s, 4 segments of 10 s holding 10, 20, 30, 40 spikes -> 1, 2, 3, 4 Hz
    const times: number[] = [];
    [10, 20, 30, 40].forEach((c, s) => {
      for (let i = 0; i < c; i++) times.push(s * 10 + (i + 0.5) * (10 / c));
    });
    const d = rateDrift(Float64Array.from(times), driftSegments(0, 40, 4));
    expect(Array.from(d.ratesHz)).toEqual([1, 2, 3, 4]);
    // mean 2.5, population SD sqrt(1.25) -> CV = 0.4472135955
    close(d.cv, Math.sqrt(1.25) / 2.5, 1e-12);
    // slope 1 Hz per 10 s = 6 Hz per minute
    close(d.slopeHzPerMin, 6, 1e-12);
  });
  it('leaves excluded intervals (e.g. light windows) out of counts and time', () => {
    // 1 Hz everywhere in [0, 40) s (spikes at k + 0.5 s), plus a burst of 50 spikes at 35.000-35.049 s
    const base = Array.from({ length: 40 }, (_, k) => k + 0.5);
    const burst = Array.from({ length: 50 }, (_, k) => 35 + k * 0.001);
    const t = Float64Array.from([...base, ...burst].sort((a, b) => a - b));
    expect(rateDrift(t, driftSegments(0, 40, 4)).ratesHz[3]).toBeCloseTo(6, 12); // (10 + 50) / 10 s without exclusion
    // exclude [35, 35.1) (the burst) and [10, 15) (half of segment 2, holding 5 regular spikes)
    const d = rateDrift(t, driftSegments(0, 40, 4, { startS: Float64Array.of(10, 35), stopS: Float64Array.of(15, 35.1) }));
    // segment 2: 5 spikes in 5 s left = 1 Hz; segment 4: 10 spikes in 9.9 s = 1.0101 Hz
    expect(d.ratesHz[1]).toBeCloseTo(1, 12);
    expect(d.ratesHz[3]).toBeCloseTo(10 / 9.9, 12);
    expect(d.cv).toBeLessThan(0.005);
    // a segment left with no time has no rate and is left out
    const all = rateDrift(t, driftSegments(0, 40, 4, { startS: Float64Array.of(0), stopS: Float64Array.of(10) }));
    expect(all.ratesHz[0]).toBeNaN();
    expect(Number.isFinite(all.cv)).toBe(true);
  });
  it('is NaN for an empty span or a silent unit', () => {
    expect(rateDrift(Float64Array.of(1), driftSegments(0, 0, 4)).cv).toBeNaN();
    const silent = rateDrift(new Float64Array(0), driftSegments(0, 10, 4));
    expect(silent.cv).toBeNaN();
    expect(silent.slopeHzPerMin).toBe(0);
  });
});

describe('quality defaults (common practice / our choice, pinned)', () => {
  it('pins the thresholds', () => {
    expect(DEFAULTS.quality).toMatchObject({ presenceBins: 100, driftSegments: 10, minSpikes: 100, maxContamination: 0.1, minPresenceRatio: 0.9, maxRateDriftCv: 0.5, acgBinMs: 1, acgWindowMs: 50 });
  });
});

describe('lightWindows', () => {
  it('builds merged windows after each pulse', () => {
    // pulses at 1, 1.005 (overlapping 10 ms windows merge) and 3 s; window 0-10 ms
    const w = lightWindows(Float64Array.of(3, 1, 1.005), 0, 10);
    expect(Array.from(w.startS)).toEqual([1, 3]);
    expect(Array.from(w.stopS).map((x) => +x.toFixed(9))).toEqual([1.015, 3.01]);
    expect(lightWindows(Float64Array.of(1), 5, 5).startS.length).toBe(0);
  });
});
