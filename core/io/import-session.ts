/**
 * Imports a session folder (DESIGN.md section 3, README "Input formats") from
 * any SessionSource: reads session.json if present, the spike table (CSV/TSV
 * or spikes.npy + units.npy), laser pulses (pulses.csv or a laser trace
 * laser.npy), events, trials, sampled behaviour (behaviour.csv), unit info,
 * mean waveforms and the raw voltage file; converts times to seconds; hashes every file it reads (SHA-256, as it
 * streams); and hands the typed columns to buildRecording for validation.
 *
 * The same code runs in Node (CLI, Electron main) and in the browser.
 * Errors are InputErrors naming file, row and column; nothing is written.
 * Delimited files stream chunk by chunk, so a 20-million-row spike table needs
 * its parsed row blocks (10 bytes per spike while there are fewer than 65,536
 * unit ids) plus one chunk, not its text; .npy spikes are read piece by piece.
 */
import { DEFAULTS, type Parameters } from '../defaults';
import { InputError } from '../errors';
import type { Warning } from '../model/types';
import { resolveParameters } from '../resolve-parameters';
import { buildRecording, type BuildRecordingOptions, type EventColumns, type PulseColumns, type SpikeColumns, type TrialColumns, type UnitInfoColumns, type WaveformColumns } from './build-recording';
import { createDelimitedParser, type ColumnSpec, type DelimitedTable } from './create-delimited-parser';
import { createRawSource } from './create-raw-source';
import { createSha256, type Sha256 } from './create-sha256';
import { decodeUtf8 } from './decode-utf8';
import { detectLaserPulses } from './detect-laser-pulses';
import type { BehaviourColumns } from './build-behaviour';
import type { ImportResult, InputFileRecord } from './import-result';
import { npyToFloat64 } from './npy-to-float64';
import { parseManifest, type SessionManifest, type TableSection, type TimeUnit } from './parse-manifest';
import { readNpy, type NpyArray } from './read-npy';
import { npySpikePieces } from './npy-spike-pieces';
import type { RandomAccessFile, SessionSource } from './session-source';
import { spikePieces } from './spike-pieces';

export interface ImportOptions {
  /** Further parameter sources applied after session.json's (e.g. --config). */
  readonly parameterSources?: readonly { file: string; overrides: unknown }[];
  /**
   * Hash factory (default: the pure SHA-256 of core; Node passes node:crypto's),
   * called with the name of the input file the hash is for. A factory may
   * hash a file elsewhere (the CLI hashes large files on a second thread: its
   * digestHex then returns a placeholder that the caller replaces,
   * core/node/thread-hasher.ts).
   */
  readonly createHash?: (file: string) => Sha256;
  /**
   * Put the recording's spike times on one SharedArrayBuffer (see
   * buildRecording), so it can be posted to a worker thread without a copy.
   * Default false (browsers need cross-origin isolation for it).
   */
  readonly sharedMemory?: boolean;
  /** buildRecording's onSharedSpikes: told the shared spike array before it is filled. */
  readonly onSharedSpikes?: BuildRecordingOptions['onSharedSpikes'];
}

export const MANIFEST_FILE = 'session.json';

/** Default file names, first present wins. */
const DEFAULT_FILES = {
  spikes: ['spikes.csv', 'spikes.tsv', 'spikes.txt', 'spikes.npy'],
  pulses: ['pulses.csv', 'pulses.tsv'],
  events: ['events.csv', 'events.tsv'],
  trials: ['trials.csv', 'trials.tsv'],
  unitInfo: ['unit_info.csv', 'unit_info.tsv'],
  behaviour: ['behaviour.csv', 'behaviour.tsv'],
} as const;

export async function importSession(source: SessionSource, options: ImportOptions = {}): Promise<ImportResult> {
  const opened: RandomAccessFile[] = [];
  try {
    return await importFrom(source, options, opened);
  } finally {
    for (const f of opened) f.close?.();
  }
}

/** importSession's work; files it opens for random access go into `opened` (closed by the caller). */
async function importFrom(source: SessionSource, options: ImportOptions, opened: RandomAccessFile[]): Promise<ImportResult> {
  const makeHash = options.createHash ?? createSha256;
  const names = new Set(await source.list());
  const inputs: InputFileRecord[] = [];
  const warnings: Warning[] = [];

  // ---- helpers -------------------------------------------------------------
  const requireFile = (file: string, key: string) => {
    if (!names.has(file)) {
      throw new InputError({ file: MANIFEST_FILE, column: key, value: file, problem: `names a file that is not in the session folder "${source.name}"`, fix: 'check the spelling (names are case-sensitive)' });
    }
  };
  const readWhole = async (file: string): Promise<Uint8Array> => {
    const h = makeHash(file); // before reading: a factory may note the file's state first
    const bytes = await source.readAll(file);
    h.update(bytes);
    inputs.push({ file, bytes: bytes.length, sha256: h.digestHex() });
    return bytes;
  };
  /** Random access to a file: the host's, or the whole file read once (and hashed by the caller). */
  const randomAccess = async (file: string): Promise<RandomAccessFile> => {
    if (source.openRandomAccess) return source.openRandomAccess(file);
    const bytes = await source.readAll(file);
    return { size: bytes.length, read: (offset, length) => bytes.subarray(offset, offset + length) };
  };
  const readTable = async (file: string, columns: ColumnSpec[], keepExtra = false): Promise<DelimitedTable> => {
    const parser = createDelimitedParser({ file, columns, keepExtra });
    const h = makeHash(file);
    let size = 0;
    for await (const chunk of source.stream(file)) {
      h.update(chunk);
      size += chunk.length;
      parser.push(chunk);
    }
    const table = parser.finish();
    inputs.push({ file, bytes: size, sha256: h.digestHex() });
    if (table.ignored.length > 0) {
      warnings.push({ code: 'ignored-columns', file, count: table.ignored.length, message: `${file}: column(s) not used: ${table.ignored.join(', ')}` });
    }
    return table;
  };
  /** The header names of a delimited file (reads up to its first line break). */
  const headerOf = async (file: string): Promise<readonly string[]> => {
    const parser = createDelimitedParser({ file, columns: [], keepExtra: true });
    for await (const chunk of source.stream(file)) {
      const nl = chunk.indexOf(10);
      parser.push(nl >= 0 ? chunk.subarray(0, nl + 1) : chunk);
      if (nl >= 0) break;
    }
    return parser.finish().header;
  };
  const pick = (section: TableSection | null | undefined, defaults: readonly string[], key: string): string | null => {
    if (section === null) return null;
    if (section?.file) {
      requireFile(section.file, `${key}.file`);
      return section.file;
    }
    return defaults.find((f) => names.has(f)) ?? null;
  };

  // ---- manifest and parameters ---------------------------------------------
  let manifest: SessionManifest = {};
  if (names.has(MANIFEST_FILE)) {
    let bytes = await readWhole(MANIFEST_FILE);
    if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) bytes = bytes.subarray(3);
    manifest = parseManifest(decodeUtf8(bytes), MANIFEST_FILE);
  }
  if (manifest.nwb !== undefined) {
    throw new InputError({ file: MANIFEST_FILE, column: 'nwb', problem: 'this session points to an NWB file, which the folder importer does not read', fix: 'open the session with loadSession (CLI: tagbench run/inspect), which hands it to the NWB reader' });
  }
  const parameterSources = [
    ...(manifest.parameters !== undefined ? [{ file: MANIFEST_FILE, overrides: manifest.parameters }] : []),
    ...(options.parameterSources ?? []),
  ];
  const parameters: Parameters = resolveParameters(parameterSources);
  const unitOf = (section: TableSection | null | undefined): TimeUnit => section?.timeUnit ?? manifest.timeUnit ?? 's';
  /** Seconds per time unit of a file (samples need session.json's sample_rate). */
  const secondsPer = (unit: TimeUnit, file: string, key: string): number => {
    if (unit === 's') return 1;
    if (unit === 'ms') return 1e-3;
    if (manifest.sampleRateHz === undefined) {
      throw new InputError({ file: MANIFEST_FILE, column: key, problem: `${file} has times in samples but no "sample_rate" is given`, fix: 'add "sample_rate": <Hz> at the top level of session.json' });
    }
    return 1 / manifest.sampleRateHz;
  };
  const toSeconds = (v: Float64Array, unit: TimeUnit, file: string, key: string): void => {
    const f = secondsPer(unit, file, key);
    if (f !== 1) for (let i = 0; i < v.length; i++) v[i] *= f;
  };
  const col = (section: TableSection | null | undefined, name: string) => section?.columns[name] ?? name;

  // ---- spikes ----------------------------------------------------------------
  const spikeFile = pick(manifest.spikes, DEFAULT_FILES.spikes, 'spikes');
  if (!spikeFile) {
    const listed = [...names].sort().slice(0, 12).join(', ');
    throw new InputError({
      file: source.name,
      problem: `no spike table found (looked for ${DEFAULT_FILES.spikes.join(', ')}; the folder holds: ${listed || 'nothing'})`,
      fix: 'add spikes.csv with columns unit,time (one row per spike), or name the file in session.json ("spikes": {"file": ...})',
    });
  }
  let spikes: SpikeColumns;
  let finishSpikes = () => {};
  const spikeUnit = unitOf(manifest.spikes);
  if (spikeFile.toLowerCase().endsWith('.npy')) {
    const unitsFile = manifest.spikes?.unitsFile ?? 'units.npy';
    if (manifest.spikes?.unitsFile) requireFile(unitsFile, 'spikes.units_file');
    else if (!names.has(unitsFile)) {
      throw new InputError({ file: spikeFile, problem: 'spike times in .npy form need units.npy beside them (the unit of each spike)', fix: 'save units.npy, or name it in session.json as "spikes": {"units_file": ...}' });
    }
    // Both arrays are read piece by piece by offset, never whole: units.npy once
    // in full first (hashed, ids coded), then buildRecording visits the pieces
    // twice (unit codes alone, then both; spikes.npy is hashed on that visit).
    const tRec = { file: spikeFile, bytes: 0, sha256: '' };
    const uRec = { file: unitsFile, bytes: 0, sha256: '' };
    inputs.push(tRec, uRec);
    const tIn = { file: spikeFile, data: await randomAccess(spikeFile), hash: makeHash(spikeFile) };
    const uIn = { file: unitsFile, data: await randomAccess(unitsFile), hash: makeHash(unitsFile) };
    opened.push(tIn.data, uIn.data);
    const npy = npySpikePieces(tIn, uIn, {
      timeFactor: (h) => {
        // integer sample counts are converted exactly (float64 holds integers to 2^53)
        const unit = manifest.spikes?.timeUnit ?? manifest.timeUnit ?? (h.dtype.startsWith('f') ? 's' : 'samples');
        return secondsPer(unit, spikeFile, 'spikes.time_unit');
      },
    });
    Object.assign(uRec, { bytes: uIn.data.size, sha256: uIn.hash.digestHex() });
    spikes = { file: spikeFile, columns: { unit: unitsFile, time: spikeFile }, unitIds: npy.unitIds, pieces: npy.pieces };
    finishSpikes = () => {
      if (!npy.timesHashed()) throw new Error('spikes.npy was not read in full'); // buildRecording visits every piece
      Object.assign(tRec, { bytes: tIn.data.size, sha256: tIn.hash.digestHex() });
    };
  } else {
    const uName = col(manifest.spikes, 'unit');
    const tName = col(manifest.spikes, 'time');
    // the parser's row blocks go to buildRecording as they are (never joined into one copy)
    const t = await readTable(spikeFile, [
      { name: uName, kind: 'code', required: true, pieces: true },
      { name: tName, kind: 'number', required: true, pieces: true },
    ]);
    const time = t.pieces.get(tName)!.numbers!;
    const f = secondsPer(spikeUnit, spikeFile, 'spikes.time_unit');
    if (f !== 1) for (const b of time) for (let i = 0; i < b.length; i++) b[i] *= f;
    const c = t.pieces.get(uName)!;
    spikes = { file: spikeFile, rowOf: t.rowOf, columns: { unit: uName, time: tName }, unitIds: c.dictionary!, pieces: spikePieces(c.codes!, time) };
  }

  // ---- laser pulses ------------------------------------------------------------
  let pulses: PulseColumns | undefined;
  const pulseFile = pick(manifest.pulses, DEFAULT_FILES.pulses, 'pulses');
  if (manifest.laser) {
    const L = manifest.laser;
    if (pulseFile) {
      throw new InputError({ file: MANIFEST_FILE, column: 'laser', problem: `both a laser trace (${L.file}) and a pulse table (${pulseFile}) are given`, fix: 'keep one: remove the "laser" section, or set "pulses": null' });
    }
    requireFile(L.file, 'laser.file');
    const a = oneD(readNpy(await readWhole(L.file), L.file), L.file);
    const trace = npyToFloat64(a, L.file);
    const d = detectLaserPulses(trace, {
      sampleRateHz: L.sampleRateHz,
      startS: L.startS,
      minWidthS: L.minWidthMs / 1000,
      ...(L.highThreshold !== undefined ? { highThreshold: L.highThreshold, lowThreshold: L.lowThreshold } : {}),
    });
    if (d.onsetS.length === 0) {
      warnings.push({ code: 'laser-trace-without-pulses', file: L.file, count: 1, message: `${L.file}: no pulse crossed the threshold (${round(d.highThreshold)}); the session has no laser pulses` });
    }
    if (d.dropped > 0) warnings.push({ code: 'laser-glitches-dropped', file: L.file, count: d.dropped, message: `${L.file}: ${d.dropped} crossing(s) shorter than ${L.minWidthMs} ms were ignored as glitches` });
    if (d.unterminated > 0) warnings.push({ code: 'laser-pulse-unterminated', file: L.file, count: d.unterminated, message: `${L.file}: the trace ends during a pulse; its duration runs to the end of the trace` });
    pulses = {
      file: L.file,
      columns: { onset: `${L.file} (threshold crossings)` },
      onset: d.onsetS,
      duration: d.durationS,
      ...(L.powerMw !== undefined ? { powerMw: new Float64Array(d.onsetS.length).fill(L.powerMw) } : {}),
      ...(L.trainMaxIpiS !== undefined ? { trainMaxIpiS: L.trainMaxIpiS } : {}),
    };
  } else if (pulseFile) {
    const P = manifest.pulses ?? undefined;
    const names5 = { onset: col(P, 'onset'), duration: col(P, 'duration'), train: col(P, 'train'), frequency: col(P, 'frequency'), power: col(P, 'power') };
    const t = await readTable(pulseFile, [
      { name: names5.onset, kind: 'number', required: true },
      { name: names5.duration, kind: 'number', required: false, allowEmpty: true },
      { name: names5.train, kind: 'code', required: false },
      { name: names5.frequency, kind: 'number', required: false, allowEmpty: true },
      { name: names5.power, kind: 'number', required: false, allowEmpty: true },
    ]);
    const u = unitOf(P);
    const onset = t.numbers.get(names5.onset)!;
    toSeconds(onset, u, pulseFile, 'pulses.time_unit');
    const duration = t.numbers.get(names5.duration);
    if (duration) toSeconds(duration, u, pulseFile, 'pulses.time_unit');
    const train = t.codes.get(names5.train);
    pulses = {
      file: pulseFile,
      rowOf: t.rowOf,
      columns: {
        onset: names5.onset,
        ...(duration ? { duration: names5.duration } : {}),
        ...(train ? { train: names5.train } : {}),
        ...(t.numbers.has(names5.frequency) ? { frequency: names5.frequency } : {}),
        ...(t.numbers.has(names5.power) ? { power: names5.power } : {}),
      },
      onset,
      ...(duration ? { duration } : {}),
      ...(train ? { train: train.codes } : {}),
      ...(t.numbers.has(names5.frequency) ? { frequencyHz: t.numbers.get(names5.frequency)! } : {}),
      ...(t.numbers.has(names5.power) ? { powerMw: t.numbers.get(names5.power)! } : {}),
      ...(P?.trainMaxIpiS !== undefined ? { trainMaxIpiS: P.trainMaxIpiS } : {}),
    };
  }

  // ---- trials (before events: events refer to trials) ----------------------------
  let trials: TrialColumns | undefined;
  const trialFile = pick(manifest.trials, DEFAULT_FILES.trials, 'trials');
  if (trialFile) {
    const T = manifest.trials ?? undefined;
    const n = { trial: col(T, 'trial'), start: col(T, 'start'), stop: col(T, 'stop'), condition: col(T, 'condition') };
    const t = await readTable(
      trialFile,
      [
        { name: n.trial, kind: 'number', required: true },
        { name: n.start, kind: 'number', required: true },
        { name: n.stop, kind: 'number', required: true },
        { name: n.condition, kind: 'text', required: false },
      ],
      true,
    );
    const u = unitOf(T);
    const start = t.numbers.get(n.start)!;
    const stop = t.numbers.get(n.stop)!;
    toSeconds(start, u, trialFile, 'trials.time_unit');
    toSeconds(stop, u, trialFile, 'trials.time_unit');
    const condition = t.texts.get(n.condition);
    trials = {
      file: trialFile,
      rowOf: t.rowOf,
      columns: { trial: n.trial, start: n.start, stop: n.stop, ...(condition ? { condition: n.condition } : {}) },
      trial: t.numbers.get(n.trial)!,
      start,
      stop,
      ...(condition ? { condition } : {}),
      covariates: Object.fromEntries(t.extra),
    };
  }

  // ---- events ---------------------------------------------------------------------
  let events: EventColumns | undefined;
  const eventFile = pick(manifest.events, DEFAULT_FILES.events, 'events');
  if (eventFile) {
    const E = manifest.events ?? undefined;
    const n = { time: col(E, 'time'), event: col(E, 'event'), trial: col(E, 'trial'), kind: col(E, 'kind') };
    const t = await readTable(eventFile, [
      { name: n.time, kind: 'number', required: true },
      { name: n.event, kind: 'text', required: true },
      { name: n.trial, kind: 'number', required: false, allowEmpty: true },
      { name: n.kind, kind: 'text', required: false },
    ]);
    const time = t.numbers.get(n.time)!;
    toSeconds(time, unitOf(E), eventFile, 'events.time_unit');
    const trial = t.numbers.get(n.trial);
    const kind = t.texts.get(n.kind);
    events = {
      file: eventFile,
      rowOf: t.rowOf,
      columns: { time: n.time, label: n.event, ...(trial ? { trial: n.trial } : {}), ...(kind ? { kind: n.kind } : {}) },
      time,
      label: t.texts.get(n.event)!,
      ...(trial ? { trial } : {}),
      ...(kind ? { kind } : {}),
    };
  }

  // ---- sampled behavioural variables ------------------------------------------------
  let behaviour: BehaviourColumns | undefined;
  const behaviourFile = pick(manifest.behaviour, DEFAULT_FILES.behaviour, 'behaviour');
  if (behaviourFile) {
    const B = manifest.behaviour ?? undefined;
    const tName = col(B, 'time');
    // Every column but time is a numeric variable: read the header line first, so that
    // the parser converts them as numbers while streaming (kept as text, a 1 kHz tracking
    // file would cost a string per cell) and names the row of any value that is not one.
    const header = await headerOf(behaviourFile);
    const names = header.filter((h) => h !== tName && h !== '');
    const t = await readTable(behaviourFile, [
      { name: tName, kind: 'number', required: true },
      ...names.map((name) => ({ name, kind: 'number' as const, required: true })),
    ]);
    const time = t.numbers.get(tName)!;
    toSeconds(time, unitOf(B), behaviourFile, 'behaviour.time_unit');
    behaviour = { file: behaviourFile, rowOf: t.rowOf, columns: { time: tName }, time, variables: new Map(names.map((n) => [n, t.numbers.get(n)!])) };
  }

  // ---- unit info and waveforms ---------------------------------------------------------
  let unitInfo: UnitInfoColumns | undefined;
  const infoFile = pick(manifest.unitInfo, DEFAULT_FILES.unitInfo, 'unit_info');
  if (infoFile) {
    const uName = col(manifest.unitInfo, 'unit');
    const t = await readTable(infoFile, [{ name: uName, kind: 'text', required: true }], true);
    unitInfo = { file: infoFile, rowOf: t.rowOf, columns: { unit: uName }, ids: t.texts.get(uName)!, meta: Object.fromEntries(t.extra) };
  }
  let waveforms: WaveformColumns | undefined;
  if (manifest.waveforms) {
    const W = manifest.waveforms;
    requireFile(W.file, 'waveforms.file');
    const a = readNpy(await readWhole(W.file), W.file);
    if (a.shape.length !== 2) {
      throw new InputError({ file: W.file, value: `(${a.shape.join(', ')})`, problem: 'mean waveforms must be a 2-D array [units x samples]', fix: 'save one row per unit (for several channels, save the peak channel)' });
    }
    waveforms = { file: W.file, data: npyToFloat64(a, W.file), rows: a.shape[0], samples: a.shape[1], sampleRateHz: W.sampleRateHz };
  } else if (manifest.waveforms === undefined && names.has('waveforms.npy')) {
    throw new InputError({ file: 'waveforms.npy', problem: 'mean waveforms need their sample rate', fix: 'add "waveforms": {"sample_rate": <Hz>} to session.json (or "waveforms": null to ignore the file)' });
  }

  // ---- raw voltage ---------------------------------------------------------------------
  let raw;
  if (manifest.raw) {
    const R = manifest.raw;
    requireFile(R.file, 'raw.file');
    if (!source.openRandomAccess) {
      throw new InputError({ file: R.file, problem: 'this host cannot read the raw voltage file by offset', fix: 'open the session in the desktop app or the command line' });
    }
    const f = await source.openRandomAccess(R.file);
    raw = createRawSource(f, R);
    const h = makeHash(R.file);
    for await (const chunk of source.stream(R.file)) h.update(chunk);
    inputs.push({ file: R.file, bytes: f.size, sha256: h.digestHex() });
  }

  // ---- validate and build ----------------------------------------------------------------
  const span = spanFrom(parameters, parameterSources);
  const built = buildRecording({
    spikes,
    ...(unitInfo ? { unitInfo } : {}),
    ...(waveforms ? { waveforms } : {}),
    ...(pulses ? { pulses } : {}),
    ...(events ? { events } : {}),
    ...(trials ? { trials } : {}),
    ...(behaviour ? { behaviour } : {}),
    ...(span ? { span } : {}),
    toleranceS: parameters.span.toleranceS,
    ...(raw ? { raw } : {}),
  }, { sharedMemory: options.sharedMemory ?? false, onSharedSpikes: options.onSharedSpikes });
  finishSpikes();
  return {
    recording: built.recording,
    warnings: [...warnings, ...built.warnings],
    inputs,
    parameterSources,
    sourceKind: 'folder',
    name: source.name,
  };
}

function oneD(a: NpyArray, file: string): NpyArray {
  if (a.shape.length !== 1) {
    throw new InputError({ file, value: `(${a.shape.join(', ')})`, problem: 'expected a 1-D array', fix: 'save a flat array (numpy.ravel)' });
  }
  return a;
}

function round(x: number): string {
  return String(Math.round(x * 1e6) / 1e6);
}

/** The explicit span from the parameters, with the file that set it last. */
function spanFrom(p: Parameters, sources: readonly { file: string; overrides: unknown }[]) {
  if (p.span.startS === DEFAULTS.span.startS && p.span.stopS === DEFAULTS.span.stopS) return undefined;
  let file = MANIFEST_FILE;
  for (const s of sources) {
    const sec = (s.overrides as { span?: Record<string, unknown> } | null)?.span;
    if (sec && ('startS' in sec || 'stopS' in sec)) file = s.file;
  }
  return { startS: p.span.startS, stopS: p.span.stopS, source: 'manifest' as const, file };
}
