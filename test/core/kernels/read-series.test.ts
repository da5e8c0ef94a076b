import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors';
import { readSeries } from '../../../core/kernels/read-series';

const text = (s: string) => new TextEncoder().encode(s);

/** A little-endian float64 .npy file (format 1.0, as numpy.save writes it; NEP 1). */
function npy(values: number[], shape: number[]): Uint8Array {
  let header = `{'descr': '<f8', 'fortran_order': False, 'shape': (${shape.join(', ')}${shape.length === 1 ? ',' : ''}), }`;
  const total = 10 + header.length + 1;
  header += ' '.repeat((64 - (total % 64)) % 64) + '\n';
  const out = new Uint8Array(10 + header.length + 8 * values.length);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, header.length & 0xff, header.length >> 8]);
  out.set(text(header), 10);
  const dv = new DataView(out.buffer, 10 + header.length);
  values.forEach((v, i) => dv.setFloat64(8 * i, v, true));
  return out;
}

describe('readSeries', () => {
  it('reads time/value CSV and finds an even rate', () => {
    const s = readSeries(text('time,value\n0,1\n0.1,2\n0.2,\n'), 'trace.csv');
    expect([...s.times]).toEqual([0, 0.1, 0.2]);
    expect(s.values[1]).toBe(2);
    expect(s.values[2]).toBeNaN();
    expect(s.rateHz).toBeCloseTo(10, 9);
  });
  it('reads a one-column CSV with a given rate and start', () => {
    const s = readSeries(text('dff\n1\n2\n3\n'), 'k.csv', { rateHz: 4, startS: 1 });
    expect([...s.times]).toEqual([1, 1.25, 1.5]);
    expect([...s.values]).toEqual([1, 2, 3]);
  });
  it('reads 1-D and N x 2 .npy files', () => {
    expect([...readSeries(npy([5, 6], [2]), 'a.npy', { rateHz: 2 }).times]).toEqual([0, 0.5]);
    const s = readSeries(npy([0, 1, 0.5, 2, 1.5, 3], [3, 2]), 'b.npy');
    expect([...s.times]).toEqual([0, 0.5, 1.5]);
    expect([...s.values]).toEqual([1, 2, 3]);
    expect(s.rateHz).toBeNaN(); // uneven
  });
  it('names the file, row and fix for bad input', () => {
    expect(() => readSeries(text('time,value\n0,1\n0,2\n'), 't.csv')).toThrow(/t\.csv, row 3, column "time".*increase strictly/);
    expect(() => readSeries(text('a,b,c\n1,2,3\n'), 't.csv')).toThrow(/no "value" column/);
    expect(() => readSeries(text('value\n1\n'), 't.csv')).toThrow(/no "time" column and no sample rate/);
    expect(() => readSeries(npy([1, 2], [2]), 'a.npy')).toThrow(InputError);
    expect(() => readSeries(npy([1, 2, 3], [1, 3]), 'a.npy')).toThrow(/N x 2/);
  });
});
