/**
 * The raw file's channel map (session.json raw.channel_map): a unit's `channel` metadata names a
 * probe channel id, looked up in the map to find the file column the waveform comparison starts
 * from. Hand-made raw data: a unit whose spike shape is largest on column 1 and whose channel id
 * (42) sits in column 2; the comparison must start from column 2 with the map, and fall back to the
 * largest column (1) with a warning when the id is in no column.
 */
import { describe, expect, it } from 'vitest';
import { DEFAULTS, type Parameters } from '../../../core/defaults';
import { lightStep } from '../../../core/light/light-step';
import { emptyEvents, emptyTrials } from '../../../core/model/empty';
import type { RawSource, Recording } from '../../../core/model/types';
import { analyseRecording } from '../../../core/pipeline/analyse-recording';
import { basicStep } from '../../../core/pipeline/basic-step';
import { Rng } from '../../../core/random/rng';
import { makePulses, simulateUnit } from './helpers';

const FS = 10000;
const CH = 4;

function session(channelIds: readonly string[] | undefined, channel: string): Recording {
  const ps = makePulses({ single: 120, periodS: 0.9 });
  const frames = Math.ceil(ps.endS * FS);
  const data = new Int16Array(frames * CH);
  const rng = new Rng(5);
  for (let i = 0; i < data.length; i++) data[i] = Math.round(2 * rng.normal());
  const shape = [-20, -80, -160, -90, 10, 40, 30, 10];
  const spikes = simulateUnit(rng, ps.pulses, ps.endS, 3, 1, { reliability: 0.8, latencyMs: 3, jitterMs: 0.8 });
  for (const t of spikes) {
    const f0 = Math.round(t * FS) - 2;
    for (let k = 0; k < shape.length; k++) for (let c = 0; c < CH; c++) if (f0 + k >= 0 && f0 + k < frames) data[(f0 + k) * CH + c] += Math.round(shape[k] * [0.2, 1, 0.5, 0.1][c]);
  }
  const raw: RawSource = {
    file: 'raw.bin', channelCount: CH, sampleRateHz: FS, gainUvPerBit: 1, frameCount: frames, startS: 0,
    ...(channelIds ? { channelIds } : {}),
    readFrames: (start, count) => data.slice(Math.max(0, start) * CH, Math.min(frames, start + count) * CH),
  };
  return { units: [{ id: 'a', spikeTimes: spikes, meta: { channel } }], pulses: ps.pulses, events: emptyEvents(), trials: emptyTrials(), span: [0, ps.endS], spanSource: 'inputs', waveformSampleRateHz: NaN, raw };
}

const run = (rec: Recording) => analyseRecording(rec, JSON.parse(JSON.stringify(DEFAULTS)) as Parameters, [basicStep, lightStep]);
const first = (r: ReturnType<typeof run>) => (r.table.columns.find((c) => c.name === 'tag_waveform_channel')!.values as Float64Array)[0];

describe('raw channel map', () => {
  it('finds the column of the unit channel id through the map', () => {
    const r = run(session(['40', '41', '42', '43'], '42'));
    expect(first(r)).toBe(2);
    expect(r.warnings.filter((w) => w.code === 'waveform-channel-invalid')).toEqual([]);
  });
  it('without a map the channel is a 0-based column; an id in no column falls back to the largest column, with a warning', () => {
    expect(first(run(session(undefined, '2')))).toBe(2);
    const r = run(session(['40', '41', '42', '43'], '7'));
    expect(first(r)).toBe(1);
    expect(r.warnings.find((w) => w.code === 'waveform-channel-invalid')?.message).toMatch(/not in raw\.channel_map/);
  });
});
