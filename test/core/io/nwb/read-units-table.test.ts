// Units table layout from the NWB 2.x schema (nwb-schema core/nwb.misc.yaml,
// "Units"): ragged spike_times + spike_times_index, obs_intervals [n, 2] +
// index, waveform_mean [units, samples(, electrodes)] in volts with a
// sampling_rate attribute, electrodes as a DynamicTableRegion. Small tables
// built in memory; the h5py-written fixtures are tested in
// test/core/node/nwb/load-nwb-session.test.ts.
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../../../core/errors';
import { readUnitsTable } from '../../../../core/io/nwb/read-units-table';
import { fakeHdf5, type FakeDataset, type FakeGroup } from './fake-hdf5';

const units = (members: Record<string, FakeDataset>, colnames: string[]): FakeGroup => ({
  members: { units: { attrs: { colnames, neurodata_type: 'Units' }, members } },
});

const base = {
  id: { data: BigInt64Array.of(9007199254740993n, 4n, 5n) }, // 2^53 + 1: kept exact as text
  spike_times: { data: Float64Array.of(0.1, 0.2, 0.3, 1.5) },
  spike_times_index: { data: BigUint64Array.of(3n, 3n, 4n) }, // unit 4 has no spikes
};

function inputError(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    expect(isInputError(e)).toBe(true);
    return (e as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('readUnitsTable', () => {
  it('splits ragged spike times, keeps 64-bit ids exact and allows an empty unit', () => {
    const r = readUnitsTable(fakeHdf5(units(base, ['spike_times'])), 'f.nwb', '/units');
    expect(r.units.map((u) => u.id)).toEqual(['9007199254740993', '4', '5']);
    expect(r.units.map((u) => Array.from(u.spikeTimes))).toEqual([[0.1, 0.2, 0.3], [], [1.5]]);
    expect(r.waveformSampleRateHz).toBeNaN();
  });

  it('a one-row table may omit the index', () => {
    const g = units({ id: { data: Int32Array.of(1) }, spike_times: { data: Float64Array.of(1, 2) } }, ['spike_times']);
    expect(Array.from(readUnitsTable(fakeHdf5(g), 'f.nwb', '/units').units[0].spikeTimes)).toEqual([1, 2]);
  });

  it('keeps observation intervals sorted and merged', () => {
    const g = units(
      { ...base, obs_intervals: { data: Float64Array.of(5, 9, 0, 4, 3, 6, 0, 10, 0, 1), shape: [5, 2] }, obs_intervals_index: { data: Uint8Array.of(3, 4, 5) } },
      ['spike_times', 'obs_intervals'],
    );
    const r = readUnitsTable(fakeHdf5(g), 'f.nwb', '/units');
    expect(Array.from(r.units[0].observedIntervals!)).toEqual([0, 9]);
    expect(Array.from(r.units[1].observedIntervals!)).toEqual([0, 10]);
  });

  it('picks the best channel by peak-to-peak (first on ties), converts volts to microvolts, keeps extra columns', () => {
    // [3 units, 3 samples, 2 electrodes], row-major
    const wf = Float32Array.of(
      /* unit 0 */ 0, 0, -1e-4, -2e-4, 0, 0, // ch0 ptp 1e-4, ch1 ptp 2e-4 -> ch1
      /* unit 1 */ 0, 0, -5e-5, -5e-5, 1e-5, 1e-5, // tie -> ch0
      /* unit 2 */ 1e-6, 0, 0, 0, 0, 0,
    );
    const g = units(
      {
        ...base,
        waveform_mean: { data: wf, shape: [3, 3, 2], attrs: { sampling_rate: 30000, unit: 'volts' } },
        quality: { data: ['good', 'noise', 'mua'] },
        amp: { data: Float64Array.of(1, 2, 3) },
        flag: { data: Int8Array.of(1, 0, 1), attrs: {} },
      },
      ['spike_times', 'waveform_mean', 'quality', 'amp'],
    );
    const r = readUnitsTable(fakeHdf5(g), 'f.nwb', '/units');
    expect(r.waveformSampleRateHz).toBe(30000);
    expect(r.units.map((u) => u.meta.waveform_channel)).toEqual([1, 0, 0]);
    // exact: float32 value widened to float64, times 1e6 (one rounding), as NumPy computes it
    expect(Array.from(r.units[0].waveformMean!)).toEqual([0, -2e-4, 0].map((x) => Math.fround(x) * 1e6));
    expect(r.units.map((u) => u.meta.quality)).toEqual(['good', 'noise', 'mua']);
    expect(r.units.map((u) => u.meta.amp)).toEqual([1, 2, 3]);
    expect(r.units.map((u) => u.meta.flag)).toEqual([1, 0, 1]); // not in colnames, still a one-value-per-row column
    expect(r.warnings).toEqual([]);
  });

  it('warns and takes microvolts when "volts" values are implausibly large', () => {
    const g = units({ ...base, waveform_mean: { data: Float32Array.of(0, -80, 0, -90, 0, -70), shape: [3, 2], attrs: { sampling_rate: 30000 } } }, ['spike_times', 'waveform_mean']);
    const r = readUnitsTable(fakeHdf5(g), 'f.nwb', '/units');
    expect(Array.from(r.units[0].waveformMean!)).toEqual([0, -80]);
    expect(r.warnings.map((w) => w.code)).toEqual(['nwb-waveform-unit']);
  });

  it('names the unit and row of a NaN or unsorted spike time', () => {
    const nan = units({ ...base, spike_times: { data: Float64Array.of(0.1, NaN, 0.3, 1.5) } }, ['spike_times']);
    expect(inputError(() => readUnitsTable(fakeHdf5(nan), 'f.nwb', '/units'))).toContain('spike 1 (counting from 0) of unit 9007199254740993 (table row 0) is not a finite time');
    const uns = units({ ...base, spike_times: { data: Float64Array.of(0.1, 0.3, 0.2, 1.5) } }, ['spike_times']);
    expect(inputError(() => readUnitsTable(fakeHdf5(uns), 'f.nwb', '/units'))).toContain('are not sorted');
  });

  it('rejects duplicate ids, a missing spike_times column, a missing table and an index of the wrong length', () => {
    const dup = units({ ...base, id: { data: Int32Array.of(1, 1, 2) } }, ['spike_times']);
    expect(inputError(() => readUnitsTable(fakeHdf5(dup), 'f.nwb', '/units'))).toContain('appears twice');
    const none = units({ id: base.id }, []);
    expect(inputError(() => readUnitsTable(fakeHdf5(none), 'f.nwb', '/units'))).toContain('has no spike_times column');
    expect(inputError(() => readUnitsTable(fakeHdf5({ members: {} }), 'f.nwb', '/units'))).toContain('no units table at /units');
    const short = units({ ...base, spike_times_index: { data: Uint8Array.of(3, 4) } }, ['spike_times']);
    expect(inputError(() => readUnitsTable(fakeHdf5(short), 'f.nwb', '/units'))).toContain('index has 2 rows but the table /units has 3');
  });
});
