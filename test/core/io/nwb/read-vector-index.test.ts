// Source: hdmf-common VectorIndex as used by the NWB 2.x schema (nwb-schema
// core/nwb.misc.yaml, Units.spike_times_index): row i of a ragged column is
// data[index[i-1] : index[i]], index[-1] = 0; index dtypes uint8 .. uint64.
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../../../core/errors';
import type { H5Data } from '../../../../core/io/nwb/hdf5-access';
import { readVectorIndex } from '../../../../core/io/nwb/read-vector-index';
import { fakeHdf5 } from './fake-hdf5';

const withIndex = (data: H5Data) => fakeHdf5({ members: { t: { members: { idx: { data } } } } });

describe('readVectorIndex', () => {
  it.each([
    ['uint8', Uint8Array.of(2, 2, 5)],
    ['uint16', Uint16Array.of(2, 2, 5)],
    ['uint32', Uint32Array.of(2, 2, 5)],
    ['int32', Int32Array.of(2, 2, 5)],
    ['int64 (BigInt)', BigInt64Array.of(2n, 2n, 5n)],
    ['uint64 (BigInt)', BigUint64Array.of(2n, 2n, 5n)],
  ])('reads %s end indexes exactly', (_name, data) => {
    expect(Array.from(readVectorIndex(withIndex(data), 'f.nwb', '/t/idx', 5))).toEqual([2, 2, 5]);
  });

  it('accepts an empty index and an index that stops short of the data', () => {
    expect(readVectorIndex(withIndex(new Uint8Array(0)), 'f.nwb', '/t/idx', 3).length).toBe(0);
    expect(Array.from(readVectorIndex(withIndex(Uint8Array.of(1)), 'f.nwb', '/t/idx', 3))).toEqual([1]);
  });

  const fails = (data: H5Data, length: number, fragment: string) => {
    try {
      readVectorIndex(withIndex(data), 'f.nwb', '/t/idx', length);
    } catch (e) {
      expect(isInputError(e)).toBe(true);
      expect((e as Error).message).toContain('f.nwb');
      expect((e as Error).message).toContain('/t/idx');
      expect((e as Error).message).toContain(fragment);
      return;
    }
    throw new Error('expected an InputError');
  };
  it('rejects an end past the data, naming the row', () => fails(Uint8Array.of(2, 9), 5, 'table row 1'));
  it('rejects a decreasing index', () => fails(Uint8Array.of(3, 2), 5, 'must not decrease'));
  it('rejects a uint64 beyond 2^53 (cannot be a real length)', () => fails(BigUint64Array.of(2n ** 60n), 5, 'index out of range'));
  it('rejects a float index', () => {
    try {
      readVectorIndex(withIndex(Float64Array.of(1, 2)), 'f.nwb', '/t/idx', 5);
      throw new Error('expected an InputError');
    } catch (e) {
      expect(isInputError(e)).toBe(true);
      expect((e as Error).message).toContain('should hold integers');
    }
  });
});

describe('readFloat64Blocks', () => {
  it('gives the same values block by block as in one read, for any block size', async () => {
    const { readFloat64Blocks } = await import('../../../../core/io/nwb/read-float64-blocks');
    const data = Float64Array.from({ length: 1001 }, (_, i) => i * 0.5);
    const h5 = fakeHdf5({ members: { d: { data } } });
    for (const block of [1, 7, 1000, 1001, 5000]) expect(Array.from(readFloat64Blocks(h5, 'f.nwb', '/d', block))).toEqual(Array.from(data));
    const big = fakeHdf5({ members: { d: { data: BigUint64Array.of(1n, 2n, 3n) } } });
    expect(Array.from(readFloat64Blocks(big, 'f.nwb', '/d', 2))).toEqual([1, 2, 3]);
  });
});
