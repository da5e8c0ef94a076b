// The same simulated session (core/sim, seeded) read back from an NWB file
// gives the same Recording: spike times, unit metadata, waveforms, pulses,
// events and trials. The NWB file is laid out as the published NWB 2.x schema
// says (see write-nwb-from-recording.ts).
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadNwbSession } from '../../../../core/node/load-nwb-session';
import { demoScenario } from '../../../../core/sim/demo-scenario';
import { simulateSession } from '../../../../core/sim/simulate-session';
import { writeNwbFromRecording } from './write-nwb-from-recording';

const dir = mkdtempSync(join(tmpdir(), 'tagbench-nwb-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('simulated session written as NWB', () => {
  it('reads back identical units, pulses, events and trials', async () => {
    const sim = simulateSession({ ...demoScenario(31), units: demoScenario(31).units.slice(0, 12) });
    const rec = sim.recording;
    const file = join(dir, 'sim.nwb');
    await writeNwbFromRecording(rec, file);
    const r = await loadNwbSession(file);
    const got = r.recording;
    expect(r.warnings).toEqual([]);
    expect(got.span).toEqual(rec.span);
    expect(got.units.map((u) => u.id)).toEqual(rec.units.map((u) => u.id));
    got.units.forEach((u, i) => {
      expect(Array.from(u.spikeTimes)).toEqual(Array.from(rec.units[i].spikeTimes));
      expect(u.meta.channel).toBe(rec.units[i].meta.channel);
      expect(u.meta.depth_um).toBe(rec.units[i].meta.depth_um);
      // microvolts -> volts -> microvolts: equal to 1 ulp-scale rounding (relative 4 * EPS)
      const w = rec.units[i].waveformMean!;
      u.waveformMean!.forEach((x, s) => expect(Math.abs(x - w[s])).toBeLessThanOrEqual(4 * Number.EPSILON * Math.max(1, Math.abs(w[s]))));
    });
    expect(got.waveformSampleRateHz).toBe(rec.waveformSampleRateHz);
    for (const key of ['onset', 'duration', 'train', 'frequencyHz', 'powerMw'] as const) {
      const a = Array.from(got.pulses[key] as ArrayLike<number>);
      const b = Array.from(rec.pulses[key] as ArrayLike<number>);
      if (key === 'duration') a.forEach((x, i) => expect(Math.abs(x - b[i])).toBeLessThan(1e-9)); // stop - start in float64
      else expect(a).toEqual(b);
    }
    expect(got.pulses.onset.length).toBeGreaterThan(400);
    // events: the reader sorts by time; ties keep source order, so compare as sorted (time, label, trial, kind) rows
    const rows = (e: typeof rec.events) => Array.from(e.time, (t, i) => `${t}|${e.label[i]}|${e.trial[i]}|${e.kind[i]}`).sort();
    expect(rows(got.events)).toEqual(rows(rec.events));
    expect([...new Set(got.events.label)].sort()).toEqual(['jump', 'reward', 'sweep_on']);
    expect(Array.from(got.trials.trial)).toEqual(Array.from(rec.trials.trial));
    expect(Array.from(got.trials.start)).toEqual(Array.from(rec.trials.start));
    expect(Array.from(got.trials.stop)).toEqual(Array.from(rec.trials.stop));
    expect(got.trials.condition).toEqual(rec.trials.condition);
    expect(Object.keys(got.trials.covariates).sort()).toEqual(Object.keys(rec.trials.covariates).sort());
    for (const [k, v] of Object.entries(rec.trials.covariates)) expect(Array.from(got.trials.covariates[k] as ArrayLike<number>)).toEqual(Array.from(v as ArrayLike<number>));
  });

  it('warns about units not observed during part of the light block or the task (obs_intervals)', async () => {
    const sim = simulateSession({ ...demoScenario(31), units: demoScenario(31).units.slice(0, 4) });
    const rec = sim.recording;
    const firstPulse = rec.pulses.onset[0];
    const t = rec.trials;
    // unit 0 lost just before the light block; unit 1 missing trials 3 and 4 (a gap from the
    // middle of trial 3 to the middle of trial 4); units 2 and 3 observed throughout
    const mid = (k: number) => (t.start[k] + t.stop[k]) / 2;
    const observed = [Float64Array.of(rec.span[0], firstPulse - 1), Float64Array.of(rec.span[0], mid(3), mid(4), rec.span[1])];
    const withGaps = { ...rec, units: rec.units.map((u, i) => (observed[i] ? { ...u, observedIntervals: observed[i] } : u)) };
    const file = join(dir, 'gaps.nwb');
    await writeNwbFromRecording(withGaps, file);
    const r = await loadNwbSession(file);
    expect(r.warnings.map((w) => w.code)).toEqual(['partly-observed-units']);
    const w = r.warnings[0];
    expect(w.count).toBe(2);
    // unit 0: every pulse, and the trials from the light block on (none: the light block ends the session)
    const trialsAfter = Array.from(t.stop).filter((s) => s > firstPulse - 1).length;
    expect(w.message).toContain(`2 unit(s) were not observed during part of the light block or task (obs_intervals: 1 miss laser pulses, ${trialsAfter ? 2 : 1} miss trials or events; e.g. unit ${rec.units[0].id}: ${rec.pulses.onset.length} pulses, ${trialsAfter} trials or events outside)`);
    expect(w.file).toBe('gaps.nwb (/units/obs_intervals)');
  });
});
