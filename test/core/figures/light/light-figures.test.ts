/**
 * Light figures are data: pure functions from a session to Plotly JSON. Checked for what
 * they must show (numbers tied to the engine's own columns), for null when they do not
 * apply, and for stable, JSON-clean output.
 */
import { describe, expect, it } from 'vitest';
import { DEFAULTS, type Parameters } from '../../../../core/defaults';
import { lightFollowingFigure } from '../../../../core/figures/light/light-following';
import { lightLatencyFigure } from '../../../../core/figures/light/light-latency';
import { lightRasterFigure } from '../../../../core/figures/light/light-raster';
import { lightWaveformFigure } from '../../../../core/figures/light/light-waveform';
import type { FigureContext } from '../../../../core/figures/types';
import { lightResponse } from '../../../../core/light/light-response';
import { lightSchedule } from '../../../../core/light/light-schedule';
import { emptyEvents, emptyPulses, emptyTrials } from '../../../../core/model/empty';
import type { RawSource, Recording } from '../../../../core/model/types';
import { Rng } from '../../../../core/random/rng';
import { makePulses, simulateUnit } from '../../light/helpers';

const parameters = JSON.parse(JSON.stringify(DEFAULTS)) as Parameters;
const ps = makePulses({ single: 60, trainFrequencies: [10], trains: 4 });
const spikes = simulateUnit(new Rng(3), ps.pulses, ps.endS, 4, 1, { reliability: 0.6, latencyMs: 3, jitterMs: 0.7, fade: 0.9 });
const rec: Recording = {
  units: [{ id: 'u7', spikeTimes: spikes, meta: {} }],
  pulses: ps.pulses, events: emptyEvents(), trials: emptyTrials(), span: [0, ps.endS], spanSource: 'inputs', waveformSampleRateHz: NaN,
};
const ctx: FigureContext = { recording: rec, parameters, table: { columns: [], rowCount: 1 } };
const resp = lightResponse(spikes, lightSchedule(ps.pulses, rec.span, parameters.light), parameters.light, true);

describe('light figures', () => {
  it('raster: one row per pulse, spikes within -20..40 ms, the test window shaded', () => {
    const f = lightRasterFigure.build(ctx, 0)!;
    expect(f.data.length).toBe(2); // single pulses, 10 Hz trains
    const ys = f.data.flatMap((d) => d.y as number[]);
    expect(Math.max(...ys)).toBeLessThanOrEqual(99);
    const xs = f.data.flatMap((d) => d.x as number[]);
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(-20);
    expect(Math.max(...xs)).toBeLessThan(40);
    const shapes = f.layout.shapes as { x0: number; x1: number }[];
    expect([shapes[0].x0, shapes[0].x1]).toEqual([0, 10]);
    // the pulse bar spans the pulses' duration (5 ms, makePulses' default), and the key says what bar and shading are
    expect([shapes[1].x0, shapes[1].x1]).toEqual([0, 5]);
    expect((f.layout.annotations as { text: string }[])[0].text).toBe('bar: light pulse (5 ms) · shaded: test window');
    expect(JSON.parse(JSON.stringify(f))).toEqual(f);
  });
  it('latency histogram: bars add up to the reliability', () => {
    const f = lightLatencyFigure.build(ctx, 0)!;
    const sum = (f.data[0].y as number[]).reduce((a, b) => a + b, 0);
    expect(sum).toBeCloseTo(resp.reliability, 12);
    expect((f.data[0].x as number[]).length).toBe(40);
  });
  it('following: per pulse index reliability and latency per frequency', () => {
    const f = lightFollowingFigure.build(ctx, 0)!;
    expect(f.data.map((d) => d.name)).toEqual(['single pulses', 'single pulses', '10 Hz', '10 Hz']);
    expect((f.data[0].y as number[])[0]).toBeCloseTo(resp.frequencyReliability![0], 12);
    expect((f.data[2].x as number[]).length).toBe(10);
  });
  it('same input, same JSON', () => {
    for (const fig of [lightRasterFigure, lightLatencyFigure, lightFollowingFigure]) {
      expect(JSON.stringify(fig.build(ctx, 0))).toBe(JSON.stringify(fig.build(ctx, 0)));
    }
  });
  it('null without pulses, and the waveform figure null without raw data', () => {
    const none: FigureContext = { ...ctx, recording: { ...rec, pulses: emptyPulses() } };
    for (const fig of [lightRasterFigure, lightLatencyFigure, lightFollowingFigure, lightWaveformFigure]) expect(fig.build(none, 0)).toBeNull();
    expect(lightWaveformFigure.build(ctx, 0)).toBeNull();
  });
  it('waveform figure: evoked and spontaneous traces on the compared channels, r in the title', () => {
    const FS = 10000;
    const CH = 2;
    const frames = Math.ceil(ps.endS * FS);
    const data = new Int16Array(frames * CH);
    const shape = [-30, -100, -60, 20, 30, 10];
    for (const t of spikes) {
      const f0 = Math.round(t * FS) - 1;
      for (let k = 0; k < shape.length; k++) if (f0 + k >= 0 && f0 + k < frames) data[(f0 + k) * CH + 1] += shape[k];
    }
    const raw: RawSource = { file: 'r.bin', channelCount: CH, sampleRateHz: FS, gainUvPerBit: 0.5, frameCount: frames, startS: 0, readFrames: (s, c) => data.slice(Math.max(0, s) * CH, Math.min(frames, s + c) * CH) };
    const f = lightWaveformFigure.build({ ...ctx, recording: { ...rec, raw } }, 0)!;
    expect(f.data.length).toBe(2);
    expect((f.layout.title as { text: string }).text).toMatch(/waveform match r = 1/);
  });
});
