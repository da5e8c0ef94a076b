/**
 * Child process of the benchmark: runs `tagbench run <session> --out <dir>`
 * in process, then prints one JSON line {runMs, cpuMs, maxRssBytes, heapUsedBytes}
 * (maxRssBytes: this process's own peak, see peak-rss.ts).
 * Usage: node --import tsx bench/run-child.ts <session> <out>
 */
import { runCommand } from '../core/node/commands/run';
import { peakRssBytes } from './peak-rss';

const [session, out] = process.argv.slice(2);
const t0 = performance.now();
const c0 = process.cpuUsage();
const code = await runCommand.run([session, '--out', out], { stdout: () => {}, stderr: (s) => process.stderr.write(s), isTty: false });
const runMs = performance.now() - t0;
const cpu = process.cpuUsage(c0);
const cpuMs = (cpu.user + cpu.system) / 1000;
if (code !== 0) process.exit(code);
console.log(JSON.stringify({ runMs, cpuMs, maxRssBytes: peakRssBytes(), heapUsedBytes: process.memoryUsage().heapUsed }));
