/**
 * Reads and checks the header of a NumPy .npy file (format versions 1.0,
 * 2.0, 3.0: NumPy's numpy.lib.format documentation, NEP 1) through a reader
 * of byte ranges, so a large file need not be in memory: the 12 first bytes
 * say how long the header is, then the header alone is read. Checks that a
 * file of `fileSize` bytes holds all the data the header announces.
 *
 * Errors (InputError naming the file), the same as readNpy's: not an .npy
 * file, unknown version, malformed header, big-endian data, Fortran order
 * with 2+ dimensions, object or structured arrays, other dtypes, truncated data.
 */
import { InputError } from '../errors';
import { decodeUtf8 } from './decode-utf8';
import { NPY_ITEM_SIZE } from './npy-typed-view';

/** True when this machine stores numbers little-endian (every platform tagbench runs on). */
const LITTLE = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** What the header of a .npy file says, and where its data starts. */
export interface NpyHeader {
  readonly descr: string;
  readonly dtype: string;
  readonly shape: readonly number[];
  readonly version: string;
  /** Byte offset of the first element. */
  readonly dataStart: number;
  /** Number of elements (product of the shape). */
  readonly count: number;
  /** Bytes per element. */
  readonly itemSize: number;
}

export function readNpyHeader(read: (offset: number, length: number) => Uint8Array, fileSize: number, file: string): NpyHeader {
  // the first 12 bytes give the header's length; then read exactly the header
  const lead = read(0, Math.min(12, fileSize));
  let bytes = lead;
  if (lead.length >= 10 && lead[6] >= 1 && lead[6] <= 3) {
    const len = lead[6] === 1 ? 10 + (lead[8] | (lead[9] << 8)) : lead.length >= 12 ? 12 + (lead[8] | (lead[9] << 8) | (lead[10] << 16)) + lead[11] * 2 ** 24 : 12;
    bytes = read(0, Math.min(len, fileSize));
  }
  const bad = (problem: string, fix?: string): never => {
    throw new InputError({ file, problem, ...(fix ? { fix } : {}) });
  };
  const magic = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59];
  if (bytes.length < 10 || magic.some((m, i) => bytes[i] !== m)) {
    bad('this is not a NumPy .npy file (the "\\x93NUMPY" signature is missing)', 'save the array with numpy.save');
  }
  const major = bytes[6];
  const minor = bytes[7];
  let headerLen: number;
  let start: number;
  if (major === 1) {
    headerLen = bytes[8] | (bytes[9] << 8);
    start = 10;
  } else if (major === 2 || major === 3) {
    if (bytes.length < 12) bad('the file ends inside the .npy header');
    headerLen = (bytes[8] | (bytes[9] << 8) | (bytes[10] << 16)) + bytes[11] * 2 ** 24;
    start = 12;
  } else {
    return bad(`unsupported .npy format version ${major}.${minor}`, 'save with numpy.save (format 1.0, 2.0 or 3.0)');
  }
  const version = `${major}.${minor}`;
  if (start + headerLen > bytes.length) bad('the file ends inside the .npy header');
  const header = decodeUtf8(bytes, start, start + headerLen);
  const descrM = /['"]descr['"]\s*:\s*(['"])([^'"]*)\1/.exec(header);
  if (!descrM) {
    if (/['"]descr['"]\s*:\s*\[/.test(header)) bad('structured (record) arrays are not supported', 'save each field as its own plain numeric array');
    bad(`the .npy header is malformed (no dtype): ${header.trim().slice(0, 80)}`);
  }
  const descr = descrM![2];
  const fortM = /['"]fortran_order['"]\s*:\s*(True|False)/.exec(header);
  const shapeM = /['"]shape['"]\s*:\s*\(([^)]*)\)/.exec(header);
  if (!fortM || !shapeM) bad(`the .npy header is malformed: ${header.trim().slice(0, 80)}`);
  const shape = shapeM![1]
    .split(',')
    .map((s) => s.trim())
    .filter((s) => s !== '')
    .map((s) => {
      const v = Number(s.replace(/L$/, ''));
      if (!Number.isInteger(v) || v < 0) bad(`the .npy header has an invalid shape (${shapeM![1]})`);
      return v;
    });
  const fortran = fortM![1] === 'True';
  if (fortran && shape.filter((d) => d > 1).length > 1) {
    bad(`the array is stored in Fortran (column-major) order, shape (${shape.join(', ')})`, 'save a C-ordered copy: numpy.save(path, numpy.ascontiguousarray(a))');
  }
  const order = descr.charAt(0);
  const code = descr.slice(1);
  if (descr === '|O' || code === 'O') bad('this is an object array (pickled Python objects), which tagbench never loads', 'save a numeric array (e.g. a.astype(numpy.float64))');
  if (order === '>' && !code.endsWith('1')) bad(`the data is big-endian (dtype ${descr})`, "convert it: numpy.save(path, a.astype(a.dtype.newbyteorder('<')))");
  if (order !== '<' && order !== '|' && order !== '=') bad(`unsupported dtype ${descr}`);
  const size = NPY_ITEM_SIZE[code];
  if (!size) {
    bad(
      `unsupported dtype ${descr}`,
      'use float64, float32, int64, int32, int16, int8 or their unsigned forms',
    );
  }
  if (!LITTLE) bad('this machine is big-endian, which tagbench does not support');
  const count = shape.reduce((a, b) => a * b, 1);
  const dataStart = start + headerLen;
  const need = count * size;
  const have = fileSize - dataStart;
  if (have < need) {
    bad(`the data is truncated: shape (${shape.join(', ')}) of ${descr} needs ${need} bytes, the file holds ${have}`, 'copy the file again or re-save it');
  }
  return { descr, dtype: code, shape, version, dataStart, count, itemSize: size };
}

