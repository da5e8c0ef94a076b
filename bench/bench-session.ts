/**
 * The benchmark's reference session (DESIGN.md section 7: 1,000 units, 2 h,
 * ~20 M spikes, 10,000 pulses, 600 trials), written once by the project's
 * simulator and cached outside the repository, keyed by simulator version,
 * seed and unit count:
 *   $TAGBENCH_CACHE or ~/.cache/tagbench / bench / v<version>-seed<seed>-u<units> / {csv,npy}/
 * Both forms share pulses.csv, events.csv, trials.csv, unit_info.csv,
 * waveforms.npy and session.json; csv/ has spikes.csv, npy/ has spikes.npy
 * (float64 s) + units.npy (int32). Spikes are streamed to disk in chunks,
 * never built as one giant string. The folder appears only when complete.
 */
import { closeSync, existsSync, mkdirSync, openSync, readFileSync, renameSync, rmSync, writeFileSync, writeSync } from 'node:fs';
import { homedir } from 'node:os';
import { join } from 'node:path';
import { npyHeader } from '../core/io/npy-header';
import { benchScenario } from '../core/sim/bench-scenario';
import { sessionFiles } from '../core/sim/session-files';
import { simulateSession } from '../core/sim/simulate-session';
import { SIMULATOR_VERSION } from '../core/sim/simulator-version';
import { spikeTimeOrder } from '../core/sim/spike-time-order';
import { spikesCsvChunks } from '../core/sim/spikes-csv-chunks';

export interface BenchSession {
  readonly dir: string;
  readonly csvDir: string;
  readonly npyDir: string;
  readonly units: number;
  readonly spikes: number;
  readonly pulses: number;
  readonly trials: number;
  readonly spanS: number;
  /** Seconds spent generating (0 when taken from the cache). */
  readonly generatedS: number;
  readonly cached: boolean;
}

export function benchCacheRoot(): string {
  return process.env.TAGBENCH_CACHE ?? join(homedir(), '.cache', 'tagbench');
}

export function ensureBenchSession(seed = 7, units = 1000, log: (s: string) => void = () => {}): BenchSession {
  const dir = join(benchCacheRoot(), 'bench', `v${SIMULATOR_VERSION}-seed${seed}-u${units}`);
  const done = join(dir, 'complete.json');
  if (existsSync(done)) {
    const info = JSON.parse(readFileSync(done, 'utf8'));
    return { ...info, dir, csvDir: join(dir, 'csv'), npyDir: join(dir, 'npy'), generatedS: 0, cached: true };
  }
  const t0 = performance.now();
  log(`simulating the benchmark session (${units} units, seed ${seed}) ...`);
  const sim = simulateSession(benchScenario(seed, units));
  const rec = sim.recording;
  log(`  simulated in ${((performance.now() - t0) / 1000).toFixed(1)} s; ordering spikes ...`);
  const order = spikeTimeOrder(rec.units);
  const ids = rec.units.map((u) => u.id);
  const tmp = `${dir}.partial-${process.pid}`;
  rmSync(tmp, { recursive: true, force: true });
  mkdirSync(join(tmp, 'csv'), { recursive: true });
  mkdirSync(join(tmp, 'npy'), { recursive: true });
  for (const f of sessionFiles(sim, { spikes: 'none' })) {
    writeFileSync(join(tmp, 'csv', f.name), f.data);
    writeFileSync(join(tmp, 'npy', f.name), f.data);
  }
  log('  writing spikes.csv ...');
  let fd = openSync(join(tmp, 'csv', 'spikes.csv'), 'w');
  for (const chunk of spikesCsvChunks(ids, order.unit, order.time, 200_000)) writeSync(fd, chunk);
  closeSync(fd);
  log('  writing spikes.npy and units.npy ...');
  const n = order.time.length;
  const step = 1 << 20;
  fd = openSync(join(tmp, 'npy', 'spikes.npy'), 'w');
  writeSync(fd, npyHeader('<f8', [n], n));
  for (let i = 0; i < n; i += step) {
    const part = order.time.subarray(i, Math.min(n, i + step));
    writeSync(fd, new Uint8Array(part.buffer, part.byteOffset, part.byteLength));
  }
  closeSync(fd);
  const numeric = ids.map(Number);
  const unitIds = new Int32Array(step);
  fd = openSync(join(tmp, 'npy', 'units.npy'), 'w');
  writeSync(fd, npyHeader('<i4', [n], n));
  for (let i = 0; i < n; i += step) {
    const m = Math.min(n, i + step) - i;
    for (let j = 0; j < m; j++) unitIds[j] = numeric[order.unit[i + j]];
    writeSync(fd, new Uint8Array(unitIds.buffer, 0, m * 4));
  }
  closeSync(fd);
  const info = {
    units: rec.units.length,
    spikes: n,
    pulses: rec.pulses.onset.length,
    trials: rec.trials.trial.length,
    spanS: rec.span[1] - rec.span[0],
    simulatorVersion: SIMULATOR_VERSION,
    seed,
  };
  writeFileSync(join(tmp, 'complete.json'), JSON.stringify(info, null, 2));
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(join(dir, '..'), { recursive: true });
  renameSync(tmp, dir);
  const generatedS = (performance.now() - t0) / 1000;
  log(`  written to ${dir} in ${generatedS.toFixed(1)} s`);
  return { ...info, dir, csvDir: join(dir, 'csv'), npyDir: join(dir, 'npy'), generatedS, cached: false };
}
