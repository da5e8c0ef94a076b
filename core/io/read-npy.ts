/**
 * Reads a NumPy .npy file from its bytes (format versions 1.0, 2.0, 3.0, as
 * specified in NumPy's `numpy.lib.format` documentation, NEP 1).
 *
 * Supported: little-endian (or byte-order-free) float64, float32, int64,
 * int32, int16, int8, uint64, uint32, uint16, uint8; C order (and Fortran
 * order for 1-D arrays, where it is the same layout); any number of
 * dimensions (callers check the shape they need).
 * Errors (InputError naming the file): not an .npy file, unknown version,
 * malformed header, big-endian data, Fortran order with 2+ dimensions,
 * object or structured arrays, other dtypes, truncated data.
 *
 * The data is returned as a typed array viewing the input bytes when they
 * are aligned (no copy), otherwise as a copy. 64-bit integers are returned
 * as BigInt64Array / BigUint64Array; use npyToFloat64 / npyToInt for numbers.
 */
import { npyTypedView } from './npy-typed-view';
import { readNpyHeader } from './read-npy-header';

export type NpyData =
  | Float64Array
  | Float32Array
  | BigInt64Array
  | BigUint64Array
  | Int32Array
  | Uint32Array
  | Int16Array
  | Uint16Array
  | Int8Array
  | Uint8Array;

export interface NpyArray {
  /** dtype as written in the header, e.g. "<f8". */
  readonly descr: string;
  /** Kind and size: "f8", "i4", ... */
  readonly dtype: string;
  readonly shape: readonly number[];
  readonly data: NpyData;
  /** Format version, e.g. "1.0". */
  readonly version: string;
}

export function readNpy(bytes: Uint8Array, file: string): NpyArray {
  const h = readNpyHeader((offset, length) => bytes.subarray(offset, offset + length), bytes.length, file);
  const { descr, dtype: code, shape, version, dataStart, count, itemSize } = h;
  const need = count * itemSize;
  const absolute = bytes.byteOffset + dataStart;
  const data =
    absolute % itemSize === 0
      ? npyTypedView(code, bytes.buffer, absolute, count)
      : npyTypedView(code, bytes.slice(dataStart, dataStart + need).buffer, 0, count);
  return { descr, dtype: code, shape, data, version };
}

