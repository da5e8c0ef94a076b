/**
 * An in-memory Hdf5File for unit tests of the pure NWB logic: a tree of
 * groups and datasets described as plain objects. Not a fixture writer: the
 * NWB fixtures proper are written by h5py (test/fixtures/nwb/make_fixtures.py).
 */
import type { H5AttrValue, H5Class, H5Data, H5DatasetInfo, Hdf5File } from '../../../../core/io/nwb/hdf5-access';

export interface FakeDataset {
  readonly data: H5Data;
  readonly shape?: readonly number[];
  readonly attrs?: Record<string, H5AttrValue>;
}
export interface FakeGroup {
  readonly attrs?: Record<string, H5AttrValue>;
  readonly members: Record<string, FakeGroup | FakeDataset>;
}

const isDataset = (x: FakeGroup | FakeDataset): x is FakeDataset => 'data' in x;

export function fakeHdf5(root: FakeGroup): Hdf5File {
  const at = (path: string): FakeGroup | FakeDataset | null => {
    let node: FakeGroup | FakeDataset = root;
    for (const part of path.split('/').filter(Boolean)) {
      if (isDataset(node)) return null;
      const next: FakeGroup | FakeDataset | undefined = node.members[part];
      if (!next) return null;
      node = next;
    }
    return node;
  };
  const classOf = (d: H5Data): H5Class => {
    if (Array.isArray(d)) return 'string';
    if (d instanceof Float64Array || d instanceof Float32Array) return 'float';
    if (d instanceof BigUint64Array || d instanceof Uint8Array || d instanceof Uint16Array || d instanceof Uint32Array) return 'uint';
    return 'int';
  };
  const ds = (path: string): FakeDataset => {
    const n = at(path);
    if (!n || !isDataset(n)) throw new Error(`fake: no dataset ${path}`);
    return n;
  };
  return {
    kind: (path) => {
      const n = at(path);
      return n ? (isDataset(n) ? 'dataset' : 'group') : null;
    },
    keys: (path) => {
      const n = at(path);
      return n && !isDataset(n) ? Object.keys(n.members).sort() : [];
    },
    attrNames: (path) => Object.keys(at(path)?.attrs ?? {}),
    attr: (path, name) => at(path)?.attrs?.[name],
    info: (path): H5DatasetInfo => {
      const d = ds(path);
      const bytes = Array.isArray(d.data) ? 0 : (d.data as { BYTES_PER_ELEMENT: number }).BYTES_PER_ELEMENT;
      return { shape: d.shape ?? [d.data.length], elementClass: classOf(d.data), elementBytes: bytes };
    },
    read: (path, start, stop) => {
      const d = ds(path);
      const shape = d.shape ?? [d.data.length];
      const row = shape.slice(1).reduce((p, k) => p * k, 1);
      const a = (start ?? 0) * row;
      const b = (stop ?? shape[0] ?? 1) * row;
      return Array.isArray(d.data) ? d.data.slice(a, b) : (d.data as Float64Array).slice(a, b);
    },
  };
}
