/**
 * Reads an NWB/hdmf VectorIndex (the cumulative end of each row of a ragged
 * column: row i is data[index[i-1] : index[i]], with index[-1] = 0) and checks
 * it against the length of the data it indexes.
 *
 * Index dtypes uint8 .. uint64 are all allowed by the schema; 64-bit values
 * arrive as BigInt and are converted exactly (Number.MAX_SAFE_INTEGER is far
 * beyond any dataset length).
 *
 * Errors (InputError, naming the file, the index dataset and the row): a
 * value that is negative, not an integer, decreasing, or beyond the data.
 */
import { InputError } from '../../errors';
import type { Hdf5File } from './hdf5-access';
import { toFloat64 } from './to-float64';

export function readVectorIndex(h5: Hdf5File, file: string, indexPath: string, dataLength: number): Float64Array {
  const info = h5.info(indexPath);
  if (info.elementClass !== 'int' && info.elementClass !== 'uint') {
    throw new InputError({ file, problem: `${indexPath} should hold integers (a VectorIndex) but holds ${info.elementClass} values`, fix: 'rewrite the file with an integer index' });
  }
  const ends = toFloat64(h5.read(indexPath), file, indexPath);
  let prev = 0;
  for (let i = 0; i < ends.length; i++) {
    const e = ends[i];
    if (!Number.isSafeInteger(e) || e < 0 || e < prev || e > dataLength) {
      const why =
        e > dataLength
          ? `points past the end of its data (${dataLength} elements)`
          : e < prev
            ? `is smaller than the previous row's end (${prev}); a VectorIndex must not decrease`
            : 'is not a non-negative integer';
      throw new InputError({ file, column: indexPath, value: String(e), problem: `index out of range: the end index of table row ${i} (counting from 0) ${why}`, fix: 'rewrite the file so each end index lies within the indexed data' });
    }
    prev = e;
  }
  return ends;
}
