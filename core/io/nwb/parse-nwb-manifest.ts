/**
 * Validates the `nwb` section of session.json: which NWB file a session reads
 * and which tables / series play which role. Every key is optional; what is
 * left out is chosen automatically when the choice is unambiguous (see
 * planNwbRoles). Unknown keys are an error (a typo must not be ignored
 * silently).
 *
 *   "nwb": {
 *     "file": "session.nwb",
 *     "units": "/units",
 *     "trials": "/intervals/trials" | false | {"table", "condition_column"},
 *     "pulses": false
 *             | {"table": "/intervals/laser_pulses", "power_column", "power_unit": "mW"|"W",
 *                "train_column", "frequency_column", "train_max_ipi_s"}
 *             | {"series": "/stimulus/presentation/blue_light", "threshold_mw" |
 *                ("high_threshold_mw" + "low_threshold_mw"), "min_width_ms", "train_max_ipi_s"},
 *     "events": [ {"table", "label" | "label_column", "time_column", "kind_column", "trial_column"},
 *                 {"series", "label", "threshold"},
 *                 {"trials_column": "reward_time", "label": "reward"} ],
 *     "waveform_sample_rate_hz": 30000
 *   }
 *
 * `false` turns a role off. Paths are absolute HDF5 paths as `inspect` lists
 * them. Errors: InputError naming the manifest file and the key.
 */
import { InputError } from '../../errors';

export interface NwbTableEvents {
  readonly table: string;
  readonly label?: string;
  readonly labelColumn?: string;
  readonly timeColumn?: string;
  readonly kindColumn?: string;
  readonly trialColumn?: string;
}
export interface NwbSeriesEvents {
  readonly series: string;
  readonly label?: string;
  /** Rising crossings of this value (in the series' unit) are the events; absent = every sample is an event. */
  readonly threshold?: number;
}
export interface NwbTrialColumnEvents {
  readonly trialsColumn: string;
  readonly label?: string;
}
export type NwbEventSource = NwbTableEvents | NwbSeriesEvents | NwbTrialColumnEvents;

export interface NwbPulseTable {
  readonly table: string;
  /** Pulses closer than this belong to one train (s); default: the builder's. */
  readonly trainMaxIpiS?: number;
  readonly powerColumn?: string;
  readonly powerUnit?: 'mW' | 'W';
  readonly trainColumn?: string;
  readonly frequencyColumn?: string;
}
export interface NwbPulseSeries {
  readonly series: string;
  /** Levels switching a pulse on and off, mW (both or neither; default 60 % / 40 % of the trace's range). */
  readonly highThresholdMw?: number;
  readonly lowThresholdMw?: number;
  /** Shortest pulse kept, ms (default 0.5, as for a folder's laser trace). */
  readonly minWidthMs?: number;
  readonly trainMaxIpiS?: number;
}

export interface NwbManifest {
  readonly file?: string;
  readonly units?: string;
  /** false = no trials; string = table path. */
  readonly trials?: false | { readonly table?: string; readonly conditionColumn?: string };
  readonly pulses?: false | NwbPulseTable | NwbPulseSeries;
  readonly events?: false | readonly NwbEventSource[];
  readonly waveformSampleRateHz?: number;
}

export function parseNwbManifest(section: unknown, manifestFile = 'session.json'): NwbManifest {
  const ctx = new Ctx(manifestFile);
  if (section === undefined || section === null) return {};
  const o = ctx.object(section, 'nwb');
  ctx.only(o, 'nwb', ['file', 'units', 'trials', 'pulses', 'events', 'waveform_sample_rate_hz']);
  const m: { -readonly [K in keyof NwbManifest]: NwbManifest[K] } = {};
  if (o.file !== undefined) m.file = ctx.text(o.file, 'nwb.file');
  if (o.units !== undefined) m.units = ctx.path(o.units, 'nwb.units');
  if (o.trials !== undefined) {
    if (o.trials === false) m.trials = false;
    else if (typeof o.trials === 'string') m.trials = { table: ctx.path(o.trials, 'nwb.trials') };
    else {
      const t = ctx.object(o.trials, 'nwb.trials');
      ctx.only(t, 'nwb.trials', ['table', 'condition_column']);
      m.trials = {
        ...(t.table !== undefined ? { table: ctx.path(t.table, 'nwb.trials.table') } : {}),
        ...(t.condition_column !== undefined ? { conditionColumn: ctx.text(t.condition_column, 'nwb.trials.condition_column') } : {}),
      };
    }
  }
  if (o.pulses !== undefined) {
    if (o.pulses === false) m.pulses = false;
    else {
      const p = ctx.object(o.pulses, 'nwb.pulses');
      if (p.table !== undefined && p.series !== undefined) ctx.fail('nwb.pulses', 'give either "table" or "series", not both');
      if (p.table !== undefined) {
        ctx.only(p, 'nwb.pulses', ['table', 'power_column', 'power_unit', 'train_column', 'frequency_column', 'train_max_ipi_s']);
        const unit = p.power_unit === undefined ? undefined : ctx.text(p.power_unit, 'nwb.pulses.power_unit');
        if (unit !== undefined && unit !== 'mW' && unit !== 'W') ctx.fail('nwb.pulses.power_unit', 'must be "mW" or "W"', unit);
        m.pulses = {
          table: ctx.path(p.table, 'nwb.pulses.table'),
          ...(p.power_column !== undefined ? { powerColumn: ctx.text(p.power_column, 'nwb.pulses.power_column') } : {}),
          ...(unit !== undefined ? { powerUnit: unit as 'mW' | 'W' } : {}),
          ...(p.train_column !== undefined ? { trainColumn: ctx.text(p.train_column, 'nwb.pulses.train_column') } : {}),
          ...(p.frequency_column !== undefined ? { frequencyColumn: ctx.text(p.frequency_column, 'nwb.pulses.frequency_column') } : {}),
          ...(p.train_max_ipi_s !== undefined ? { trainMaxIpiS: ctx.positive(p.train_max_ipi_s, 'nwb.pulses.train_max_ipi_s') } : {}),
        };
      } else if (p.series !== undefined) {
        ctx.only(p, 'nwb.pulses', ['series', 'threshold_mw', 'high_threshold_mw', 'low_threshold_mw', 'min_width_ms', 'train_max_ipi_s']);
        let high = p.high_threshold_mw === undefined ? undefined : ctx.positive(p.high_threshold_mw, 'nwb.pulses.high_threshold_mw');
        let low = p.low_threshold_mw === undefined ? undefined : ctx.positive(p.low_threshold_mw, 'nwb.pulses.low_threshold_mw');
        if (p.threshold_mw !== undefined) {
          if (high !== undefined || low !== undefined) ctx.fail('nwb.pulses.threshold_mw', 'give threshold_mw, or high_threshold_mw and low_threshold_mw, not both');
          high = low = ctx.positive(p.threshold_mw, 'nwb.pulses.threshold_mw');
        }
        if ((high === undefined) !== (low === undefined)) ctx.fail('nwb.pulses', 'give both high_threshold_mw and low_threshold_mw, or neither (automatic levels)');
        if (high !== undefined && low! > high) ctx.fail('nwb.pulses.low_threshold_mw', 'must not exceed high_threshold_mw', String(low));
        m.pulses = {
          series: ctx.path(p.series, 'nwb.pulses.series'),
          ...(high !== undefined ? { highThresholdMw: high, lowThresholdMw: low } : {}),
          ...(p.min_width_ms !== undefined ? { minWidthMs: ctx.positive(p.min_width_ms, 'nwb.pulses.min_width_ms') } : {}),
          ...(p.train_max_ipi_s !== undefined ? { trainMaxIpiS: ctx.positive(p.train_max_ipi_s, 'nwb.pulses.train_max_ipi_s') } : {}),
        };
      } else ctx.fail('nwb.pulses', 'needs "table" (an interval table of pulses) or "series" (a laser power series)');
    }
  }
  if (o.events !== undefined) {
    if (o.events === false) m.events = false;
    else {
      if (!Array.isArray(o.events)) ctx.fail('nwb.events', 'must be a list of event sources (or false)');
      m.events = (o.events as unknown[]).map((e, i) => parseEventSource(ctx, e, `nwb.events[${i}]`));
    }
  }
  if (o.waveform_sample_rate_hz !== undefined) m.waveformSampleRateHz = ctx.positive(o.waveform_sample_rate_hz, 'nwb.waveform_sample_rate_hz');
  return m;
}

function parseEventSource(ctx: Ctx, e: unknown, key: string): NwbEventSource {
  const o = ctx.object(e, key);
  const label = o.label === undefined ? undefined : ctx.text(o.label, `${key}.label`);
  if (o.table !== undefined) {
    ctx.only(o, key, ['table', 'label', 'label_column', 'time_column', 'kind_column', 'trial_column']);
    return {
      table: ctx.path(o.table, `${key}.table`),
      ...(label !== undefined ? { label } : {}),
      ...(o.label_column !== undefined ? { labelColumn: ctx.text(o.label_column, `${key}.label_column`) } : {}),
      ...(o.time_column !== undefined ? { timeColumn: ctx.text(o.time_column, `${key}.time_column`) } : {}),
      ...(o.kind_column !== undefined ? { kindColumn: ctx.text(o.kind_column, `${key}.kind_column`) } : {}),
      ...(o.trial_column !== undefined ? { trialColumn: ctx.text(o.trial_column, `${key}.trial_column`) } : {}),
    };
  }
  if (o.series !== undefined) {
    ctx.only(o, key, ['series', 'label', 'threshold']);
    const threshold = o.threshold === undefined ? undefined : ctx.number(o.threshold, `${key}.threshold`);
    return { series: ctx.path(o.series, `${key}.series`), ...(label !== undefined ? { label } : {}), ...(threshold !== undefined ? { threshold } : {}) };
  }
  if (o.trials_column !== undefined) {
    ctx.only(o, key, ['trials_column', 'label']);
    return { trialsColumn: ctx.text(o.trials_column, `${key}.trials_column`), ...(label !== undefined ? { label } : {}) };
  }
  return ctx.fail(key, 'needs "table", "series" or "trials_column"');
}

class Ctx {
  constructor(readonly file: string) {}
  fail(key: string, problem: string, value?: string): never {
    throw new InputError({ file: this.file, column: key, problem, ...(value !== undefined ? { value } : {}), fix: 'see "NWB files" in the README for the nwb section' });
  }
  object(v: unknown, key: string): Record<string, unknown> {
    if (typeof v !== 'object' || v === null || Array.isArray(v)) this.fail(key, 'must be an object', JSON.stringify(v));
    return v as Record<string, unknown>;
  }
  only(o: Record<string, unknown>, key: string, allowed: string[]): void {
    for (const k of Object.keys(o)) if (!allowed.includes(k)) this.fail(`${key}.${k}`, `unknown key (allowed here: ${allowed.join(', ')})`);
  }
  text(v: unknown, key: string): string {
    if (typeof v !== 'string' || v === '') this.fail(key, 'must be a non-empty text', JSON.stringify(v));
    return v;
  }
  path(v: unknown, key: string): string {
    const s = this.text(v, key);
    return s.startsWith('/') ? s : `/${s}`;
  }
  number(v: unknown, key: string): number {
    if (typeof v !== 'number' || !Number.isFinite(v)) this.fail(key, 'must be a number', JSON.stringify(v));
    return v;
  }
  positive(v: unknown, key: string): number {
    const x = this.number(v, key);
    if (!(x > 0)) this.fail(key, 'must be a positive number', String(x));
    return x;
  }
}
