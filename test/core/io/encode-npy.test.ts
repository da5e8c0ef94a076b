/**
 * encodeNpy against files written by NumPy 2.4 itself
 * (test/fixtures/sim/make-npy-fixtures.py, np.save): byte-for-byte equality,
 * which checks header layout, padding, dtype strings and data bytes at once.
 * When python3 with NumPy is on the machine, a second check has NumPy read
 * back what encodeNpy wrote (np.load) and compare values exactly.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { encodeNpy, type NpyWritable } from '../../../core/io/encode-npy';

const DIR = join(__dirname, '../../fixtures/sim/npy');
const manifest = JSON.parse(readFileSync(join(DIR, 'manifest.json'), 'utf8')) as {
  numpy: string;
  files: Record<string, { dtype: string; shape: number[]; values: number[] }>;
};

function typed(dtype: string, values: number[]): NpyWritable {
  switch (dtype) {
    case '<f8':
      return Float64Array.from(values);
    case '<f4':
      return Float32Array.from(values);
    case '<i4':
      return Int32Array.from(values);
    case '<i2':
      return Int16Array.from(values);
    case '|u1':
      return Uint8Array.from(values);
    case '<i8':
      return BigInt64Array.from(values.map((v) => BigInt(v)));
    default:
      throw new Error(`fixture dtype ${dtype} not covered`);
  }
}

describe('encodeNpy (reference: files written by NumPy ' + manifest.numpy + ')', () => {
  it('every fixture is used', () => {
    expect(Object.keys(manifest.files).sort()).toEqual(
      ['f4_small', 'f8_empty', 'f8_matrix_2x3', 'f8_times', 'i2_raw', 'i4_units', 'i8_big', 'u1_mask'].map((n) => n + '.npy'),
    );
  });
  it.each(Object.entries(manifest.files))('%s is byte-identical to np.save', (name, f) => {
    const want = new Uint8Array(readFileSync(join(DIR, name)));
    const got = encodeNpy(typed(f.dtype, f.values), f.shape);
    expect(got.length).toBe(want.length);
    expect(Buffer.from(got).equals(Buffer.from(want))).toBe(true);
  });
  it('refuses a shape that does not hold the data', () => {
    expect(() => encodeNpy(new Float64Array(5), [2, 3])).toThrow(/shape/);
  });
  const py = spawnSync('python3', ['-c', 'import numpy'], { encoding: 'utf8' });
  it.skipIf(py.status !== 0)('NumPy reads back large and odd-length arrays exactly (np.load)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tagbench-npy-'));
    try {
      const a = new Float64Array(100_003);
      for (let i = 0; i < a.length; i++) a[i] = i * 0.1 - i / 7; // IEEE-exact in both languages (no transcendental functions)
      const b = new Int32Array(12_345).map((_, i) => (i * 7919) % 65536 - 30000);
      writeFileSync(join(dir, 'a.npy'), encodeNpy(a));
      writeFileSync(join(dir, 'b.npy'), encodeNpy(b, [5, 2469]));
      const out = execFileSync(
        'python3',
        [
          '-c',
          `import numpy as np, sys
a = np.load(sys.argv[1]); b = np.load(sys.argv[2])
i = np.arange(100003)
print(a.dtype.str, a.shape, bool(np.array_equal(a, i * 0.1 - i / 7)))
print(b.dtype.str, b.shape, int(b[4, 2468]), int(b.sum()))`,
          join(dir, 'a.npy'),
          join(dir, 'b.npy'),
        ],
        { encoding: 'utf8' },
      ).trim().split('\n');
      expect(out[0]).toBe('<f8 (100003,) True');
      const sum = b.reduce((s, x) => s + x, 0);
      expect(out[1]).toBe(`<i4 (5, 2469) ${b[12_344]} ${sum}`);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('encodeNpy -> readNpy round trip (property-based, fast-check)', () => {
  it('any float64 / int32 / int16 array and 2-D shape comes back equal', async () => {
    const fc = await import('fast-check');
    const { readNpy } = await import('../../../core/io/read-npy');
    fc.assert(
      fc.property(
        fc.array(fc.double({ noNaN: true }), { maxLength: 200 }),
        fc.array(fc.integer({ min: -2147483648, max: 2147483647 }), { maxLength: 200 }),
        fc.integer({ min: 1, max: 7 }),
        (xs, ints, cols) => {
          const a = readNpy(encodeNpy(Float64Array.from(xs)), 'a.npy');
          expect(a.shape).toEqual([xs.length]);
          expect(Array.from(a.data as Float64Array)).toEqual(xs.map((x) => (Object.is(x, -0) ? -0 : x)));
          const rows = Math.floor(ints.length / cols);
          const m = Int32Array.from(ints.slice(0, rows * cols));
          const b = readNpy(encodeNpy(m, [rows, cols]), 'b.npy');
          expect(b.shape).toEqual([rows, cols]);
          expect(b.descr).toBe('<i4');
          expect(Array.from(b.data as Int32Array)).toEqual(Array.from(m));
          const c = readNpy(encodeNpy(Int16Array.from(ints.map((v) => v >> 16))), 'c.npy');
          expect(c.descr).toBe('<i2');
        },
      ),
      { seed: 42, numRuns: 200 },
    );
  });
});
