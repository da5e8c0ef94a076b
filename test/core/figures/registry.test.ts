import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import { POPULATION_FIGURES, UNIT_FIGURES } from '../../../core/figures/registry';
import { isiHistogram } from '../../../core/figures/quality/isi-histogram';
import { emptyEvents, emptyPulses, emptyTrials } from '../../../core/model/empty';
import type { Recording } from '../../../core/model/types';
import { analyseRecording } from '../../../core/pipeline/analyse-recording';
import { applyCuration } from '../../../core/curation/apply-curation';
import { curationReducer } from '../../../core/curation/curation-reducer';
import { EMPTY_CURATION } from '../../../core/curation/types';

const rec: Recording = {
  units: [
    { id: 'a', spikeTimes: Float64Array.of(0.1, 0.1005, 0.2, 0.35, 0.5, 2.5, 4, 9.9), meta: {}, waveformMean: Float64Array.of(0, 0, 0, 0, 0, -50, -100, -50, 0, 20, 40, 20, 0, 0, 0) },
    { id: 'b', spikeTimes: Float64Array.of(5), meta: {} },
  ],
  pulses: emptyPulses(),
  events: emptyEvents(),
  trials: emptyTrials(),
  span: [0, 10],
  spanSource: 'inputs',
  waveformSampleRateHz: 30000,
};
const analysis = analyseRecording(rec, DEFAULTS);
const ctx = { recording: rec, parameters: DEFAULTS, table: analysis.table };

describe('figure registry', () => {
  it('has unique ids and every figure builds plain JSON or null', () => {
    const ids = [...UNIT_FIGURES, ...POPULATION_FIGURES].map((f) => f.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const f of UNIT_FIGURES) {
      for (let i = 0; i < rec.units.length; i++) {
        const spec = f.build(ctx, i);
        if (spec) expect(JSON.parse(JSON.stringify(spec))).toEqual(spec); // plain data, no typed arrays or functions
      }
    }
    for (const f of POPULATION_FIGURES) {
      const spec = f.build(ctx);
      if (['verdict-counts', 'population-rate-heatmap'].includes(f.id)) expect(spec).not.toBeNull(); // the quality ones always apply
      if (spec) expect(JSON.parse(JSON.stringify(spec))).toEqual(spec);
    }
  });
  it('draws the autocorrelogram mirrored and counts the hand-made ISI', () => {
    const acg = UNIT_FIGURES.find((f) => f.id === 'quality-autocorrelogram')!.build(ctx, 0)!;
    const bar = acg.data[0] as { x: number[]; y: number[] };
    expect(bar.x.length).toBe(100); // +-50 ms in 1 ms bins
    expect(bar.x[49]).toBe(-0.5);
    expect(bar.x[50]).toBe(0.5);
    // unit a: the only lag under 50 ms is 0.5 ms (0.1 -> 0.1005), in bin 0 on each side
    expect(bar.y[50]).toBe(1);
    expect(bar.y[49]).toBe(1);
    expect(bar.y.reduce((s, v) => s + v, 0)).toBe(2);
  });
  it('leaves out figures that do not apply', () => {
    expect(UNIT_FIGURES.find((f) => f.id === 'quality-waveform')!.build(ctx, 1)).toBeNull(); // no waveform
    expect(UNIT_FIGURES.find((f) => f.id === 'quality-isi-histogram')!.build(ctx, 1)).toBeNull(); // one spike
  });
  it('counts verdicts, computed and final', () => {
    const cur = curationReducer(EMPTY_CURATION, { type: 'label', unit: 'a', column: 'quality', value: 'pass', by: 'x', at: '2026-03-01T00:00:00Z' });
    const table = applyCuration(analysis.table, cur).table;
    const spec = POPULATION_FIGURES.find((f) => f.id === 'verdict-counts')!.build({ ...ctx, table })!;
    const [computed, final] = spec.data as { x: string[][]; y: number[] }[];
    const at = (w: string) => computed.x[0].findIndex((c, k) => c === 'quality' && computed.x[1][k] === w);
    expect(at('pass')).toBeGreaterThanOrEqual(0);
    expect(computed.y[at('pass')]).toBe(0); // 8 and 1 spikes: too few to judge
    expect(computed.y[at('review')]).toBe(2);
    expect(final.y[at('pass')]).toBe(1);
    expect(final.y[at('review')]).toBe(1);
  });
});

describe('isiHistogram', () => {
  it('bins ISIs and counts the longer ones', () => {
    // ISIs 0.5 ms, 99.5 ms, 150 ms, 150 ms, 2000 ms, 1500 ms, 5900 ms with 1 ms bins up to 100 ms
    const h = isiHistogram(rec.units[0].spikeTimes, 0.001, 100);
    expect(h.counts[0]).toBe(1);
    expect(h.counts[99]).toBe(1);
    expect(h.counts.reduce((s, v) => s + v, 0)).toBe(2);
    expect(h.beyond).toBe(5);
  });
});
