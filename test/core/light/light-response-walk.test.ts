/**
 * The fast walks of the light engine (issue 9) against the general computation they replace,
 * on the same inputs, bit for bit:
 * - lightResponse / saltBaseline (SALT baseline blocks read in time order by one forward walk,
 *   offset windows from schedule.offsetPulses) vs a window-by-window reference written here the
 *   plain way: every pulse's test and offset window and every SALT block found by its own binary
 *   search (core/align/lower-bound.ts, itself checked against plain scans), blocks in SALT-pulse
 *   order, the window and bin formulas of the documented definition (floor((t - start) / w),
 *   floor(latency / bin), clamped). This is the computation the engine did before the walks.
 * - lightResponse with a precomputed baseline half (the trust simulation's responders) vs the
 *   whole train; detail 'summary' vs true.
 * Edge cases: no spikes, one spike, spikes exactly on window, block and anchor edges, ties,
 * trains (blocks stacked back, read out of pulse order), long pulses (offset windows),
 * overlapping test windows (200 Hz trains), a negative window start, SALT not run.
 * Spike times are sorted, as a Recording's always are (core/io sorts them on import).
 */
import { describe, expect, it } from 'vitest';
import { lowerBound } from '../../../core/align/lower-bound';
import { createLightScratch, lightResponse, type LightResponse } from '../../../core/light/light-response';
import { lightSchedule, type LightSchedule } from '../../../core/light/light-schedule';
import { saltBaseline } from '../../../core/light/salt-baseline';
import { saltTest } from '../../../core/light/salt-test';
import type { Parameters } from '../../../core/defaults';
import { Rng } from '../../../core/random/rng';
import { lightParams, makePulses, simulateUnit } from './helpers';

/** The reference: everything the fast walks compute, window by window. */
function reference(spikes: Float64Array, sch: LightSchedule, p: Parameters['light']) {
  const n = sch.n;
  const ws = sch.windowStartS;
  const wn = sch.windowS;
  const rel = new Float64Array(n).fill(NaN);
  let answered = 0;
  let windowSpikes = 0;
  for (let i = 0; i < n; i++) {
    const lo = sch.onset[i] + ws;
    const hi = lo + wn;
    const a = lowerBound(spikes, lo);
    const b = lowerBound(spikes, hi);
    if (b > a) {
      rel[i] = spikes[a] - lo;
      answered++;
      windowSpikes += b - a;
    }
  }
  let offsetPulses = 0;
  let offsetAnswered = 0;
  let offSpikes = 0;
  for (let i = 0; i < n; i++) {
    const lo = sch.offset[i];
    if (!Number.isFinite(lo) || lo < sch.onset[i] + sch.windowEndS) continue;
    offsetPulses++;
    const a = lowerBound(spikes, lo);
    const b = lowerBound(spikes, lo + p.offsetWindowMs / 1000);
    if (b > a) offsetAnswered++;
    offSpikes += b - a;
  }
  const J = sch.windows;
  const classes = sch.nBins + 1;
  const m = sch.saltPulses.length;
  const counts = new Int32Array((J + 1) * classes);
  let baseSpikes = 0;
  let baseAnswered = 0;
  for (let k = 0; k < m && J > 0; k++) {
    const i = sch.saltPulses[k];
    const r = rel[i];
    if (r === r) counts[1 + Math.min(sch.nBins - 1, Math.floor(r / sch.binS))]++;
    else counts[0]++;
    const start = sch.anchor[i] - J * wn;
    const a = lowerBound(spikes, start);
    const b = lowerBound(spikes, sch.anchor[i]);
    baseSpikes += b - a;
    let last = -1;
    for (let j = a; j < b; j++) {
      const w = Math.min(J - 1, Math.floor((spikes[j] - start) / wn));
      if (w === last) continue;
      last = w;
      const bin = Math.max(0, Math.min(sch.nBins - 1, Math.floor((spikes[j] - (start + w * wn)) / sch.binS)));
      counts[(1 + w) * classes + 1 + bin]++;
      baseAnswered++;
    }
  }
  for (let w = 1; w <= J; w++) {
    let c = 0;
    for (let b = 1; b < classes; b++) c += counts[w * classes + b];
    counts[w * classes] = m - c;
  }
  const salt = J > 0 && m > 0 ? saltTest(counts, J + 1, classes, m) : null;
  return { rel, answered, windowSpikes, offsetPulses, offsetAnswered, offSpikes, counts, baseSpikes, baseAnswered, salt };
}

/** Every number of a response, NaN kept (Object.is-equal lists compare bit for bit). */
function numbers(r: LightResponse): unknown[] {
  return Object.entries(r)
    .filter(([, v]) => typeof v === 'number' || v instanceof Float64Array || (typeof v === 'object' && v !== null && !ArrayBuffer.isView(v)))
    .map(([k, v]) => [k, v instanceof Float64Array ? Array.from(v) : v]);
}

interface Case {
  name: string;
  sch: LightSchedule;
  p: Parameters['light'];
  trains: Float64Array[];
}

function cases(): Case[] {
  const out: Case[] = [];
  const rng = new Rng(909);
  const add = (name: string, pulses: ReturnType<typeof makePulses>, p: Parameters['light'], extra: (sch: LightSchedule) => Float64Array[]) => {
    const sch = lightSchedule(pulses.pulses, [0, pulses.endS], p);
    const trains: Float64Array[] = [new Float64Array(0), Float64Array.of(pulses.pulses.onset[0] + 0.003)];
    for (const rate of [0.5, 4, 40]) trains.push(simulateUnit(rng, pulses.pulses, pulses.endS, rate, rate > 10 ? 0.5 : 1, { reliability: 0.4, latencyMs: 4, jitterMs: 1.5 }));
    trains.push(...extra(sch));
    out.push({ name, sch, p, trains });
  };
  // Spikes exactly on every edge the engine reads: test window start and end, SALT block
  // starts, window edges inside blocks, anchors, offset window edges; with ties.
  const edges = (sch: LightSchedule) => {
    const t: number[] = [];
    for (let i = 0; i < sch.n; i++) {
      t.push(sch.onset[i] + sch.windowStartS, sch.onset[i] + sch.windowStartS + sch.windowS, sch.onset[i] + sch.windowEndS);
      if (Number.isFinite(sch.offset[i])) t.push(sch.offset[i], sch.offset[i]);
      const start = sch.anchor[i] - sch.windows * sch.windowS;
      for (let j = 0; j <= sch.windows; j++) t.push(start + j * sch.windowS);
      t.push(sch.anchor[i], sch.anchor[i]);
    }
    return [Float64Array.from(t).sort()];
  };
  const base = lightParams({ saltBaselineMs: 300 });
  add('single pulses', makePulses({ single: 60, periodS: 1 }), base, edges);
  add('single pulses and 10/20 Hz trains (blocks stacked back)', makePulses({ single: 40, trainFrequencies: [10, 20], trains: 4 }), base, edges);
  add('long pulses: offset windows', makePulses({ single: 40, durationS: 0.015, trainFrequencies: [20], trains: 3 }), base, edges);
  add('200 Hz trains: overlapping test windows', makePulses({ single: 20, trainFrequencies: [200], trains: 3 }), lightParams({ saltBaselineMs: 200, saltMinPulseFraction: 0.1 }), edges);
  add('negative window start', makePulses({ single: 50, jitterPeriodS: 0.5 }), lightParams({ windowStartMs: -2, windowEndMs: 8, saltBaselineMs: 400 }), edges);
  add('SALT not run (no light-free time before dense pulses)', makePulses({ single: 50, periodS: 0.1, startS: 0.05 }), lightParams(), edges);
  return out;
}

describe('lightResponse fast walks vs the window-by-window reference', () => {
  const scratch = createLightScratch();
  for (const c of cases()) {
    it(`${c.name}: the same counts, histograms and SALT, bit for bit`, () => {
      expect(c.sch.n).toBeGreaterThan(0);
      for (const spikes of c.trains) {
        const want = reference(spikes, c.sch, c.p);
        const r = lightResponse(spikes, c.sch, c.p, true, scratch);
        expect(Array.from(r.latencyS!)).toEqual(Array.from(want.rel, (x) => x + c.sch.windowStartS));
        expect(r.answered).toBe(want.answered);
        expect(Math.round(r.evokedPerPulse * r.pulses)).toBe(want.windowSpikes);
        expect([r.offsetPulses, r.offsetAnswered]).toEqual([want.offsetPulses, want.offsetAnswered]);
        if (c.sch.windows > 0) {
          const b = saltBaseline(spikes, c.sch);
          const classes = c.sch.nBins + 1;
          expect(Array.from(b.rows)).toEqual(Array.from(want.counts.subarray(classes)));
          expect([b.spikes, b.answered]).toEqual([want.baseSpikes, want.baseAnswered]);
          expect(r.baselineHz).toBe(want.baseSpikes / (c.sch.saltPulses.length * c.sch.windows * c.sch.windowS));
          expect(r.baselineReliability).toBe(want.baseAnswered / (c.sch.saltPulses.length * c.sch.windows));
          expect(r.salt).toEqual(want.salt);
        } else {
          expect(c.sch.saltProblem).not.toBe('');
          expect(r.salt.p).toBeNaN();
        }
      }
    });
  }
  it('the cases reach what they are meant to reach', () => {
    const cs = cases();
    expect(cs[1].sch.saltBlockOrder.some((v, k) => v !== cs[1].sch.saltPulses[k])).toBe(true); // blocks out of pulse order
    expect(cs[2].sch.offsetPulses.length).toBeGreaterThan(0);
    expect(cs[0].sch.offsetPulses.length).toBe(0);
    expect(cs[5].sch.windows).toBe(0);
  });
});

describe('lightResponse: precomputed baseline half and detail levels', () => {
  const p = lightParams({ saltBaselineMs: 300 });
  const { pulses, endS } = makePulses({ single: 80, trainFrequencies: [20], trains: 4 });
  const sch = lightSchedule(pulses, [0, endS], p);
  const rng = new Rng(4);
  const nullTrain = simulateUnit(rng, pulses, endS, 6, 1, null);
  it('a responder (null train + spikes after pulses) with its null train\'s baseline half equals the whole computation', () => {
    const added: number[] = [];
    for (let i = 0; i < sch.n; i++) if (rng.uniform() < 0.3) added.push(sch.onset[i] + 0.004 + 0.001 * rng.normal());
    const responder = Float64Array.from([...nullTrain, ...added]).sort();
    const whole = lightResponse(responder, sch, p, false);
    const withBase = lightResponse(responder, sch, p, false, createLightScratch(), -Infinity, saltBaseline(nullTrain, sch));
    expect(numbers(withBase)).toEqual(numbers(whole));
  });
  it("'summary' gives true's median and per-frequency figures without the per-pulse array", () => {
    const full = lightResponse(nullTrain, sch, p, true);
    const sum = lightResponse(nullTrain, sch, p, 'summary');
    expect(sum.latencyS).toBeUndefined();
    expect(numbers(sum)).toEqual(numbers({ ...full, latencyS: undefined }));
    expect(sum.medianLatencyS).toBe(full.medianLatencyS);
    expect(Array.from(sum.frequencyReliability!)).toEqual(Array.from(full.frequencyReliability!));
  });
});

describe('lightSchedule: block order and offset list', () => {
  it('saltBlockOrder is saltPulses sorted by block start; offsetPulses are the pulses ending at or after their test window', () => {
    const p = lightParams({ saltBaselineMs: 300 });
    const { pulses, endS } = makePulses({ single: 30, durationS: 0.012, trainFrequencies: [10, 20], trains: 3 });
    pulses.duration[3] = NaN;
    pulses.duration[4] = 0.005;
    const sch = lightSchedule(pulses, [0, endS], p);
    expect(Array.from(sch.saltBlockOrder).sort((a, b) => a - b)).toEqual(Array.from(sch.saltPulses));
    for (let k = 1; k < sch.saltBlockOrder.length; k++) expect(sch.anchor[sch.saltBlockOrder[k]]).toBeGreaterThan(sch.anchor[sch.saltBlockOrder[k - 1]]);
    const want = [];
    for (let i = 0; i < sch.n; i++) if (Number.isFinite(sch.offset[i]) && sch.offset[i] >= sch.onset[i] + sch.windowEndS) want.push(i);
    expect(Array.from(sch.offsetPulses)).toEqual(want);
    expect(want).not.toContain(3);
    expect(want).not.toContain(4);
    expect(want.length).toBe(sch.n - 2);
  });
});
