/**
 * Turns plain typed columns (from CSV, NPY or NWB readers) into a validated,
 * immutable Recording, plus the counted warnings of DESIGN.md section 8.
 *
 * Every reader of the project funnels through this one function, so the same
 * input gets the same checks whatever its format.
 *
 * Units: all times in seconds (readers convert ms / samples before calling).
 *
 * Errors (InputError naming file, row or element, column, value, fix):
 *  - no spikes at all; an empty unit id; a spike/pulse/event/trial time that
 *    is NaN or infinite;
 *  - a negative time (before 0 s, or before the span start when one is given);
 *  - a unit in the spike table unknown to the unit-info table (and duplicate
 *    unit-info rows); an event trial unknown to the trial table; duplicate
 *    trial numbers; a trial stopping before it starts; an empty event label;
 *  - times beyond the recording span by more than `toleranceS`; with an
 *    explicit span, any time past span stop + tolerance; with a span taken
 *    from the inputs, one file ending over SCALE_RATIO times later than all
 *    others (unless it is the spike file and the units' median rate is at
 *    least PLAUSIBLE_MEDIAN_RATE_HZ: then a warning). Both say "looks like
 *    milliseconds labelled as seconds" when the overshoot is a factor of
 *    ~1000 (the classic unit slip);
 *  - laser pulses (onset, or onset + duration) outside the recording span.
 * Warnings (counted): unsorted spikes, duplicate spike times, units without
 * spikes. Behavioural samples: buildBehaviour's checks, and they must overlap
 * the span (they do not extend it).
 *
 * Span (DESIGN.md section 4): [span.startS ?? 0, span.stopS ?? latest time in
 * any input (spike, pulse end, event, trial stop)].
 *
 * Unit order: the unit-info table's order when given, otherwise ids in natural
 * order (numeric ids numerically, "2" before "10"; others by code point).
 * Spikes are read in pieces (SpikePieces: whole arrays, CSV row blocks, .npy
 * pieces), twice: unit codes alone (skipped when the source counted them
 * already: SpikePieces.codeCounts), then codes and times. They are grouped
 * with a counting sort (O(n)) into one Float64Array, the only full-length
 * array made here; each unit's spikeTimes is a view of it, sorted. Unsorted
 * spikes are counted afterwards as descents within each unit's range (the
 * sort is stable, so the range holds the unit's spikes in file order). Events are sorted by time,
 * trials by start, pulses by onset (ties keep file order).
 *
 * options.sharedMemory (default false): allocate that one spike array on a
 * SharedArrayBuffer, so the Recording's spike times can be posted to a worker
 * thread without a copy (every unit's spikeTimes.buffer is then the same
 * SharedArrayBuffer). Off by default: browsers offer SharedArrayBuffer only
 * to cross-origin-isolated pages. The values are the same either way.
 * options.onSharedSpikes: told that shared array before it is filled (see
 * SharedSpikeMemory), e.g. to have another thread fault its pages in while
 * this one fills it (core/node/fault-in-pages.ts).
 */
import { InputError } from '../errors';
import type { Events, Pulses, RawSource, Recording, Scalar, Trials, Unit, Warning } from '../model/types';
import { emptyEvents, emptyPulses, emptyTrials } from '../model/empty';
import { assignTrains } from './assign-trains';
import { buildBehaviour, type BehaviourColumns } from './build-behaviour';
import { spikePieces, type SpikePieces, type UnitCodes } from './spike-pieces';

/** Where a table's i-th record sits in its file, for messages. */
export interface Located {
  /** File name as the user knows it (relative to the session folder). */
  readonly file: string;
  /** 1-based line number of record i (CSV: header is line 1). Absent for binary files: messages then name the 0-based element. */
  readonly rowOf?: (index: number) => number;
}

interface SpikeColumnsBase extends Located {
  /** Column names as in the user's file, for messages. */
  readonly columns: { readonly unit: string; readonly time: string };
  /** Distinct unit ids; unit codes index this list. */
  readonly unitIds: readonly string[];
}

/** Spikes as two whole arrays (NWB, tests). */
export interface SpikeArrays extends SpikeColumnsBase {
  /** Unit code of each spike (index into unitIds). */
  readonly unit: Int32Array;
  /** Spike time, s, any order. */
  readonly time: Float64Array;
}

/** Spikes in pieces (CSV row blocks, .npy read piece by piece): see spike-pieces.ts. */
export interface SpikePieceColumns extends SpikeColumnsBase {
  readonly pieces: SpikePieces;
}

export type SpikeColumns = SpikeArrays | SpikePieceColumns;

export interface UnitInfoColumns extends Located {
  readonly columns: { readonly unit: string };
  /** Unit id per row (each once). */
  readonly ids: readonly string[];
  /** Metadata columns (channel, depth, label, ...), one value per row; NaN / "" = not given. */
  readonly meta: Readonly<Record<string, Float64Array | readonly string[]>>;
}

export interface WaveformColumns {
  readonly file: string;
  /** Row-major [rows x samples], microvolts by convention; row r belongs to unit-info row r. */
  readonly data: Float64Array;
  readonly rows: number;
  readonly samples: number;
  readonly sampleRateHz: number;
}

export interface PulseColumns extends Located {
  readonly columns: { readonly onset: string; readonly duration?: string; readonly train?: string; readonly frequency?: string; readonly power?: string };
  readonly onset: Float64Array;
  /** s; NaN = unknown. */
  readonly duration?: Float64Array;
  /** Train label code per pulse (any integer labels; renumbered 0.. in onset order). */
  readonly train?: Int32Array;
  /** Hz; NaN = unknown (then inferred from the train's inter-pulse intervals). */
  readonly frequencyHz?: Float64Array;
  /** mW; NaN = unknown. */
  readonly powerMw?: Float64Array;
  /** Train grouping when `train` is absent (see assignTrains). */
  readonly trainMaxIpiS?: number;
}

export interface EventColumns extends Located {
  readonly columns: { readonly time: string; readonly label: string; readonly trial?: string; readonly kind?: string };
  readonly time: Float64Array;
  readonly label: readonly string[];
  /** NaN = not given. */
  readonly trial?: Float64Array;
  readonly kind?: readonly string[];
}

export interface TrialColumns extends Located {
  readonly columns: { readonly trial: string; readonly start: string; readonly stop: string; readonly condition?: string };
  readonly trial: Float64Array;
  readonly start: Float64Array;
  readonly stop: Float64Array;
  readonly condition?: readonly string[];
  readonly covariates?: Readonly<Record<string, Float64Array | readonly string[]>>;
}

export interface RecordingTables {
  readonly spikes: SpikeColumns;
  readonly unitInfo?: UnitInfoColumns;
  readonly waveforms?: WaveformColumns;
  readonly pulses?: PulseColumns;
  readonly events?: EventColumns;
  readonly trials?: TrialColumns;
  /** Sampled behavioural variables (checked by buildBehaviour). */
  readonly behaviour?: BehaviourColumns;
  /** Explicit span limits (null = from the inputs) and where they came from. */
  readonly span?: {
    readonly startS: number | null;
    readonly stopS: number | null;
    readonly source: 'manifest' | 'observation-intervals';
    /** File that set the span, for messages (e.g. "session.json"). */
    readonly file: string;
  };
  /** Allowed overshoot of the span, s (DEFAULTS.span.toleranceS). */
  readonly toleranceS: number;
  readonly raw?: RawSource;
}

/** Files whose latest time exceeds every other file's by more than this factor are rejected (but see PLAUSIBLE_MEDIAN_RATE_HZ). */
export const SCALE_RATIO = 300;
/**
 * When the spike file is the one running long, a median unit rate of at least
 * this (Hz, over [span start, last spike]) is taken as proof the spike times
 * are seconds, and the session is accepted with a warning. Our choice: sorted
 * units below 0.1 Hz median are rare, while milliseconds read as seconds put
 * a 5 Hz unit at 0.005 Hz.
 */
export const PLAUSIBLE_MEDIAN_RATE_HZ = 0.1;

export interface BuildRecordingOptions {
  /** Allocate the one full-length spike array on a SharedArrayBuffer (default false). */
  readonly sharedMemory?: boolean;
  /** Called once with the shared spike array just allocated, before it is filled (only with sharedMemory). */
  readonly onSharedSpikes?: (memory: SharedSpikeMemory) => void;
}

/**
 * The shared spike array as buildRecording fills it: the spikes of group g
 * (one group per distinct unit id of the spike file) go to elements
 * starts[g] .. starts[g + 1] - 1 of `buffer` (float64), in file order, so
 * a time-sorted file fills every group's range from its start at the same
 * pace. Only the elements' places are final; their values come later.
 */
export interface SharedSpikeMemory {
  readonly buffer: SharedArrayBuffer;
  /** Group starts, groups + 1 entries (the last is the spike count). */
  readonly starts: Float64Array;
}

export function buildRecording(t: RecordingTables, options: BuildRecordingOptions = {}): { recording: Recording; warnings: Warning[] } {
  const warnings: Warning[] = [];
  const tol = t.toleranceS;
  const spanStartGiven = t.span?.startS ?? null;
  // Before 0 s is an error; with an explicit span start, before start - tolerance.
  const minTime = spanStartGiven !== null ? spanStartGiven - tol : 0;

  // ---- value checks: finite, not negative -------------------------------
  const s = t.spikes;
  const pieces = 'pieces' in s ? s.pieces : spikePieces([s.unit], [s.time]);
  const n = pieces.length;
  if (n === 0) {
    throw new InputError({ file: s.file, problem: 'the spike table has no rows', fix: 'export at least one spike (one row per spike: unit, time)' });
  }
  // Pass 1 (unit codes only): spikes per unit code and each code's first
  // record. Sources that already counted while coding the ids (the .npy
  // reader) hand over their counts instead, saving a visit.
  const nCodes = s.unitIds.length;
  const known = pieces.codeCounts?.();
  const codeCount = known ? known.count : new Float64Array(nCodes);
  const firstOf = known ? known.first : new Float64Array(nCodes).fill(-1);
  if (!known) {
    pieces.forEachUnit((unit, first) => {
      for (let i = 0; i < unit.length; i++) {
        const c = unit[i];
        if (!(c >= 0 && c < nCodes)) throw new Error(`spike ${first + i}: unit code ${c} out of range`); // reader bug
        if (codeCount[c]++ === 0) firstOf[c] = first + i;
      }
    });
  } else if (codeCount.length !== nCodes || firstOf.length !== nCodes) throw new Error('codeCounts: one count per unit id expected'); // reader bug
  // Pass 2: check every time (in file order, so the first bad row is named),
  // note the latest time, and group the spikes by unit code (a counting sort,
  // stable: file order is kept within a unit, so sorted inputs need no sort).
  // One Float64Array holds every spike; each unit's spikeTimes is a view of
  // its code's range. The scatter runs in two loops per block of BLOCK
  // spikes: destinations first, then the stores (fused into one loop, the
  // table update and the dependent far store ran ~10x slower on real data).
  const codeStart = new Float64Array(nCodes + 1);
  for (let c = 0; c < nCodes; c++) codeStart[c + 1] = codeStart[c] + codeCount[c];
  const all = options.sharedMemory ? new Float64Array(new SharedArrayBuffer(n * 8)) : new Float64Array(n);
  if (options.onSharedSpikes && all.buffer instanceof SharedArrayBuffer) options.onSharedSpikes({ buffer: all.buffer, starts: codeStart.slice() });
  const small = n < 2 ** 31;
  const at = small ? Int32Array.from(codeStart.subarray(0, nCodes)) : codeStart.slice(0, nCodes);
  const dst = small ? new Int32Array(BLOCK) : new Float64Array(BLOCK);
  const latest = Float64Array.of(-Infinity); // the latest time so far
  let maxAt = -1;
  pieces.forEach((unit, time, first) => {
    for (let b = 0; b < time.length; b += BLOCK) {
      const e = Math.min(time.length, b + BLOCK);
      destinations(unit, b, e, at, dst);
      const k = checkAndStore(time, b, e, dst, all, minTime, latest);
      if (k < 0) checkTimes(s, s.columns.time, time.subarray(-k - 1), minTime, first - k - 1); // throws, naming the record
      if (k > 0) maxAt = first + k - 1;
    }
  }, true);
  const maxT = latest[0];
  for (let c = 0; c < nCodes; c++) {
    if (at[c] !== codeStart[c + 1]) {
      // the two visits disagreed: the reader saw other data the second time
      throw new InputError({ file: s.file, problem: 'the spike table changed while it was being read', fix: 'wait until the files are completely written, then import again' });
    }
  }
  if (t.pulses) {
    checkTimes(t.pulses, t.pulses.columns.onset, t.pulses.onset, minTime);
    if (t.pulses.duration) checkOptional(t.pulses, t.pulses.columns.duration!, t.pulses.duration, 'a duration');
  }
  if (t.events) checkTimes(t.events, t.events.columns.time, t.events.time, minTime);
  if (t.trials) {
    checkTimes(t.trials, t.trials.columns.start, t.trials.start, minTime);
    checkTimes(t.trials, t.trials.columns.stop, t.trials.stop, minTime);
  }

  // ---- unit ids across files --------------------------------------------
  const emptyId = s.unitIds.indexOf('');
  if (emptyId >= 0 && codeCount[emptyId] > 0) {
    throw new InputError({ ...where(s, firstOf[emptyId]), column: s.columns.unit, problem: 'the unit id is empty', fix: 'give every spike its unit' });
  }
  let unitOrder: string[];
  const codeToUnit = new Int32Array(nCodes);
  const info = t.unitInfo;
  if (info) {
    const rowOfId = new Map<string, number>();
    info.ids.forEach((id, r) => {
      if (rowOfId.has(id)) {
        throw new InputError({ ...where(info, r), column: info.columns.unit, value: id, problem: 'this unit is listed twice', fix: 'list each unit once' });
      }
      rowOfId.set(id, r);
    });
    for (let c = 0; c < nCodes; c++) {
      const r = rowOfId.get(s.unitIds[c]);
      if (r === undefined) {
        throw new InputError({
          ...where(s, firstOf[c]),
          column: s.columns.unit,
          value: s.unitIds[c],
          problem: `unit "${s.unitIds[c]}" has spikes but is not listed in ${info.file}`,
          fix: `add it to ${info.file} or check that both files come from the same sorting`,
        });
      }
      codeToUnit[c] = r;
    }
    unitOrder = [...info.ids];
  } else {
    // (an empty id without spikes comes from a blank CSV line: not a unit)
    const sorted = s.unitIds
      .map((id, c) => ({ id, c }))
      .filter(({ id, c }) => id !== '' || codeCount[c] > 0)
      .sort((a, b) => naturalCompare(a.id, b.id));
    codeToUnit.fill(-1);
    sorted.forEach(({ c }, k) => (codeToUnit[c] = k));
    unitOrder = sorted.map((x) => x.id);
  }
  if (t.waveforms) {
    const w = t.waveforms;
    if (!info) {
      throw new InputError({ file: w.file, problem: 'mean waveforms need a unit-info table to say which row belongs to which unit', fix: 'add unit_info.csv (row r of the waveforms is unit-info row r)' });
    }
    if (w.rows !== info.ids.length) {
      throw new InputError({ file: w.file, problem: `has ${w.rows} waveform rows but ${info.file} lists ${info.ids.length} units`, fix: `write one row per unit, in the order of ${info.file}` });
    }
    if (!(w.sampleRateHz > 0) || !Number.isFinite(w.sampleRateHz)) {
      throw new InputError({ file: w.file, problem: 'the waveform sample rate is missing or not a positive number', fix: 'set waveforms.sample_rate (Hz) in session.json' });
    }
  }

  // ---- span ---------------------------------------------------------------
  const extents: { file: string; column: string; maxS: number; index: number; located: Located }[] = [];
  const pushExtent = (loc: Located, column: string, v: Float64Array, add?: Float64Array) => {
    let m = -Infinity;
    let k = -1;
    for (let i = 0; i < v.length; i++) {
      const x = add && add[i] === add[i] ? v[i] + add[i] : v[i];
      if (x > m) {
        m = x;
        k = i;
      }
    }
    if (k >= 0) extents.push({ file: loc.file, column, maxS: m, index: k, located: loc });
  };
  if (maxAt >= 0) extents.push({ file: s.file, column: s.columns.time, maxS: maxT, index: maxAt, located: s });
  if (t.pulses) pushExtent(t.pulses, t.pulses.columns.onset, t.pulses.onset, t.pulses.duration);
  if (t.events) pushExtent(t.events, t.events.columns.time, t.events.time);
  if (t.trials) pushExtent(t.trials, t.trials.columns.stop, t.trials.stop);

  const start = spanStartGiven ?? 0;
  let stop: number;
  let spanSource: Recording['spanSource'];
  if (t.span && (t.span.startS !== null || t.span.stopS !== null)) spanSource = t.span.source;
  else spanSource = 'inputs';
  if (t.span?.stopS !== null && t.span?.stopS !== undefined) {
    stop = t.span.stopS;
    if (!(stop > start)) {
      throw new InputError({ file: t.span.file, column: 'span', value: `[${start}, ${stop}]`, problem: 'the recording span stops before it starts' });
    }
    for (const e of extents) {
      if (e.located === t.pulses) continue; // pulses get their own message below
      if (e.maxS > stop + tol) {
        throw new InputError({
          ...where(e.located, e.index),
          column: e.column,
          value: String(e.maxS),
          problem: `time ${e.maxS} s lies beyond the recording span [${start}, ${stop}] s set by ${t.span.file} (tolerance ${tol} s)${scaleHint(e.maxS / stop)}`,
          fix: scaleFix(e.maxS / stop, e.file),
        });
      }
    }
  } else {
    stop = Math.max(...extents.map((e) => e.maxS));
    if (extents.length >= 2) {
      const top = extents.reduce((a, b) => (b.maxS > a.maxS ? b : a));
      const others = Math.max(...extents.filter((e) => e !== top).map((e) => e.maxS));
      if (others > 0 && top.maxS > SCALE_RATIO * others) {
        const ends = extents.filter((e) => e !== top).map((e) => `${e.file} by ${round(e.maxS)} s`).join(', ');
        // Spikes running long after short pulses/events are a real design too (a brief light block
        // at the start, no task): a unit slip in the spike file also divides every unit's apparent
        // rate by ~1000 (ms) or more (samples), so a plausible median rate in seconds lets it pass.
        const rates: number[] = [];
        if (top.located === s) for (let c = 0; c < nCodes; c++) if (codeCount[c] > 0) rates.push(codeCount[c] / (top.maxS - start));
        rates.sort((a, b) => a - b);
        const medianRate = rates.length ? rates[(rates.length - 1) >> 1] : NaN;
        if (!(medianRate >= PLAUSIBLE_MEDIAN_RATE_HZ)) {
          throw new InputError({
            ...where(top.located, top.index),
            column: top.column,
            value: String(top.maxS),
            problem: `times run to ${round(top.maxS)} s, but ${ends}${scaleHint(top.maxS / others)}`,
            fix: `${scaleFix(1000, top.file)}; if the recording really is that long, set parameters.span.stopS in session.json`,
          });
        }
        warnings.push({
          code: 'inputs-end-early',
          file: top.file,
          count: 1,
          message: `spike times run to ${round(top.maxS)} s but ${ends}; accepted as seconds because the units' median rate over that span (${round(medianRate)} Hz) is plausible (spike times in milliseconds would give rates ~1000x lower). If the other files should cover the whole recording, check their clock and time unit.`,
        });
      }
    }
    if (!(stop > start)) stop = start + 1; // a single spike at 0 s: span of 1 s rather than 0
  }
  if (t.pulses) {
    const p = t.pulses;
    for (let i = 0; i < p.onset.length; i++) {
      const d = p.duration && p.duration[i] === p.duration[i] ? p.duration[i] : 0;
      if (p.onset[i] < start - tol || p.onset[i] + d > stop + tol) {
        throw new InputError({
          ...where(p, i),
          column: p.columns.onset,
          value: String(p.onset[i]),
          problem: `this laser pulse lies outside the recording [${start}, ${stop}] s${scaleHint(p.onset[i] / stop)}`,
          fix: 'check that pulses and spikes share one clock and one time unit',
        });
      }
    }
  }
  const nUnits = unitOrder.length;

  const codeOfUnit = new Int32Array(nUnits).fill(-1);
  for (let c = 0; c < nCodes; c++) if (codeToUnit[c] >= 0) codeOfUnit[codeToUnit[c]] = c;
  // Unsorted spikes: a spike before its unit's previous one in file order,
  // i.e. a descent within the unit's range (file order is kept there).
  // Duplicates are counted once the unit is sorted.
  let unsorted = 0;
  let duplicates = 0;
  const counts = new Float64Array(2);
  const unitsWithDuplicates = new Set<string>();
  let empty = 0;
  const units: Unit[] = [];
  for (let u = 0; u < nUnits; u++) {
    const c = codeOfUnit[u];
    const st = c >= 0 ? all.subarray(codeStart[c], codeStart[c + 1]) : all.subarray(0, 0);
    orderCounts(st, counts);
    let dups = counts[1];
    if (counts[0] > 0) {
      unsorted += counts[0];
      st.sort();
      orderCounts(st, counts);
      dups = counts[1];
    }
    if (dups > 0) {
      duplicates += dups;
      unitsWithDuplicates.add(unitOrder[u]);
    }
    if (st.length === 0) empty++;
    const meta: Record<string, Scalar> = {};
    if (info) {
      for (const [k, col] of Object.entries(info.meta)) {
        const v = col[u];
        if (typeof v === 'number' ? v === v : v !== '') meta[k] = v;
      }
    }
    const w = t.waveforms;
    units.push({
      id: unitOrder[u],
      spikeTimes: st,
      meta,
      ...(w ? { waveformMean: w.data.slice(u * w.samples, (u + 1) * w.samples) } : {}),
    });
  }
  if (unsorted > 0) {
    warnings.push({ code: 'unsorted-spikes', file: s.file, count: unsorted, message: `${unsorted} spike(s) came before an earlier row's spike of the same unit; spikes were sorted by time` });
  }
  if (duplicates > 0) {
    warnings.push({
      code: 'duplicate-spike-times',
      file: s.file,
      count: duplicates,
      message: `${duplicates} spike(s) repeat the time of the unit's previous spike (${unitsWithDuplicates.size} unit(s), e.g. ${[...unitsWithDuplicates].slice(0, 3).join(', ')}); they were kept`,
    });
  }
  if (empty > 0) {
    warnings.push({ code: 'units-without-spikes', file: info?.file, count: empty, message: `${empty} unit(s) listed in ${info?.file ?? 'the inputs'} have no spikes; they are kept with a rate of 0 Hz` });
  }

  let behaviour;
  if (t.behaviour) {
    const b = buildBehaviour(t.behaviour);
    const bt = b.samples.time;
    if (bt[bt.length - 1] < start || bt[0] > stop) {
      throw new InputError({
        file: t.behaviour.file,
        column: t.behaviour.columns.time,
        value: `${bt[0]} to ${bt[bt.length - 1]}`,
        problem: `the behavioural samples do not overlap the recording [${start}, ${stop}] s${scaleHint(bt[0] / stop)}`,
        fix: 'check that behaviour and spikes share one clock and one time unit ("time_unit" in the behaviour section of session.json)',
      });
    }
    behaviour = b.samples;
    warnings.push(...b.warnings);
  }

  const recording: Recording = {
    units,
    pulses: t.pulses ? buildPulses(t.pulses) : emptyPulses(),
    events: t.events ? buildEvents(t.events, t.trials) : emptyEvents(),
    trials: t.trials ? buildTrials(t.trials) : emptyTrials(),
    span: [start, stop],
    spanSource,
    waveformSampleRateHz: t.waveforms ? t.waveforms.sampleRateHz : NaN,
    ...(t.raw ? { raw: t.raw } : {}),
    ...(behaviour ? { behaviour } : {}),
  };
  return { recording, warnings };
}

function where(loc: Located, index: number): { file: string; row?: number } {
  if (loc.rowOf) return { file: loc.file, row: loc.rowOf(index) };
  return { file: `${loc.file}, element ${index} (0-based)` };
}

function round(x: number): string {
  return String(Math.round(x * 1000) / 1000);
}

function scaleHint(ratio: number): string {
  if (ratio >= 300 && ratio <= 3000) return '; this looks like milliseconds labelled as seconds';
  if (ratio > 3000) return '; this looks like sample counts labelled as seconds';
  return '';
}

function scaleFix(ratio: number, file: string): string {
  if (ratio > 3000) return `give ${file} its time unit in session.json ("time_unit": "samples" in its section, and "sample_rate")`;
  if (ratio >= 300) return `give ${file} its time unit in session.json ("time_unit": "ms" in its section)`;
  return 'check the time unit and clock of this file';
}

/** Spikes per block of the scatter (the destination list stays in the first-level cache). */
const BLOCK = 4096;

/** dst[i - b] = at[unit[i]]++ for i in b .. e-1: where each spike goes. */
function destinations(unit: UnitCodes, b: number, e: number, at: Int32Array | Float64Array, dst: Int32Array | Float64Array): void {
  for (let i = b; i < e; i++) dst[i - b] = at[unit[i]]++;
}

/**
 * out[0] = descents (v[i] < v[i - 1]), out[1] = ties (v[i] === v[i - 1]).
 * Its own small function so the engine optimizes this loop at once (inside
 * buildRecording it ran unoptimized for a while, boxing every time).
 */
function orderCounts(v: Float64Array, out: Float64Array): void {
  let descents = 0;
  let ties = 0;
  for (let i = 1; i < v.length; i++) {
    if (v[i] < v[i - 1]) descents++;
    else if (v[i] === v[i - 1]) ties++;
  }
  out[0] = descents;
  out[1] = ties;
}

/**
 * all[dst[i - b]] = time[i] for i in b .. e-1, checking each time (finite,
 * not before minTime) and raising latest[0] to the latest time seen. Returns
 * -(i + 1) for the first bad time (stores before it are done, later ones
 * not); else k + 1 for the first occurrence k of the block's maximum when it
 * exceeds the latest time before the block; else 0. (The running maximum
 * lives in a typed array: held in a local that starts from a parameter, the
 * engine boxed it on every new maximum, i.e. on almost every spike of a
 * time-sorted file, ~300 MB of garbage per 20 M spikes.)
 */
function checkAndStore(time: Float64Array, b: number, e: number, dst: Int32Array | Float64Array, all: Float64Array, minTime: number, latest: Float64Array): number {
  let k = -1;
  for (let i = b; i < e; i++) {
    const x = time[i];
    if (!(x >= minTime && x !== Infinity)) return -(i + 1);
    if (x > latest[0]) {
      latest[0] = x;
      k = i;
    }
    all[dst[i - b]] = x;
  }
  return k + 1;
}

/** Checks times v (records first.. of the file): finite and not before minTime. */
function checkTimes(loc: Located, column: string, v: Float64Array, minTime: number, first = 0): void {
  for (let i = 0; i < v.length; i++) {
    const x = v[i];
    if (x >= minTime && x !== Infinity) continue;
    const row = first + i;
    if (x !== x || !Number.isFinite(x)) {
      throw new InputError({ ...where(loc, row), column, value: String(x), problem: 'time is not a finite number', fix: 'remove the row or give a time in seconds' });
    }
    if (minTime === 0) {
      throw new InputError({ ...where(loc, row), column, value: String(x), problem: 'time is negative', fix: 'times count from the start of the recording; shift them or set parameters.span.startS' });
    }
    throw new InputError({ ...where(loc, row), column, value: String(x), problem: `time lies before the recording span (earliest allowed time: span start minus tolerance = ${minTime} s)`, fix: 'check parameters.span.startS and the clock of this file' });
  }
}

function checkOptional(loc: Located, column: string, v: Float64Array, what: string): void {
  for (let i = 0; i < v.length; i++) {
    const x = v[i];
    if (x !== x) continue; // NaN = not given
    if (!Number.isFinite(x) || x < 0) {
      throw new InputError({ ...where(loc, i), column, value: String(x), problem: `${what} must be a finite number >= 0 (or empty when unknown)` });
    }
  }
}

/** Indices 0..n-1 sorted by key ascending, ties in index order (stable). */
function orderBy(key: Float64Array): Int32Array {
  const idx = new Int32Array(key.length);
  let sorted = true;
  for (let i = 0; i < idx.length; i++) {
    idx[i] = i;
    if (i > 0 && key[i] < key[i - 1]) sorted = false;
  }
  if (!sorted) {
    const a = Array.from(idx).sort((x, y) => key[x] - key[y] || x - y);
    idx.set(a);
  }
  return idx;
}

function take(v: Float64Array, idx: Int32Array): Float64Array {
  const out = new Float64Array(idx.length);
  for (let i = 0; i < idx.length; i++) out[i] = v[idx[i]];
  return out;
}

function buildPulses(p: PulseColumns): Pulses {
  const idx = orderBy(p.onset);
  const n = idx.length;
  const onset = take(p.onset, idx);
  const duration = p.duration ? take(p.duration, idx) : new Float64Array(n).fill(NaN);
  const powerMw = p.powerMw ? take(p.powerMw, idx) : new Float64Array(n).fill(NaN);
  let train: Int32Array;
  let inferredF: Float64Array;
  if (p.train) {
    // renumber labels 0.. in onset order; frequency from each train's median IPI
    const ren = new Map<number, number>();
    train = new Int32Array(n);
    for (let i = 0; i < n; i++) {
      const lab = p.train[idx[i]];
      let id = ren.get(lab);
      if (id === undefined) ren.set(lab, (id = ren.size));
      train[i] = id;
    }
    inferredF = new Float64Array(n).fill(NaN);
    const members: number[][] = Array.from({ length: ren.size }, () => []);
    for (let i = 0; i < n; i++) members[train[i]].push(i);
    for (const m of members) {
      if (m.length < 2) continue;
      const ipi = new Float64Array(m.length - 1);
      for (let k = 1; k < m.length; k++) ipi[k - 1] = onset[m[k]] - onset[m[k - 1]];
      ipi.sort();
      const L = ipi.length;
      const med = L % 2 ? ipi[(L - 1) >> 1] : (ipi[L / 2 - 1] + ipi[L / 2]) / 2;
      for (const i of m) inferredF[i] = med > 0 ? 1 / med : NaN;
    }
  } else {
    const a = assignTrains(onset, p.trainMaxIpiS);
    train = a.train;
    inferredF = a.frequencyHz;
  }
  let frequencyHz = inferredF;
  if (p.frequencyHz) {
    frequencyHz = take(p.frequencyHz, idx);
    for (let i = 0; i < n; i++) if (frequencyHz[i] !== frequencyHz[i]) frequencyHz[i] = inferredF[i];
  }
  return { onset, duration, train, frequencyHz, powerMw };
}

function buildEvents(e: EventColumns, trials?: TrialColumns): Events {
  for (let i = 0; i < e.label.length; i++) {
    if (e.label[i] === '') {
      throw new InputError({ ...where(e, i), column: e.columns.label, problem: 'the event label is empty', fix: 'name every event (e.g. reward, jump)' });
    }
  }
  if (e.trial && trials) {
    const known = new Set<number>(trials.trial);
    for (let i = 0; i < e.trial.length; i++) {
      const tr = e.trial[i];
      if (tr === tr && !known.has(tr)) {
        throw new InputError({
          ...where(e, i),
          column: e.columns.trial!,
          value: String(tr),
          problem: `trial ${tr} is not in ${trials.file}`,
          fix: `add the trial to ${trials.file} or leave the cell empty for events outside trials`,
        });
      }
    }
  }
  const idx = orderBy(e.time);
  const n = idx.length;
  return {
    time: take(e.time, idx),
    label: Array.from(idx, (i) => e.label[i]),
    trial: e.trial ? take(e.trial, idx) : new Float64Array(n).fill(NaN),
    kind: e.kind ? Array.from(idx, (i) => e.kind![i]) : new Array<string>(n).fill(''),
  };
}

function buildTrials(t: TrialColumns): Trials {
  const seen = new Map<number, number>();
  for (let i = 0; i < t.trial.length; i++) {
    const tr = t.trial[i];
    if (!Number.isFinite(tr)) {
      throw new InputError({ ...where(t, i), column: t.columns.trial, value: String(tr), problem: 'the trial number is missing or not finite' });
    }
    if (seen.has(tr)) {
      throw new InputError({ ...where(t, i), column: t.columns.trial, value: String(tr), problem: `trial ${tr} appears twice`, fix: 'give each trial one row' });
    }
    seen.set(tr, i);
    if (t.stop[i] < t.start[i]) {
      throw new InputError({ ...where(t, i), column: t.columns.stop, value: String(t.stop[i]), problem: `the trial stops before it starts (start ${t.start[i]} s)` });
    }
  }
  const idx = orderBy(t.start);
  const covariates: Record<string, Float64Array | readonly string[]> = {};
  for (const [k, col] of Object.entries(t.covariates ?? {})) {
    covariates[k] = col instanceof Float64Array ? take(col, idx) : Array.from(idx, (i) => (col as readonly string[])[i]);
  }
  return {
    trial: take(t.trial, idx),
    start: take(t.start, idx),
    stop: take(t.stop, idx),
    condition: t.condition ? Array.from(idx, (i) => t.condition![i]) : new Array<string>(idx.length).fill(''),
    covariates,
  };
}

/** Natural order of unit ids: numeric ids numerically and before others; others by code point. */
function naturalCompare(a: string, b: string): number {
  const na = a.trim() === '' ? NaN : Number(a);
  const nb = b.trim() === '' ? NaN : Number(b);
  const fa = Number.isFinite(na);
  const fb = Number.isFinite(nb);
  if (fa && fb) return na - nb || (a < b ? -1 : a > b ? 1 : 0);
  if (fa) return -1;
  if (fb) return 1;
  return a < b ? -1 : a > b ? 1 : 0;
}
