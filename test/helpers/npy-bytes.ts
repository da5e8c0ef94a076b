/**
 * Writes .npy bytes (format 1.0, C order) for tests that build sessions in
 * memory. The reader itself is checked against files written by NumPy
 * (test/fixtures/npy); this writer follows the same layout (NEP 1): magic,
 * version, little-endian header length, a Python-dict header padded with
 * spaces to a multiple of 64 bytes and ending in "\n", then the data.
 */
type NpyTyped = Float64Array | Float32Array | Int32Array | Uint32Array | BigInt64Array | BigUint64Array | Int16Array | Uint16Array | Int8Array | Uint8Array;
const DESCR: [new (n: number) => NpyTyped, string][] = [
  [Float64Array, '<f8'], [Float32Array, '<f4'], [Int32Array, '<i4'], [Uint32Array, '<u4'], [BigInt64Array, '<i8'],
  [BigUint64Array, '<u8'], [Int16Array, '<i2'], [Uint16Array, '<u2'], [Int8Array, '|i1'], [Uint8Array, '|u1'],
];

export function npyBytes(data: NpyTyped, shape: number[] = [data.length]): Uint8Array {
  const descr = DESCR.find(([C]) => data instanceof C)![1];
  const shapeText = shape.length === 1 ? `(${shape[0]},)` : `(${shape.join(', ')})`;
  let header = `{'descr': '${descr}', 'fortran_order': False, 'shape': ${shapeText}, }`;
  const total = 10 + header.length + 1;
  header += ' '.repeat((64 - (total % 64)) % 64) + '\n';
  const out = new Uint8Array(10 + header.length + data.byteLength);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, header.length & 0xff, header.length >> 8]);
  for (let i = 0; i < header.length; i++) out[10 + i] = header.charCodeAt(i);
  out.set(new Uint8Array(data.buffer, data.byteOffset, data.byteLength), 10 + header.length);
  return out;
}
