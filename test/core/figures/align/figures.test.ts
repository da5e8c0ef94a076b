import { describe, expect, it } from 'vitest';
import { eventResponse } from '../../../../core/align/event-response';
import { DEFAULTS } from '../../../../core/defaults';
import { eventLockedComparisonFigure } from '../../../../core/figures/align/event-locked-comparison-figure';
import { indicatorTraceFigure } from '../../../../core/figures/align/indicator-trace-figure';
import { populationResponseFigure } from '../../../../core/figures/align/population-response-figure';
import { rasterPsthFigure } from '../../../../core/figures/align/raster-psth-figure';
import { rasterPsthUnitFigure } from '../../../../core/figures/align/raster-psth-unit-figure';
import { GROUP_COLORS } from '../../../../core/figures/theme';
import { eventLockedTrace } from '../../../../core/kernels/event-locked-trace';
import { fitAmplitudeOffset } from '../../../../core/kernels/fit-amplitude-offset';
import { predictTrace } from '../../../../core/kernels/predict-trace';
import { normaliseFigure } from '../../../helpers/normalise-figure';
import { makeRecording } from '../../../helpers/recording';

// Invented mini session: 4 trials, two conditions, one reward per trial.
const rec = makeRecording({
  units: [{ id: 'u7', spikes: [0.9, 1.05, 1.2, 10.8, 11.1, 11.15, 21.0, 30.7, 31.3] }],
  trials: [
    { trial: 1, start: 0, stop: 10, condition: 'standard' },
    { trial: 2, start: 10, stop: 20, condition: 'probe' },
    { trial: 3, start: 20, stop: 30, condition: 'standard' },
    { trial: 4, start: 30, stop: 40, condition: 'probe' },
  ],
  events: [1, 11, 21, 31].map((t) => ({ time: t, label: 'reward' })),
});
const params = JSON.parse(JSON.stringify(DEFAULTS)) as typeof DEFAULTS;
const resp = eventResponse(rec, params, { unitIndex: 0, align: { event: 'reward' }, psth: { windowStartS: -0.5, windowStopS: 0.5, binMs: 250, smoothing: { kind: 'none', widthMs: 0 } } });

describe('rasterPsthFigure', () => {
  it('draws one raster trace and one PSTH (band + mean) per condition, in group colours', () => {
    const f = rasterPsthFigure(resp);
    expect(resp.groups.map((g) => g.label)).toEqual(['probe', 'standard']);
    const raster = f.data.filter((d) => d.type === 'scattergl');
    expect(raster.map((d) => d.name)).toEqual(['probe (n = 2)', 'standard (n = 2)']);
    // probe rewards at 11 and 31: spikes 10.8, 11.1, 11.15 and 30.7, 31.3 -> rows 0 and 1
    expect(raster[0].y).toEqual([0, 0, 0, 1, 1]);
    expect(raster[1].y).toEqual([2, 2, 2, 3]);
    expect((raster[1].marker as { color: string }).color).toBe(GROUP_COLORS[1]);
    expect(f.data.length).toBe(2 + 2 * 3);
  });
  it('matches its snapshot (normalised JSON)', async () => {
    await expect(normaliseFigure(rasterPsthFigure(resp))).toMatchFileSnapshot('./__snapshots__/raster-psth.json');
  });
  it('is built by the Event response unit figure from the parameters, or null without the event', () => {
    const ctx = { recording: rec, parameters: params, table: { columns: [], rowCount: 1 } };
    expect(rasterPsthUnitFigure.build(ctx, 0)?.data.length).toBeGreaterThan(0);
    const other = { ...params, align: { ...params.align, event: 'tone_on' } };
    expect(rasterPsthUnitFigure.build({ ...ctx, parameters: other }, 0)).toBeNull();
  });
});

describe('indicator figures', () => {
  const grid = { startS: 0, rateHz: 10, length: 40 };
  const spikes = rec.units[0].spikeTimes;
  const predicted = predictTrace(spikes, { kind: 'double-exponential', tauRiseS: 0.05, tauDecayS: 0.5, peakDff: 1 }, grid);
  const measured = predicted.map((v, i) => 0.3 * v + 0.02 + 0.01 * Math.sin(i));
  const fit = fitAmplitudeOffset(predicted, measured);
  it('predicted alone, and scaled by the fit beside the measured trace', async () => {
    const alone = indicatorTraceFigure({ label: 'unit u7', kernelName: 'jGCaMP8m', grid, predicted, predictedUnit: 'dF/F' });
    expect(alone.data.length).toBe(1);
    const both = indicatorTraceFigure({ label: 'unit u7', kernelName: 'jGCaMP8m', grid, predicted, predictedUnit: 'dF/F', measured: { values: measured, fit, unit: 'dF/F' } });
    expect(both.data.map((d) => (d.name as string).split(' (')[0])).toEqual(['measured', 'predicted, jGCaMP8m']);
    await expect(normaliseFigure(both)).toMatchFileSnapshot('./__snapshots__/indicator-trace.json');
  });
  it('event-locked comparison has two panels with SEM bands', async () => {
    const align = [1, 11, 21, 31].filter((t) => t + 1 < 4);
    const m = eventLockedTrace(measured, 0, 10, align, -0.5, 1);
    const p = eventLockedTrace(predicted, 0, 10, align, -0.5, 1);
    const f = eventLockedComparisonFigure({ event: 'reward', measured: m, predicted: p, measuredUnit: 'dF/F', predictedUnit: 'dF/F', kernelName: 'jGCaMP8m' });
    expect(f.data.map((d) => d.yaxis)).toEqual(['y', 'y', 'y', 'y2', 'y2', 'y2']);
    await expect(normaliseFigure(f)).toMatchFileSnapshot('./__snapshots__/event-locked-comparison.json');
  });
});

describe('populationResponseFigure', () => {
  it('z-scores each unit against the start of the window and sorts rows by peak time', async () => {
    // Two invented units: 'early' bursts 0.1 s after each reward, 'late' 0.4 s after; both fire sparsely before.
    const rewards = Array.from({ length: 20 }, (_, k) => 10 + 5 * k);
    const early = rewards.flatMap((t) => [t - 2.5, t - 1.7, t - 0.9, t + 0.1, t + 0.11, t + 0.12]);
    const late = rewards.flatMap((t) => [t - 2.2, t - 1.3, t - 0.6, t + 0.4, t + 0.41, t + 0.42]);
    const r2 = makeRecording({ units: [{ id: 'late', spikes: late }, { id: 'early', spikes: early }, { id: 'silent', spikes: [] }], events: rewards.map((t) => ({ time: t, label: 'reward' })) });
    const p2 = { ...params, align: { ...params.align, binMs: 100, smoothing: 'none', windowStartS: -3, windowStopS: 1 } };
    const f = populationResponseFigure.build({ recording: r2, parameters: p2, table: { columns: [], rowCount: 3 } })!;
    expect(f.data[0].y).toEqual(['unit early', 'unit late', 'unit silent']);
    const z = f.data[0].z as (number | null)[][];
    expect((z[2] as (number | null)[]).every((v) => v === null)).toBe(true); // silent: flat baseline, no z
    expect(Math.max(...(z[0] as number[]))).toBe(5); // capped burst
    await expect(normaliseFigure(f)).toMatchFileSnapshot('./__snapshots__/population-response.json');
    expect(populationResponseFigure.build({ recording: r2, parameters: { ...p2, align: { ...p2.align, event: 'lick' } }, table: { columns: [], rowCount: 3 } })).toBeNull();
  });
});
