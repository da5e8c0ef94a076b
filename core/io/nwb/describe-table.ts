/**
 * Describes an hdmf DynamicTable (NWB's tables: Units, TimeIntervals, the
 * electrodes table, ...): its row count, ids and columns, without reading
 * column data.
 *
 * Columns are the names in the table's `colnames` attribute (the schema's
 * ordered column list), then any other dataset that is neither `id`, an
 * index (`<col>_index`) nor listed. A column `c` is ragged when `c_index`
 * exists (doubly ragged when `c_index_index` exists too). Row count = length of
 * `id`, or of the outermost index / first column when `id` is missing.
 */
import type { H5Class, Hdf5File } from './hdf5-access';
import { textAttr } from './text-attr';

export interface TableColumn {
  readonly name: string;
  /** Dataset path of the values. */
  readonly path: string;
  /** VectorIndex paths, outermost last ([] for a plain column). */
  readonly indexPaths: readonly string[];
  readonly elementClass: H5Class;
  /** Shape of the values dataset. */
  readonly shape: readonly number[];
  /** neurodata_type of the values dataset ("VectorData", "DynamicTableRegion", ...). */
  readonly neurodataType: string;
  /** Description attribute, if any. */
  readonly description: string;
}

export interface TableDescription {
  readonly path: string;
  readonly neurodataType: string;
  readonly description: string;
  readonly rowCount: number;
  readonly columns: readonly TableColumn[];
}

export function describeTable(h5: Hdf5File, path: string): TableDescription {
  const keys = new Set(h5.keys(path));
  const listed = h5.attr(path, 'colnames');
  const names: string[] = [];
  const listedNames = Array.isArray(listed) ? (listed as string[]) : typeof listed === 'string' ? [listed] : [];
  for (const n of listedNames) {
    if (keys.has(n) && !names.includes(n)) names.push(n);
  }
  for (const k of [...keys].sort()) {
    if (k === 'id' || names.includes(k) || /_index$/.test(k) || h5.kind(`${path}/${k}`) !== 'dataset') continue;
    names.push(k);
  }
  const columns: TableColumn[] = names.map((name) => {
    const p = `${path}/${name}`;
    const info = h5.info(p);
    const indexPaths: string[] = [];
    let idx = `${p}_index`;
    while (keys.has(idx.slice(path.length + 1)) && h5.kind(idx) === 'dataset') {
      indexPaths.push(idx);
      idx = `${idx}_index`;
    }
    return {
      name,
      path: p,
      indexPaths,
      elementClass: info.elementClass,
      shape: info.shape,
      neurodataType: textAttr(h5, p, 'neurodata_type'),
      description: textAttr(h5, p, 'description'),
    };
  });
  let rowCount = 0;
  if (keys.has('id') && h5.kind(`${path}/id`) === 'dataset') rowCount = h5.info(`${path}/id`).shape[0] ?? 0;
  else if (columns.length) {
    const c = columns[0];
    rowCount = (c.indexPaths.length ? h5.info(c.indexPaths[c.indexPaths.length - 1]).shape[0] : c.shape[0]) ?? 0;
  }
  return { path, neurodataType: textAttr(h5, path, 'neurodata_type'), description: textAttr(h5, path, 'description'), rowCount, columns };
}
