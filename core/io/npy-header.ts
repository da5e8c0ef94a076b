/**
 * The header bytes (magic, version, length, dict, padding) of a .npy file
 * holding `length` elements of dtype `descr` in C-order `shape`; streaming
 * writers write it and then the data in pieces. Laid out as NumPy's own
 * writer does (numpy.lib.format, version 1.0): the dict literal with keys in
 * sorted order, 21 - len(repr(shape[0])) spare spaces so the array can grow
 * in place, then space padding and a newline so that the data starts on a
 * multiple of 64 bytes. The result is byte-identical to np.save
 * (test/core/io/encode-npy.test.ts compares with files NumPy 2.4 wrote).
 */
export function npyHeader(descr: string, shape: readonly number[], length: number): Uint8Array {
  const count = shape.reduce((a, b) => a * b, 1);
  if (count !== length || shape.some((s) => !Number.isInteger(s) || s < 0)) {
    throw new Error(`encodeNpy: shape (${shape.join(', ')}) does not hold ${length} elements`);
  }
  const shapeText = shape.length === 1 ? `(${shape[0]},)` : `(${shape.join(', ')})`;
  let dict = `{'descr': '${descr}', 'fortran_order': False, 'shape': ${shapeText}, }`;
  if (shape.length > 0) dict += ' '.repeat(Math.max(0, 21 - String(shape[0]).length));
  const hlen = dict.length + 1; // + newline
  const padlen = 64 - ((10 + hlen) % 64);
  const total = 10 + hlen + padlen;
  if (total - 10 > 0xffff) throw new Error('encodeNpy: header too long for format 1.0');
  const text = dict + ' '.repeat(padlen) + '\n';
  const out = new Uint8Array(total);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0], 0); // \x93NUMPY 1.0
  out[8] = (total - 10) & 0xff;
  out[9] = (total - 10) >>> 8;
  for (let i = 0; i < text.length; i++) out[10 + i] = text.charCodeAt(i);
  return out;
}
