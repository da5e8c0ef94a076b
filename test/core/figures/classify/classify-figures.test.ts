/**
 * Ramp, jump and cluster figures: pure builders from results to Plotly JSON.
 * Checked structurally (traces, axes, verdict text) and as normalised JSON
 * snapshots (numbers rounded to 6 significant digits).
 */
import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../../core/defaults';
import { clusterAveragesFigure } from '../../../../core/figures/classify/cluster-averages-figure';
import { jumpAnswersFigure } from '../../../../core/figures/classify/jump-answers-figure';
import { rampFitFigure } from '../../../../core/figures/classify/ramp-fit-figure';
import { VERDICT_STYLE } from '../../../../core/figures/theme';
import { emptyEvents } from '../../../../core/model/empty';
import { analyseRecording } from '../../../../core/pipeline/analyse-recording';
import { taskSession } from '../../../helpers/task-session';

function normalise(x: unknown): unknown {
  if (typeof x === 'number') return Number.isFinite(x) ? Number(x.toPrecision(6)) : String(x);
  if (Array.isArray(x)) return x.map(normalise);
  if (x && typeof x === 'object') return Object.fromEntries(Object.entries(x).map(([k, v]) => [k, normalise(v)]));
  return x;
}

describe('classification figures', () => {
  const recording = taskSession({
    nTrials: 120,
    probeFraction: 0.3,
    otherConditions: [{ label: 'fast', fraction: 0.3 }],
    units: [
      { rateHz: 12, shape: 1, rampChange: 1 },
      { rateHz: 10, shape: 2, jump: { forward: { amplitude: 3, form: 'transient' }, backward: { amplitude: 0.8, form: 'step' } } },
      ...Array.from({ length: 10 }, (_, i) => ({ rateHz: 4 + i, shape: 1, rampChange: i % 2 ? 0.8 : -0.5 })),
    ],
    seed: 303,
  });
  const { table } = analyseRecording(recording, DEFAULTS);
  const ctx = { recording, parameters: DEFAULTS, table };

  it('ramp fit: mean +- SEM, the fit coloured and labelled by the verdict, other conditions', () => {
    const f = rampFitFigure.build(ctx, 0)!;
    expect(f.data).toHaveLength(4); // points, fit, fast, probe
    const [points, fit] = f.data as Record<string, any>[];
    expect(points.x).toHaveLength(30);
    expect(fit.name).toContain('up');
    expect(fit.line.color).toBe(VERDICT_STYLE.up.color);
    expect(fit.y[1]).toBeGreaterThan(fit.y[0]);
    expect(JSON.stringify(f.layout)).toContain('time from reward (s)');
    expect(normalise(f)).toMatchSnapshot();
  });

  it('jump answers: one control-subtracted PSTH per kind, windows shaded, verdict and shape named', () => {
    const f = jumpAnswersFigure.build(ctx, 1)!;
    expect(f.data).toHaveLength(2);
    const names = (f.data as Record<string, any>[]).map((d) => d.name);
    expect(names[1]).toMatch(/^forward \(\d+ jumps\): excited, transient$/);
    expect(names[0]).toMatch(/^backward \(\d+ jumps\): excited/);
    expect((f.layout.shapes as unknown[]).length).toBe(3);
    expect(normalise(f)).toMatchSnapshot();
  });

  it('cluster averages: one panel per segment, one line and band per cluster', () => {
    const f = clusterAveragesFigure.build(ctx)!;
    expect(f.layout).toHaveProperty('xaxis3');
    const lines = (f.data as Record<string, any>[]).filter((d) => d.showlegend === true);
    expect(lines.length).toBeGreaterThanOrEqual(2);
    expect(lines[0].name).toMatch(/^cluster 1 \(\d+ units\)$/);
    expect(normalise(f)).toMatchSnapshot();
  });

  it('returns null when the session has no events', () => {
    const bare = { ...ctx, recording: { ...recording, events: emptyEvents() } };
    expect(rampFitFigure.build(bare, 0)).toBeNull();
    expect(jumpAnswersFigure.build(bare, 0)).toBeNull();
    expect(clusterAveragesFigure.build(bare)).toBeNull();
  });
});
