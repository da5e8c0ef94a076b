/**
 * Peak resident memory of this process since it started, bytes. On Linux it
 * reads VmHWM from /proc/self/status: getrusage's ru_maxrss (Node's
 * process.resourceUsage().maxRSS) survives exec, so a benchmark child forked
 * from a parent holding 700 MB would report the parent's 700 MB. Elsewhere it
 * falls back to maxRSS.
 */
import { readFileSync } from 'node:fs';

export function peakRssBytes(): number {
  try {
    const m = /^VmHWM:\s+(\d+)\s+kB/m.exec(readFileSync('/proc/self/status', 'utf8'));
    if (m) return Number(m[1]) * 1024;
  } catch {
    // not Linux
  }
  return process.resourceUsage().maxRSS * 1024;
}
