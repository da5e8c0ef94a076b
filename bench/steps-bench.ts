/**
 * The ramp, jump, cluster and quality steps on the reference session of
 * `npm run bench` (bench/bench-session.ts, NPY form, cached), run in this
 * fresh process one after the other as `run` does (first call = cold, JIT
 * warm-up included: what one `run` pays). Prints wall and CPU time per step
 * and, with --digest <file>, writes a SHA-256 of every column's values (the
 * raw bytes of number columns, so NaN, -0 and the last bit count) and of each
 * step's summary and warnings: two digests from before and after a change
 * show whether the results stayed bit-identical (`diff a.json b.json`).
 *
 * Run: npx tsx bench/steps-bench.ts [ramp jump cluster quality] [--reps 3] [--digest out.json] [--profile dir]
 * --profile writes a V8 CPU profile of each step's first run alone (--profile-run 1: its second, warm)
 * (<dir>/<step>.cpuprofile, node:inspector; open in Chrome DevTools) and
 * prints its top functions by self time.
 * Never asserts; prints figures.
 */
import { createHash } from 'node:crypto';
import { mkdirSync, writeFileSync } from 'node:fs';
import { Session } from 'node:inspector/promises';
import { join } from 'node:path';
import { loadSession } from '../core/node/load-session';
import { STEPS } from '../core/pipeline/steps';
import { resolveParameters } from '../core/resolve-parameters';
import type { Column } from '../core/table/types';
import { ensureBenchSession } from './bench-session';
import { printTopFunctions, type CpuProfile } from './print-top-functions';

const args = process.argv.slice(2);
const valueOf = (name: string): string | undefined => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const digestFile = valueOf('--digest');
const profileDir = valueOf('--profile');
const reps = Number(valueOf('--reps') ?? 1);
const profileRun = Number(valueOf('--profile-run') ?? 0); // which run of each step to profile (0 = the first, cold)
const names = args.filter((a, i) => !a.startsWith('--') && !(i > 0 && args[i - 1].startsWith('--')));
const wanted = names.length > 0 ? names : ['ramp', 'jump', 'cluster', 'quality'];

const s = ensureBenchSession(7, 1000, (m) => console.log(m));
const imported = await loadSession(s.npyDir);
const recording = imported.recording;
const parameters = resolveParameters(imported.parameterSources);
console.log(`${recording.units.length} units, ${s.spikes.toLocaleString('en')} spikes, ${s.trials} trials; steps ${wanted.join(', ')}`);

const hashColumn = (c: Column): string => {
  const h = createHash('sha256');
  if (c.kind === 'number') {
    const v = c.values as Float64Array;
    h.update(new Uint8Array(v.buffer, v.byteOffset, v.byteLength));
  } else h.update(JSON.stringify(c.values));
  return h.digest('hex').slice(0, 16);
};
const digest: Record<string, Record<string, string>> = {};
let totalWall = 0;
let totalCpu = 0;
for (const name of wanted) {
  const step = STEPS.find((x) => x.name === name);
  if (!step) throw new Error(`no step ${name}; steps: ${STEPS.map((x) => x.name).join(', ')}`);
  const times: string[] = [];
  for (let r = 0; r < Math.max(1, reps); r++) {
    const session = profileDir && r === profileRun ? new Session() : null;
    if (session) {
      session.connect();
      await session.post('Profiler.enable');
      await session.post('Profiler.setSamplingInterval', { interval: 100 });
      await session.post('Profiler.start');
    }
    const t0 = performance.now();
    const c0 = process.cpuUsage();
    const res = step.run({ recording, parameters, columns: new Map() });
    const c = process.cpuUsage(c0);
    const wall = performance.now() - t0;
    const cpu = (c.user + c.system) / 1000;
    if (session && profileDir) {
      const { profile } = await session.post('Profiler.stop');
      session.disconnect();
      mkdirSync(profileDir, { recursive: true });
      writeFileSync(join(profileDir, `${name}.cpuprofile`), JSON.stringify(profile));
      printTopFunctions(profile as unknown as CpuProfile);
    }
    if (r === 0) {
      totalWall += wall;
      totalCpu += cpu;
      const d: Record<string, string> = {};
      for (const col of res.columns) d[col.name] = hashColumn(col);
      d['(summary)'] = createHash('sha256').update(JSON.stringify(res.summary ?? null)).digest('hex').slice(0, 16);
      d['(warnings)'] = createHash('sha256').update(JSON.stringify(res.warnings ?? [])).digest('hex').slice(0, 16);
      digest[name] = d;
    }
    times.push(`${(wall / 1000).toFixed(3)} / ${(cpu / 1000).toFixed(3)} s`);
  }
  console.log(`step ${name.padEnd(8)} wall / CPU ${times[0]}${times.length > 1 ? `   (again: ${times.slice(1).join(', ')})` : ''}`);
}
console.log(`${'together'.padEnd(13)} wall / CPU ${(totalWall / 1000).toFixed(3)} / ${(totalCpu / 1000).toFixed(3)} s (first runs)`);
if (digestFile) writeFileSync(digestFile, JSON.stringify(digest, null, 1));
