/**
 * rampUnitFromSpikes must give exactly what rampUnit gives on the binCounts
 * matrix (the dense reference path, itself checked against NIST Norris,
 * Hollander & Wolfe and Dobson through its parts): every field, bit for bit
 * (Object.is), on random trains with bursts, windows in time order, out of
 * order, overlapping, with a non-finite alignment time, and empty trains.
 */
import { describe, expect, it } from 'vitest';
import { binCounts } from '../../../core/align/bin-counts';
import { rampUnit } from '../../../core/classify';
import { rampUnitFromSpikes } from '../../../core/classify/ramp-unit-from-spikes';
import { mannWhitney } from '../../../core/stats/mann-whitney';
import { wilcoxonSignedRank } from '../../../core/stats/wilcoxon-signed-rank';
import { Rng } from '../../../core/random/rng';

function same(a: unknown, b: unknown, path = ''): void {
  if (a instanceof Float64Array && b instanceof Float64Array) {
    expect(a.length, path).toBe(b.length);
    a.forEach((v, i) => expect(Object.is(v, b[i]), `${path}[${i}]: ${v} vs ${b[i]}`).toBe(true));
  } else if (typeof a === 'object' && a !== null) {
    for (const k of Object.keys(a)) same((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], `${path}.${k}`);
  } else expect(Object.is(a, b), `${path}: ${String(a)} vs ${String(b)}`).toBe(true);
}

describe('rampUnitFromSpikes', () => {
  it('equals rampUnit(binCounts(...)) bit for bit', () => {
    const rng = new Rng(77);
    for (let rep = 0; rep < 40; rep++) {
      const rate = [0, 0.5, 3, 20, 120][rep % 5];
      const spikes: number[] = [];
      for (let t = rng.exponential() / Math.max(rate, 1e-9); t < 400 && rate > 0; t += rng.exponential() / rate) {
        spikes.push(t);
        if (rng.uniform() < 0.1) spikes.push(t + 0.001, t + 0.002); // bursts: several spikes in one bin
      }
      const st = Float64Array.from(spikes).sort();
      let align = Float64Array.from({ length: 60 }, (_, k) => 5 + 6 * k + rng.uniform());
      if (rep % 4 === 1) align = align.slice().reverse(); // out of order
      if (rep % 4 === 2) align = Float64Array.from(align, (a, k) => (k % 2 ? align[k - 1] + 1 : a)); // overlapping windows
      if (rep % 4 === 3) align[7] = NaN;
      const binS = [0.1, 0.05, 0.25][rep % 3];
      const nBins = Math.round(3 / binS);
      const centres = Float64Array.from({ length: nBins }, (_, j) => -3 + (j + 0.5) * binS);
      const dense = rampUnit(binCounts(st, align, -3, binS, nBins), align.length, centres, binS, 6, 30);
      const direct = rampUnitFromSpikes(st, align, -3, binS, centres, 6, 30);
      same(direct, dense, `rep ${rep}`);
      // The rank tests on rankKeys (integer numerators) equal the tests on the slopes themselves.
      expect(direct.rankKeys.every((w) => Number.isInteger(w))).toBe(true);
      same(wilcoxonSignedRank(direct.rankKeys, 30), wilcoxonSignedRank(direct.trialSlopes, 30), `rep ${rep} signed-rank`);
      const half = Math.floor(align.length / 2);
      same(
        mannWhitney(direct.rankKeys.subarray(0, half), direct.rankKeys.subarray(half)),
        mannWhitney(direct.trialSlopes.subarray(0, half), direct.trialSlopes.subarray(half)),
        `rep ${rep} rank-sum`,
      );
      // tests = false (the other conditions' slopes): the same slopes and rates, no GLM or signed-rank test.
      const lite = rampUnitFromSpikes(st, align, -3, binS, centres, 6, 30, false);
      const liteDense = rampUnit(binCounts(st, align, -3, binS, nBins), align.length, centres, binS, 6, 30, undefined, false);
      same(lite, liteDense, `rep ${rep} (tests off)`);
      for (const k of ['nTrials', 'meanRateHz', 'slopeHzPerS', 'slopeRelPerS', 'r2', 'lateEarlyRatio', 'trialSlopes', 'meanRate', 'semRate', 'interceptHz'] as const) {
        same(lite[k], direct[k], `rep ${rep} ${k}`);
      }
      for (const k of ['p', 'statistic', 'glmSlopePerS', 'glmLrtP', 'glmDispersion'] as const) expect(lite[k]).toBeNaN();
      expect(lite.direction).toBe(0);
      expect(lite.nNonZero).toBe(0);
    }
  });
});
