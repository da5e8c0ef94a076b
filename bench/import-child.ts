/**
 * Child process of bench/import-bench.ts: imports one session folder the way
 * the CLI does (loadSession: node:crypto hashing, file-system source), then
 * prints one JSON line {wallMs, cpuMs, userMs, sysMs, maxRssBytes, minorFaults, units, spikes}
 * (minorFaults: pages of fresh memory touched by the whole process;
 * importFaults: those touched during loadSession).
 * Usage: node --import tsx bench/import-child.ts <session-dir>
 */
import { loadSession } from '../core/node/load-session';
import { peakRssBytes } from './peak-rss';

const dir = process.argv[2];
const f0 = process.resourceUsage().minorPageFault;
const t0 = performance.now();
const c0 = process.cpuUsage();
const r = await loadSession(dir);
const wallMs = performance.now() - t0;
const c = process.cpuUsage(c0);
let spikes = 0;
for (const u of r.recording.units) spikes += u.spikeTimes.length;
const ru = process.resourceUsage();
console.log(JSON.stringify({ wallMs, cpuMs: (c.user + c.system) / 1000, userMs: c.user / 1000, sysMs: c.system / 1000, maxRssBytes: peakRssBytes(), minorFaults: ru.minorPageFault, importFaults: ru.minorPageFault - f0, units: r.recording.units.length, spikes }));
