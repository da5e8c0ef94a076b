/**
 * Seed of an independent random stream `stream` under a master seed, so every
 * unit and every part of a simulation draws from its own generator: adding a
 * unit or changing one unit's parameters leaves every other unit's spikes
 * unchanged. Mixing: the splitmix32 finaliser (the same constants as the
 * seeding of core/random/rng.ts). Returns an unsigned 32-bit integer.
 */
export function streamSeed(seed: number, stream: number): number {
  let z = (Math.imul(seed >>> 0, 0x9e3779b1) + Math.imul(stream + 1, 0x85ebca77)) | 0;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  z ^= z >>> 16;
  // second round so neighbouring streams differ in every bit
  z = Math.imul(z ^ (z >>> 15), 0x2c1b3c6d);
  z = Math.imul(z ^ (z >>> 12), 0x297a2d39);
  return (z ^ (z >>> 15)) >>> 0;
}
