/**
 * Spike times (spikes.npy) and the unit of each spike (units.npy) read piece
 * by piece through two small reused buffers, as SpikePieces for
 * buildRecording: importing a 20-million-spike session then creates no
 * full-length array but the recording's own (the whole files are never in
 * memory, nor converted copies of them).
 *
 * Reads the units file once in full first (hashing every byte with its
 * `hash`, giving each distinct unit id its code in order of first
 * appearance, the same codes whatever the piece length, and counting the
 * spikes per code: pieces.codeCounts, so buildRecording need not visit the
 * unit codes a second time before it groups the spikes); the times file is
 * hashed during the first visit of the pieces (forEach). Every visit reads both files
 * by offset (the second time from the operating system's file cache)
 * and converts each piece: unit values to codes, times to float64 seconds
 * (times are multiplied by `timeFactor(header)`, e.g. 1 / sample rate for
 * integer sample counts, exactly as importSession converts other tables).
 *
 * Accepted: 1-D arrays of equal length; times of any dtype readNpyHeader
 * accepts; unit ids of any integer dtype, or floats holding whole numbers.
 * Errors (InputError, the same wording as the whole-array reader): the
 * header errors of readNpyHeader, "expected a 1-D array", unequal lengths,
 * a unit id that is not a whole number or a 64-bit integer beyond +-2^53
 * (naming the 0-based element), and a file that changes while it is read.
 * Unit ids become strings as String(number) does ("7", "-1").
 */
import { InputError } from '../errors';
import type { Sha256 } from './create-sha256';
import { npyTypedView } from './npy-typed-view';
import { readNpyHeader, type NpyHeader } from './read-npy-header';
import type { RandomAccessFile } from './session-source';
import type { SpikePieces } from './spike-pieces';

export interface NpySpikeFile {
  /** Name for messages and the input list. */
  readonly file: string;
  readonly data: RandomAccessFile;
  /** Hash of the file's bytes, updated while the file is first read in full. */
  readonly hash: Sha256;
}

export interface NpySpikeOptions {
  /** Seconds per unit of the times file (1 for seconds); called once, after both headers are checked. */
  readonly timeFactor: (times: NpyHeader) => number;
  /** Elements per piece (default 2^18: 2 MiB of float64 times). */
  readonly pieceLength?: number;
}

export interface NpySpikes {
  readonly times: NpyHeader;
  readonly units: NpyHeader;
  /** Distinct unit ids in order of first appearance; codes index this list. */
  readonly unitIds: readonly string[];
  readonly pieces: SpikePieces;
  /** True once the pieces were visited in full: the times file's hash is then complete. */
  readonly timesHashed: () => boolean;
}

const MAX_SAFE_HI = 0x1fffff; // high 32 bits of 2^53 - 1

export function npySpikePieces(timesIn: NpySpikeFile, unitsIn: NpySpikeFile, options: NpySpikeOptions): NpySpikes {
  const th = header(timesIn);
  const uh = header(unitsIn);
  if (th.count !== uh.count) {
    throw new InputError({ file: unitsIn.file, problem: `holds ${uh.count} unit ids but ${timesIn.file} holds ${th.count} spike times`, fix: 'both arrays need one element per spike, in the same order' });
  }
  const factor = options.timeFactor(th);
  const n = th.count;
  const P = Math.max(1, Math.min(options.pieceLength ?? 1 << 18, Math.max(1, n)));
  const tBuf = new Uint8Array(P * th.itemSize);
  const uBuf = new Uint8Array(P * uh.itemSize);
  const codes = new Int32Array(P);
  const tVals = th.dtype === 'f8' && factor === 1 ? null : new Float64Array(P);

  // unit id -> code: a direct table for small non-negative whole numbers, a Map for the rest
  const ids: string[] = [];
  let small = new Int32Array(1024).fill(-1);
  const other = new Map<number, number>();
  let frozen = false; // after the first full read, no new id may appear
  // spikes per code and each code's first element, counted during the first full read
  const firstOf: number[] = [];
  let count = new Float64Array(64);

  const readRange = (f: NpySpikeFile, offset: number, into: Uint8Array): void => {
    let got: number;
    if (f.data.readInto) got = f.data.readInto(offset, into);
    else {
      const r = f.data.read(offset, into.length);
      into.set(r);
      got = r.length;
    }
    if (got !== into.length) changed(f);
  };
  const changed = (f: NpySpikeFile): never => {
    throw new InputError({ file: f.file, problem: 'the file changed (or became shorter) while it was being read', fix: 'wait until the file is completely written, then import again' });
  };

  // integer dtypes up to 32 bits are read in place (exact as numbers); the rest through uVals
  const inPlace = uh.dtype === 'i4' || uh.dtype === 'u4' || uh.dtype === 'i2' || uh.dtype === 'u2' || uh.dtype === 'i1' || uh.dtype === 'u1';
  const uVals = inPlace ? null : new Float64Array(P);
  /** Unit codes of elements first .. first + m - 1 (bytes already in uBuf). */
  const unitCodes = (first: number, m: number): void => {
    let src: Float64Array | Int32Array | Uint32Array | Int16Array | Uint16Array | Int8Array | Uint8Array;
    if (inPlace) src = npyTypedView(uh.dtype, uBuf.buffer, uBuf.byteOffset, m) as typeof src;
    else {
      toFloat64(uh, uBuf, m, uVals!, unitsIn.file, first);
      src = uVals!;
    }
    let table = small;
    for (let i = 0; i < m; i++) {
      const v = src[i];
      const k = v | 0;
      if (k === v && k >= 0 && k < table.length) {
        const c = table[k];
        if (c >= 0) {
          codes[i] = c;
          continue;
        }
      }
      codes[i] = newCode(v, first + i);
      table = small;
    }
  };
  const newCode = (v: number, index: number): number => {
    if (!Number.isInteger(v)) {
      throw new InputError({ file: `${unitsIn.file}, element ${index} (0-based)`, value: String(v), problem: 'unit ids must be whole numbers', fix: 'save the unit of each spike as an integer array' });
    }
    const k = v | 0;
    if (k === v && k >= 0 && k < 1 << 20) {
      if (k >= small.length) {
        const big = new Int32Array(Math.max(k + 1, small.length * 2)).fill(-1);
        big.set(small);
        small = big;
      }
      if (small[k] >= 0) return small[k];
      if (frozen) changed(unitsIn);
      small[k] = ids.length;
    } else {
      const c = other.get(v);
      if (c !== undefined) return c;
      if (frozen) changed(unitsIn);
      other.set(v, ids.length);
    }
    ids.push(String(v));
    firstOf.push(index);
    return ids.length - 1;
  };

  // ---- first full read: hash both files, code the unit ids -----------------
  hashRange(unitsIn, 0, uh.dataStart);
  for (let first = 0; first < n; first += P) {
    const m = Math.min(P, n - first);
    const b = uBuf.subarray(0, m * uh.itemSize);
    readRange(unitsIn, uh.dataStart + first * uh.itemSize, b);
    unitsIn.hash.update(b);
    unitCodes(first, m);
    if (ids.length > count.length) {
      const more = new Float64Array(Math.max(ids.length, 2 * count.length));
      more.set(count);
      count = more;
    }
    for (let i = 0; i < m; i++) count[codes[i]]++;
  }
  hashRange(unitsIn, uh.dataStart + n * uh.itemSize, unitsIn.data.size);
  frozen = true;

  // The times file is hashed during the first visit of the pieces (its first full read).
  let timesHash: 'pending' | 'running' | 'done' = 'pending';
  const pieces: SpikePieces = {
    length: n,
    forEach(visit) {
      const hashing = timesHash === 'pending';
      if (hashing) {
        timesHash = 'running';
        hashRange(timesIn, 0, th.dataStart);
      }
      for (let first = 0; first < n; first += P) {
        const m = Math.min(P, n - first);
        readRange(unitsIn, uh.dataStart + first * uh.itemSize, uBuf.subarray(0, m * uh.itemSize));
        unitCodes(first, m);
        const tb = tBuf.subarray(0, m * th.itemSize);
        readRange(timesIn, th.dataStart + first * th.itemSize, tb);
        if (hashing) timesIn.hash.update(tb);
        let t: Float64Array;
        if (tVals) {
          toFloat64(th, tBuf, m, tVals, timesIn.file, first);
          if (factor !== 1) for (let i = 0; i < m; i++) tVals[i] *= factor;
          t = tVals.subarray(0, m);
        } else t = new Float64Array(tBuf.buffer, tBuf.byteOffset, m);
        visit(codes.subarray(0, m), t, first);
      }
      if (hashing) {
        hashRange(timesIn, th.dataStart + n * th.itemSize, timesIn.data.size);
        timesHash = 'done';
      }
    },
    codeCounts() {
      return { count: count.slice(0, ids.length), first: Float64Array.from(firstOf) };
    },
    forEachUnit(visit) {
      for (let first = 0; first < n; first += P) {
        const m = Math.min(P, n - first);
        readRange(unitsIn, uh.dataStart + first * uh.itemSize, uBuf.subarray(0, m * uh.itemSize));
        unitCodes(first, m);
        visit(codes.subarray(0, m), first);
      }
    },
  };
  return {
    times: th,
    units: uh,
    unitIds: ids,
    pieces,
    timesHashed: () => timesHash === 'done',
  };

  function hashRange(f: NpySpikeFile, from: number, to: number): void {
    const step = Math.max(tBuf.length, 1 << 16);
    const buf = new Uint8Array(Math.min(step, Math.max(0, to - from)));
    for (let o = from; o < to; o += buf.length) {
      const b = buf.subarray(0, Math.min(buf.length, to - o));
      readRange(f, o, b);
      f.hash.update(b);
    }
  }
}

function header(f: NpySpikeFile): NpyHeader {
  const h = readNpyHeader((offset, length) => f.data.read(offset, length), f.data.size, f.file);
  if (h.shape.length !== 1) {
    throw new InputError({ file: f.file, value: `(${h.shape.join(', ')})`, problem: 'expected a 1-D array', fix: 'save a flat array (numpy.ravel)' });
  }
  return h;
}

/**
 * Elements 0 .. m-1 of `bytes` (dtype of h) as exact float64 numbers into out;
 * 64-bit integers beyond +-(2^53 - 1) are an InputError naming the element
 * (first + i), worded as npyToFloat64 words it.
 */
function toFloat64(h: NpyHeader, bytes: Uint8Array, m: number, out: Float64Array, file: string, first: number): void {
  const d = h.dtype;
  if (d === 'i8' || d === 'u8') {
    const w = new Int32Array(bytes.buffer, bytes.byteOffset, 2 * m); // little-endian halves: lo, hi
    const signed = d === 'i8';
    for (let i = 0; i < m; i++) {
      const lo = w[2 * i] >>> 0;
      const hi = w[2 * i + 1];
      let ok: boolean;
      let v: number;
      if (signed) {
        ok = hi <= MAX_SAFE_HI && (hi > -MAX_SAFE_HI - 1 || (hi === -MAX_SAFE_HI - 1 && lo !== 0));
        v = hi * 4294967296 + lo;
      } else {
        ok = hi >>> 0 <= MAX_SAFE_HI;
        v = (hi >>> 0) * 4294967296 + lo;
      }
      if (!ok) {
        const big = npyTypedView(d, bytes.buffer, bytes.byteOffset, m) as BigInt64Array | BigUint64Array;
        throw new InputError({ file: `${file}, element ${first + i} (0-based)`, value: String(big[i]), problem: 'the integer is too large to be represented exactly' });
      }
      out[i] = v;
    }
    return;
  }
  const src = npyTypedView(d, bytes.buffer, bytes.byteOffset, m) as Exclude<ReturnType<typeof npyTypedView>, BigInt64Array | BigUint64Array>;
  out.set(src);
}
