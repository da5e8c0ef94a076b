/**
 * Child process of bench/import-bench.ts: imports one session folder the way
 * the CLI does (loadSession: node:crypto hashing, file-system source), then
 * prints one JSON line {wallMs, cpuMs, maxRssBytes, minorFaults, units, spikes}
 * (minorFaults: pages of fresh memory touched by the whole process).
 * Usage: node --import tsx bench/import-child.ts <session-dir>
 */
import { loadSession } from '../core/node/load-session';
import { peakRssBytes } from './peak-rss';

const dir = process.argv[2];
const t0 = performance.now();
const c0 = process.cpuUsage();
const r = await loadSession(dir);
const wallMs = performance.now() - t0;
const c = process.cpuUsage(c0);
let spikes = 0;
for (const u of r.recording.units) spikes += u.spikeTimes.length;
const ru = process.resourceUsage();
console.log(JSON.stringify({ wallMs, cpuMs: (c.user + c.system) / 1000, maxRssBytes: peakRssBytes(), minorFaults: ru.minorPageFault, units: r.recording.units.length, spikes }));
