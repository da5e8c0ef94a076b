/**
 * The piecewise .npy spike reader (core/io/npy-spike-pieces.ts) against the
 * whole-array reader (readNpy + npyToFloat64, itself checked against files
 * written by NumPy 2.4 in test/fixtures/npy), on the same bytes: every dtype,
 * piece lengths from 1 up (piece boundaries anywhere), unsorted spikes,
 * integer sample times, negative and 64-bit unit ids, hosts with and without
 * readInto and random access. Exact equality throughout (tolerance 0: the same
 * IEEE operations on the same numbers). Hashes against node:crypto's SHA-256.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors';
import { buildRecording } from '../../../core/io/build-recording';
import { createSha256 } from '../../../core/io/create-sha256';
import { importSession } from '../../../core/io/import-session';
import { npySpikePieces, type NpySpikeFile } from '../../../core/io/npy-spike-pieces';
import { npyToFloat64 } from '../../../core/io/npy-to-float64';
import { readNpy } from '../../../core/io/read-npy';
import type { RandomAccessFile, SessionSource } from '../../../core/io/session-source';
import { memorySource } from '../../helpers/memory-source';
import { npyBytes } from '../../helpers/npy-bytes';

const sha = (b: Uint8Array) => createHash('sha256').update(b).digest('hex');

/** Random access over bytes; `into` adds readInto (as the Node host has). */
function access(bytes: Uint8Array, into: boolean): RandomAccessFile {
  const f: RandomAccessFile = { size: bytes.length, read: (o, n) => bytes.slice(o, o + n) };
  if (into) {
    return {
      ...f,
      readInto: (o, b) => {
        const part = bytes.subarray(o, o + b.length);
        b.set(part);
        return part.length;
      },
    };
  }
  return f;
}
const file = (name: string, bytes: Uint8Array, into = true): NpySpikeFile => ({ file: name, data: access(bytes, into), hash: createSha256() });

/** What the whole-array path gives: times (s) and unit ids per spike, in file order. */
function reference(tBytes: Uint8Array, uBytes: Uint8Array, factor: number): { time: number[]; id: string[] } {
  const t = Array.from(npyToFloat64(readNpy(tBytes, 'spikes.npy'), 'spikes.npy'), (x) => (factor === 1 ? x : x * factor));
  const u = Array.from(npyToFloat64(readNpy(uBytes, 'units.npy'), 'units.npy'), String);
  return { time: t, id: u };
}

/** Visits the pieces and returns times and ids per spike in file order, with the pieces' first indices. */
function visitAll(tBytes: Uint8Array, uBytes: Uint8Array, pieceLength: number, factor = 1, into = true) {
  const r = npySpikePieces(file('spikes.npy', tBytes, into), file('units.npy', uBytes, into), { timeFactor: () => factor, pieceLength });
  const time: number[] = [];
  const id: string[] = [];
  const firsts: number[] = [];
  r.pieces.forEach((unit, t, first) => {
    firsts.push(first);
    expect(unit.length).toBe(t.length);
    for (let i = 0; i < t.length; i++) {
      time.push(t[i]);
      id.push(r.unitIds[unit[i]]);
    }
  });
  return { time, id, firsts, unitIds: r.unitIds, timesHashed: r.timesHashed() };
}

function lcg(seed: number) {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
}

describe('npySpikePieces vs the whole-array reader', () => {
  const rnd = lcg(7);
  const n = 1000;
  const tF8 = Float64Array.from({ length: n }, () => rnd() * 100); // unsorted
  const idsPool = [0, 3, 17, 1023, 1024, 5000, 2 ** 20 + 5, -1, 2 ** 40];
  const uI8 = BigInt64Array.from({ length: n }, () => BigInt(idsPool[Math.floor(rnd() * idsPool.length)]));
  const uI4 = Int32Array.from(uI8, (v) => Number(v % 2n ** 31n));
  const uU2 = Uint16Array.from(uI4, (v) => Math.abs(v) % 65536);
  const uF8 = Float64Array.from(uI8, Number);
  const tI8 = BigInt64Array.from({ length: n }, () => BigInt(Math.floor(rnd() * 2 ** 40)));
  const tI4 = Int32Array.from({ length: n }, () => Math.floor(rnd() * 2 ** 31));
  const tF4 = Float32Array.from(tF8);

  const cases: [string, Uint8Array, Uint8Array, number][] = [
    ['f8 times, i8 ids', npyBytes(tF8), npyBytes(uI8), 1],
    ['f8 times, i4 ids', npyBytes(tF8), npyBytes(uI4), 1],
    ['f8 times, u2 ids', npyBytes(tF8), npyBytes(uU2), 1],
    ['f8 times, whole f8 ids', npyBytes(tF8), npyBytes(uF8), 1],
    ['i8 sample counts at 30 kHz', npyBytes(tI8), npyBytes(uI4), 1 / 30000],
    ['i4 sample counts at 25 kHz', npyBytes(tI4), npyBytes(uI4), 1 / 25000],
    ['f4 times in ms', npyBytes(tF4), npyBytes(uI4), 1e-3],
  ];
  for (const [name, tb, ub, factor] of cases) {
    it(`${name}: same spikes for every piece length and host`, () => {
      const want = reference(tb, ub, factor);
      for (const P of [1, 2, 3, 7, 64, 999, 1000, 1 << 18]) {
        for (const into of [true, false]) {
          const got = visitAll(tb, ub, P, factor, into);
          expect(got.time).toEqual(want.time);
          expect(got.id).toEqual(want.id);
          expect(got.firsts).toEqual(Array.from({ length: Math.ceil(n / Math.min(P, n)) }, (_, k) => k * Math.min(P, n)));
          // codes in order of first appearance, whatever the piece length
          expect(got.unitIds).toEqual([...new Set(want.id)]);
          expect(got.timesHashed).toBe(true);
        }
      }
    });

    it(`${name}: codeCounts equals a count of the pieces' unit codes (what buildRecording would count)`, () => {
      for (const P of [1, 7, 1000, 1 << 18]) {
        const r = npySpikePieces(file('spikes.npy', tb), file('units.npy', ub), { timeFactor: () => factor, pieceLength: P });
        const count = new Float64Array(r.unitIds.length);
        const first = new Float64Array(r.unitIds.length).fill(-1);
        r.pieces.forEachUnit((unit, f) => {
          for (let i = 0; i < unit.length; i++) if (count[unit[i]]++ === 0) first[unit[i]] = f + i;
        });
        const got = r.pieces.codeCounts!();
        expect(Array.from(got.count)).toEqual(Array.from(count));
        expect(Array.from(got.first)).toEqual(Array.from(first));
        expect(got.count.reduce((a, b) => a + b, 0)).toBe(n);
      }
    });
  }

  it('every 1-D fixture written by NumPy reads as readNpy reads it (as times)', () => {
    const DIR = join(__dirname, '../../fixtures/npy');
    const manifest = JSON.parse(readFileSync(join(DIR, 'manifest.json'), 'utf8')) as { good: { file: string; shape: number[] }[] };
    const oneD = manifest.good.filter((g) => g.shape.length === 1 && g.shape[0] > 0);
    expect(oneD.length).toBeGreaterThanOrEqual(9);
    for (const g of oneD) {
      const tb = new Uint8Array(readFileSync(join(DIR, g.file)));
      const ub = npyBytes(new Int32Array(g.shape[0]));
      const want = Array.from(npyToFloat64(readNpy(tb, g.file), g.file));
      for (const P of [1, 4, 100]) expect(visitAll(tb, ub, P).time).toEqual(want);
      // and as unit ids when they are whole numbers
      if (!g.file.startsWith('f')) {
        const tz = npyBytes(new Float64Array(g.shape[0]));
        expect(visitAll(tz, tb, 2).id).toEqual(want.map(String));
      }
    }
  });

  it('hashes both files exactly (reference: node:crypto SHA-256 of the whole file)', () => {
    const tb = npyBytes(tF8);
    const ub = npyBytes(uI8);
    for (const P of [1, 33, 5000]) {
      const t = file('spikes.npy', tb);
      const u = file('units.npy', ub);
      const r = npySpikePieces(t, u, { timeFactor: () => 1, pieceLength: P });
      expect(u.hash.digestHex()).toBe(sha(ub));
      r.pieces.forEach(() => {});
      r.pieces.forEach(() => {}); // a second visit does not hash again
      expect(t.hash.digestHex()).toBe(sha(tb));
    }
  });

  it('grouped by buildRecording: the same recording as from whole arrays', () => {
    const tb = npyBytes(tF8);
    const ub = npyBytes(uI8);
    const r = npySpikePieces(file('spikes.npy', tb), file('units.npy', ub), { timeFactor: () => 1, pieceLength: 37 });
    const cols = { file: 'spikes.npy', columns: { unit: 'units.npy', time: 'spikes.npy' } };
    const fromPieces = buildRecording({ spikes: { ...cols, unitIds: r.unitIds, pieces: r.pieces }, toleranceS: 1 });
    const want = reference(tb, ub, 1);
    const ids = [...new Set(want.id)];
    const fromArrays = buildRecording({
      spikes: { ...cols, unitIds: ids, unit: Int32Array.from(want.id, (x) => ids.indexOf(x)), time: Float64Array.from(want.time) },
      toleranceS: 1,
    });
    expect(fromPieces.recording.units.map((u) => [u.id, Array.from(u.spikeTimes)])).toEqual(fromArrays.recording.units.map((u) => [u.id, Array.from(u.spikeTimes)]));
    expect(fromPieces.warnings).toEqual(fromArrays.warnings);
    expect(fromPieces.recording.span).toEqual(fromArrays.recording.span);
  });
});

describe('npySpikePieces: errors name the file and the 0-based element', () => {
  const msg = (f: () => unknown): string => {
    try {
      f();
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      return (e as Error).message;
    }
    throw new Error('expected an InputError');
  };
  const run = (tb: Uint8Array, ub: Uint8Array, P = 4) => {
    const r = npySpikePieces(file('spikes.npy', tb), file('units.npy', ub), { timeFactor: () => 1, pieceLength: P });
    r.pieces.forEach(() => {});
  };
  const t10 = npyBytes(Float64Array.from({ length: 10 }, (_, i) => i));

  it('a unit id that is not a whole number, in a later piece', () => {
    const u = Float64Array.from({ length: 10 }, () => 1);
    u[9] = 2.5;
    expect(msg(() => run(t10, npyBytes(u)))).toBe('units.npy, element 9 (0-based): unit ids must be whole numbers (value "2.5"). Save the unit of each spike as an integer array.');
  });
  it('64-bit ids and times beyond 2^53', () => {
    const u = new BigInt64Array(10);
    u[6] = 2n ** 53n;
    expect(msg(() => run(t10, npyBytes(u)))).toBe('units.npy, element 6 (0-based): the integer is too large to be represented exactly (value "9007199254740992").');
    u[6] = -(2n ** 53n);
    expect(msg(() => run(t10, npyBytes(u)))).toMatch(/element 6 .*value "-9007199254740992"/);
    u[6] = -(2n ** 53n) + 1n; // -(2^53 - 1) is exact
    expect(() => run(t10, npyBytes(u))).not.toThrow();
    const t = BigUint64Array.from({ length: 10 }, (_, i) => BigInt(i));
    t[5] = 2n ** 64n - 1n;
    expect(msg(() => run(npyBytes(t), npyBytes(new Int32Array(10))))).toBe('spikes.npy, element 5 (0-based): the integer is too large to be represented exactly (value "18446744073709551615").');
  });
  it('shape and length problems', () => {
    expect(msg(() => run(npyBytes(new Float64Array(4), [2, 2]), npyBytes(new Int32Array(4))))).toBe('spikes.npy: expected a 1-D array (value "(2, 2)"). Save a flat array (numpy.ravel).');
    expect(msg(() => run(t10, npyBytes(new Int32Array(9))))).toBe('units.npy: holds 9 unit ids but spikes.npy holds 10 spike times. Both arrays need one element per spike, in the same order.');
    expect(msg(() => run(t10.subarray(0, t10.length - 3), npyBytes(new Int32Array(10))))).toMatch(/^spikes\.npy: the data is truncated: shape \(10\) of <f8 needs 80 bytes, the file holds 77/);
  });
  it('a bad time in a later piece is named by its element (checked by buildRecording)', () => {
    const t = Float64Array.from({ length: 10 }, (_, i) => i);
    t[7] = NaN;
    const r = npySpikePieces(file('spikes.npy', npyBytes(t)), file('units.npy', npyBytes(new Int32Array(10))), { timeFactor: () => 1, pieceLength: 3 });
    const spikes = { file: 'spikes.npy', columns: { unit: 'units.npy', time: 'spikes.npy' }, unitIds: r.unitIds, pieces: r.pieces };
    expect(msg(() => buildRecording({ spikes, toleranceS: 1 }))).toBe(
      'spikes.npy, element 7 (0-based), column "spikes.npy": time is not a finite number (value "NaN"). Remove the row or give a time in seconds.',
    );
  });
  it('a file that changes between reads', () => {
    const ub = npyBytes(new Int32Array(10));
    const t = file('spikes.npy', t10);
    let dataReads = 0; // the second read of the data (after the full first read) sees other ids
    const u: NpySpikeFile = {
      file: 'units.npy',
      hash: createSha256(),
      data: { size: ub.length, read: (o, n) => (o > 12 && n < 100 && ++dataReads === 2 ? ub.slice(o, o + n).fill(9) : ub.slice(o, o + n)) },
    };
    const r = npySpikePieces(t, u, { timeFactor: () => 1, pieceLength: 100 });
    expect(msg(() => r.pieces.forEach(() => {}))).toMatch(/^units\.npy: the file changed \(or became shorter\) while it was being read/);
  });
  it('a units file that changes between its counting read and the grouping read (same ids, other counts)', () => {
    const u0 = Int32Array.from({ length: 10 }, (_, i) => i % 2); // 5 + 5
    const u1 = Int32Array.from({ length: 10 }, (_, i) => (i < 3 ? 0 : 1)); // 3 + 7, same ids in the same order
    const b0 = npyBytes(u0);
    const b1 = npyBytes(u1);
    let fullReads = 0;
    const u: NpySpikeFile = {
      file: 'units.npy',
      hash: createSha256(),
      data: { size: b0.length, read: (o, len) => (o >= 64 && len === 40 && ++fullReads > 1 ? b1 : b0).slice(o, o + len) },
    };
    const r = npySpikePieces(file('spikes.npy', t10), u, { timeFactor: () => 1, pieceLength: 10 });
    const spikes = { file: 'spikes.npy', columns: { unit: 'units.npy', time: 'spikes.npy' }, unitIds: r.unitIds, pieces: r.pieces };
    expect(msg(() => buildRecording({ spikes, toleranceS: 1 }))).toBe('spikes.npy: the spike table changed while it was being read. Wait until the files are completely written, then import again.');
  });
});

describe('importSession with .npy spikes on hosts without random access', () => {
  it('empty arrays: the same message as an empty spike table', async () => {
    const files = { 'spikes.npy': npyBytes(new Float64Array(0)), 'units.npy': npyBytes(new Int32Array(0)) };
    await expect(importSession(memorySource(files))).rejects.toThrow('spikes.npy: the spike table has no rows. Export at least one spike (one row per spike: unit, time).');
  });

  it('reads the whole files instead and gives the same recording and hashes', async () => {
    const rnd = lcg(3);
    const t = Float64Array.from({ length: 500 }, () => rnd() * 50);
    const u = Int32Array.from({ length: 500 }, () => Math.floor(rnd() * 7));
    const files = { 'spikes.npy': npyBytes(t), 'units.npy': npyBytes(u), 'events.csv': 'time,event\n1,reward\n' };
    const withRa = await importSession(memorySource(files));
    const base = memorySource(files);
    const noRa: SessionSource = { name: base.name, list: base.list, stream: base.stream, readAll: base.readAll };
    const without = await importSession(noRa);
    const units = (r: typeof withRa) => r.recording.units.map((x) => [x.id, Array.from(x.spikeTimes)]);
    expect(units(without)).toEqual(units(withRa));
    expect(without.inputs).toEqual(withRa.inputs);
    expect(withRa.inputs.map((i) => i.file)).toEqual(['spikes.npy', 'units.npy', 'events.csv']);
    expect(withRa.inputs[0].sha256).toBe(sha(files['spikes.npy']));
    expect(withRa.inputs[1].sha256).toBe(sha(files['units.npy']));
    expect(withRa.warnings.map((w) => w.code)).toEqual(['unsorted-spikes']);
    // each unit: its spikes in time order (reference: a plain sort of the file's values)
    for (const [id, st] of units(withRa) as [string, number[]][]) {
      const want = Array.from(t).filter((_, i) => String(u[i]) === id).sort((a, b) => a - b);
      expect(st).toEqual(want);
    }
  });
});
