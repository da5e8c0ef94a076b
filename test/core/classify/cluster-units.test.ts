/**
 * Population clusters on a simulated session with three response types
 * (rising ramp, falling ramp, burst to forward jumps), varied rates and ISI
 * shapes. The check is agreement with the simulated types (purity), not a
 * published value: the k-means and silhouette pieces are checked against
 * SciPy/NumPy on Iris in test/core/stats/k-means-silhouette.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import { clusterUnits } from '../../../core/classify';
import { taskSession, type UnitModel } from '../../helpers/task-session';

describe('clusterUnits', () => {
  const units: UnitModel[] = [];
  const type: number[] = [];
  for (let i = 0; i < 60; i++) {
    const t = i % 3;
    const rate = [8, 15, 25][Math.floor(i / 3) % 3];
    const shape = [1, 3][i % 2];
    if (t === 0) units.push({ rateHz: rate, shape, rampChange: 1.5 });
    else if (t === 1) units.push({ rateHz: rate, shape, rampChange: -0.7 });
    else units.push({ rateHz: rate, shape, jump: { forward: { amplitude: 4, form: 'transient', tauS: 0.15 } } });
    type.push(t);
  }
  const rec = taskSession({ nTrials: 200, probeFraction: 0.3, units, seed: 91 });
  const c = clusterUnits(rec, DEFAULTS);

  it('finds the three response types (k by silhouette) with purity >= 0.9', () => {
    expect(c.note).toBe('');
    expect(c.k).toBe(3);
    expect(['strong', 'reasonable']).toContain(c.structure);
    expect(c.unitsUsed).toBe(60);
    let agree = 0;
    for (let k = 1; k <= c.k; k++) {
      const members = type.filter((_, i) => c.cluster[i] === k);
      const counts = [0, 1, 2].map((t) => members.filter((m) => m === t).length);
      agree += Math.max(...counts);
    }
    expect(agree / 60).toBeGreaterThanOrEqual(0.9);
    expect(c.silhouetteByK.map((s) => s.k)).toEqual([2, 3, 4, 5, 6]);
    const best = Math.max(...c.silhouetteByK.map((s) => s.mean));
    expect(c.silhouetteByK.find((s) => s.k === 3)!.mean).toBe(best);
  });

  it('gives class averages over the concatenated segments', () => {
    expect(c.segments.map((s) => s.name)).toEqual(['reward', 'jump backward', 'jump forward']);
    const dim = c.segments.reduce((s, g) => s + g.nBins, 0);
    expect(c.classes).toHaveLength(3);
    for (const cl of c.classes) {
      expect(cl.mean).toHaveLength(dim);
      expect(cl.size).toBeGreaterThan(10);
    }
    expect(c.classes.reduce((s, cl) => s + cl.size, 0)).toBe(60);
    // Rising-ramp class: the reward segment's z-scored average climbs.
    const risingCluster = c.cluster[0];
    const cl = c.classes[risingCluster - 1];
    const seg = c.segments[0];
    expect(cl.mean[seg.offset + seg.nBins - 1]).toBeGreaterThan(cl.mean[seg.offset]);
  });

  it('is deterministic for a seed', () => {
    const again = clusterUnits(rec, DEFAULTS);
    expect(Array.from(again.cluster)).toEqual(Array.from(c.cluster));
  });

  it('leaves silent units out and refuses to cluster too few units', () => {
    const rec2 = taskSession({ nTrials: 20, units: [{ rateHz: 5, shape: 1 }, { rateHz: 5, shape: 1 }], seed: 92 });
    const two = clusterUnits(rec2, DEFAULTS);
    expect(two.k).toBe(0);
    expect(two.note).toContain('only 2 units');
    expect(Number.isNaN(two.cluster[0])).toBe(true);
    const silent = { ...rec, units: [...rec.units, { id: 'silent', spikeTimes: new Float64Array(0), meta: {} }] };
    const c3 = clusterUnits(silent, DEFAULTS);
    expect(c3.unitsUsed).toBe(60);
    expect(Number.isNaN(c3.cluster[60])).toBe(true);
  });
});
