import type { LightSchedule } from './light-schedule';

/**
 * The stretches of time a light analysis of this schedule looks at, in two
 * parts, each merged and sorted as [a0, b0, a1, b1, ...], s:
 * - `test`: every pulse's test window [onset + windowStart, onset + windowEnd);
 *   `testDisjoint` is true when no two of them touch (then `test` holds exactly
 *   one interval per pulse, in pulse order);
 * - `base`: every SALT pulse's baseline block [anchor - J w, anchor) (the J
 *   windows lightResponse cuts it into, whole), one interval each, sorted by
 *   start (the blocks are disjoint, so they never overlap; neighbours touch);
 * - `offset`: the offset window [offset, offset + offsetWindowS) of every pulse
 *   ending at or after its test window (the only offset windows lightResponse
 *   reads), merged.
 * The trust simulation simulates spikes only there (spikes elsewhere cannot
 * change any result, as long as SALT can run; without SALT the baseline rate
 * comes from all light-free time and the rule cannot call `tagged` anyway).
 */
export function simulationIntervals(sch: LightSchedule, offsetWindowS: number): { test: Float64Array; testDisjoint: boolean; base: Float64Array; offset: Float64Array } {
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
  const J = sch.windows;
  const w = sch.windowS;
  const blocks = J > 0 ? sch.saltBlockOrder : new Int32Array(0);
  const base = new Float64Array(2 * blocks.length);
  let k = 0;
  for (const i of blocks) {
    // Same block edges as saltBaseline: [anchor - J w, anchor).
    base[k++] = sch.anchor[i] - J * w;
    base[k++] = sch.anchor[i];
  }
  const iv: [number, number][] = [];
  for (const i of sch.offsetPulses) iv.push([sch.offset[i], sch.offset[i] + offsetWindowS]);
  iv.sort((x, y) => x[0] - y[0] || x[1] - y[1]);
  const offset: number[] = [];
  for (const [a, b] of iv) {
    if (offset.length && a <= offset[offset.length - 1]) offset[offset.length - 1] = Math.max(offset[offset.length - 1], b);
    else offset.push(a, b);
  }
  return { test: Float64Array.from(test), testDisjoint: disjoint, base, offset: Float64Array.from(offset) };
}
