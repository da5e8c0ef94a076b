/**
 * npm run bench [-- --units 1000 --seed 7 --profile --skip-csv --core-only --all]
 *
 * Benchmarks the engine on the reference session of DESIGN.md section 7
 * (1,000 units, ~2 h, ~20 M spikes, 10,000 pulses, 600 trials), simulated once
 * by the project's simulator and cached outside the repository (see
 * bench/bench-session.ts; TAGBENCH_CACHE moves the cache). Prints:
 *   - one plain pass over all spike times (the floor any analysis pays);
 *   - import of the CSV form and of the NPY form (s, M rows/s);
 *   - every step of the run pipeline (core/pipeline/steps.ts), timed alone, then
 *     all of them as `run` does them (analyseRecordingThreads: two threads
 *     on a session this large when two CPUs are available);
 *   - PSTHs of every unit on every reward (10 ms bins, [-3, 1) s);
 *   - the full `run` on the NPY form in a fresh process (wall time, peak RSS: the
 *     child's own, read from /proc/self/status, since getrusage's maxRSS of a
 *     forked child includes this parent's memory; see bench/peak-rss.ts),
 *     against the targets: <= 3 s, CSV >= 5 M rows/s, peak < 3x the input;
 *   - the same run as a user types it (node bin/tagbench.mjs run ...), wall
 *     time from start to exit, module loading and writing included;
 * --profile also writes a V8 CPU profile of the full run (node --cpu-prof)
 * and prints its top functions by self time. Then, unless --core-only, it
 * runs the areas' own benchmarks in child processes and passes their output
 * through: bench/csv-import.ts, light-bench.ts, align-bench.ts,
 * classify-bench.ts; with --all also nwb-session.ts (needs python3 with
 * h5py to write a large NWB file once) and renderer-bench.ts (needs
 * Chromium). Never asserts; prints figures.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { availableParallelism, cpus, tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { binCounts } from '../core/align/bin-counts';
import { analyseRecordingThreads } from '../core/node/analyse-recording-threads';
import { loadSession } from '../core/node/load-session';
import { readNpy } from '../core/io/read-npy';
import { STEPS } from '../core/pipeline/steps';
import { resolveParameters } from '../core/resolve-parameters';
import type { Column } from '../core/table/types';
import type { Recording } from '../core/model/types';
import { ensureBenchSession } from './bench-session';
import { printTopFunctions, type CpuProfile } from './print-top-functions';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const args = process.argv.slice(2);
const opt = (name: string, dflt: number) => {
  const i = args.indexOf(name);
  return i >= 0 ? Number(args[i + 1]) : dflt;
};
const flag = (name: string) => args.includes(name);

const TARGET_RUN_S = 3;
const TARGET_CSV_ROWS_PER_S = 5e6;
const TARGET_MEMORY_FACTOR = 3;

const line = (label: string, value: string, note = '') => console.log(`${label.padEnd(34)} ${value.padStart(20)}  ${note}`);
/** Wall time and CPU time (user + system, this process) since a mark: CPU time is what
 *  matters on a shared, loaded machine, where wall time also counts waiting for a core. */
const mark = () => ({ wall: performance.now(), cpu: process.cpuUsage() });
const since = (m: ReturnType<typeof mark>) => {
  const c = process.cpuUsage(m.cpu);
  return { wallMs: performance.now() - m.wall, cpuMs: (c.user + c.system) / 1000 };
};
const both = (t: { wallMs: number; cpuMs: number }) => `${(t.wallMs / 1000).toFixed(2)} / ${(t.cpuMs / 1000).toFixed(2)} s`;
const mib = (b: number) => `${(b / 1048576).toFixed(0)} MiB`;

function recordingBytes(r: Recording): number {
  let b = 0;
  for (const u of r.units) b += u.spikeTimes.byteLength + (u.waveformMean?.byteLength ?? 0);
  b += r.pulses.onset.byteLength * 5 + r.events.time.byteLength * 3 + r.trials.trial.byteLength * 4;
  return b;
}

async function main(): Promise<void> {
  const units = opt('--units', 1000);
  const seed = opt('--seed', 7);
  console.log(`tagbench benchmark: ${cpus().length} CPUs (${availableParallelism()} usable), Node ${process.version}`);
  const s = ensureBenchSession(seed, units, (m) => console.log(m));
  console.log(`session: ${s.units} units, ${s.spikes.toLocaleString('en')} spikes, ${s.pulses} pulses, ${s.trials} trials, ${(s.spanS / 3600).toFixed(2)} h ${s.cached ? '(cached)' : `(generated in ${s.generatedS.toFixed(0)} s)`}`);
  console.log(`        ${s.dir}`);
  console.log('');

  // Plain pass: the floor. The spike times as one Float64Array, summed once.
  const times = readNpy(new Uint8Array(readFileSync(join(s.npyDir, 'spikes.npy'))), 'spikes.npy').data as Float64Array;
  console.log(`${''.padEnd(34)} ${'wall / CPU'.padStart(20)}`);
  let m0 = mark();
  let acc = 0;
  for (let i = 0; i < times.length; i++) acc += times[i];
  const plain = since(m0);
  line('plain pass over all spike times', both(plain), `(${(times.length / plain.cpuMs / 1000).toFixed(0)} M spikes per CPU-s; checksum ${acc.toExponential(3)})`);

  // Imports.
  let csvMs = NaN;
  if (!flag('--skip-csv')) {
    m0 = mark();
    const c = await loadSession(s.csvDir);
    const t = since(m0);
    csvMs = t.cpuMs;
    const rate = s.spikes / t.cpuMs / 1000;
    line('import CSV form', both(t), `${rate.toFixed(2)} M rows per CPU-s (target >= ${TARGET_CSV_ROWS_PER_S / 1e6}): ${rate >= TARGET_CSV_ROWS_PER_S / 1e6 ? 'ok' : 'MISSED'}; ${c.recording.units.length} units`);
  }
  m0 = mark();
  const imported = await loadSession(s.npyDir, { sharedMemory: true });
  const npy = since(m0);
  line('import NPY form', both(npy), `${(s.spikes / npy.cpuMs / 1000).toFixed(2)} M rows per CPU-s`);
  const rec = imported.recording;
  const inputBytes = recordingBytes(rec);
  line('in-memory input (recording)', mib(inputBytes));

  // Steps, each timed alone, in pipeline order (later steps see earlier columns).
  const parameters = resolveParameters(imported.parameterSources);
  const columns = new Map<string, Column>();
  let stepsWall = 0;
  let stepsCpu = 0;
  for (const step of STEPS) {
    m0 = mark();
    const res = step.run({ recording: rec, parameters, columns });
    const t = since(m0);
    stepsWall += t.wallMs;
    stepsCpu += t.cpuMs;
    for (const c of res.columns) columns.set(c.name, c);
    line(`step ${step.name}`, both(t), `${res.columns.length} columns; ${(t.cpuMs / plain.cpuMs).toFixed(0)}x a plain pass`);
  }
  line('all steps', both({ wallMs: stepsWall, cpuMs: stepsCpu }));
  m0 = mark();
  let plan = '';
  await analyseRecordingThreads(rec, parameters, { onPlan: (p) => (plan = p.reason) });
  line('all steps as run does them', both(since(m0)), plan);

  // PSTHs: every unit on every reward, [-3, 1) s in 10 ms bins.
  const rewards = Float64Array.from(rec.events.time.filter((_, i) => rec.events.label[i] === 'reward'));
  m0 = mark();
  let bins = 0;
  for (const u of rec.units) bins += binCounts(u.spikeTimes, rewards, -3, 0.01, 400).length;
  line('PSTHs (all units x rewards)', both(since(m0)), `${rec.units.length} units x ${rewards.length} events x 400 bins (${bins.toLocaleString('en')} cells)`);

  // Full run in a fresh process: wall time inside the process and peak RSS.
  const out = mkdtempSync(join(tmpdir(), 'tagbench-bench-out-'));
  const profDir = flag('--profile') ? mkdtempSync(join(tmpdir(), 'tagbench-prof-')) : null;
  try {
    const nodeArgs = ['--import', 'tsx', ...(profDir ? ['--cpu-prof', '--cpu-prof-dir', profDir] : []), join(ROOT, 'bench/run-child.ts'), s.npyDir, join(out, 'run')];
    const r = spawnSync(process.execPath, nodeArgs, { cwd: ROOT, encoding: 'utf8', maxBuffer: 1 << 26 });
    if (r.status !== 0) {
      console.log(`full run FAILED (exit ${r.status}):\n${r.stderr}`);
    } else {
      const m = JSON.parse(r.stdout.trim().split('\n').pop()!) as { runMs: number; cpuMs: number; maxRssBytes: number; heapUsedBytes: number };
      line('full run, NPY form (fresh process)', both({ wallMs: m.runMs, cpuMs: m.cpuMs }), `target <= ${TARGET_RUN_S} s: ${m.runMs / 1000 <= TARGET_RUN_S ? 'ok' : m.cpuMs / 1000 <= TARGET_RUN_S ? 'ok in CPU time (machine busy)' : 'MISSED'}`);
      line('peak memory of the run (max RSS)', mib(m.maxRssBytes), `${(m.maxRssBytes / inputBytes).toFixed(2)}x the input (target < ${TARGET_MEMORY_FACTOR}x): ${m.maxRssBytes < TARGET_MEMORY_FACTOR * inputBytes ? 'ok' : 'MISSED'}`);
    }
    // The same run as a user types it: the launcher, module loading and writing included. Its
    // cached bundle is brought up to date first (`--help`), as any earlier command would have.
    spawnSync(process.execPath, [join(ROOT, 'bin/tagbench.mjs'), '--help'], { cwd: ROOT, encoding: 'utf8' });
    const t0 = performance.now();
    const cli = spawnSync(process.execPath, [join(ROOT, 'bin/tagbench.mjs'), 'run', s.npyDir, '--out', join(out, 'cli')], { cwd: ROOT, encoding: 'utf8' });
    const cliMs = performance.now() - t0;
    if (cli.status !== 0) console.log(`tagbench run FAILED (exit ${cli.status}):\n${cli.stderr}`);
    else line('`tagbench run` on it, start to exit', `${(cliMs / 1000).toFixed(2)} s wall`, 'node bin/tagbench.mjs run ... (what npm run tagbench starts)');
    if (profDir) {
      const f = readdirSync(profDir).find((x) => x.endsWith('.cpuprofile'));
      if (f) {
        console.log(`\nCPU profile: ${join(profDir, f)} (open in Chrome DevTools > Performance)`);
        printTopFunctions(JSON.parse(readFileSync(join(profDir, f), 'utf8')) as CpuProfile);
      }
    }
  } finally {
    rmSync(out, { recursive: true, force: true });
  }
  void csvMs;
  console.log('\nwall / CPU: elapsed time, and CPU time used by this process (user + system); on a busy');
  console.log('machine wall time includes waiting for a core, so compare CPU times with the targets.');

  if (!flag('--core-only')) {
    const areas = ['csv-import.ts', 'light-bench.ts', 'align-bench.ts', 'classify-bench.ts', ...(flag('--all') ? ['nwb-session.ts', 'renderer-bench.ts'] : [])];
    for (const a of areas) {
      const file = join(ROOT, 'bench', a);
      console.log(`\n=== bench/${a} ${'='.repeat(Math.max(0, 60 - a.length))}`);
      if (!existsSync(file)) {
        console.log('(not present in this checkout)');
        continue;
      }
      const r = spawnSync(process.execPath, ['--import', 'tsx', file], { cwd: ROOT, stdio: 'inherit' });
      if (r.status !== 0) console.log(`bench/${a} exited with code ${r.status} (its figures above are incomplete)`);
    }
  }
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
