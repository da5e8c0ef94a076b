import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli } from '../../../../core/node/run-cli';
import { captureIo } from '../../../helpers/memory-session';

// End to end through the CLI entry and the real session loader, on a small
// invented session folder written here (CSV as README "Input formats").
const dir = mkdtempSync(join(tmpdir(), 'tagbench-align-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const session = join(dir, 'session');
const spikes = [9.0, 9.4, 9.5, 10.0, 10.2, 10.99, 11.0, 19.1, 20.7];
mkdirSync(session);
writeFileSync(join(session, 'spikes.csv'), `unit,time\n${spikes.map((t) => `7,${t}`).join('\n')}\n8,15\n`);
writeFileSync(join(session, 'events.csv'), 'time,event\n10,reward\n20,reward\n');
writeFileSync(join(session, 'trials.csv'), 'trial,start,stop,condition\n1,5,15,standard\n2,15,25,probe\n');

describe('tagbench psth and predict through the CLI', () => {
  it('psth prints hand-checkable rates (exit 0)', async () => {
    const io = captureIo();
    const code = await runCli(['psth', session, '--unit', '7', '--event', 'reward', '--window', '-1,1', '--bin', '500', '--smooth', 'none', '--by', 'none'], io);
    expect(io.err.join('')).toBe('');
    expect(code).toBe(0);
    // Hand-counted (test/core/align/psth.test.ts): 3, 1, 2, 2 Hz.
    expect(io.out.join('').trim().split('\n').slice(1).map((l) => l.split(',')[6])).toEqual(['3', '1', '2', '2']);
  });
  it('predict writes a trace file (exit 0)', async () => {
    const out = join(dir, 'out', 'trace.csv');
    const io = captureIo();
    expect(await runCli(['predict', session, '--kernel', 'jGCaMP8f', '--unit', '7', '--rate', '20', '--out', out], io)).toBe(0);
    const lines = readFileSync(out, 'utf8').trim().split('\n');
    expect(lines[0]).toBe('time_s,predicted');
    expect(lines.length).toBeGreaterThan(100);
  });
  it('bad input exits 2 with one paragraph and no stack, writing nothing', async () => {
    const out = join(dir, 'bad.csv');
    const io = captureIo();
    expect(await runCli(['psth', session, '--unit', '99', '--event', 'reward', '--out', out], io)).toBe(2);
    const msg = io.err.join('');
    expect(msg).toMatch(/no such unit/);
    expect(msg).not.toMatch(/\n\s+at /);
    expect(existsSync(out)).toBe(false);
    const io2 = captureIo();
    expect(await runCli(['predict', session, '--kernel', 'nope', '--out', out], io2)).toBe(2);
    expect(io2.err.join('')).toMatch(/unknown kernel/);
    expect(existsSync(out)).toBe(false);
  });
});
