import type { LightSchedule } from './light-schedule';

/**
 * The stretches of time a light analysis of this schedule looks at: for each
 * pulse, from its earliest SALT baseline window (or its test window when SALT
 * cannot run) to the later of its test-window end and its offset window end;
 * merged and sorted as [a0, b0, a1, b1, ...], s. The trust simulation
 * simulates spikes only there (spikes elsewhere cannot change any result).
 */
export function simulationIntervals(sch: LightSchedule, offsetWindowS: number): Float64Array {
  const iv: [number, number][] = [];
  for (let i = 0; i < sch.n; i++) {
    const o = sch.onset[i];
    let a = o + Math.min(0, sch.windowStartS);
    if (sch.windows > 0) a = Math.min(a, sch.anchor[i] - sch.windows * sch.windowS);
    let b = o + sch.windowEndS;
    if (Number.isFinite(sch.offset[i])) b = Math.max(b, sch.offset[i] + offsetWindowS);
    iv.push([a, b]);
  }
  iv.sort((x, y) => x[0] - y[0] || x[1] - y[1]);
  const out: number[] = [];
  for (const [a, b] of iv) {
    if (out.length && a <= out[out.length - 1]) out[out.length - 1] = Math.max(out[out.length - 1], b);
    else out.push(a, b);
  }
  return Float64Array.from(out);
}
