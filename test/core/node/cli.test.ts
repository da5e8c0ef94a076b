/**
 * The command line as users meet it: spawns `node bin/tagbench.mjs` (the
 * entry behind `npm run tagbench`) on small sessions written here by hand.
 * Every validation error must give exit code 2, one paragraph on stderr
 * naming file/row/column (no stack trace), and leave no output behind.
 */
import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const ROOT = resolve(__dirname, '../../..');
const CLI = join(ROOT, 'bin/tagbench.mjs');
const DEMO = join(ROOT, 'sample-data/demo');
const work = mkdtempSync(join(tmpdir(), 'tagbench-cli-'));

interface Result { code: number; stdout: string; stderr: string }
function cli(args: string[]): Promise<Result> {
  return new Promise((res) => {
    const p = spawn(process.execPath, [CLI, ...args], { cwd: work });
    let stdout = '';
    let stderr = '';
    p.stdout.on('data', (d) => (stdout += d));
    p.stderr.on('data', (d) => (stderr += d));
    p.on('close', (code) => res({ code: code ?? -1, stdout, stderr }));
  });
}
async function pool<T>(jobs: (() => Promise<T>)[], width = 4): Promise<T[]> {
  const out: T[] = new Array(jobs.length);
  let next = 0;
  await Promise.all(Array.from({ length: width }, async () => {
    while (next < jobs.length) {
      const k = next++;
      out[k] = await jobs[k]();
    }
  }));
  return out;
}
function session(name: string, files: Record<string, string>): string {
  const dir = join(work, name);
  mkdirSync(dir, { recursive: true });
  for (const [f, text] of Object.entries(files)) writeFileSync(join(dir, f), text);
  return dir;
}

const GOOD = {
  'spikes.csv': 'unit,time\n1,0.5\n2,1.0\n1,0.2\n2,3.5\n3,7.25\n',
  'pulses.csv': 'onset,duration\n1.0,0.005\n1.1,0.005\n1.2,0.005\n5,0.005\n',
  'events.csv': 'time,event,trial,kind\n2,reward,1,\n4,jump,2,forward\n6,reward,2,\n',
  'trials.csv': 'trial,start,stop,condition,speed\n1,0,3,standard,1.5\n2,3,7,probe,2\n',
};

/** [name, files, extra args, expected stderr]. */
const BAD: [string, Record<string, string>, string[], RegExp][] = [
  ['missing column', { 'spikes.csv': 'unit,t\n1,0.5\n' }, [], /^spikes\.csv, row 1, column "time": required column "time" is missing; the header has: unit, t\./],
  ['non-numeric value', { 'spikes.csv': 'unit,time\n1,0.5\n1,0.6s\n' }, [], /^spikes\.csv, row 3, column "time": the value is not a number \(value "0\.6s"\)/],
  ['NaN', { 'spikes.csv': 'unit,time\n1,0.5\n1,NaN\n' }, [], /^spikes\.csv, row 3, column "time": time is not a finite number \(value "NaN"\)/],
  ['Inf', { 'spikes.csv': 'unit,time\n1,inf\n' }, [], /^spikes\.csv, row 2, column "time": time is not a finite number \(value "Infinity"\)/],
  ['negative time', { ...GOOD, 'events.csv': 'time,event\n2,reward\n-1,reward\n' }, [], /^events\.csv, row 3, column "time": time is negative/],
  ['empty file', { ...GOOD, 'trials.csv': '' }, [], /^trials\.csv: the file is empty/],
  ['unit unknown to unit info', { ...GOOD, 'unit_info.csv': 'unit,channel\n1,5\n2,6\n' }, [], /^spikes\.csv, row 6, column "unit": unit "3" has spikes but is not listed in unit_info\.csv/],
  ['ms labelled as seconds', { ...GOOD, 'spikes.csv': 'unit,time\n1,500\n1,7250\n' }, [], /^spikes\.csv, row 3, column "time": times run to 7250 s, but pulses\.csv by 5\.005 s, events\.csv by 6 s, trials\.csv by 7 s; this looks like milliseconds labelled as seconds/],
  ['pulse outside the recording', { ...GOOD, 'session.json': '{"parameters": {"span": {"stopS": 4}}}', 'spikes.csv': 'unit,time\n1,1\n', 'events.csv': 'time,event\n1,reward\n', 'trials.csv': 'trial,start,stop\n1,0,2\n' }, [], /^pulses\.csv, row 5, column "onset": this laser pulse lies outside the recording \[0, 4\] s/],
  ['beyond the span', { ...GOOD, 'session.json': '{"parameters": {"span": {"stopS": 6}}}' }, [], /^spikes\.csv, row 6, column "time": time 7\.25 s lies beyond the recording span \[0, 6\] s set by session\.json \(tolerance 1 s\)/],
  ['unknown parameter in --config', GOOD, ['--config', 'CONFIG'], /^analysis\.json, column "light\.windowEnd": unknown parameter/],
  ['event trial unknown to trials', { ...GOOD, 'events.csv': 'time,event,trial\n2,reward,9\n' }, [], /^events\.csv, row 2, column "trial": trial 9 is not in trials\.csv/],
  ['behaviour: repeated sample time', { ...GOOD, 'behaviour.csv': 'time,progress\n0,0\n1,0.5\n1,0.6\n' }, [], /^behaviour\.csv, row 4, column "time": two samples share this time \(also row 3\)/],
  ['no session', {}, [], /^.*nowhere: no such file or folder/],
  ['unknown option', GOOD, ['--outt', 'x'], /^tagbench run: unknown option \(value "--outt"\)/],
  ['threads not a whole number', GOOD, ['--threads', '0'], /^tagbench run, column "--threads": is not a whole number >= 1 \(value "0"\)/],
];

let results: Result[] = [];
let okRun: Result;
let okRun2: Result;
let inspect: Result;
let help: Result[];
let refuse: Result;
let inside: Result;

beforeAll(async () => {
  writeFileSync(join(work, 'analysis.json'), '{"light": {"windowEnd": 8}}');
  const good = session('good', GOOD);
  mkdirSync(join(work, 'precious'));
  writeFileSync(join(work, 'precious', 'notes.txt'), 'keep me');
  const jobs = BAD.map(([name, files, extra], i) => () => {
    const dir = name === 'no session' ? join(work, 'nowhere') : session(`bad${i}`, files);
    return cli(['run', dir, '--out', join(work, `out-bad${i}`), ...extra.map((a) => (a === 'CONFIG' ? join(work, 'analysis.json') : a))]);
  });
  jobs.push(() => cli(['inspect', good]));
  jobs.push(() => cli(['run', good, '--out', join(work, 'precious')]));
  jobs.push(() => cli(['run', good, '--out', join(good, 'out')]));
  jobs.push(() => cli(['--help']), () => cli(['--version']), () => cli(['run', '--help']), () => cli(['inspect', '--help']), () => cli([]));
  const all = await pool(jobs);
  results = all.slice(0, BAD.length);
  [inspect, refuse, inside] = all.slice(BAD.length, BAD.length + 3);
  help = all.slice(BAD.length + 3);
  okRun = await cli(['run', good, '--out', join(work, 'out-good')]);
  okRun2 = await cli(['run', good, '--out', join(work, 'out-good')]); // replaces the earlier output
}, 600_000);

afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('tagbench CLI: bad input', () => {
  it.each(BAD.map((b, i) => [b[0], i] as const))('%s: exit 2, one paragraph, no stack, no output', (_name, i) => {
    const r = results[i];
    expect(r.stderr).toMatch(BAD[i][3]);
    expect(r.code).toBe(2);
    expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
    expect(r.stderr.trim().split('\n')).toHaveLength(1); // one paragraph
    expect(r.stdout).toBe('');
    expect(existsSync(join(work, `out-bad${i}`))).toBe(false);
  });

  it('leaves no temporary folders behind', () => {
    expect(readdirSync(work).filter((f) => f.includes('.partial-') || f.includes('.previous-'))).toEqual([]);
  });

  it('refuses to replace a folder that is not a tagbench output, and leaves it untouched', () => {
    expect(refuse.code).toBe(2);
    expect(refuse.stderr).toMatch(/precious: exists and is not an earlier tagbench output/);
    expect(readdirSync(join(work, 'precious'))).toEqual(['notes.txt']);
  });

  it('never writes into the input folder', () => {
    expect(inside.code).toBe(2);
    expect(inside.stderr).toMatch(/the output folder lies inside the input session folder/);
    expect(readdirSync(join(work, 'good')).sort()).toEqual(Object.keys(GOOD).sort());
  });
});

describe('tagbench CLI: run', () => {
  it('writes units.csv and run.json', () => {
    expect(okRun.stderr).toBe('');
    expect(okRun.code).toBe(0);
    expect(okRun.stdout).toMatch(/3 units -> .*out-good\/units\.csv, run\.json \(1 warning: see run\.json\)/);
    // span [0, 7.25] s from the inputs: rate = n / 7.25
    // (later analyses add columns after these; the first three are this contract)
    const lines = readFileSync(join(work, 'out-good', 'units.csv'), 'utf8').trimEnd().split('\n');
    expect(lines.map((l) => l.split(',').slice(0, 3).join(','))).toEqual(['unit,n_spikes,rate_hz', '1,2,0.27586', '2,2,0.27586', '3,1,0.13793']);
  });

  it('run.json records version, parameters, input hashes (reference: node:crypto) and warnings', () => {
    const j = JSON.parse(readFileSync(join(work, 'out-good', 'run.json'), 'utf8'));
    const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8'));
    expect(j.tool).toBe('tagbench');
    expect(j.version).toBe(pkg.version);
    expect(Number.isNaN(Date.parse(j.startedAt))).toBe(false);
    expect(j.parameters.light.windowEndMs).toBe(10);
    for (const f of Object.keys(GOOD)) {
      const rec = j.inputs.find((x: { file: string }) => x.file === f);
      expect(rec.sha256).toBe(createHash('sha256').update(GOOD[f as keyof typeof GOOD]).digest('hex'));
      expect(rec.bytes).toBe(Buffer.byteLength(GOOD[f as keyof typeof GOOD]));
    }
    expect(j.warnings).toEqual([expect.objectContaining({ code: 'unsorted-spikes', count: 1, file: 'spikes.csv' })]);
    expect(j.recording).toEqual({ units: 3, spikes: 5, spanS: [0, 7.25], spanSource: 'inputs', pulses: 4, events: 3, trials: 2 });
  });

  it('a second run replaces the earlier output', () => {
    expect(okRun2.code).toBe(0);
    expect(readdirSync(join(work, 'out-good')).sort()).toEqual(['run.json', 'units.csv']);
  });
});

describe('tagbench CLI: inspect and help', () => {
  it('inspect prints a readable summary', () => {
    expect(inspect.code).toBe(0);
    expect(inspect.stdout).toBe(
      [
        'Session: good (folder)',
        'Inputs: spikes.csv (41 B), pulses.csv (53 B), trials.csv (66 B), events.csv (63 B)',
        'Span: 0 to 7.25 s (7.25 s; latest time in the inputs)',
        'Units: 3; spikes: 5',
        '  spikes per unit: min 1, median 2, max 2; median rate 0.27586 Hz',
        'Laser pulses: 4, 1 to 5 s; duration 5 ms',
        '  single pulses: 1',
        '  trains at 10 Hz: 1 (3 pulses)',
        'Events: 3',
        '  jump: 1 (kind forward 1)',
        '  reward: 2',
        'Trials: 2',
        '  probe: 1',
        '  standard: 1',
        '  covariates: speed',
        'Warnings: 1',
        "  [unsorted-spikes] 1 spike(s) came before an earlier row's spike of the same unit; spikes were sorted by time",
        '',
      ].join('\n'),
    );
  });

  it('--help, --version, per-command help', () => {
    const [h, v, rh, ih, none] = help;
    expect(h.code).toBe(0);
    expect(h.stdout).toMatch(/Commands:\n  run\s+Analyse a session and write units\.csv and run\.json\n  inspect\s+Summarise a session/);
    expect(v.stdout.trim()).toBe(JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')).version);
    expect(rh.stdout).toMatch(/^Usage: tagbench run <session-dir\|file\.nwb> --out <out-dir> \[--config analysis\.json\]/);
    expect(ih.stdout).toMatch(/^Usage: tagbench inspect <session-dir\|file\.nwb>/);
    expect(none.code).toBe(2); // no command: usage on stdout, non-zero
  });

  it('ends quietly when the reader of its output stops early (| head): exit 0, nothing on stderr', async () => {
    // a PSTH of every unit on every reward is ~1 MB of CSV; the reader takes one line and closes the pipe
    const r = await new Promise<Result>((res) => {
      const p = spawn('bash', ['-o', 'pipefail', '-c', `"${process.execPath}" "${CLI}" psth "${DEMO}" --unit all --event reward | head -n 1`], { cwd: work });
      let stdout = '';
      let stderr = '';
      p.stdout.on('data', (d) => (stdout += d));
      p.stderr.on('data', (d) => (stderr += d));
      p.on('close', (code) => res({ code: code ?? -1, stdout, stderr }));
    });
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^unit,/);
  }, 60_000);
});
