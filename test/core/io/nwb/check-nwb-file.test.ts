// NWB 2.x root attribute nwb_version (nwb-schema core/nwb.file.yaml); NWB 1.x
// stored the version as a root dataset "NWB-1.0.x" (NWB 1.0 specification).
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../../../core/errors';
import { checkNwbFile } from '../../../../core/io/nwb/check-nwb-file';
import { fakeHdf5 } from './fake-hdf5';

const root = (attrs: Record<string, string>) => fakeHdf5({ attrs, members: {} });

describe('checkNwbFile', () => {
  it.each(['2.0.0', '2.2.5', '2.7.0', '2.8.0', 'NWB-2.1.0', '2.6.0-alpha'])('accepts %s', (v) => {
    expect(checkNwbFile(root({ nwb_version: v, neurodata_type: 'NWBFile' }), 'f.nwb')).toBe(v);
  });
  it.each([
    ['3.0.0', '3.0.0'],
    ['1.0.6', 'NWB 1.x'],
  ])('rejects version %s, saying which are supported', (v, fragment) => {
    try {
      checkNwbFile(root({ nwb_version: v }), 'f.nwb');
      throw new Error('expected an InputError');
    } catch (e) {
      expect(isInputError(e)).toBe(true);
      expect((e as Error).message).toContain(fragment);
      expect((e as Error).message).toContain('NWB 2.x (2.0.0 and later');
    }
  });
  it('rejects an HDF5 file without NWB markers', () => {
    expect(() => checkNwbFile(root({}), 'f.h5')).toThrow(/f\.h5: this HDF5 file is not an NWB file/);
  });
  it('reads the NWB 1.x root dataset and rejects it', () => {
    const h5 = fakeHdf5({ members: { nwb_version: { data: ['NWB-1.0.6'], shape: [] } } });
    expect(() => checkNwbFile(h5, 'old.nwb')).toThrow(/unsupported NWB version \(NWB 1\.x/);
  });
});
