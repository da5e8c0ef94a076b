/**
 * Lists what an NWB file holds, for `inspect` and for choosing roles: every
 * table (DynamicTable: Units, TimeIntervals, electrodes, ...) with its rows
 * and columns, every time series (a group with `data` and `timestamps` or
 * `starting_time`) with its size and timing, and the optogenetic stimulus
 * sites. The cached schema under /specifications is skipped. Nothing large
 * is read: shapes and attributes only (plus a series' first/last timestamp).
 *
 * Checks the file is NWB 2.x first (checkNwbFile).
 */
import { checkNwbFile } from './check-nwb-file';
import { describeTable } from './describe-table';
import type { H5Class, Hdf5File } from './hdf5-access';
import { textAttr } from './text-attr';
import { toFloat64 } from './to-float64';

export interface NwbColumnListing {
  readonly name: string;
  /** "number", "text", "bool", "reference", "other". */
  readonly type: string;
  /** Dimensions beyond the row, e.g. [32, 4] for waveform_mean; [] for one value per row. */
  readonly cell: readonly number[];
  /** Ragged column (has an index): number of index levels. */
  readonly ragged: number;
}

export interface NwbTableListing {
  readonly path: string;
  readonly neurodataType: string;
  readonly description: string;
  readonly rows: number;
  readonly columns: readonly NwbColumnListing[];
}

export interface NwbSeriesListing {
  readonly path: string;
  readonly neurodataType: string;
  readonly description: string;
  /** Shape of data. */
  readonly shape: readonly number[];
  readonly unit: string;
  readonly timing: 'timestamps' | 'rate';
  /** Sampling rate, Hz (NaN for timestamps). */
  readonly rateHz: number;
  /** First and last sample time, s. */
  readonly startS: number;
  readonly stopS: number;
}

export interface NwbSiteListing {
  readonly path: string;
  readonly description: string;
  readonly location: string;
  readonly excitationLambdaNm: number;
}

export interface NwbContents {
  readonly file: string;
  readonly nwbVersion: string;
  readonly identifier: string;
  readonly sessionDescription: string;
  readonly sessionStartTime: string;
  readonly tables: readonly NwbTableListing[];
  readonly series: readonly NwbSeriesListing[];
  readonly sites: readonly NwbSiteListing[];
}

const TYPE_NAME: Record<H5Class, string> = { float: 'number', int: 'number', uint: 'number', string: 'text', bool: 'bool', reference: 'reference', compound: 'other', other: 'other' };

export function listNwbContents(h5: Hdf5File, file: string): NwbContents {
  const nwbVersion = checkNwbFile(h5, file);
  const tables: NwbTableListing[] = [];
  const series: NwbSeriesListing[] = [];
  const sites: NwbSiteListing[] = [];
  const seen = new Set<string>();
  const walk = (path: string, depth: number): void => {
    if (depth > 12 || seen.has(path)) return;
    seen.add(path);
    for (const key of h5.keys(path)) {
      const p = path === '/' ? `/${key}` : `${path}/${key}`;
      if (p === '/specifications' || h5.kind(p) !== 'group') continue;
      const type = textAttr(h5, p, 'neurodata_type');
      const members = new Set(h5.keys(p));
      if (h5.attr(p, 'colnames') !== undefined) {
        const t = describeTable(h5, p);
        tables.push({
          path: p,
          neurodataType: t.neurodataType,
          description: t.description,
          rows: t.rowCount,
          columns: t.columns.map((c) => ({ name: c.name, type: TYPE_NAME[c.elementClass], cell: c.shape.slice(1), ragged: c.indexPaths.length })),
        });
        continue;
      }
      if (members.has('data') && (members.has('timestamps') || members.has('starting_time')) && h5.kind(`${p}/data`) === 'dataset') {
        series.push(listSeries(h5, file, p, type));
        continue;
      }
      if (type === 'OptogeneticStimulusSite') {
        sites.push({
          path: p,
          description: textData(h5, `${p}/description`),
          location: textData(h5, `${p}/location`),
          excitationLambdaNm: numData(h5, file, `${p}/excitation_lambda`),
        });
        continue;
      }
      walk(p, depth + 1);
    }
  };
  walk('/', 0);
  return {
    file,
    nwbVersion,
    identifier: textData(h5, '/identifier'),
    sessionDescription: textData(h5, '/session_description'),
    sessionStartTime: textData(h5, '/session_start_time'),
    tables,
    series,
    sites,
  };
}

function listSeries(h5: Hdf5File, file: string, p: string, type: string): NwbSeriesListing {
  const shape = h5.info(`${p}/data`).shape;
  const n = shape[0] ?? 0;
  let timing: 'timestamps' | 'rate' = 'rate';
  let rateHz = NaN;
  let startS = NaN;
  let stopS = NaN;
  if (h5.kind(`${p}/timestamps`) === 'dataset') {
    timing = 'timestamps';
    const m = h5.info(`${p}/timestamps`).shape[0] ?? 0;
    if (m > 0) {
      startS = toFloat64(h5.read(`${p}/timestamps`, 0, 1), file, p)[0];
      stopS = toFloat64(h5.read(`${p}/timestamps`, m - 1, m), file, p)[0];
    }
  } else if (h5.kind(`${p}/starting_time`) === 'dataset') {
    startS = numData(h5, file, `${p}/starting_time`);
    const r = h5.attr(`${p}/starting_time`, 'rate');
    rateHz = typeof r === 'number' ? r : NaN;
    stopS = n > 0 && rateHz > 0 ? startS + (n - 1) / rateHz : startS;
  }
  return { path: p, neurodataType: type, description: textAttr(h5, p, 'description'), shape, unit: textAttr(h5, `${p}/data`, 'unit'), timing, rateHz, startS, stopS };
}

function textData(h5: Hdf5File, path: string): string {
  if (h5.kind(path) !== 'dataset') return '';
  const v = h5.read(path);
  return Array.isArray(v) ? String(v[0] ?? '') : '';
}

function numData(h5: Hdf5File, file: string, path: string): number {
  if (h5.kind(path) !== 'dataset') return NaN;
  const v = h5.read(path);
  return Array.isArray(v) ? NaN : toFloat64(v, file, path)[0];
}
