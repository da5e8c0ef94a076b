/**
 * The progress ramp end to end: a session folder with behaviour.csv, `run`
 * through the CLI entry with ramp.progressVariable in --config, units.csv and
 * run.json read back. Invented, hand-checkable session: 12 trials of 8 s;
 * progress runs 0 -> 1 from 2 s to 5 s after each start and reward comes at
 * 5 s, so the ramp window [-3, 0) s is exactly the approach. Unit 1 fires
 * only late in the approach (7 spikes at progress 0.55-0.95, every trial):
 * all 12 per-trial slopes positive, exact two-sided signed-rank p = 2 / 2^12
 * (Hollander & Wolfe 1973: the all-positive pattern is 1 of 2^n). Unit 2 fires
 * only outside the windows.
 */
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { parseDelimited } from '../../../core/export/parse-delimited';
import { runCli } from '../../../core/node/run-cli';
import { captureIo } from '../../helpers/memory-session';

const dir = mkdtempSync(join(tmpdir(), 'tagbench-progress-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const session = join(dir, 'session');
mkdirSync(session);
const spikes: string[] = [];
const trials: string[] = [];
const events: string[] = [];
for (let k = 0; k < 12; k++) {
  const s = 10 * k;
  trials.push(`${k + 1},${s},${s + 8},standard`);
  events.push(`${s + 5},reward,${k + 1}`);
  for (const p of [0.55, 0.65, 0.75, 0.8, 0.85, 0.9, 0.95]) spikes.push(`1,${(s + 2 + 3 * p).toFixed(6)}`);
  spikes.push(`2,${s + 0.5}`, `2,${s + 6}`);
}
const samples: string[] = [];
for (let i = 0; i <= 2400; i++) {
  const t = i * 0.05;
  const inTrial = t % 10;
  const progress = inTrial < 2 ? 0 : inTrial < 5 ? (inTrial - 2) / 3 : inTrial < 8 ? 1 : 0;
  samples.push(`${t.toFixed(3)},${progress.toFixed(6)},${(180 * progress).toFixed(4)}`);
}
writeFileSync(join(session, 'spikes.csv'), `unit,time\n${spikes.join('\n')}\n`);
writeFileSync(join(session, 'trials.csv'), `trial,start,stop,condition\n${trials.join('\n')}\n`);
writeFileSync(join(session, 'events.csv'), `time,event,trial\n${events.join('\n')}\n`);
writeFileSync(join(session, 'behaviour.csv'), `time,progress,position_cm\n${samples.join('\n')}\n`);
writeFileSync(join(dir, 'analysis.json'), JSON.stringify({ ramp: { progressVariable: 'progress' } }));
writeFileSync(join(dir, 'bad.json'), JSON.stringify({ ramp: { progressVariable: 'speed' } }));

describe('progress ramp through the CLI', () => {
  it('run writes the progress_ramp columns and the run.json summary', async () => {
    const io = captureIo();
    const out = join(dir, 'out');
    expect(await runCli(['run', session, '--out', out, '--config', join(dir, 'analysis.json')], io)).toBe(0);
    const [cols, ...rows] = parseDelimited(readFileSync(join(out, 'units.csv'), 'utf8'), ',', 'units.csv');
    expect(cols.slice(0, 12)).toEqual(['unit', 'n_spikes', 'rate_hz', 'tag', 'tag_latency_ms', 'tag_jitter_ms', 'tag_reliability', 'tag_p', 'ramp', 'ramp_slope_hz_per_s', 'ramp_p', 'ramp_q']);
    const at = (row: string[], name: string) => row[cols.indexOf(name)];
    expect(at(rows[0], 'progress_ramp')).toBe('up');
    expect(Number(at(rows[0], 'progress_ramp_p'))).toBeCloseTo(2 / 4096, 9);
    expect(Number(at(rows[0], 'progress_ramp_slope_hz_per_unit'))).toBeGreaterThan(0);
    expect(at(rows[0], 'progress_ramp_n_trials')).toBe('12');
    expect(at(rows[1], 'progress_ramp')).toBe('flat');
    expect(at(rows[1], 'progress_ramp_reason')).toBe('no spikes in the windows inside the range of "progress"');
    const run = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    const text = JSON.stringify(run);
    expect(text).toContain('behaviour.csv');
    expect(text).toMatch(/"progress":\{"variable":"progress","windows":12/);
  });

  it('an unknown variable is an input error naming the parameter (exit 2, no output)', async () => {
    const io = captureIo();
    const out = join(dir, 'out-bad');
    expect(await runCli(['run', session, '--out', out, '--config', join(dir, 'bad.json')], io)).toBe(2);
    expect(io.err.join('')).toMatch(/column "ramp\.progressVariable": is not a column of the behavioural samples \(they hold: progress, position_cm\)/);
    expect(() => readFileSync(join(out, 'units.csv'))).toThrow();
  });
});
