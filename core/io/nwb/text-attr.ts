/**
 * A text attribute of an HDF5 object as one string ("" when absent or not
 * text). A one-element string array (as some writers store scalars) counts
 * as its element.
 */
import type { Hdf5File } from './hdf5-access';

export function textAttr(h5: Hdf5File, path: string, name: string): string {
  const v = h5.attr(path, name);
  if (typeof v === 'string') return v;
  if (Array.isArray(v) && v.length === 1 && typeof v[0] === 'string') return v[0];
  return '';
}
