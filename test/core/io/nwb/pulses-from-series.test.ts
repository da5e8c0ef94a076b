// Threshold crossing on a sampled square-pulse trace. Expected values are
// worked by hand from the trace below (no outside library needed: each pulse
// starts at the first sample >= threshold and ends at the first sample below).
import { describe, expect, it } from 'vitest';
import { pulsesFromSeries } from '../../../../core/io/nwb/pulses-from-series';

const t = Float64Array.from({ length: 12 }, (_, i) => i * 0.001); // 1 kHz
const v = Float64Array.of(0, 0, 8, 10, 0, 0, 0, 4, 4, 0, 12, 12); // mW

describe('pulsesFromSeries', () => {
  it('finds pulses above an explicit threshold, with duration and peak power', () => {
    const p = pulsesFromSeries(t, v, 3);
    expect(Array.from(p.onset)).toEqual([0.002, 0.007, 0.01]);
    // third pulse is still on at the last sample: it ends there
    expect(Array.from(p.duration).map((d) => Math.round(d * 1e9) / 1e9)).toEqual([0.002, 0.002, 0.001]);
    expect(Array.from(p.powerMw)).toEqual([10, 4, 12]);
    expect(p.thresholdMw).toBe(3);
  });
  it('defaults to half the maximum (6 mW here), so the 4 mW pulse is not counted', () => {
    const p = pulsesFromSeries(t, v);
    expect(p.thresholdMw).toBe(6);
    expect(Array.from(p.onset)).toEqual([0.002, 0.01]);
  });
  it('a trace that starts high starts a pulse at the first sample; NaN counts as low', () => {
    const p = pulsesFromSeries(Float64Array.of(0, 1, 2, 3), Float64Array.of(5, NaN, 5, 0), 1);
    expect(Array.from(p.onset)).toEqual([0, 2]);
    expect(Array.from(p.duration)).toEqual([1, 1]);
  });
  it('a flat zero trace and an empty trace have no pulses', () => {
    expect(pulsesFromSeries(t, new Float64Array(12)).onset.length).toBe(0);
    expect(pulsesFromSeries(new Float64Array(0), new Float64Array(0)).onset.length).toBe(0);
  });
});
