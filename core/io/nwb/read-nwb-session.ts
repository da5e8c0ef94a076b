/**
 * Reads a whole NWB 2.x file as a tagbench session: the same Recording and
 * warnings a session folder gives, built by the one shared builder
 * (buildRecording), so the same problem gets the same check and message
 * whatever the format.
 *
 * Roles (units, trials, pulses, events) come from the manifest's `nwb`
 * section or, where unambiguous, automatically (planNwbRoles). All times are
 * seconds on the file's clock (NWB stores seconds relative to the session's
 * reference time). Span: from session.json when given; otherwise, when the
 * units table has obs_intervals, [earliest start, latest end] of all units'
 * observation intervals ("observation-intervals"); otherwise from the inputs.
 *
 * Pulses from an interval table: onset = start_time, duration = stop_time -
 * start_time, power from `power` (mW; W when the column's unit attribute or
 * the manifest says so), train and frequency from `train` / `frequency` when
 * present (otherwise inferred by the builder). Pulses from an
 * OptogeneticSeries (watts, shown in mW): the project's laser-trace detector
 * through pulsesFromSeries, with the same options and warnings as a session
 * folder's laser trace; each pulse's power is the largest value inside it. The stimulus site (description,
 * location, excitation wavelength) is kept in Recording.meta.
 *
 * Events: see planNwbRoles. Empty (NaN) cells of a trials `<label>_time`
 * column mean "no such event in that trial" and are skipped; a NaN time in an
 * event table is an error naming the table and row.
 */
import { InputError } from '../../errors';
import type { Recording, Scalar, Warning } from '../../model/types';
import { buildRecording, type EventColumns, type PulseColumns, type RecordingTables, type TrialColumns, type UnitInfoColumns, type WaveformColumns } from '../build-recording';
import type { Hdf5File } from './hdf5-access';
import { listNwbContents, type NwbContents } from './list-nwb-contents';
import { observationGapWarning, observationGaps } from './observation-gaps';
import type { NwbManifest, NwbPulseSeries, NwbPulseTable } from './parse-nwb-manifest';
import { planNwbRoles, type NwbPlan } from './plan-nwb-roles';
import { readIntervalTable, type IntervalTable } from './read-interval-table';
import { readTimeSeries } from './read-time-series';
import { readUnitsTable } from './read-units-table';
import { textAttr } from './text-attr';
import { toFloat64 } from './to-float64';
import { pulsesFromSeries } from './pulses-from-series';

export interface NwbSessionOptions {
  readonly manifest?: NwbManifest;
  /** Name of the manifest file, for messages (default "session.json"). */
  readonly manifestFile?: string;
  /** Span limits from session.json parameters (null = not given). */
  readonly span?: { readonly startS: number | null; readonly stopS: number | null; readonly file: string };
  /** Allowed overshoot of the span, s (DEFAULTS.span.toleranceS). */
  readonly toleranceS: number;
  /** Spike times on one SharedArrayBuffer (see buildRecording; default false). */
  readonly sharedMemory?: boolean;
}

export interface NwbSession {
  readonly recording: Recording;
  readonly warnings: readonly Warning[];
  readonly contents: NwbContents;
  readonly plan: NwbPlan;
}

export function readNwbSession(h5: Hdf5File, file: string, options: NwbSessionOptions): NwbSession {
  const contents = listNwbContents(h5, file);
  const plan = planNwbRoles(contents, options.manifest ?? {}, options.manifestFile ?? 'session.json');
  const warnings: Warning[] = [];

  // ---- units -----------------------------------------------------------
  const u = readUnitsTable(h5, file, plan.units);
  warnings.push(...u.warnings);
  const ids = u.units.map((x) => x.id);
  // The stored spike_times are already grouped by unit: pass them as they are, with one unit code per spike.
  const time = u.spikeTimes.subarray(0, u.spikeEnds.length ? u.spikeEnds[u.spikeEnds.length - 1] : 0);
  const unitCode = new Int32Array(time.length);
  u.spikeEnds.forEach((end, r) => unitCode.fill(r, r === 0 ? 0 : u.spikeEnds[r - 1], end));
  const tables: { -readonly [K in keyof RecordingTables]: RecordingTables[K] } = {
    spikes: { file, columns: { unit: `${plan.units}/id`, time: `${plan.units}/spike_times` }, unitIds: ids, unit: unitCode, time },
    unitInfo: unitInfoColumns(file, plan.units, u.units.map((x) => x.meta), ids),
    toleranceS: options.toleranceS,
  };
  const withWave = u.units.filter((x) => x.waveformMean).length;
  if (withWave > 0) {
    const rate = options.manifest?.waveformSampleRateHz ?? u.waveformSampleRateHz;
    if (rate > 0) tables.waveforms = waveformColumns(file, u.units.map((x) => x.waveformMean), rate);
    else warnings.push({ code: 'nwb-waveforms-without-rate', file, count: withWave, message: 'waveform_mean has no sampling_rate, so waveforms were not used; set "waveform_sample_rate_hz" in the nwb section of session.json to use them' });
  }

  // ---- trials ------------------------------------------------------------
  let trialTable: IntervalTable | null = null;
  const trialColumnEvents = new Set(plan.events.flatMap((e) => ('trialsColumn' in e ? [e.trialsColumn] : [])));
  if (plan.trials) {
    trialTable = readIntervalTable(h5, file, plan.trials.table);
    tables.trials = trialColumns(h5, file, trialTable, plan.trials.conditionColumn, trialColumnEvents);
  }

  // ---- pulses ------------------------------------------------------------
  const meta: Record<string, Scalar> = {
    nwb_version: contents.nwbVersion,
    ...(contents.identifier ? { identifier: contents.identifier } : {}),
    ...(contents.sessionDescription ? { session_description: contents.sessionDescription } : {}),
    ...(contents.sessionStartTime ? { session_start_time: contents.sessionStartTime } : {}),
  };
  if (plan.pulses) {
    if ('table' in plan.pulses) tables.pulses = pulseTableColumns(h5, file, plan.pulses);
    else {
      const p = seriesPulses(h5, file, plan.pulses, meta, warnings);
      if (p) tables.pulses = p;
    }
  }

  // ---- events ------------------------------------------------------------
  const ev = collectEvents(h5, file, plan, trialTable);
  if (ev) tables.events = ev;

  // ---- span ----------------------------------------------------------------
  if (options.span && (options.span.startS !== null || options.span.stopS !== null)) {
    tables.span = { ...options.span, source: 'manifest' };
  } else if (u.units.some((x) => x.observedIntervals && x.observedIntervals.length)) {
    let lo = Infinity;
    let hi = -Infinity;
    for (const x of u.units) {
      const o = x.observedIntervals;
      if (!o || !o.length) continue;
      lo = Math.min(lo, o[0]);
      hi = Math.max(hi, o[o.length - 1]);
    }
    tables.span = { startS: lo, stopS: hi, source: 'observation-intervals', file: `${file} (${plan.units}/obs_intervals)` };
  }

  const built = buildRecording(tables, { sharedMemory: options.sharedMemory ?? false });
  warnings.push(...built.warnings);
  const observed = new Map(u.units.map((x) => [x.id, x.observedIntervals]));
  const recording: Recording = {
    ...built.recording,
    units: built.recording.units.map((x) => {
      const o = observed.get(x.id);
      return o ? { ...x, observedIntervals: o } : x;
    }),
    meta,
  };
  warnings.push(...observationGapWarning(observationGaps(recording), `${file} (${plan.units}/obs_intervals)`));
  return { recording, warnings, contents, plan };
}

function unitInfoColumns(file: string, table: string, metas: readonly Readonly<Record<string, Scalar>>[], ids: readonly string[]): UnitInfoColumns {
  const keys: string[] = [];
  for (const m of metas) for (const key of Object.keys(m)) if (!keys.includes(key)) keys.push(key);
  const meta: Record<string, Float64Array | readonly string[]> = {};
  for (const key of keys) {
    const numeric = metas.every((m) => m[key] === undefined || typeof m[key] === 'number');
    meta[key] = numeric ? Float64Array.from(metas, (m) => (m[key] === undefined ? NaN : (m[key] as number))) : metas.map((m) => (m[key] === undefined ? '' : String(m[key])));
  }
  return { file, columns: { unit: `${table}/id` }, ids, meta };
}

function waveformColumns(file: string, means: readonly (Float64Array | undefined)[], rate: number): WaveformColumns {
  const samples = means.find((w) => w)?.length ?? 0;
  const data = new Float64Array(means.length * samples).fill(NaN);
  means.forEach((w, r) => w && data.set(w, r * samples));
  return { file, data, rows: means.length, samples, sampleRateHz: rate };
}

function trialColumns(h5: Hdf5File, file: string, t: IntervalTable, conditionColumn: string | null, exclude: ReadonlySet<string>): TrialColumns {
  const start = t.columns.start_time;
  const stop = t.columns.stop_time;
  if (!(start instanceof Float64Array) || !(stop instanceof Float64Array)) {
    throw new InputError({ file, column: t.path, problem: 'the trials table needs numeric start_time and stop_time columns' });
  }
  const idPath = `${t.path}/id`;
  const trial = h5.kind(idPath) === 'dataset' ? toFloat64(h5.read(idPath), file, idPath) : Float64Array.from({ length: t.rowCount }, (_, i) => i);
  let condition: readonly string[] | undefined;
  if (conditionColumn) {
    const c = t.columns[conditionColumn];
    if (!c) throw new InputError({ file, column: `${t.path}/${conditionColumn}`, problem: 'the condition column is ragged, multi-dimensional or missing' });
    condition = c instanceof Float64Array ? Array.from(c, (x) => (x === x ? String(x) : '')) : c;
  }
  const covariates: Record<string, Float64Array | readonly string[]> = {};
  for (const [name, col] of Object.entries(t.columns)) {
    if (name === 'start_time' || name === 'stop_time' || name === conditionColumn || exclude.has(name)) continue;
    covariates[name] = col;
  }
  return {
    file,
    columns: { trial: idPath, start: `${t.path}/start_time`, stop: `${t.path}/stop_time`, ...(conditionColumn ? { condition: `${t.path}/${conditionColumn}` } : {}) },
    trial,
    start,
    stop,
    ...(condition ? { condition } : {}),
    covariates,
  };
}

function pulseTableColumns(h5: Hdf5File, file: string, p: NwbPulseTable): PulseColumns {
  const t = readIntervalTable(h5, file, p.table);
  const onset = t.columns.start_time as Float64Array;
  const stopCol = t.columns.stop_time;
  const num = (name: string | undefined, key: string, required: boolean): Float64Array | undefined => {
    if (!name) return undefined;
    const c = t.columns[name];
    if (c instanceof Float64Array) return c;
    if (required || c) throw new InputError({ file, column: `${p.table}/${name}`, problem: `the pulse table has no numeric column "${name}" (named by ${key})` });
    return undefined;
  };
  const duration = stopCol instanceof Float64Array ? Float64Array.from(onset, (on, i) => stopCol[i] - on) : undefined;
  const powerName = p.powerColumn ?? (t.columns.power ? 'power' : undefined);
  let powerMw = num(powerName, 'nwb.pulses.power_column', Boolean(p.powerColumn));
  if (powerMw && powerName) {
    const unitAttr = textAttr(h5, `${p.table}/${powerName}`, 'unit').toLowerCase();
    const watts = p.powerUnit ? p.powerUnit === 'W' : unitAttr === 'w' || unitAttr === 'watt' || unitAttr === 'watts';
    if (watts) powerMw = Float64Array.from(powerMw, (x) => x * 1000);
  }
  const trainF = num(p.trainColumn ?? (t.columns.train ? 'train' : undefined), 'nwb.pulses.train_column', Boolean(p.trainColumn));
  let train: Int32Array | undefined;
  if (trainF) {
    train = new Int32Array(trainF.length);
    for (let i = 0; i < trainF.length; i++) {
      if (!Number.isInteger(trainF[i])) throw new InputError({ file, column: `${p.table}/train`, value: String(trainF[i]), problem: `train label of pulse row ${i} (counting from 0) is not an integer` });
      train[i] = trainF[i];
    }
  }
  const frequencyHz = num(p.frequencyColumn ?? (t.columns.frequency ? 'frequency' : undefined), 'nwb.pulses.frequency_column', Boolean(p.frequencyColumn));
  return {
    file,
    columns: { onset: `${p.table}/start_time`, duration: `${p.table}/stop_time`, ...(powerName ? { power: `${p.table}/${powerName}` } : {}) },
    onset,
    ...(duration ? { duration } : {}),
    ...(train ? { train } : {}),
    ...(frequencyHz ? { frequencyHz } : {}),
    ...(powerMw ? { powerMw } : {}),
    ...(p.trainMaxIpiS !== undefined ? { trainMaxIpiS: p.trainMaxIpiS } : {}),
  };
}

function seriesPulses(h5: Hdf5File, file: string, p: NwbPulseSeries, meta: Record<string, Scalar>, warnings: Warning[]): PulseColumns | null {
  const s = readTimeSeries(h5, file, p.series);
  // Power in mW: OptogeneticSeries data are watts (NWB schema core/nwb.ogen.yaml).
  const unit = s.unit.toLowerCase();
  const toMw = unit === 'mw' || unit === 'milliwatts' ? 1 : 1000;
  const powerMw = toMw === 1 ? s.values : Float64Array.from(s.values, (x) => x * toMw);
  if (s.reduced) warnings.push({ code: 'nwb-series-columns', file, count: 1, message: `${p.series} has several columns; a pulse is counted when any column crosses the threshold` });
  const sitePath = `${p.series}/site`;
  if (h5.kind(sitePath) === 'group') {
    const text = (name: string) => {
      const path = `${sitePath}/${name}`;
      if (h5.kind(path) !== 'dataset') return '';
      const v = h5.read(path);
      return Array.isArray(v) ? String(v[0] ?? '') : String(toFloat64(v, file, path)[0]);
    };
    const d = text('description');
    const l = text('location');
    const lambda = Number(text('excitation_lambda'));
    if (d) meta.stimulus_site_description = d;
    if (l) meta.stimulus_site_location = l;
    if (lambda > 0) meta.excitation_lambda_nm = lambda;
  }
  const minWidthMs = p.minWidthMs ?? 0.5;
  const found = pulsesFromSeries(s.times, powerMw, {
    ...(s.rateHz !== undefined ? { rateHz: s.rateHz } : {}),
    ...(p.highThresholdMw !== undefined ? { highThreshold: p.highThresholdMw, lowThreshold: p.lowThresholdMw } : {}),
    minWidthS: minWidthMs / 1000,
  });
  // Same warnings as a session folder's laser trace (core/io/import-session.ts).
  const where = `${file} ${p.series}`;
  if (found.dropped > 0) warnings.push({ code: 'laser-glitches-dropped', file, count: found.dropped, message: `${where}: ${found.dropped} crossing(s) shorter than ${minWidthMs} ms were ignored as glitches` });
  if (found.unterminated > 0) warnings.push({ code: 'laser-pulse-unterminated', file, count: found.unterminated, message: `${where}: the trace ends during a pulse; its duration runs to the end of the trace` });
  if (found.onset.length === 0) {
    warnings.push({ code: 'laser-trace-without-pulses', file, count: 1, message: `${where}: no pulse crossed the threshold (${Math.round(found.highThreshold * 1e6) / 1e6} mW); the session has no laser pulses` });
    return null;
  }
  return {
    file,
    columns: { onset: `${p.series} (threshold crossings)`, duration: `${p.series} (threshold crossings)`, power: `${p.series}/data` },
    onset: found.onset,
    duration: found.duration,
    powerMw: found.peak,
    ...(p.trainMaxIpiS !== undefined ? { trainMaxIpiS: p.trainMaxIpiS } : {}),
  };
}

function collectEvents(h5: Hdf5File, file: string, plan: NwbPlan, trials: IntervalTable | null): EventColumns | null {
  const time: number[] = [];
  const label: string[] = [];
  const trial: number[] = [];
  const kind: string[] = [];
  let anyTrial = false;
  let anyKind = false;
  const trialIds = trials ? (h5.kind(`${trials.path}/id`) === 'dataset' ? toFloat64(h5.read(`${trials.path}/id`), file, trials.path) : Float64Array.from({ length: trials.rowCount }, (_, i) => i)) : null;
  for (const e of plan.events) {
    if ('trialsColumn' in e) {
      const c = trials?.columns[e.trialsColumn];
      if (!(c instanceof Float64Array)) throw new InputError({ file, column: `${trials?.path ?? '/intervals/trials'}/${e.trialsColumn}`, problem: 'this trials column is not a numeric column of event times' });
      for (let i = 0; i < c.length; i++) {
        if (c[i] !== c[i]) continue; // no such event in this trial
        time.push(c[i]);
        label.push(e.label ?? e.trialsColumn.replace(/_time$/, ''));
        trial.push(trialIds![i]);
        kind.push('');
      }
      anyTrial = true;
    } else if ('table' in e) {
      const hasStart = h5.kind(`${e.table}/start_time`) === 'dataset';
      const tc = e.timeColumn ?? (hasStart ? 'start_time' : 'timestamp');
      const t = readIntervalTable(h5, file, e.table, tc);
      const tv = t.columns[tc] as Float64Array;
      const col = (name: string | undefined, key: string): Float64Array | readonly string[] | undefined => {
        if (!name) return undefined;
        const c = t.columns[name];
        if (!c) throw new InputError({ file, column: `${e.table}/${name}`, problem: `the table has no one-value-per-row column "${name}" (named by ${key})` });
        return c;
      };
      const labels = col(e.labelColumn, 'label_column');
      const kinds = col(e.kindColumn, 'kind_column');
      const trs = col(e.trialColumn, 'trial_column');
      if (trs && !(trs instanceof Float64Array)) throw new InputError({ file, column: `${e.table}/${e.trialColumn}`, problem: 'the trial column must hold trial numbers' });
      for (let i = 0; i < tv.length; i++) {
        if (!Number.isFinite(tv[i])) throw new InputError({ file, column: `${e.table}/${tc}`, value: String(tv[i]), problem: `event time of table row ${i} (counting from 0) is not a finite number` });
        time.push(tv[i]);
        label.push(labels ? String(labels[i]) : (e.label ?? e.table.split('/').pop()!));
        trial.push(trs ? (trs as Float64Array)[i] : NaN);
        kind.push(kinds ? String(kinds[i]) : '');
      }
      anyTrial ||= Boolean(trs);
      anyKind ||= Boolean(kinds);
    } else {
      const s = readTimeSeries(h5, file, e.series);
      const lab = e.label ?? e.series.split('/').pop()!;
      if (e.threshold === undefined) {
        for (let i = 0; i < s.times.length; i++) {
          time.push(s.times[i]);
          label.push(lab);
          trial.push(NaN);
          kind.push('');
        }
      } else {
        const found = pulsesFromSeries(s.times, s.values, { ...(s.rateHz !== undefined ? { rateHz: s.rateHz } : {}), highThreshold: e.threshold, lowThreshold: e.threshold });
        for (const t of found.onset) {
          time.push(t);
          label.push(lab);
          trial.push(NaN);
          kind.push('');
        }
      }
    }
  }
  if (time.length === 0) return null;
  return {
    file,
    columns: { time: 'event times', label: 'event labels', ...(anyTrial ? { trial: 'event trials' } : {}), ...(anyKind ? { kind: 'event kinds' } : {}) },
    time: Float64Array.from(time),
    label,
    ...(anyTrial ? { trial: Float64Array.from(trial) } : {}),
    ...(anyKind ? { kind } : {}),
  };
}
