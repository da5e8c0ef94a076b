import { describe, expect, it } from 'vitest';
import { sessionTimelineFigure } from '../../../core/figures/session-timeline-figure';
import { emptyPulses } from '../../../core/model/empty';
import { summariseRecording } from '../../../core/model/summarise-recording';
import type { Events, Recording, Trials } from '../../../core/model/types';

const events: Events = {
  time: Float64Array.from([10, 20, 30, 35]),
  label: ['reward', 'reward', 'reward', 'tone_on'],
  trial: Float64Array.from([1, 2, 3, 3]),
  kind: ['', '', '', ''],
};
const trials: Trials = {
  trial: Float64Array.from([1, 2, 3]),
  start: Float64Array.from([5, 15, 25]),
  stop: Float64Array.from([12, 22, 32]),
  condition: ['standard', 'probe', 'standard'],
  covariates: {},
};

const recording: Recording = {
  units: [
    { id: 'a', spikeTimes: Float64Array.from([1, 2, 3]), meta: {} },
    { id: 'b', spikeTimes: Float64Array.from([4]), meta: {} },
  ],
  pulses: {
    onset: Float64Array.from([40, 41, 41.1, 41.2]),
    duration: Float64Array.from([0.005, 0.005, 0.005, 0.005]),
    train: Int32Array.from([0, 1, 1, 1]),
    frequencyHz: Float64Array.from([NaN, 10, 10, 10]),
    powerMw: new Float64Array(4).fill(NaN),
  },
  events,
  trials,
  span: [0, 45],
  spanSource: 'inputs',
  waveformSampleRateHz: NaN,
};

describe('session summary and timeline', () => {
  it('counts units, spikes, pulses by train frequency, events and trials', () => {
    const s = summariseRecording(recording);
    expect(s).toMatchObject({ units: 2, spikes: 4, pulses: 4, singlePulses: 1, lightBlockS: [40, 41.2], hasWaveforms: false });
    expect(s.trainsByFrequency).toEqual([{ frequencyHz: 10, trains: 1, pulses: 3 }]);
    expect(s.eventsByLabel).toEqual([{ label: 'reward', count: 3, kinds: [] }, { label: 'tone_on', count: 1, kinds: [] }]);
    expect(s.trialsByCondition).toEqual([{ condition: 'standard', count: 2 }, { condition: 'probe', count: 1 }]);
    expect(summariseRecording({ ...recording, pulses: emptyPulses() }).lightBlockS).toEqual([NaN, NaN]);
  });
  it('draws one row per condition, event label and the pulses, over the span', () => {
    const f = sessionTimelineFigure(recording);
    expect((f.layout.yaxis as { categoryarray: string[] }).categoryarray).toEqual(['laser pulses', 'event: tone_on', 'event: reward', 'trials: probe', 'trials: standard']);
    expect((f.layout.xaxis as { range: number[] }).range).toEqual([0, 45]);
    expect(f.data[0].x).toEqual([5, 12, null, 25, 32, null]);
  });
});

