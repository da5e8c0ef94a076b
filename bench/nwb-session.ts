/**
 * NWB benchmark: reads a large NWB file (1,000 units, ~20 M spikes, 2 h, 600
 * trials, 10,000 pulses, plus a 2 GB raw voltage dataset) as a session and
 * prints the time and the peak resident memory, to show that only the
 * tables are read (peak memory stays far below the file size).
 *
 *   npx tsx bench/nwb-session.ts [file.nwb]
 *
 * Without a file it writes one with bench/nwb/make_large_nwb.py (Debian's
 * /usr/bin/python3 with h5py) into the system temp folder first.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadNwbSession } from '../core/node/load-nwb-session';
import { openHdf5File } from '../core/node/nwb/open-hdf5-file';

const here = dirname(fileURLToPath(import.meta.url));
const file = process.argv[2] ?? join(tmpdir(), 'tagbench-bench-large.nwb');
if (!existsSync(file)) {
  console.log(`writing ${file} ...`);
  execFileSync('/usr/bin/python3', [join(here, 'nwb/make_large_nwb.py'), file], { stdio: 'inherit' });
}
const peakRssMb = () => {
  const m = /VmHWM:\s+(\d+) kB/.exec(readFileSync('/proc/self/status', 'utf8'));
  return m ? Number(m[1]) / 1024 : process.memoryUsage().rss / 2 ** 20;
};
// Load the HDF5 library once first (under tsx its first import alone takes seconds), then time the read.
const tLib = performance.now();
(await openHdf5File(join(here, '../test/fixtures/nwb/pulse_table.nwb'))).close();
console.log(`h5wasm load     ${((performance.now() - tLib) / 1000).toFixed(2)} s`);
const t0 = performance.now();
const r = await loadNwbSession(file);
const t1 = performance.now();
const spikes = r.recording.units.reduce((s, u) => s + u.spikeTimes.length, 0);
console.log(`file            ${(statSync(file).size / 1e9).toFixed(2)} GB`);
console.log(`units           ${r.recording.units.length}`);
console.log(`spikes          ${spikes} (${((spikes * 8) / 2 ** 20).toFixed(0)} MiB as float64)`);
console.log(`pulses, trials  ${r.recording.pulses.onset.length}, ${r.recording.trials.trial.length}`);
console.log(`load (incl. SHA-256 of the whole file)  ${((t1 - t0) / 1000).toFixed(2)} s`);
console.log(`peak RSS        ${peakRssMb().toFixed(0)} MiB`);
