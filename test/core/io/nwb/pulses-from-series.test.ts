// Threshold crossing on sampled square-pulse traces, through the project's
// laser-trace detector (core/io/detect-laser-pulses.ts, tested on its own).
// Expected values are worked by hand from the traces below.
import { describe, expect, it } from 'vitest';
import { detectLaserPulses } from '../../../../core/io/detect-laser-pulses';
import { pulsesFromSeries } from '../../../../core/io/nwb/pulses-from-series';

const v = Float64Array.of(0, 0, 8, 10, 0, 0, 0, 4, 4, 0, 12, 12); // mW, 1 kHz from 0.5 s
const t = Float64Array.from(v, (_, i) => 0.5 + i / 1000);
const round = (a: Float64Array) => Array.from(a, (x) => Math.round(x * 1e9) / 1e9);

describe('pulsesFromSeries', () => {
  it('regularly sampled: same onsets and durations as the folder laser-trace detector, plus peak power', () => {
    const p = pulsesFromSeries(t, v, { rateHz: 1000, highThreshold: 3, lowThreshold: 3, minWidthS: 0.0005 });
    const d = detectLaserPulses(v, { sampleRateHz: 1000, startS: 0.5, highThreshold: 3, lowThreshold: 3, minWidthS: 0.0005 });
    expect(Array.from(p.onset)).toEqual(Array.from(d.onsetS));
    expect(Array.from(p.duration)).toEqual(Array.from(d.durationS));
    expect(round(p.onset)).toEqual([0.502, 0.507, 0.51]);
    expect(round(p.duration)).toEqual([0.002, 0.002, 0.002]); // the last runs to the end of the trace
    expect(Array.from(p.peak)).toEqual([10, 4, 12]);
    expect(p.unterminated).toBe(1);
  });
  it('default levels 60 % / 40 % of the range (7.2 / 4.8 mW here) leave out the 4 mW pulse', () => {
    const p = pulsesFromSeries(t, v, { rateHz: 1000 });
    expect(p.highThreshold).toBeCloseTo(7.2, 12);
    expect(round(p.onset)).toEqual([0.502, 0.51]);
  });
  it('irregular timestamps (value held until the next sample): onsets and ends at the timestamps', () => {
    // power stored at each change: on at 1.0 s, off at 1.005 s; on at 2.0 s, off at 2.01 s; on at 3.0 s to the end
    const ts = Float64Array.of(0, 1.0, 1.005, 2.0, 2.01, 3.0);
    const vs = Float64Array.of(0, 5, 0, 5, 0, 5);
    const p = pulsesFromSeries(ts, vs, { highThreshold: 1 });
    expect(Array.from(p.onset)).toEqual([1.0, 2.0, 3.0]);
    expect(round(p.duration)).toEqual([0.005, 0.01, 0]);
    expect(Array.from(p.peak)).toEqual([5, 5, 5]);
  });
  it('drops pulses shorter than the minimum width; a flat or empty trace has none', () => {
    const ts = Float64Array.of(0, 1.0, 1.0001, 2.0, 2.005);
    const vs = Float64Array.of(0, 5, 0, 5, 0);
    const p = pulsesFromSeries(ts, vs, { highThreshold: 1 });
    expect(Array.from(p.onset)).toEqual([2.0]);
    expect(p.dropped).toBe(1);
    expect(pulsesFromSeries(t, new Float64Array(12), { rateHz: 1000 }).onset.length).toBe(0);
    expect(pulsesFromSeries(new Float64Array(0), new Float64Array(0)).onset.length).toBe(0);
  });
});
