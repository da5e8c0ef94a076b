/**
 * Light schedule: SALT baseline windows must lie in light-free time before the pulses,
 * never in the gaps inside a train (issue 3; REFERENCES.md: baseline from light-free time).
 * Checks are exact geometry on hand-made schedules (no outside library applies).
 */
import { describe, expect, it } from 'vitest';
import { lightSchedule } from '../../../core/light/light-schedule';
import { emptyPulses } from '../../../core/model/empty';
import { lightParams, makePulses } from './helpers';

describe('lightSchedule', () => {
  const p = lightParams();
  it('single pulses 1 s apart: one group each, 89 windows of 10 ms right before each pulse', () => {
    const { pulses, endS } = makePulses({ single: 20, periodS: 1, startS: 5 });
    const s = lightSchedule(pulses, [0, endS], p);
    expect(s.groupCount).toBe(20);
    // 1 s - 10 ms window - 100 ms guard = 890 ms light-free before each pulse (maximum 1,000 ms).
    expect(s.windows).toBe(89);
    expect(lightSchedule(pulses, [0, endS], { ...p, saltBaselineMs: 500 }).windows).toBe(50);
    expect(s.saltPulses.length).toBe(20);
    for (let i = 0; i < 20; i++) expect(s.anchor[i]).toBe(s.onset[i]);
    expect(s.nBins).toBe(10);
    expect(s.frequencyKeys).toEqual(['single']);
  });
  it('every baseline window of a 20 Hz train lies in light-free time before the train', () => {
    const { pulses, endS } = makePulses({ single: 0, trainFrequencies: [20], trains: 6, perTrain: 10, trainGapS: 2.5, startS: 3 });
    const s = lightSchedule(pulses, [0, endS], p);
    expect(s.groupCount).toBe(6);
    expect(s.frequencyKeys).toEqual(['20hz']);
    expect(Array.from(s.indexInTrain.slice(0, 12))).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 0, 1]);
    const li = s.lightIntervals;
    const inLight = (a: number, b: number) => {
      for (let k = 0; k < li.length; k += 2) if (a < li[k + 1] && b > li[k]) return true;
      return false;
    };
    for (const i of s.saltPulses) {
      for (let j = 0; j < s.windows; j++) {
        const a = s.anchor[i] - (j + 1) * s.windowS;
        const b = s.anchor[i] - j * s.windowS;
        expect(inLight(a, b), `pulse ${i} window ${j}`).toBe(false);
        expect(a).toBeGreaterThanOrEqual(-1e-12); // span start 0 (rounding of 10 x 30 x 0.01 s)
      }
    }
    // No stretch of time serves two pulses (exchangeability of test and baseline rows):
    // every baseline window of every SALT pulse is disjoint from every other one.
    const starts: number[] = [];
    for (const i of s.saltPulses) for (let j = 0; j < s.windows; j++) starts.push(s.anchor[i] - (j + 1) * s.windowS);
    starts.sort((a, b) => a - b);
    for (let k = 1; k < starts.length; k++) expect(starts[k] - starts[k - 1]).toBeGreaterThanOrEqual(s.windowS - 1e-9);
    // Blocks stacked back from the train's start: the m-th pulse's block ends m x J windows before it.
    expect(s.anchor[3]).toBeCloseTo(s.onset[0] - 3 * s.windows * s.windowS, 12);
    // Light-free time: 3 s before the first train, 3 s - 0.56 s = 2.44 s before the others;
    // J = 30 (0.3 s blocks) gives 10 + 5 x 8 = 50 of 60 pulses (>= 80 %), J = 31 only 10 + 5 x 7.
    expect(s.windows).toBe(30);
    expect(s.saltPulses.length).toBe(50);
    expect(Array.from(s.saltPulses.slice(8, 12))).toEqual([8, 9, 10, 11]);
    expect(Array.from(s.saltPulses.slice(16, 20))).toEqual([16, 17, 20, 21]);
  });
  it('too little light-free time: fewer windows, then SALT cannot run with a reason', () => {
    const { pulses, endS } = makePulses({ single: 50, periodS: 0.3, startS: 0.5 });
    const s = lightSchedule(pulses, [0, endS], p);
    // 300 ms period - 10 ms window - 100 ms guard = 190 ms light-free: 19 windows.
    expect(s.windows).toBe(19);
    // Asking for 20 windows joins all pulses into one group (190 ms < 200 ms), whose 0.5 s
    // of light-free time gives 2 pulses a block of 20 windows: SALT runs on those two only.
    const t = lightSchedule(pulses, [0, endS], { ...p, saltMinWindows: 20 });
    expect(t.windows).toBe(20);
    expect(Array.from(t.saltPulses)).toEqual([0, 1]);
    // With 0.1 s before the first pulse no pulse has 20 windows of its own: SALT cannot run.
    const early = makePulses({ single: 50, periodS: 0.3, startS: 0.1 });
    const u = lightSchedule(early.pulses, [0, early.endS], { ...p, saltMinWindows: 20 });
    expect(u.windows).toBe(0);
    expect(u.saltPulses.length).toBe(0);
    expect(u.saltProblem).toMatch(/too little light-free time/);
  });
  it('no pulses', () => {
    const s = lightSchedule(emptyPulses(), [0, 100], p);
    expect(s.n).toBe(0);
    expect(s.saltProblem).toBe('no laser pulses');
    expect(s.lightFreeS).toBe(100);
  });
  it('derives a train frequency from onsets when none is given; unknown durations are NaN offsets', () => {
    const { pulses, endS } = makePulses({ single: 0, trainFrequencies: [12.5], trains: 2, perTrain: 5 });
    const noFreq = { ...pulses, frequencyHz: new Float64Array(pulses.onset.length).fill(NaN), duration: new Float64Array(pulses.onset.length).fill(NaN) };
    const s = lightSchedule(noFreq, [0, endS], p);
    expect(s.frequencyKeys).toEqual(['12p5hz']);
    expect(s.frequencies[0]).toBe(12.5);
    expect(Number.isNaN(s.offset[0])).toBe(true);
  });
  it('light-free time excludes pulse, window and guard', () => {
    const { pulses } = makePulses({ single: 3, periodS: 10, startS: 10 });
    const s = lightSchedule(pulses, [0, 40], p);
    // each pulse: max(5 ms pulse, 10 ms window) + 100 ms guard = 110 ms of light time
    expect(s.lightFreeS).toBeCloseTo(40 - 3 * 0.11, 9);
  });
});
