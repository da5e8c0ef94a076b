/**
 * A typed array of a .npy dtype code ("f8", "i4", ...; little-endian, as
 * readNpyHeader accepts) viewing `count` elements of `buffer` from
 * `byteOffset` (which must be a multiple of the element size). No copy.
 * 64-bit integers give BigInt64Array / BigUint64Array.
 */
import type { NpyData } from './read-npy';

/** Bytes per element of each supported dtype code. */
export const NPY_ITEM_SIZE: Readonly<Record<string, number>> = { f8: 8, f4: 4, i8: 8, u8: 8, i4: 4, u4: 4, i2: 2, u2: 2, i1: 1, u1: 1 };

export function npyTypedView(dtype: string, buffer: ArrayBufferLike, byteOffset: number, count: number): NpyData {
  switch (dtype) {
    case 'f8': return new Float64Array(buffer, byteOffset, count);
    case 'f4': return new Float32Array(buffer, byteOffset, count);
    case 'i8': return new BigInt64Array(buffer, byteOffset, count);
    case 'u8': return new BigUint64Array(buffer, byteOffset, count);
    case 'i4': return new Int32Array(buffer, byteOffset, count);
    case 'u4': return new Uint32Array(buffer, byteOffset, count);
    case 'i2': return new Int16Array(buffer, byteOffset, count);
    case 'u2': return new Uint16Array(buffer, byteOffset, count);
    case 'i1': return new Int8Array(buffer, byteOffset, count);
    case 'u1': return new Uint8Array(buffer, byteOffset, count);
    default: throw new Error(`npyTypedView: unsupported dtype ${dtype}`);
  }
}
