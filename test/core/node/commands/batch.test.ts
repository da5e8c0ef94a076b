/**
 * tagbench batch end to end: two small simulated sessions (one CSV, one NPY
 * form) and one bad session. The first run uses real worker threads through
 * the CLI (as users run it); later runs call the command in process with
 * --workers 0 (same job code, no threads) to check resume and --force.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { batchCommand } from '../../../../core/node/commands/batch';
import { writeOutputFolder } from '../../../../core/node/write-output-folder';
import { defaultScenario } from '../../../../core/sim/default-scenario';
import { sessionFiles } from '../../../../core/sim/session-files';
import { simulateSession } from '../../../../core/sim/simulate-session';
import { unitSpec } from '../../../../core/sim/unit-spec';
import { parseCsvRecords } from '../../../../core/table/parse-csv-records';

const ROOT = resolve(__dirname, '../../../..');
let dir = '';
let out = '';

function makeSession(path: string, seed: number, form: 'csv' | 'npy', units: number): void {
  const base = defaultScenario();
  const spec = defaultScenario({
    seed,
    preTaskS: 10,
    task: { ...base.task!, trials: 16 },
    light: { ...base.light!, leadS: 2, singles: { count: 40, intervalS: [0.8, 1.2] }, trains: [{ frequencyHz: 10, trains: 2, pulsesPerTrain: 10 }] },
    units: Array.from({ length: units }, (_, i) =>
      unitSpec({ id: String(i + 1), rateHz: 3 + i, ...(i === 0 ? { light: { kind: 'direct', latencyMs: 3, jitterMs: 0.5, reliability: 0.9, followHalfHz: 30, decayPerPulse: 0.8, latencyGrowthMs: 1, extraSpikes: 0 } } : {}) }),
    ),
  });
  const files = sessionFiles(simulateSession(spec), { spikes: form });
  writeOutputFolder(path, Object.fromEntries(files.map((f) => [f.name, f.data])), { replace: 'any' });
}

async function batch(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const code = await batchCommand.run(args, { stdout: (s) => (stdout += s), stderr: (s) => (stderr += s), isTty: false });
  return { code, stdout, stderr };
}

const combinedRows = () => parseCsvRecords(readFileSync(join(out, 'units.csv'), 'utf8'));

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'tagbench-batch-'));
  makeSession(join(dir, 'alpha'), 1, 'csv', 3);
  makeSession(join(dir, 'beta'), 2, 'npy', 4);
  mkdirSync(join(dir, 'broken'));
  writeFileSync(join(dir, 'broken', 'spikes.csv'), 'unit,time\n1,0.5\n1,abc\n');
  writeFileSync(join(dir, 'list.txt'), '# sessions of the test\nalpha\nbeta   # NPY form\n\nbroken\n');
  out = join(dir, 'out');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('tagbench batch', () => {
  it('--combine-only collects outputs written by plain run commands (one job per session) without analysing', async () => {
    const o = join(dir, 'cluster-out');
    const { runCommand } = await import('../../../../core/node/commands/run');
    mkdirSync(join(o, 'sessions'), { recursive: true });
    const quiet = { stdout: () => {}, stderr: () => {}, isTty: false };
    expect(await runCommand.run([join(dir, 'alpha'), '--out', join(o, 'sessions', 'alpha')], quiet)).toBe(0);
    const r = await batch([join(dir, 'alpha'), join(dir, 'beta'), '--out', o, '--combine-only']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/beta .*no tagbench output/);
    expect(r.stdout).toMatch(/1 collected, 0 unchanged \(skipped\), 1 failed/);
    expect(parseCsvRecords(readFileSync(join(o, 'units.csv'), 'utf8')).slice(1).map((x) => x[0])).toEqual(['alpha', 'alpha', 'alpha']);
    expect(existsSync(join(o, 'sessions', 'beta'))).toBe(false);
  }, 120_000);

  it('runs sessions on worker threads, combines the good ones and fails with exit 2 naming the bad one', () => {
    const r = spawnSync(process.execPath, [join(ROOT, 'bin/tagbench.mjs'), 'batch', '--list', join(dir, 'list.txt'), '--out', out, '--workers', '2'], {
      cwd: ROOT,
      encoding: 'utf8',
    });
    expect(r.status, r.stderr).toBe(2);
    expect(r.stderr).toMatch(/1 of 3 sessions failed/);
    expect(r.stderr).toMatch(/broken .*spikes\.csv, row 3, column "time"/);
    expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
    expect(r.stdout).toMatch(/2 analysed, 0 unchanged \(skipped\), 1 failed/);
    const rows = combinedRows();
    expect(rows[0].slice(0, 4)).toEqual(['session', 'unit', 'n_spikes', 'rate_hz']);
    expect(rows.length - 1).toBe(3 + 4);
    expect(rows.slice(1).map((x) => `${x[0]}:${x[1]}`)).toEqual(['alpha:1', 'alpha:2', 'alpha:3', 'beta:1', 'beta:2', 'beta:3', 'beta:4']);
    // each session's own output, equal to its rows in the combined table
    for (const s of ['alpha', 'beta']) {
      const own = parseCsvRecords(readFileSync(join(out, 'sessions', s, 'units.csv'), 'utf8'));
      expect(own[0]).toEqual(rows[0].slice(1, 1 + own[0].length));
      expect(own.slice(1).map((x) => x.join('|'))).toEqual(rows.filter((x) => x[0] === s).map((x) => x.slice(1, 1 + own[0].length).join('|')));
      expect(existsSync(join(out, 'sessions', s, 'run.json'))).toBe(true);
    }
    expect(existsSync(join(out, 'sessions', 'broken'))).toBe(false);
    const html = readFileSync(join(out, 'summary.html'), 'utf8');
    expect(html).toMatch(/<th scope="row">broken<\/th><td>failed<\/td>/);
    expect(html).toMatch(/not a number/);
    const state = JSON.parse(readFileSync(join(out, 'batch.json'), 'utf8'));
    expect(Object.fromEntries(Object.entries(state.sessions).map(([k, v]) => [k, (v as { status: string }).status]))).toEqual({ alpha: 'ok', beta: 'ok', broken: 'failed' });
    // no temporary files left behind
    expect(spawnSync('find', [out, '-name', '.*'], { encoding: 'utf8' }).stdout.trim()).toBe('');
  }, 240_000);

  it('skips unchanged sessions on a re-run (JSON progress), and re-runs a changed one', async () => {
    const before = statSync(join(out, 'sessions', 'alpha', 'units.csv')).mtimeMs;
    const r = await batch([join(dir, 'alpha'), join(dir, 'beta'), '--out', out, '--workers', '0', '--json']);
    expect(r.code).toBe(0);
    const events = r.stdout.trim().split('\n').map((l) => JSON.parse(l));
    const finals = events.filter((e) => e.event === 'session' && e.status !== 'running');
    expect(finals.map((e) => [e.session, e.status])).toEqual([
      ['alpha', 'skipped'],
      ['beta', 'skipped'],
    ]);
    const done = events[events.length - 1];
    expect(done).toMatchObject({ event: 'done', ok: 0, skipped: 2, failed: 0, units: 7 });
    expect(statSync(join(out, 'sessions', 'alpha', 'units.csv')).mtimeMs).toBe(before);
    expect(combinedRows().length - 1).toBe(7);
    // the desktop app's autosaved curation (and its backup) in a session folder is not an input:
    // the session is still skipped
    writeFileSync(join(dir, 'beta', 'tagbench-session.json'), '{}');
    writeFileSync(join(dir, 'beta', 'tagbench-session.json.bak'), '{}');
    const rc = await batch([join(dir, 'beta'), '--out', out, '--workers', '0']);
    expect(rc.stdout).toMatch(/\[1\/1\] skipped beta/);
    // a new file in the folder is (it could be an input): the session runs again
    writeFileSync(join(dir, 'beta', 'notes.txt'), 'x');
    const rn = await batch([join(dir, 'beta'), '--out', out, '--workers', '0']);
    expect(rn.stdout).toMatch(/\[1\/1\] ok beta/);
    // change one input file: that session runs again, the other is still skipped
    const spikes = join(dir, 'alpha', 'spikes.csv');
    writeFileSync(spikes, readFileSync(spikes, 'utf8') + '2,10.5\n');
    const r2 = await batch([join(dir, 'alpha'), join(dir, 'beta'), '--out', out, '--workers', '0']);
    expect(r2.code).toBe(0);
    expect(r2.stdout).toMatch(/\[1\/2\] ok alpha/);
    expect(r2.stdout).toMatch(/\[2\/2\] skipped beta/);
  }, 120_000);

  it('--force runs everything again; a changed --config counts as changed parameters', async () => {
    const r = await batch([join(dir, 'alpha'), join(dir, 'beta'), '--out', out, '--workers', '0', '--force']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^tagbench batch: 2 sessions, no worker threads \(in process\)/);
    expect(r.stdout).toMatch(/2 analysed, 0 unchanged/);
    const cfg = join(dir, 'config.json');
    writeFileSync(cfg, JSON.stringify({ ramp: { binS: 0.2 } }));
    const r2 = await batch([join(dir, 'beta'), '--out', out, '--workers', '0', '--config', cfg]);
    expect(r2.code, r2.stderr).toBe(0);
    expect(r2.stdout).toMatch(/^tagbench batch: 1 session, no worker threads/);
    expect(r2.stdout).toMatch(/1 analysed, 0 unchanged/);
    const run = JSON.parse(readFileSync(join(out, 'sessions', 'beta', 'run.json'), 'utf8'));
    expect(run.parameters.ramp.binS).toBe(0.2);
    // the combined table now holds only the sessions of this batch
    expect(new Set(combinedRows().slice(1).map((x) => x[0]))).toEqual(new Set(['beta']));
  }, 120_000);

  it('refuses bad batch input with exit 2 and no output: no sessions, missing --out, foreign --out folder', async () => {
    await expect(batch(['--out', join(dir, 'o2')])).rejects.toThrow(/no sessions given/);
    await expect(batch([join(dir, 'alpha')])).rejects.toThrow(/--out folder is missing/);
    const foreign = join(dir, 'foreign');
    mkdirSync(foreign);
    writeFileSync(join(foreign, 'notes.txt'), 'mine');
    await expect(batch([join(dir, 'alpha'), '--out', foreign])).rejects.toThrow(/holds files that are not a tagbench batch output/);
    expect(readFileSync(join(foreign, 'notes.txt'), 'utf8')).toBe('mine');
    await expect(batch(['--list', join(dir, 'nope.txt'), '--out', join(dir, 'o3')])).rejects.toThrow(/--list file does not exist/);
    expect(existsSync(join(dir, 'o2'))).toBe(false);
  });
});
