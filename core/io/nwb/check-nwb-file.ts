/**
 * Checks that an open HDF5 file is an NWB 2.x file and returns its
 * `nwb_version` (root attribute, NWB 2.x schema core/nwb.file.yaml).
 *
 * Supported: NWB 2.0.0 up to any 2.x release (SUPPORTED_NWB above). The
 * version string may carry a prefix ("NWB-2.1.0") or a suffix ("2.7.0-alpha").
 * Errors (InputError, naming the file):
 *  - no `nwb_version` attribute and no NWB markers: an HDF5 file that is not NWB;
 *  - NWB 1.x (version in a root dataset, "NWB-1.0.x"): unsupported, say which are;
 *  - any other major version: unsupported, say which are.
 */
import { InputError } from '../../errors';
import type { Hdf5File } from './hdf5-access';
import { textAttr } from './text-attr';

/** Supported NWB versions, as users read them. */
export const SUPPORTED_NWB = 'NWB 2.x (2.0.0 and later 2.* releases)';

export function checkNwbFile(h5: Hdf5File, file: string): string {
  let version = textAttr(h5, '/', 'nwb_version');
  if (!version && h5.kind('/nwb_version') === 'dataset') {
    const v = h5.read('/nwb_version');
    version = Array.isArray(v) ? String(v[0] ?? '') : '';
  }
  if (!version) {
    const type = textAttr(h5, '/', 'neurodata_type');
    throw new InputError({
      file,
      problem: `this HDF5 file is not an NWB file (it has no nwb_version attribute${type ? '' : ' and no NWBFile type'})`,
      fix: `give an ${SUPPORTED_NWB} file, or a session folder`,
    });
  }
  const m = /(\d+)\.(\d+)(?:\.(\d+))?/.exec(version);
  const major = m ? Number(m[1]) : NaN;
  if (major !== 2) {
    throw new InputError({
      file,
      value: version,
      problem: `unsupported NWB version${major === 1 ? ' (NWB 1.x files use a different layout)' : ''}`,
      fix: `tagbench reads ${SUPPORTED_NWB}; convert the file to a current NWB 2 version`,
    });
  }
  return version;
}
