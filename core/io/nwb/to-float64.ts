/**
 * Converts stored numeric HDF5 data to a Float64Array (seconds, volts, ...
 * stay in whatever unit they were stored in). 64-bit integers arrive as
 * BigInt arrays; they are converted with Number(), exact up to 2^53, which
 * covers every count and index a recording can hold.
 *
 * Text data are an InputError naming the dataset: a numeric column was
 * expected there.
 */
import { InputError } from '../../errors';
import type { H5Data } from './hdf5-access';

export function toFloat64(data: H5Data, file: string, path: string): Float64Array {
  if (data instanceof Float64Array) return data;
  if (data instanceof BigInt64Array || data instanceof BigUint64Array) {
    const out = new Float64Array(data.length);
    for (let i = 0; i < data.length; i++) out[i] = Number(data[i]);
    return out;
  }
  if (ArrayBuffer.isView(data)) return Float64Array.from(data as ArrayLike<number>);
  throw new InputError({ file, problem: `${path} holds text where numbers were expected`, fix: 'point the manifest at a numeric column' });
}
