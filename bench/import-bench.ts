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
 *   npx tsx bench/import-bench.ts [--reps 3] [--only csv|npy] [--units 1000] [--seed 7] [--compare DIR] [--env NAME=VALUE]
 *
 * --compare DIR runs another checkout's import (its bench/import-child.ts) in turn with this
 * one's, rep by rep, so before/after figures share the machine's load. --env NAME=VALUE
 * (repeatable) sets a variable for the import processes (e.g. GLIBC_TUNABLES=glibc.malloc.hugetlb=1:
 * large allocations on transparent huge pages).
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
const mib = (pages: number) => ((pages * 4096) / 1048576).toFixed(0);
const sec = (ms: number) => (ms / 1000).toFixed(2);
// --compare DIR: another checkout of the project (e.g. `git worktree add /tmp/old <commit>` with
// node_modules linked): its own bench/import-child.ts runs in turn with ours, so both see the
// same machine load; fields an older child does not print show as "?"
const compare = opt('--compare', '');
// --env NAME=VALUE (repeatable): set for the import processes, e.g. GLIBC_TUNABLES=glibc.malloc.hugetlb=1
const childEnv: Record<string, string | undefined> = { ...process.env };
args.forEach((a, i) => {
  if (a === '--env' && args[i + 1]?.includes('=')) {
    const [k, ...v] = args[i + 1].split('=');
    childEnv[k] = v.join('=');
  }
});
const sides: [string, string][] = [['', ROOT], ...(compare ? ([['compare', resolve(compare)]] as [string, string][]) : [])];
for (const form of ['csv', 'npy'] as const) {
  if (only && only !== form) continue;
  const runs = new Map<string, Run[]>(sides.map(([label]) => [label, []]));
  for (let k = 0; k < reps; k++) {
    for (const [label, dir] of sides) {
      const r = spawnSync(process.execPath, ['--import', 'tsx', join(dir, 'bench/import-child.ts'), form === 'csv' ? s.csvDir : s.npyDir], { cwd: dir, encoding: 'utf8', env: childEnv });
      if (r.status !== 0) {
        console.log(`${form}${label ? ` (${label})` : ''}: import FAILED (exit ${r.status})\n${r.stderr}`);
        continue;
      }
      runs.get(label)!.push(JSON.parse(r.stdout.trim().split('\n').pop()!) as Run);
    }
  }
  for (const [label, rs] of runs) {
    if (rs.length === 0) continue;
    const cpu = rs.map((r) => r.cpuMs);
    const wall = rs.map((r) => r.wallMs);
    const rate = s.spikes / median(cpu) / 1000;
    const target = form === 'csv' ? `; target >= 5 M rows/s: ${rate >= 5 ? 'ok' : 'MISSED'}` : '';
    const med = (k: keyof Run, f: (x: number) => string) => (rs.every((r) => typeof r[k] === 'number') ? f(median(rs.map((r) => r[k] as number))) : '?');
    console.log(
      `import ${form.toUpperCase()}${label ? ` [${label}: ${compare}]` : ''}: wall ${sec(median(wall))} s (best ${sec(Math.min(...wall))}), ` +
        `CPU ${sec(median(cpu))} s (best ${sec(Math.min(...cpu))}; user ${med('userMs', sec)} + sys ${med('sysMs', sec)}) = ${rate.toFixed(2)} M spikes per CPU-s${target}; ` +
        `peak RSS ${(median(rs.map((r) => r.maxRssBytes)) / 1048576).toFixed(0)} MiB, ` +
        `${med('minorFaults', mib)} MiB of fresh pages touched (${med('importFaults', mib)} MiB by the import itself); ${rs[0].units} units, ${rs[0].spikes.toLocaleString('en')} spikes`,
    );
  }
}
console.log('medians of fresh processes; CPU time is the figure to compare on a busy machine (uptime load above ~2 inflates wall time).');
