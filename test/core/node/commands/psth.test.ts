import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { InputError } from '../../../../core/errors';
import { createPsthCommand } from '../../../../core/node/commands/psth';
import { captureIo, memoryLoader } from '../../../helpers/memory-session';
import { makeRecording } from '../../../helpers/recording';

// Invented session: rewards at 10 and 20 s (trials of two conditions), a pulse at 30 s.
const rec = makeRecording({
  units: [
    { id: 'a1', spikes: [9.0, 9.4, 9.5, 10.0, 10.2, 10.99, 11.0, 19.1, 20.7, 30.004] },
    { id: 'b2', spikes: [] },
  ],
  trials: [
    { trial: 1, start: 5, stop: 15, condition: 'standard' },
    { trial: 2, start: 15, stop: 25, condition: 'probe' },
  ],
  events: [
    { time: 10, label: 'reward' },
    { time: 20, label: 'reward' },
  ],
  pulses: [{ onset: 30 }],
});
const cmd = createPsthCommand(memoryLoader(rec));
const dir = mkdtempSync(join(tmpdir(), 'tagbench-psth-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('tagbench psth', () => {
  it('writes hand-checkable CSV rates per group to stdout', async () => {
    const io = captureIo();
    const code = await cmd.run(['demo', '--unit', 'a1', '--event', 'reward', '--window', '-1,1', '--bin', '500', '--smooth', 'none', '--by', 'none'], io);
    expect(code).toBe(0);
    const lines = io.out.join('').trim().split('\n');
    expect(lines[0]).toBe('unit,event,group,n_trials,bin_start_s,bin_center_s,rate_hz,sem_hz,lower_hz,upper_hz,z');
    // Same raster as test/core/align/psth.test.ts: rates 3, 1, 2, 2 Hz (hand-counted).
    expect(lines.slice(1).map((l) => l.split(',')[6])).toEqual(['3', '1', '2', '2']);
    expect(lines[1].split(',').slice(0, 6)).toEqual(['a1', 'reward', 'all', '2', '-1', '-0.75']);
  });
  it('groups by condition and adds z-scores with a baseline', async () => {
    const io = captureIo();
    await cmd.run(['demo', '--unit', 'a1', '--event', 'reward', '--window', '-1,1', '--bin', '500', '--smooth', 'none', '--baseline', '-1,0'], io);
    const rows = io.out.join('').trim().split('\n').slice(1).map((l) => l.split(','));
    expect([...new Set(rows.map((r) => r[2]))]).toEqual(['probe', 'standard']);
    // probe (event 20): rates 2, 0, 0, 2 -> baseline bins 2, 0: mean 1, SD sqrt(2) -> z of bin 4 = 1/sqrt(2)
    expect(Number(rows[3][10])).toBeCloseTo(1 / Math.SQRT2, 5);
  });
  it('writes JSON with the raster, and aligns on pulses', async () => {
    const out = join(dir, 'pulses.json');
    const io = captureIo();
    await cmd.run(['demo', '--unit', 'a1', '--pulses', '--window', '-0.01,0.02', '--bin', '1', '--smooth', 'none', '--out', out], io);
    const j = JSON.parse(readFileSync(out, 'utf8'));
    expect(j.units[0].event).toBe('pulses');
    expect(j.units[0].groups[0].raster.offsets).toEqual([0, 1]);
    expect(j.units[0].groups[0].raster.timesS[0]).toBeCloseTo(0.004, 9);
    expect(j.units[0].groups[0].rateHz[14]).toBe(1000);
    expect(io.err.join('')).toMatch(/wrote/);
  });
  it('covers every unit with --unit all (an empty train gives zero rates)', async () => {
    const io = captureIo();
    await cmd.run(['demo', '--unit', 'all', '--event', 'reward', '--by', 'none', '--bin', '100', '--window', '0,1'], io);
    const rows = io.out.join('').trim().split('\n').slice(1).map((l) => l.split(','));
    expect(rows.length).toBe(20);
    expect(rows.filter((r) => r[0] === 'b2').every((r) => r[6] === '0')).toBe(true);
  });
  it.each([
    [['demo', '--unit', 'zz', '--event', 'reward'], /no such unit.*a1, b2/],
    [['demo', '--unit', 'a1', '--event', 'lick'], /no events with this label.*reward/],
    [['demo', '--unit', 'a1', '--event', 'reward', '--window', '2,1'], /stop must be after the start/],
    [['demo', '--unit', 'a1', '--event', 'reward', '--smooth', 'triangle:5'], /gaussian:MS/],
    [['demo', '--unit', 'a1', '--event', 'reward', '--by', 'covariate:depth'], /no such trial covariate/],
    [['demo', '--unit', 'a1', '--event', 'reward', '--out', 'x.txt'], /\.csv or \.json/],
    [['demo', '--event', 'reward'], /which unit/],
    [['demo', '--unit', 'a1', '--frobnicate', '1'], /unknown option/],
    [['demo', '--unit', 'a1', '--event', 'reward', '--kind', 'forward'], /no "reward" events left/],
  ])('rejects bad input with a clear message: %s', async (argv, msg) => {
    const out = join(dir, 'never.csv');
    const run = cmd.run([...argv], captureIo());
    await expect(run).rejects.toThrow(InputError);
    await expect(cmd.run([...argv], captureIo())).rejects.toThrow(msg);
    expect(existsSync(out)).toBe(false);
  });
  it('writes a time-warped PSTH between anchors (hand-counted)', async () => {
    // Anchors trial_start -> reward: 5 -> 10 s and 15 -> 20 s, both 5 s, so the template is [0, 5] and
    // nothing is stretched. Window 1 s before / after; 1 s bins from -1 s. Spikes in template time:
    // trial 1: 4.0, 4.4, 4.5 | 5.0, 5.2, 5.99 (11.0 is at the window's end, excluded); trial 2: 4.1 | 5.7.
    // Bin [4, 5): 4 spikes / 2 s = 2 Hz; bin [5, 6): 4 / 2 s = 2 Hz; others 0.
    const io = captureIo();
    expect(await cmd.run(['demo', '--unit', 'a1', '--warp', 'trial_start,reward', '--window', '-1,1', '--bin', '1000', '--by', 'none'], io)).toBe(0);
    const rows = io.out.join('').trim().split('\n');
    expect(rows[0]).toBe('unit,anchors,group,n_trials,bin_start_s,bin_center_s,rate_hz,sem_hz');
    expect(rows.slice(1).map((l) => l.split(',')[6])).toEqual(['0', '0', '0', '0', '0', '2', '2']);
    expect(io.err.join('')).toMatch(/template trial_start at 0 s, reward at 5 s; 0 trial\(s\)/);
    await expect(cmd.run(['demo', '--unit', 'a1', '--warp', 'reward'], captureIo())).rejects.toThrow(/at least two anchor/);
    await expect(cmd.run(['demo', '--unit', 'a1', '--warp', 'reward,lick'], captureIo())).rejects.toThrow(/no events with this label/);
    await expect(cmd.run(['demo', '--unit', 'a1', '--warp', 'reward,trial_start'], captureIo())).rejects.toThrow(/no trial has every anchor/);
  });
  it('prints its usage', async () => {
    const io = captureIo();
    expect(await cmd.run(['--help'], io)).toBe(0);
    expect(io.out.join('')).toMatch(/Usage: tagbench psth/);
  });
});
