/**
 * Reads an NWB TimeIntervals table (NWB 2.x schema core/nwb.epoch.yaml:
 * `start_time`, `stop_time` in s, plus any columns; /intervals/trials is one)
 * or any DynamicTable with a time column, as plain columns.
 *
 * Every one-value-per-row column comes back: numbers (any numeric dtype,
 * 64-bit converted exactly up to 2^53; booleans as 0/1) as Float64Array, text
 * as strings. Ragged columns (`tags`, `timeseries`, ...) and multi-dimensional
 * ones are listed in `skipped`.
 *
 * Errors (InputError naming the file and table): the path is not a table;
 * a required time column is missing (`timeColumn`, default start_time).
 * Time values themselves are checked later by buildRecording.
 */
import { InputError } from '../../errors';
import { describeTable } from './describe-table';
import type { Hdf5File } from './hdf5-access';
import { toFloat64 } from './to-float64';

export interface IntervalTable {
  readonly path: string;
  readonly rowCount: number;
  readonly columns: Readonly<Record<string, Float64Array | readonly string[]>>;
  /** Column dataset paths, for messages. */
  readonly columnPaths: Readonly<Record<string, string>>;
  readonly skipped: readonly string[];
}

export function readIntervalTable(h5: Hdf5File, file: string, path: string, timeColumn = 'start_time'): IntervalTable {
  if (h5.kind(path) !== 'group') {
    throw new InputError({ file, value: path, problem: 'there is no table at this path', fix: `run "tagbench inspect ${file}" to list the tables the file holds` });
  }
  const t = describeTable(h5, path);
  const columns: Record<string, Float64Array | readonly string[]> = {};
  const columnPaths: Record<string, string> = {};
  const skipped: string[] = [];
  for (const c of t.columns) {
    if (c.indexPaths.length || c.shape.length !== 1 || c.shape[0] !== t.rowCount) {
      skipped.push(c.name);
      continue;
    }
    if (c.elementClass === 'string') columns[c.name] = h5.read(c.path) as readonly string[];
    else if (c.elementClass === 'float' || c.elementClass === 'int' || c.elementClass === 'uint' || c.elementClass === 'bool') columns[c.name] = toFloat64(h5.read(c.path), file, c.path);
    else {
      skipped.push(c.name);
      continue;
    }
    columnPaths[c.name] = c.path;
  }
  if (!(columns[timeColumn] instanceof Float64Array)) {
    const have = Object.keys(columns).join(', ') || 'none';
    throw new InputError({ file, column: `${path}/${timeColumn}`, problem: `the table ${path} has no numeric column "${timeColumn}" (its columns: ${have})`, fix: 'name the time column of this table in session.json' });
  }
  return { path, rowCount: t.rowCount, columns, columnPaths, skipped };
}
