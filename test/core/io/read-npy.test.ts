/**
 * The .npy reader against files written by NumPy itself
 * (test/fixtures/npy/make_fixtures.py; NumPy version in manifest.json).
 * Reference: NumPy's own writer, numpy.lib.format.write_array (NEP 1 format).
 * Values must match exactly (tolerance 0: the bytes are the same IEEE numbers).
 */
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors';
import { npyToFloat64 } from '../../../core/io/npy-to-float64';
import { readNpy } from '../../../core/io/read-npy';

const DIR = join(__dirname, '../../fixtures/npy');
const manifest = JSON.parse(readFileSync(join(DIR, 'manifest.json'), 'utf8')) as {
  numpy: string;
  good: { file: string; dtype: string; shape: number[]; version: string; values: string[] }[];
  bad: { file: string; problem: string }[];
};
const num = (s: string) => (s === 'inf' ? Infinity : s === '-inf' ? -Infinity : Number(s));

describe(`readNpy vs files written by NumPy ${manifest.numpy}`, () => {
  it('every fixture file is listed in the manifest and vice versa', () => {
    const files = readdirSync(DIR).filter((f) => f.endsWith('.npy')).sort();
    const listed = [...manifest.good, ...manifest.bad].map((f) => f.file).sort();
    expect(files).toEqual(listed);
    expect(manifest.good.length).toBeGreaterThanOrEqual(10);
  });

  it.each(manifest.good.map((g) => [g.file, g] as const))('%s', (_f, g) => {
    const bytes = new Uint8Array(readFileSync(join(DIR, g.file)));
    const a = readNpy(bytes, g.file);
    expect(a.descr).toBe(g.dtype);
    expect(a.shape).toEqual(g.shape);
    expect(a.version).toBe(g.version);
    if (g.dtype.endsWith('8') && g.dtype.includes('i') || g.dtype.includes('u8')) {
      expect(Array.from(a.data as BigInt64Array, String)).toEqual(g.values);
    }
    const x = npyToFloat64(a, g.file);
    expect(Array.from(x)).toEqual(g.values.map(num));
  });

  it('reads from an unaligned byte offset (copies instead of viewing)', () => {
    const raw = readFileSync(join(DIR, 'f8_v1.npy'));
    const shifted = new Uint8Array(raw.length + 3);
    shifted.set(raw, 3);
    const a = readNpy(shifted.subarray(3), 'f8_v1.npy');
    expect(Array.from(a.data as Float64Array)).toEqual(manifest.good[0].values.map(Number));
  });

  it.each(manifest.bad.map((b) => [b.file, b.problem] as const))('%s -> error mentioning "%s"', (file, problem) => {
    const bytes = new Uint8Array(readFileSync(join(DIR, file)));
    let err: unknown;
    try {
      readNpy(bytes, file);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(InputError);
    expect((err as Error).message).toContain(`${file}: `);
    expect((err as Error).message).toContain(problem);
  });

  it('rejects int64 values beyond 2^53 when converting to numbers', () => {
    const a = { descr: '<i8', dtype: 'i8', shape: [2], version: '1.0', data: BigInt64Array.from([1n, 2n ** 60n]) };
    expect(() => npyToFloat64(a, 'units.npy')).toThrow(/units\.npy, element 1 \(0-based\).*too large/);
  });
});
