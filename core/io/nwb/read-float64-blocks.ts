/**
 * Reads a 1-D numeric dataset into one Float64Array in blocks of
 * `blockRows` elements (default 1 Mi = 8 MiB of float64), so a large
 * dataset (e.g. tens of millions of spike times) never needs a second
 * full-size buffer inside the HDF5 reader's own memory.
 */
import type { Hdf5File } from './hdf5-access';
import { toFloat64 } from './to-float64';

export function readFloat64Blocks(h5: Hdf5File, file: string, path: string, blockRows = 1 << 20): Float64Array {
  const n = h5.info(path).shape[0] ?? 1;
  if (n <= blockRows) return toFloat64(h5.read(path), file, path);
  const out = new Float64Array(n);
  for (let a = 0; a < n; a += blockRows) out.set(toFloat64(h5.read(path, a, Math.min(n, a + blockRows)), file, path), a);
  return out;
}
