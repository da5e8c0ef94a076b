/**
 * SALT (Kvitsiani et al. 2013, Nature 498:363) as REFERENCES.md describes the authors'
 * reference code: hand-worked cases of the p-value rule p = #(null >= test) / #null and
 * I = median(test) - median(null) (distances from the REFERENCES.md check value
 * 0.3792638082), the documented pitfall, and the behaviour on simulated units.
 *
 * Finding (computed here, reported to the team): under a null the published p-value is NOT
 * uniform. The test value is a median over J test-baseline distances while the null holds
 * single baseline-baseline distances, so p concentrates around 0.5 and the lower tail is
 * thin: the test is conservative. We therefore check validity (P(p <= alpha) <= alpha in the
 * lower tail, with the Dvoretzky-Kiefer-Wolfowitz band, Massart 1990 Ann Probab 18:1269) and
 * pin the non-uniformity with @stdlib/stats-kstest, rather than assert uniformity.
 *
 * The rank-calibrated p (pCalibrated: the test histogram's rank among all J + 1 histograms by
 * median distance to the others) is a permutation p: when the test window is exchangeable
 * with the baseline windows it is uniform on {1, ..., J + 1} / (J + 1) up to ties. Checked
 * here with @stdlib/stats-kstest against uniform on a few hundred null units per firing regime,
 * hand-worked on small matrices, and at its floor 1 / (J + 1) for identified units.
 */
import kstest from '@stdlib/stats-kstest';
import { describe, expect, it } from 'vitest';
import { lightResponse, createLightScratch } from '../../../core/light/light-response';
import { lightSchedule } from '../../../core/light/light-schedule';
import { createSaltScratch, saltTest } from '../../../core/light/salt-test';
import { selectKth } from '../../../core/light/select-kth';
import { Rng } from '../../../core/random/rng';
import { burstyTrain, lightParams, makePulses, simulateUnit } from './helpers';

const D = 0.3792638082; // distance of [1,0] and [0.5,0.5] (REFERENCES.md, computed)

describe('saltTest on hand-made histograms (2 pulses, classes [no spike, bin 1])', () => {
  it('test between baselines that differ: p = #(null >= test)/#null, no +1', () => {
    // baselines [2,0], [1,1], [2,0]: null = {D, 0, D}; test [1,1]: distances {D, 0, D}, median D
    const r = saltTest(Int32Array.from([1, 1, 2, 0, 1, 1, 2, 0]), 4, 2, 2);
    expect(r.nullCount).toBe(3);
    expect(r.p).toBeCloseTo(2 / 3, 15);
    expect(r.testDistance).toBeCloseTo(D, 9);
    expect(r.nullMedian).toBeCloseTo(D, 9);
    expect(r.informationDifference).toBeCloseTo(0, 9);
  });
  it('an answer the baseline never shows: p = 0, I = D', () => {
    // baselines all [2,0] (never a spike); test [1,1]
    const r = saltTest(Int32Array.from([1, 1, 2, 0, 2, 0, 2, 0]), 4, 2, 2);
    expect(r.p).toBe(0);
    expect(r.informationDifference).toBeCloseTo(D, 9);
  });
  it('PITFALL (REFERENCES.md): every pulse answered in one class the baseline rarely visits gives p = 1', () => {
    // baselines [2,0], [1,1], [2,0]; test [0,2] (reliability 1, zero jitter): supports disjoint
    // from two baselines -> distances {0, D, 0}, median 0 -> p = 3/3.
    const r = saltTest(Int32Array.from([0, 2, 2, 0, 1, 1, 2, 0]), 4, 2, 2);
    expect(r.p).toBe(1);
    expect(r.testDistance).toBe(0);
    expect(r.informationDifference).toBeLessThan(0);
  });
  it('calibrated p by hand: all row medians equal -> 1; only the test row apart -> 1/(J + 1); pitfall -> 1', () => {
    // rows T=[1,1], B=[2,0],[1,1],[2,0]: every row's distances are {D, D, 0} in some order, median D
    expect(saltTest(Int32Array.from([1, 1, 2, 0, 1, 1, 2, 0]), 4, 2, 2).pCalibrated).toBe(1);
    // T=[1,1], B all [2,0]: test row median D, every baseline row {D, 0, 0} -> 0: p = 1/4
    const r = saltTest(Int32Array.from([1, 1, 2, 0, 2, 0, 2, 0]), 4, 2, 2);
    expect(r.pCalibrated).toBe(1 / 4);
    expect(r.rows).toBe(4);
    // pitfall T=[0,2]: test row {0, D, 0} -> 0, every row's median >= 0: p = 1
    expect(saltTest(Int32Array.from([0, 2, 2, 0, 1, 1, 2, 0]), 4, 2, 2).pCalibrated).toBe(1);
  });
  it('calibrated p with the smallest J (2): values in {1/3, 2/3, 1}', () => {
    // T=[3,0], B=[0,3],[1,2] (3 pulses): d(T,B1) is 0 by the support restriction, so the
    // rows' medians are T: (0 + d(T,B2)) / 2, B1: (0 + d(B1,B2)) / 2, B2: (d(T,B2) + d(B1,B2)) / 2.
    const r = saltTest(Int32Array.from([3, 0, 0, 3, 1, 2]), 3, 2, 3);
    expect([1 / 3, 2 / 3, 1]).toContain(r.pCalibrated);
    expect(r.rows).toBe(3);
    const tb2 = r.testDistance * 2; // median of {0, d(T,B2)}
    const b1b2 = saltTest(Int32Array.from([0, 3, 0, 3, 1, 2]), 3, 2, 3).testDistance * 2; // row [0,3] vs [0,3], [1,2]
    const meds = [tb2 / 2, b1b2 / 2, (tb2 + b1b2) / 2];
    expect(r.pCalibrated).toBe(meds.filter((m) => m >= meds[0]).length / 3);
  });
  it('returns NaN with fewer than 2 baseline windows or no pulses', () => {
    expect(saltTest(Int32Array.from([1, 1, 2, 0]), 2, 2, 2).p).toBeNaN();
    expect(saltTest(Int32Array.from([1, 1, 2, 0]), 2, 2, 2).pCalibrated).toBeNaN();
    expect(saltTest(new Int32Array(8), 4, 2, 0).p).toBeNaN();
  });
  it('reuses scratch space across sizes without changing results', () => {
    const s = createSaltScratch();
    const a = saltTest(Int32Array.from([1, 1, 2, 0, 1, 1, 2, 0]), 4, 2, 2, s);
    saltTest(Int32Array.from([10, 0, 0, 5, 5, 0, 9, 1, 0, 7, 2, 1]), 4, 3, 10, s);
    const b = saltTest(Int32Array.from([1, 1, 2, 0, 1, 1, 2, 0]), 4, 2, 2, s);
    expect(b).toEqual(a);
  });
});

describe('selectKth (median without sorting) against a full sort', () => {
  it.each([1, 2, 3, 10, 51, 1225])('n = %i, every k, with ties', (n) => {
    const rng = new Rng(n);
    const x = Float64Array.from({ length: n }, () => Math.floor(rng.uniform() * n * 0.7) / 7);
    const sorted = Float64Array.from(x).sort();
    for (let k = 0; k < n; k += Math.max(1, Math.floor(n / 40))) expect(selectKth(Float64Array.from(x), n, k)).toBe(sorted[k]);
    expect(() => selectKth(x, n, n)).toThrow();
  });
});

describe('SALT on simulated units (300 single pulses near 1 Hz, 5 ms)', () => {
  const p = lightParams();
  const { pulses, endS } = makePulses({ single: 300, jitterPeriodS: 0.3 });
  const sch = lightSchedule(pulses, [0, endS], p);
  const scratch = createLightScratch();
  const nullP = (seed: number, rate: number, shape: number, n: number) => {
    const rng = new Rng(seed);
    const out: number[] = [];
    for (let k = 0; k < n; k++) out.push(lightResponse(simulateUnit(rng, pulses, endS, rate, shape, null), sch, p, false, scratch).salt.p);
    return out;
  };
  it.each([
    [5, 1],
    [2, 4],
    [12, 0.4],
  ])('null units (rate %s Hz, gamma shape %s): valid lower tail, documented non-uniformity', (rate, shape) => {
    const ps = nullP(17 + rate, rate, shape, 250);
    const n = ps.length;
    // DKW band at 99 %: sup |F_n - F| <= sqrt(ln(2/0.01) / (2n)) (Massart 1990).
    const band = Math.sqrt(Math.log(2 / 0.01) / (2 * n));
    for (const a of [0.005, 0.01, 0.02, 0.05, 0.1, 0.2]) {
      const f = ps.filter((x) => x <= a).length / n;
      expect(f, `P(p <= ${a}) = ${f}`).toBeLessThanOrEqual(a + band);
    }
    // The published statistic is conservative: far fewer small p than uniform would give.
    expect(ps.filter((x) => x <= 0.05).length / n).toBeLessThan(0.05);
    // Kolmogorov-Smirnov (@stdlib/stats-kstest): the null p-values are not uniform
    // (median-versus-single-distance construction); D well above the 1 % critical ~0.1.
    const ks = kstest(ps, 'uniform', 0, 1);
    expect(ks.statistic).toBeGreaterThan(0.1);
    expect(ks.pValue).toBeLessThan(0.001);
  });
  it('light-identified units give tiny p (reliability 0.3, 4 +- 1 ms)', () => {
    const rng = new Rng(99);
    for (let k = 0; k < 20; k++) {
      const spikes = simulateUnit(rng, pulses, endS, 3 + k, 1, { reliability: 0.3, latencyMs: 4, jitterMs: 1 });
      const r = lightResponse(spikes, sch, p, false, scratch);
      expect(r.salt.p).toBeLessThan(0.002);
      expect(r.salt.informationDifference).toBeGreaterThan(0);
      // The test row is the most distant of all J + 1: the calibrated p sits at its floor.
      expect(r.salt.pCalibrated).toBe(1 / (sch.windows + 1));
    }
  });
});

describe('calibrated SALT p on simulated null units: uniform (Kolmogorov-Smirnov, @stdlib/stats-kstest)', () => {
  const p = lightParams();
  // Sparse single pulses (J = 100), and singles with 20 Hz trains (disjoint blocks stacked
  // before each train: J = 49): the exchangeability of test and baseline windows is the design's job.
  const schedules = {
    sparse: makePulses({ single: 300, periodS: 2, jitterPeriodS: 0.5, seed: 4 }),
    trains: makePulses({ single: 100, periodS: 1.2, jitterPeriodS: 0.3, trainFrequencies: [20], trains: 20, trainGapS: 4, seed: 3 }),
  };
  const regimes: [string, (rng: Rng, ps: ReturnType<typeof makePulses>) => Float64Array][] = [
    ['Poisson 5 Hz', (rng, s) => simulateUnit(rng, s.pulses, s.endS, 5, 1, null)],
    ['regular (gamma shape 4) 10 Hz', (rng, s) => simulateUnit(rng, s.pulses, s.endS, 10, 4, null)],
    ['bursty (gamma shape 0.3) 3 Hz', (rng, s) => simulateUnit(rng, s.pulses, s.endS, 3, 0.3, null)],
    ['bursts of 1 + Poisson(2) spikes, 4.5 Hz', (rng, s) => burstyTrain(rng, 1.5, 2, s.endS)],
  ];
  const nullCal = (s: ReturnType<typeof makePulses>, make: (rng: Rng, ps: ReturnType<typeof makePulses>) => Float64Array, n = 200) => {
    const sch = lightSchedule(s.pulses, [0, s.endS], p);
    const rng = new Rng(9);
    const scratch = createLightScratch();
    const out: number[] = [];
    for (let k = 0; k < n; k++) out.push(lightResponse(make(rng, s), sch, p, false, scratch).salt.pCalibrated);
    return { ps: out, J: sch.windows };
  };
  for (const [sName, s] of Object.entries(schedules)) {
    it.each(regimes)(`${sName} schedule, %s: KS p > 0.01 and a valid lower tail`, (_, make) => {
      const { ps, J } = nullCal(s, make);
      expect(J).toBe(sName === 'sparse' ? 100 : 49);
      // Discrete values k/(J + 1) add at most 1/(J + 1) to D; the 1 % critical D for n = 200 is ~0.115.
      const ks = kstest(ps, 'uniform', 0, 1);
      expect(ks.pValue, `KS D = ${ks.statistic}`).toBeGreaterThan(0.01);
      const band = Math.sqrt(Math.log(2 / 0.01) / (2 * ps.length)); // DKW 99 % (Massart 1990)
      for (const a of [0.02, 0.05, 0.1, 0.2]) expect(ps.filter((x) => x <= a).length / ps.length).toBeLessThanOrEqual(a + band);
    });
  }
  it.each([0.5, 0.1])('low rate (%s Hz): ties make it conservative, never liberal', (rate) => {
    // Few spikes: many histograms are identical, rows tie, and ">=" counts ties against the
    // test, so p piles up near 1 (KS rejects uniformity), while the lower tail stays valid.
    for (const s of Object.values(schedules)) {
      const { ps } = nullCal(s, (rng, x) => simulateUnit(rng, x.pulses, x.endS, rate, 1, null));
      const band = Math.sqrt(Math.log(2 / 0.01) / (2 * ps.length));
      for (const a of [0.02, 0.05, 0.1, 0.2]) expect(ps.filter((x) => x <= a).length / ps.length).toBeLessThanOrEqual(a + band);
      expect(ps.filter((x) => x <= 0.5).length / ps.length).toBeLessThan(0.5);
    }
  });
});
