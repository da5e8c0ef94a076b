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
import { InputError } from '../errors';
import { decodeUtf8 } from './decode-utf8';

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

const CTORS: Record<string, { size: number; make: (buf: ArrayBufferLike, off: number, n: number) => NpyData }> = {
  f8: { size: 8, make: (b, o, n) => new Float64Array(b, o, n) },
  f4: { size: 4, make: (b, o, n) => new Float32Array(b, o, n) },
  i8: { size: 8, make: (b, o, n) => new BigInt64Array(b, o, n) },
  u8: { size: 8, make: (b, o, n) => new BigUint64Array(b, o, n) },
  i4: { size: 4, make: (b, o, n) => new Int32Array(b, o, n) },
  u4: { size: 4, make: (b, o, n) => new Uint32Array(b, o, n) },
  i2: { size: 2, make: (b, o, n) => new Int16Array(b, o, n) },
  u2: { size: 2, make: (b, o, n) => new Uint16Array(b, o, n) },
  i1: { size: 1, make: (b, o, n) => new Int8Array(b, o, n) },
  u1: { size: 1, make: (b, o, n) => new Uint8Array(b, o, n) },
};

/** True when this machine stores numbers little-endian (every platform tagbench runs on). */
const LITTLE = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

export function readNpy(bytes: Uint8Array, file: string): NpyArray {
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
  const ctor = CTORS[code];
  if (!ctor) {
    bad(
      `unsupported dtype ${descr}`,
      'use float64, float32, int64, int32, int16, int8 or their unsigned forms',
    );
  }
  if (!LITTLE) bad('this machine is big-endian, which tagbench does not support');
  const count = shape.reduce((a, b) => a * b, 1);
  const dataStart = start + headerLen;
  const need = count * ctor!.size;
  const have = bytes.length - dataStart;
  if (have < need) {
    bad(`the data is truncated: shape (${shape.join(', ')}) of ${descr} needs ${need} bytes, the file holds ${have}`, 'copy the file again or re-save it');
  }
  const absolute = bytes.byteOffset + dataStart;
  const data =
    absolute % ctor!.size === 0
      ? ctor!.make(bytes.buffer, absolute, count)
      : ctor!.make(bytes.slice(dataStart, dataStart + need).buffer, 0, count);
  return { descr, dtype: code, shape, data, version };
}
