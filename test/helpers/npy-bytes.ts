/**
 * Writes .npy bytes (format 1.0, C order) for tests that build sessions in
 * memory. The reader itself is checked against files written by NumPy
 * (test/fixtures/npy); this writer follows the same layout (NEP 1): magic,
 * version, little-endian header length, a Python-dict header padded with
 * spaces to a multiple of 64 bytes and ending in "\n", then the data.
 */
export function npyBytes(data: Float64Array | Int32Array | BigInt64Array | Int16Array, shape: number[] = [data.length]): Uint8Array {
  const descr = data instanceof Float64Array ? '<f8' : data instanceof Int32Array ? '<i4' : data instanceof BigInt64Array ? '<i8' : '<i2';
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
