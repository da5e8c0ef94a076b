import { npyHeader } from './npy-header';

/**
 * Encodes a typed array as a NumPy .npy file (format version 1.0, C order,
 * little-endian), following the format specification in NumPy's
 * documentation (numpy.lib.format, "NEP 1"): the magic string \x93NUMPY,
 * version bytes 1 0, a little-endian uint16 header length, an ASCII Python
 * dict literal {'descr': ..., 'fortran_order': False, 'shape': (...), }
 * padded with spaces and a final newline so the data starts on a multiple of
 * 64 bytes, then the raw data. Checked by reading the bytes back with NumPy
 * (test/core/io/encode-npy.test.ts).
 *
 * Supported: Float64Array <f8, Float32Array <f4, Int32Array <i4, Int16Array
 * <i2, Uint32Array <u4, Uint16Array <u2, Int8Array |i1, Uint8Array |u1,
 * BigInt64Array <i8. `shape` defaults to [length]; its product must equal
 * the length. On a big-endian host the data bytes are swapped.
 */
export type NpyWritable =
  | Float64Array
  | Float32Array
  | Int32Array
  | Int16Array
  | Uint32Array
  | Uint16Array
  | Int8Array
  | Uint8Array
  | BigInt64Array;

export function encodeNpy(data: NpyWritable, shape: readonly number[] = [data.length]): Uint8Array {
  const header = npyHeader(npyDescr(data), shape, data.length);
  const out = new Uint8Array(header.length + data.byteLength);
  out.set(header, 0);
  out.set(new Uint8Array(data.buffer, data.byteOffset, data.byteLength), header.length);
  if (!littleEndianHost() && data.BYTES_PER_ELEMENT > 1) swapInPlace(out.subarray(header.length), data.BYTES_PER_ELEMENT);
  return out;
}

/** The dtype string of a typed array, e.g. "<f8". */
function npyDescr(data: NpyWritable): string {
  if (data instanceof Float64Array) return '<f8';
  if (data instanceof Float32Array) return '<f4';
  if (data instanceof Int32Array) return '<i4';
  if (data instanceof Int16Array) return '<i2';
  if (data instanceof Uint32Array) return '<u4';
  if (data instanceof Uint16Array) return '<u2';
  if (data instanceof Int8Array) return '|i1';
  if (data instanceof Uint8Array) return '|u1';
  if (data instanceof BigInt64Array) return '<i8';
  throw new Error('encodeNpy: unsupported array type');
}

function littleEndianHost(): boolean {
  return new Uint8Array(Uint16Array.of(1).buffer)[0] === 1;
}

function swapInPlace(bytes: Uint8Array, width: number): void {
  for (let i = 0; i < bytes.length; i += width) {
    for (let a = i, b = i + width - 1; a < b; a++, b--) {
      const t = bytes[a];
      bytes[a] = bytes[b];
      bytes[b] = t;
    }
  }
}
