/**
 * Reads and checks session.json, the optional manifest of a session folder
 * (format documented in README.md, "Input formats"). Every key is checked:
 * an unknown key, a wrong type or an impossible value is an InputError naming
 * session.json and the key (a typo must never silently fall back to a default).
 *
 * Key names are snake_case; analysis parameters under "parameters" keep the
 * names of the defaults table (checked later by resolveParameters). The "nwb"
 * section belongs to the NWB reader: it is passed through untouched.
 * A table section set to null means "do not read this table" even when its
 * default file exists.
 */
import { InputError } from '../errors';

export type TimeUnit = 's' | 'ms' | 'samples';

export interface TableSection {
  readonly file?: string;
  /** Contract column name -> the user's header name. */
  readonly columns: Readonly<Record<string, string>>;
  readonly timeUnit?: TimeUnit;
}

export interface SessionManifest {
  readonly description?: string;
  /** Default time unit of every table (default "s"). */
  readonly timeUnit?: TimeUnit;
  /** Sample rate for "samples" times, Hz. */
  readonly sampleRateHz?: number;
  /** null = skip the table; undefined = default file if present. */
  readonly spikes?: TableSection & { readonly unitsFile?: string };
  readonly pulses?: (TableSection & { readonly trainMaxIpiS?: number }) | null;
  readonly events?: TableSection | null;
  readonly trials?: TableSection | null;
  readonly unitInfo?: TableSection | null;
  /** Sampled behavioural variables (behaviour.csv). */
  readonly behaviour?: TableSection | null;
  readonly waveforms?: { readonly file: string; readonly sampleRateHz: number } | null;
  readonly laser?: {
    readonly file: string;
    readonly sampleRateHz: number;
    readonly startS: number;
    readonly highThreshold?: number;
    readonly lowThreshold?: number;
    readonly minWidthMs: number;
    readonly powerMw?: number;
    readonly trainMaxIpiS?: number;
  };
  readonly raw?: {
    readonly file: string;
    readonly channelCount: number;
    readonly sampleRateHz: number;
    readonly gainUvPerBit: number;
    readonly startS: number;
    /** Probe channel id of each column of the file, when given (raw.channel_map). */
    readonly channelIds?: readonly string[];
  };
  /** Settings for the NWB reader, untouched. */
  readonly nwb?: unknown;
  /** Analysis parameter overrides, checked by resolveParameters. */
  readonly parameters?: unknown;
}

/** Contract columns each table section may map (README "Input formats"). */
export const TABLE_COLUMNS = {
  spikes: ['unit', 'time'],
  pulses: ['onset', 'duration', 'train', 'frequency', 'power'],
  events: ['time', 'event', 'trial', 'kind'],
  trials: ['trial', 'start', 'stop', 'condition'],
  unit_info: ['unit'],
  behaviour: ['time'],
} as const;

const TIME_UNITS: readonly string[] = ['s', 'ms', 'samples'];

export function parseManifest(text: string, file = 'session.json'): SessionManifest {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (e) {
    const msg = (e as Error).message;
    const m = /position (\d+)/.exec(msg);
    const row = m ? text.slice(0, Number(m[1])).split('\n').length : undefined;
    throw new InputError({ file, ...(row ? { row } : {}), problem: `not valid JSON (${msg.replace(/^.*?:\s*/, '')})`, fix: 'check commas, quotes and braces (a JSON validator shows the spot)' });
  }
  const err = (key: string, problem: string, value?: unknown, fix?: string): never => {
    throw new InputError({ file, column: key, ...(value !== undefined ? { value: typeof value === 'string' ? value : JSON.stringify(value) } : {}), problem, ...(fix ? { fix } : {}) });
  };
  const obj = (v: unknown, key: string): Record<string, unknown> => {
    if (typeof v !== 'object' || v === null || Array.isArray(v)) err(key, 'expected a JSON object', v);
    return v as Record<string, unknown>;
  };
  const only = (o: Record<string, unknown>, key: string, allowed: readonly string[]) => {
    for (const k of Object.keys(o)) {
      if (!allowed.includes(k)) err(key ? `${key}.${k}` : k, 'unknown key', undefined, `known keys${key ? ` of "${key}"` : ''}: ${allowed.join(', ')}`);
    }
  };
  const str = (v: unknown, key: string): string => {
    if (typeof v !== 'string' || v === '') err(key, 'expected a non-empty text', v);
    return v as string;
  };
  const fileName = (v: unknown, key: string): string => {
    const s = str(v, key);
    if (s.startsWith('/') || s.startsWith('\\') || /^[a-zA-Z]:/.test(s) || s.split(/[\\/]/).includes('..')) {
      err(key, 'file names are relative to the session folder and may not leave it', v);
    }
    return s;
  };
  const pos = (v: unknown, key: string): number => {
    if (typeof v !== 'number' || !Number.isFinite(v) || v <= 0) err(key, 'expected a positive number', v);
    return v as number;
  };
  const fin = (v: unknown, key: string): number => {
    if (typeof v !== 'number' || !Number.isFinite(v)) err(key, 'expected a finite number', v);
    return v as number;
  };
  /** raw.channel_map: one probe channel id (number or text) per column of the raw file, all different. */
  const channelMap = (v: unknown, count: number): string[] => {
    const key = 'raw.channel_map';
    if (!Array.isArray(v)) err(key, 'expected a list of channel ids, one per column of the raw file', v);
    const ids = (v as unknown[]).map((x, i) => {
      if (!((typeof x === 'number' && Number.isInteger(x)) || (typeof x === 'string' && x !== ''))) err(`${key}[${i}]`, 'expected a whole number or a non-empty text', x);
      return String(x);
    });
    if (ids.length !== count) err(key, `lists ${ids.length} channel ids but raw.channel_count is ${count}`, undefined, 'give one id per column of the raw file, in file order');
    const seen = new Set<string>();
    ids.forEach((id, i) => {
      if (seen.has(id)) err(`${key}[${i}]`, 'repeats a channel id', id);
      seen.add(id);
    });
    return ids;
  };
  const unit = (v: unknown, key: string): TimeUnit => {
    if (typeof v !== 'string' || !TIME_UNITS.includes(v)) err(key, 'expected "s", "ms" or "samples"', v);
    return v as TimeUnit;
  };
  const table = (v: unknown, key: keyof typeof TABLE_COLUMNS, extra: readonly string[] = []): TableSection => {
    const o = obj(v, key);
    only(o, key, ['file', 'columns', ...(key === 'unit_info' ? [] : ['time_unit']), ...extra]);
    const columns: Record<string, string> = {};
    if (o.columns !== undefined) {
      const c = obj(o.columns, `${key}.columns`);
      only(c, `${key}.columns`, TABLE_COLUMNS[key]);
      for (const [k, name] of Object.entries(c)) columns[k] = str(name, `${key}.columns.${k}`);
    }
    return {
      ...(o.file !== undefined ? { file: fileName(o.file, `${key}.file`) } : {}),
      columns,
      ...(o.time_unit !== undefined ? { timeUnit: unit(o.time_unit, `${key}.time_unit`) } : {}),
    };
  };

  const root = obj(json, '(top level)');
  only(root, '', ['description', 'time_unit', 'sample_rate', 'spikes', 'pulses', 'laser', 'events', 'trials', 'unit_info', 'behaviour', 'waveforms', 'raw', 'nwb', 'parameters']);
  const m: { -readonly [K in keyof SessionManifest]: SessionManifest[K] } = {};
  if (root.description !== undefined) m.description = str(root.description, 'description');
  if (root.time_unit !== undefined) m.timeUnit = unit(root.time_unit, 'time_unit');
  if (root.sample_rate !== undefined) m.sampleRateHz = pos(root.sample_rate, 'sample_rate');
  if (root.spikes !== undefined) {
    const t = table(root.spikes, 'spikes', ['units_file']);
    const o = root.spikes as Record<string, unknown>;
    m.spikes = { ...t, ...(o.units_file !== undefined ? { unitsFile: fileName(o.units_file, 'spikes.units_file') } : {}) };
    if (m.spikes.unitsFile && !(m.spikes.file ?? '').toLowerCase().endsWith('.npy')) {
      err('spikes.units_file', 'units_file goes with a spike-time .npy file in spikes.file', o.units_file);
    }
  }
  if (root.pulses !== undefined) {
    if (root.pulses === null) m.pulses = null;
    else {
      const t = table(root.pulses, 'pulses', ['train_max_ipi_s']);
      const o = root.pulses as Record<string, unknown>;
      m.pulses = { ...t, ...(o.train_max_ipi_s !== undefined ? { trainMaxIpiS: pos(o.train_max_ipi_s, 'pulses.train_max_ipi_s') } : {}) };
    }
  }
  for (const k of ['events', 'trials', 'unit_info', 'behaviour'] as const) {
    if (root[k] === undefined) continue;
    const v = root[k] === null ? null : table(root[k], k);
    if (k === 'unit_info') m.unitInfo = v;
    else m[k] = v;
  }
  if (root.waveforms !== undefined) {
    if (root.waveforms === null) m.waveforms = null;
    else {
      const o = obj(root.waveforms, 'waveforms');
      only(o, 'waveforms', ['file', 'sample_rate']);
      if (o.sample_rate === undefined) err('waveforms.sample_rate', 'the sample rate of the waveform samples is missing', undefined, 'give it in Hz, e.g. "sample_rate": 30000');
      m.waveforms = { file: o.file === undefined ? 'waveforms.npy' : fileName(o.file, 'waveforms.file'), sampleRateHz: pos(o.sample_rate, 'waveforms.sample_rate') };
    }
  }
  if (root.laser !== undefined) {
    const o = obj(root.laser, 'laser');
    only(o, 'laser', ['file', 'sample_rate', 'start_s', 'high_threshold', 'low_threshold', 'min_width_ms', 'power_mw', 'train_max_ipi_s']);
    if (o.sample_rate === undefined) err('laser.sample_rate', 'the sample rate of the laser trace is missing', undefined, 'give it in Hz, e.g. "sample_rate": 10000');
    const high = o.high_threshold !== undefined ? fin(o.high_threshold, 'laser.high_threshold') : undefined;
    const low = o.low_threshold !== undefined ? fin(o.low_threshold, 'laser.low_threshold') : undefined;
    if ((high === undefined) !== (low === undefined)) err('laser', 'give both high_threshold and low_threshold, or neither (automatic levels)');
    if (high !== undefined && low! > high) err('laser.low_threshold', 'must not exceed high_threshold', low);
    m.laser = {
      file: o.file === undefined ? 'laser.npy' : fileName(o.file, 'laser.file'),
      sampleRateHz: pos(o.sample_rate, 'laser.sample_rate'),
      startS: o.start_s === undefined ? 0 : fin(o.start_s, 'laser.start_s'),
      ...(high !== undefined ? { highThreshold: high, lowThreshold: low } : {}),
      minWidthMs: o.min_width_ms === undefined ? 0.5 : pos(o.min_width_ms, 'laser.min_width_ms'),
      ...(o.power_mw !== undefined ? { powerMw: pos(o.power_mw, 'laser.power_mw') } : {}),
      ...(o.train_max_ipi_s !== undefined ? { trainMaxIpiS: pos(o.train_max_ipi_s, 'laser.train_max_ipi_s') } : {}),
    };
  }
  if (root.raw !== undefined) {
    const o = obj(root.raw, 'raw');
    only(o, 'raw', ['file', 'channel_count', 'sample_rate', 'gain_uv_per_bit', 'start_s', 'channel_map']);
    for (const k of ['file', 'channel_count', 'sample_rate', 'gain_uv_per_bit']) {
      if (o[k] === undefined) err(`raw.${k}`, 'is missing', undefined, 'the raw section needs file, channel_count, sample_rate (Hz) and gain_uv_per_bit');
    }
    const ch = o.channel_count;
    if (typeof ch !== 'number' || !Number.isInteger(ch) || ch < 1 || ch > 65536) err('raw.channel_count', 'expected a whole number of channels (1 to 65536)', ch);
    m.raw = {
      file: fileName(o.file, 'raw.file'),
      channelCount: ch as number,
      sampleRateHz: pos(o.sample_rate, 'raw.sample_rate'),
      gainUvPerBit: pos(o.gain_uv_per_bit, 'raw.gain_uv_per_bit'),
      startS: o.start_s === undefined ? 0 : fin(o.start_s, 'raw.start_s'),
      ...(o.channel_map !== undefined ? { channelIds: channelMap(o.channel_map, ch as number) } : {}),
    };
  }
  if (root.nwb !== undefined) m.nwb = root.nwb;
  if (root.parameters !== undefined) m.parameters = root.parameters;
  return m;
}
