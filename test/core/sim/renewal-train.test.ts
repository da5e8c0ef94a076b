import { describe, expect, it } from 'vitest';
import { Rng } from '../../../core/random/rng';
import { renewalTrain } from '../../../core/sim/renewal-train';

// Reference: moments of a gamma renewal process (Cox, 1962, Renewal Theory):
// mean ISI = refractory + shape * theta, variance of ISI = shape * theta^2.
describe('renewalTrain', () => {
  it.each([
    [10, 1, 0.002],
    [5, 4, 0.002],
    [40, 0.5, 0.001],
  ])('rate %s Hz, shape %s: mean and variance of ISIs match the gamma renewal process', (rate, shape, refr) => {
    const t = renewalTrain(new Rng(11), rate, 0, 2000, shape, refr);
    const isi = new Float64Array(t.length - 1);
    for (let i = 1; i < t.length; i++) isi[i - 1] = t[i] - t[i - 1];
    const mean = isi.reduce((a, b) => a + b, 0) / isi.length;
    const variance = isi.reduce((a, b) => a + (b - mean) ** 2, 0) / (isi.length - 1);
    const theta = (1 / rate - refr) / shape;
    const wantVar = shape * theta * theta;
    expect(Math.abs(mean - 1 / rate) / (1 / rate)).toBeLessThan(0.02);
    expect(Math.abs(variance - wantVar) / wantVar).toBeLessThan(0.06);
    expect(Math.min(...isi)).toBeGreaterThanOrEqual(refr);
  });
  it('is sorted, inside the window and reproducible', () => {
    const a = renewalTrain(new Rng(3), 20, 5, 15);
    const b = renewalTrain(new Rng(3), 20, 5, 15);
    expect([...a]).toEqual([...b]);
    for (let i = 1; i < a.length; i++) expect(a[i]).toBeGreaterThan(a[i - 1]);
    expect(a[0]).toBeGreaterThanOrEqual(5);
    expect(a[a.length - 1]).toBeLessThan(15);
  });
  it('handles empty and impossible requests', () => {
    expect(renewalTrain(new Rng(1), 0, 0, 10).length).toBe(0);
    expect(renewalTrain(new Rng(1), 10, 5, 5).length).toBe(0);
    expect(() => renewalTrain(new Rng(1), 600, 0, 1, 1, 0.002)).toThrow(/refractory/);
  });
});
