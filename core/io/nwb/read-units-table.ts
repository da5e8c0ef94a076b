/**
 * Reads an NWB Units table (NWB 2.x schema, core/nwb.misc.yaml "Units") into
 * tagbench units.
 *
 * - id: the table's `id` column, as text (64-bit ids kept exact).
 * - spike times (s): `spike_times` + `spike_times_index` (ragged; any integer
 *   index dtype, uint64 included). A table of one row may omit the index.
 *   Errors: index out of range or decreasing; NaN/infinite spike times;
 *   spike times of a unit not in ascending order (the schema's ragged rows are
 *   expected sorted; tagbench will not guess which order was meant).
 * - obs_intervals (+ index), [n, 2] start|end, s: kept per unit as
 *   Unit.observedIntervals (sorted, overlaps merged). Errors: non-finite or
 *   end < start.
 * - waveform_mean, [units, samples] or [units, samples, electrodes], volts by
 *   the schema: for 3-D data the best channel is the electrode with the largest
 *   peak-to-peak amplitude (ties: the first). Converted to microvolts
 *   (Unit.waveformMean). `sampling_rate` attribute -> waveformSampleRateHz. If
 *   the values are implausible as volts (median peak-to-peak above 10 mV) they
 *   are taken as microvolts already, with a warning.
 * - electrodes (DynamicTableRegion + index into the electrodes table):
 *   meta.electrodes = the electrode ids joined by ";", meta.channel = the best
 *   channel's electrode id (or the first electrode's), meta.location from the
 *   electrodes table's `location` column when present.
 * - electrode_group (object references): meta.electrode_group = group name.
 * - every other one-value-per-row column (numbers, text, booleans; e.g. a
 *   sorter's quality label): meta[column]. Ragged or multi-dimensional extra
 *   columns are skipped with a warning.
 */
import { InputError } from '../../errors';
import type { Scalar, Unit, Warning } from '../../model/types';
import { describeTable, type TableColumn } from './describe-table';
import type { H5Data, Hdf5File } from './hdf5-access';
import { readFloat64Blocks } from './read-float64-blocks';
import { readVectorIndex } from './read-vector-index';
import { textAttr } from './text-attr';
import { toFloat64 } from './to-float64';

export interface UnitsTableResult {
  /** Units in table order; each unit's spikeTimes is a view of `spikeTimes`. */
  readonly units: readonly Unit[];
  /** All spike times as stored (s), unit after unit, each unit's sorted. */
  readonly spikeTimes: Float64Array;
  /** End of each unit's spikes in `spikeTimes` (the checked spike_times_index). */
  readonly spikeEnds: Float64Array;
  /** Sample rate of the waveform means, Hz (NaN when none). */
  readonly waveformSampleRateHz: number;
  readonly warnings: readonly Warning[];
}

const HANDLED = new Set(['spike_times', 'obs_intervals', 'electrodes', 'electrode_group', 'waveform_mean', 'waveform_sd', 'waveforms']);

export function readUnitsTable(h5: Hdf5File, file: string, tablePath: string): UnitsTableResult {
  if (h5.kind(tablePath) !== 'group') {
    throw new InputError({
      file,
      problem: `no units table at ${tablePath}; tagbench needs sorted units (an NWB Units table with spike_times)`,
      fix: tablePath === '/units' ? 'add the sorted units to the file, or name the units table in session.json ("nwb": {"units": "/path/to/table"})' : 'check the "units" path in session.json',
    });
  }
  const table = describeTable(h5, tablePath);
  const warnings: Warning[] = [];
  const n = table.rowCount;
  const col = (name: string) => table.columns.find((c) => c.name === name);

  const ids = readIds(h5, file, tablePath, n);

  // Spike times.
  const st = col('spike_times');
  if (!st) throw new InputError({ file, problem: `the units table ${tablePath} has no spike_times column`, fix: 'write the spike times of each unit into the units table' });
  const times = readFloat64Blocks(h5, file, st.path);
  const ends = rowEnds(h5, file, st, times.length, n, tablePath);
  const spikeTimes: Float64Array[] = [];
  for (let r = 0; r < n; r++) {
    const a = r === 0 ? 0 : ends[r - 1];
    const t = times.subarray(a, ends[r]);
    for (let i = 0; i < t.length; i++) {
      if (!Number.isFinite(t[i])) {
        throw new InputError({ file, column: st.path, value: String(t[i]), problem: `spike ${i} (counting from 0) of unit ${ids[r]} (table row ${r}) is not a finite time (NaN or infinite)`, fix: 'remove or correct that spike time' });
      }
      if (i > 0 && t[i] < t[i - 1]) {
        throw new InputError({ file, column: st.path, value: String(t[i]), problem: `spike times of unit ${ids[r]} (table row ${r}) are not sorted: spike ${i} comes before spike ${i - 1} (${t[i - 1]} s)`, fix: 'write each unit\'s spike times in ascending order' });
      }
    }
    spikeTimes.push(t);
  }

  // Observation intervals.
  const observed: (Float64Array | undefined)[] = new Array(n).fill(undefined);
  const oi = col('obs_intervals');
  if (oi) {
    const flat = toFloat64(h5.read(oi.path), file, oi.path);
    if (oi.shape.length !== 2 || oi.shape[1] !== 2) throw new InputError({ file, column: oi.path, problem: `obs_intervals should have shape [intervals, 2] but has shape [${oi.shape.join(', ')}]` });
    const oends = rowEnds(h5, file, oi, oi.shape[0], n, tablePath);
    for (let r = 0; r < n; r++) {
      const a = r === 0 ? 0 : oends[r - 1];
      const pairs: [number, number][] = [];
      for (let k = a; k < oends[r]; k++) {
        const s = flat[2 * k];
        const e = flat[2 * k + 1];
        if (!Number.isFinite(s) || !Number.isFinite(e) || e < s) {
          throw new InputError({ file, column: oi.path, value: `${s}, ${e}`, problem: `observation interval ${k - a} of unit ${ids[r]} (table row ${r}) is not a finite interval with start <= end` });
        }
        pairs.push([s, e]);
      }
      observed[r] = mergeIntervals(pairs);
    }
  }

  // Electrodes.
  const meta: Record<string, Scalar>[] = ids.map(() => ({}));
  const unitElectrodes = readUnitElectrodes(h5, file, tablePath, col('electrodes'), n, meta);

  // Waveform means.
  const wave = readWaveformMeans(h5, file, col('waveform_mean'), n, unitElectrodes, meta, warnings);

  // Electrode group names.
  const eg = col('electrode_group');
  if (eg && eg.elementClass === 'reference' && eg.indexPaths.length === 0) {
    const refs = h5.read(eg.path) as readonly string[];
    for (let r = 0; r < n; r++) if (refs[r]) meta[r].electrode_group = refs[r].split('/').pop() ?? '';
  }

  // Extra columns.
  const skipped: string[] = [];
  for (const c of table.columns) {
    if (HANDLED.has(c.name)) continue;
    if (c.indexPaths.length || c.shape.length !== 1 || c.shape[0] !== n || !['float', 'int', 'uint', 'string', 'bool'].includes(c.elementClass)) {
      skipped.push(c.name);
      continue;
    }
    const values = h5.read(c.path);
    for (let r = 0; r < n; r++) meta[r][c.name] = scalarAt(values, r, c.elementClass === 'bool');
  }
  if (skipped.length) {
    warnings.push({ code: 'nwb-columns-skipped', message: `Units table columns not read (ragged, multi-dimensional or of an unsupported type): ${skipped.join(', ')}.`, count: skipped.length, file });
  }

  const units: Unit[] = ids.map((id, r) => {
    const u: { -readonly [K in keyof Unit]: Unit[K] } = { id, spikeTimes: spikeTimes[r], meta: meta[r] };
    if (wave.means[r]) u.waveformMean = wave.means[r];
    if (observed[r]) u.observedIntervals = observed[r];
    return u;
  });
  return { units, spikeTimes: times, spikeEnds: ends, waveformSampleRateHz: wave.rateHz, warnings };
}

function readIds(h5: Hdf5File, file: string, tablePath: string, n: number): string[] {
  const idPath = `${tablePath}/id`;
  const ids: string[] = [];
  if (h5.kind(idPath) === 'dataset') {
    const raw = h5.read(idPath);
    for (let i = 0; i < n; i++) ids.push(String((raw as ArrayLike<unknown>)[i]));
  } else {
    for (let i = 0; i < n; i++) ids.push(String(i));
  }
  const seen = new Map<string, number>();
  ids.forEach((id, r) => {
    const first = seen.get(id);
    if (first !== undefined) throw new InputError({ file, column: idPath, value: id, problem: `unit id ${id} appears twice (table rows ${first} and ${r})`, fix: 'give every unit its own id' });
    seen.set(id, r);
  });
  return ids;
}

/** End index of each table row of a column (ragged or one element per row). */
function rowEnds(h5: Hdf5File, file: string, c: TableColumn, dataLength: number, n: number, tablePath: string): Float64Array {
  if (c.indexPaths.length === 0) {
    if (n === 1) return Float64Array.of(dataLength);
    if (dataLength === n) return Float64Array.from({ length: n }, (_, i) => i + 1);
    throw new InputError({ file, column: c.path, problem: `${c.name} has no ${c.name}_index, so the table ${tablePath} cannot say which values belong to which of its ${n} rows`, fix: `write ${c.name}_index (the end of each row's values)` });
  }
  const ends = readVectorIndex(h5, file, c.indexPaths[0], dataLength);
  if (ends.length !== n) {
    throw new InputError({ file, column: c.indexPaths[0], problem: `index out of range: the index has ${ends.length} rows but the table ${tablePath} has ${n}`, fix: 'write one index value per table row' });
  }
  return ends;
}

function mergeIntervals(pairs: [number, number][]): Float64Array {
  pairs.sort((x, y) => x[0] - y[0] || x[1] - y[1]);
  const out: number[] = [];
  for (const [s, e] of pairs) {
    const last = out.length - 1;
    if (out.length > 0 && s <= out[last]) out[last] = Math.max(out[last], e);
    else out.push(s, e);
  }
  return Float64Array.from(out);
}

function scalarAt(values: H5Data, r: number, isBool: boolean): Scalar {
  const v = (values as ArrayLike<unknown>)[r];
  if (isBool) return Number(v) ? 'true' : 'false';
  if (typeof v === 'bigint') return Number(v);
  if (typeof v === 'number') return v;
  return String(v ?? '');
}

interface UnitElectrodes {
  /** Electrode-table rows of each unit. */
  readonly rows: number[][];
  /** Electrode id of each electrode-table row (row number when the table is absent). */
  readonly idOf: (row: number) => Scalar;
  /** Location of each electrode-table row, when the table has a location column. */
  readonly locationOf: ((row: number) => string) | null;
}

/** Electrode rows of each unit (indexes into the electrodes table), and the matching metadata. */
function readUnitElectrodes(h5: Hdf5File, file: string, tablePath: string, c: TableColumn | undefined, n: number, meta: Record<string, Scalar>[]): UnitElectrodes | null {
  if (!c || (c.elementClass !== 'int' && c.elementClass !== 'uint')) return null;
  const rows = toFloat64(h5.read(c.path), file, c.path);
  const ends = rowEnds(h5, file, c, rows.length, n, tablePath);
  const target = h5.attr(c.path, 'table');
  const tpath = target && typeof target === 'object' && 'refPath' in target ? target.refPath : '/general/extracellular_ephys/electrodes';
  let elIds: H5Data | null = null;
  let locations: H5Data | null = null;
  let nEl = Infinity;
  if (h5.kind(tpath) === 'group') {
    const t = describeTable(h5, tpath);
    nEl = t.rowCount;
    if (h5.kind(`${tpath}/id`) === 'dataset') elIds = h5.read(`${tpath}/id`);
    const loc = t.columns.find((x) => x.name === 'location' && x.elementClass === 'string' && x.indexPaths.length === 0);
    if (loc) locations = h5.read(loc.path);
  }
  const ids = elIds;
  const locs = locations;
  const idOf = (e: number): Scalar => (ids ? scalarAt(ids, e, false) : e);
  const locationOf = locs ? (e: number) => String((locs as ArrayLike<unknown>)[e] ?? '') : null;
  const out: number[][] = [];
  for (let r = 0; r < n; r++) {
    const a = r === 0 ? 0 : ends[r - 1];
    const list: number[] = [];
    for (let k = a; k < ends[r]; k++) {
      const e = rows[k];
      if (!Number.isInteger(e) || e < 0 || e >= nEl) {
        throw new InputError({ file, column: c.path, value: String(e), problem: `index out of range: unit row ${r} refers to electrode row ${e}, but the electrodes table ${tpath} has ${nEl} rows` });
      }
      list.push(e);
    }
    out.push(list);
    if (list.length) {
      meta[r].electrodes = list.map((e) => String(idOf(e))).join(';');
      meta[r].channel = idOf(list[0]);
      if (locationOf) meta[r].location = locationOf(list[0]);
    }
  }
  return { rows: out, idOf, locationOf };
}

const VOLT_SCALE: Record<string, number> = { volts: 1e6, volt: 1e6, v: 1e6, millivolts: 1e3, mv: 1e3, microvolts: 1, uv: 1, 'µv': 1 };

function readWaveformMeans(
  h5: Hdf5File,
  file: string,
  c: TableColumn | undefined,
  n: number,
  unitElectrodes: UnitElectrodes | null,
  meta: Record<string, Scalar>[],
  warnings: Warning[],
): { means: (Float64Array | undefined)[]; rateHz: number } {
  const means: (Float64Array | undefined)[] = new Array(n).fill(undefined);
  if (!c) return { means, rateHz: NaN };
  if (c.indexPaths.length || (c.shape.length !== 2 && c.shape.length !== 3) || c.shape[0] !== n || !['float', 'int', 'uint'].includes(c.elementClass)) {
    warnings.push({ code: 'nwb-waveform-shape', message: `waveform_mean has shape [${c.shape.join(', ')}]; expected [units, samples] or [units, samples, electrodes], so waveforms were not read.`, count: 1, file });
    return { means, rateHz: NaN };
  }
  const samples = c.shape[1];
  const chans = c.shape.length === 3 ? c.shape[2] : 1;
  const unitAttr = textAttr(h5, c.path, 'unit').trim().toLowerCase();
  let scale = VOLT_SCALE[unitAttr || 'volts'];
  if (scale === undefined) {
    warnings.push({ code: 'nwb-waveform-unit', message: `waveform_mean has unit "${unitAttr}"; taken as volts.`, count: 1, file });
    scale = 1e6;
  }
  const best = new Int32Array(n);
  const ptpBest = new Float64Array(n);
  const BLOCK = 64;
  for (let r0 = 0; r0 < n; r0 += BLOCK) {
    const r1 = Math.min(n, r0 + BLOCK);
    const block = toFloat64(h5.read(c.path, r0, r1), file, c.path);
    for (let r = r0; r < r1; r++) {
      const base = (r - r0) * samples * chans;
      let bestCh = 0;
      let bestPtp = -1;
      for (let ch = 0; ch < chans; ch++) {
        let lo = Infinity;
        let hi = -Infinity;
        for (let s = 0; s < samples; s++) {
          const v = block[base + s * chans + ch];
          if (v < lo) lo = v;
          if (v > hi) hi = v;
        }
        const ptp = hi - lo;
        if (ptp > bestPtp) {
          bestPtp = ptp;
          bestCh = ch;
        }
      }
      best[r] = bestCh;
      ptpBest[r] = bestPtp;
      const w = new Float64Array(samples);
      for (let s = 0; s < samples; s++) w[s] = block[base + s * chans + bestCh];
      means[r] = w;
    }
  }
  // Plausibility of "volts": extracellular spikes are tens to hundreds of microvolts.
  const sorted = Float64Array.from(ptpBest).filter(Number.isFinite).sort();
  const medianPtp = sorted.length ? sorted[Math.floor(sorted.length / 2)] : 0;
  if (scale === 1e6 && medianPtp * 1e6 > 1e4) {
    warnings.push({ code: 'nwb-waveform-unit', message: `waveform_mean is declared in volts but its median peak-to-peak is ${medianPtp.toPrecision(3)}, implausible for volts; the values were taken as microvolts.`, count: 1, file });
    scale = 1;
  }
  for (const w of means) if (w) for (let s = 0; s < w.length; s++) w[s] *= scale;
  for (let r = 0; r < n; r++) {
    if (chans > 1) meta[r].waveform_channel = best[r];
    const list = unitElectrodes?.rows[r];
    if (chans > 1 && unitElectrodes && list && list.length === chans) {
      const e = list[best[r]];
      meta[r].channel = unitElectrodes.idOf(e);
      if (unitElectrodes.locationOf) meta[r].location = unitElectrodes.locationOf(e);
    }
  }
  const rate = h5.attr(c.path, 'sampling_rate');
  const rateHz = typeof rate === 'number' ? rate : ArrayBuffer.isView(rate) ? Number((rate as ArrayLike<number>)[0]) : NaN;
  if (!(rateHz > 0)) warnings.push({ code: 'nwb-waveform-rate', message: 'waveform_mean has no sampling_rate attribute; waveforms were read without a time axis.', count: 1, file });
  return { means, rateHz: rateHz > 0 ? rateHz : NaN };
}
