import type { LightSchedule } from './light-schedule';

/**
 * The stretches of time a light analysis of this schedule looks at, in two
 * parts, each merged and sorted as [a0, b0, a1, b1, ...], s:
 * - `test`: every pulse's test window [onset + windowStart, onset + windowEnd);
 *   `testDisjoint` is true when no two of them touch (then `test` holds exactly
 *   one interval per pulse, in pulse order);
 * - `rest`: the SALT baseline block of every SALT pulse
 *   [anchor - windows x w, anchor) and the offset window [offset, offset +
 *   offsetWindowS) of every pulse ending at or after its test window (the only
 *   offset windows lightResponse reads), minus nothing else.
 * The trust simulation simulates spikes only there (spikes elsewhere cannot
 * change any result, as long as SALT can run; without SALT the baseline rate
 * comes from all light-free time and the rule cannot call `tagged` anyway).
 */
export function simulationIntervals(sch: LightSchedule, offsetWindowS: number): { test: Float64Array; testDisjoint: boolean; rest: Float64Array } {
  const test: number[] = [];
  let disjoint = true;
  for (let i = 0; i < sch.n; i++) {
    const a = sch.onset[i] + sch.windowStartS;
    const b = sch.onset[i] + sch.windowEndS;
    if (test.length && a <= test[test.length - 1]) {
      disjoint = false;
      test[test.length - 1] = Math.max(test[test.length - 1], b);
    } else test.push(a, b);
  }
  const iv: [number, number][] = [];
  if (sch.windows > 0) for (const i of sch.saltPulses) iv.push([sch.anchor[i] - sch.windows * sch.windowS, sch.anchor[i]]);
  for (let i = 0; i < sch.n; i++) {
    const o = sch.offset[i];
    if (Number.isFinite(o) && o >= sch.onset[i] + sch.windowEndS) iv.push([o, o + offsetWindowS]);
  }
  iv.sort((x, y) => x[0] - y[0] || x[1] - y[1]);
  const rest: number[] = [];
  for (const [a, b] of iv) {
    if (rest.length && a <= rest[rest.length - 1]) rest[rest.length - 1] = Math.max(rest[rest.length - 1], b);
    else rest.push(a, b);
  }
  return { test: Float64Array.from(test), testDisjoint: disjoint, rest: Float64Array.from(rest) };
}
