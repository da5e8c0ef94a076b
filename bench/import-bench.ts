/**
 * Import benchmark (issue 9): imports the reference session of DESIGN.md
 * section 7 (bench/bench-session.ts: 1,000 units, ~20 M spikes) in its CSV
 * and its NPY form, each in a fresh process as the CLI would (JIT cold, file
 * cache warm), `--reps` times (default 3), and prints per form the median and
 * best wall time, CPU time (user + system, and each: system time is the
 * kernel's, mostly page faults of fresh memory and file reads), spikes per CPU-second, the peak
 * RSS and the fresh memory touched (minor page faults x 4 KiB: on a virtual
 * machine where first touches are slow, this is much of the time), against the targets (CSV >= 5 M rows per s). Never asserts.
 *
 *   npx tsx bench/import-bench.ts [--reps 3] [--only csv|npy] [--units 1000] [--seed 7]
 */
import { spawnSync } from 'node:child_process';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureBenchSession } from './bench-session';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const args = process.argv.slice(2);
const opt = (name: string, dflt: string) => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : dflt;
};
const reps = Number(opt('--reps', '3'));
const only = opt('--only', '');
const s = ensureBenchSession(Number(opt('--seed', '7')), Number(opt('--units', '1000')), (m) => console.log(m));
console.log(`import benchmark: ${s.units} units, ${s.spikes.toLocaleString('en')} spikes; ${reps} fresh process(es) per form`);

interface Run {
  wallMs: number;
  cpuMs: number;
  userMs: number;
  sysMs: number;
  maxRssBytes: number;
  minorFaults: number;
  importFaults: number;
  units: number;
  spikes: number;
}
const median = (x: number[]) => [...x].sort((a, b) => a - b)[Math.floor((x.length - 1) / 2)];
for (const form of ['csv', 'npy'] as const) {
  if (only && only !== form) continue;
  const runs: Run[] = [];
  for (let k = 0; k < reps; k++) {
    const r = spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'bench/import-child.ts'), form === 'csv' ? s.csvDir : s.npyDir], { cwd: ROOT, encoding: 'utf8' });
    if (r.status !== 0) {
      console.log(`${form}: import FAILED (exit ${r.status})\n${r.stderr}`);
      break;
    }
    runs.push(JSON.parse(r.stdout.trim().split('\n').pop()!) as Run);
  }
  if (runs.length === 0) continue;
  const cpu = runs.map((r) => r.cpuMs);
  const wall = runs.map((r) => r.wallMs);
  const rate = s.spikes / median(cpu) / 1000;
  const target = form === 'csv' ? `; target >= 5 M rows/s: ${rate >= 5 ? 'ok' : 'MISSED'}` : '';
  console.log(
    `import ${form.toUpperCase()}: wall ${(median(wall) / 1000).toFixed(2)} s (best ${(Math.min(...wall) / 1000).toFixed(2)}), ` +
      `CPU ${(median(cpu) / 1000).toFixed(2)} s (best ${(Math.min(...cpu) / 1000).toFixed(2)}; user ${(median(runs.map((r) => r.userMs)) / 1000).toFixed(2)} + sys ${(median(runs.map((r) => r.sysMs)) / 1000).toFixed(2)}) = ${rate.toFixed(2)} M spikes per CPU-s${target}; ` +
      `peak RSS ${(median(runs.map((r) => r.maxRssBytes)) / 1048576).toFixed(0)} MiB, ` +
      `${((median(runs.map((r) => r.minorFaults)) * 4096) / 1048576).toFixed(0)} MiB of fresh pages touched (${((median(runs.map((r) => r.importFaults)) * 4096) / 1048576).toFixed(0)} MiB by the import itself); ${runs[0].units} units, ${runs[0].spikes.toLocaleString('en')} spikes`,
  );
}
console.log('medians of fresh processes; CPU time is the figure to compare on a busy machine (uptime load above ~2 inflates wall time).');
