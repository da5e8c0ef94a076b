import { Rng } from '../random/rng';
import type { UnitSpec } from './types';
import { streamSeed } from './stream-seed';
import { unitSpec } from './unit-spec';

/**
 * n units with no light, task or reward answer, for calibration tests
 * (false-positive rates): rates log-uniform in rateRangeHz (default
 * 0.5-40 Hz), gamma shapes log-uniform in shapeRange (default 0.5-8, from
 * bursty to regular), refractory 1.5-2.5 ms, drift SD `drift` (default 0).
 * Ids "n1", "n2", ... Deterministic in seed.
 */
export function nullUnits(
  n: number,
  seed: number,
  options: { rateRangeHz?: readonly [number, number]; shapeRange?: readonly [number, number]; drift?: number } = {},
): UnitSpec[] {
  const rng = new Rng(streamSeed(seed, 0x0a11));
  const [r0, r1] = options.rateRangeHz ?? [0.5, 40];
  const [s0, s1] = options.shapeRange ?? [0.5, 8];
  const logU = (a: number, b: number) => Math.exp(Math.log(a) + (Math.log(b) - Math.log(a)) * rng.uniform());
  return Array.from({ length: n }, (_, i) =>
    unitSpec({
      id: `n${i + 1}`,
      channel: i % 64,
      depthUm: (i % 64) * 20,
      rateHz: logU(r0, r1),
      shape: logU(s0, s1),
      refractoryS: 0.0015 + 0.001 * rng.uniform(),
      drift: options.drift ?? 0,
    }),
  );
}
