/**
 * Converts .npy data to a Float64Array of numbers. 64-bit integers beyond
 * +-2^53 (not exactly representable as a double) are an InputError naming
 * the file and element; float64 data is returned as is (no copy).
 */
import { InputError } from '../errors';
import type { NpyArray } from './read-npy';

export function npyToFloat64(a: NpyArray, file: string): Float64Array {
  const d = a.data;
  if (d instanceof Float64Array) return d;
  const out = new Float64Array(d.length);
  if (d instanceof BigInt64Array || d instanceof BigUint64Array) {
    const lim = BigInt(Number.MAX_SAFE_INTEGER);
    for (let i = 0; i < d.length; i++) {
      const v = d[i];
      if (v > lim || v < -lim) {
        throw new InputError({ file: `${file}, element ${i} (0-based)`, value: String(v), problem: 'the integer is too large to be represented exactly' });
      }
      out[i] = Number(v);
    }
    return out;
  }
  out.set(d as ArrayLike<number>);
  return out;
}
