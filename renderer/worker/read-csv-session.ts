import { InputError } from '../../core/errors';
import { emptyEvents, emptyPulses, emptyTrials } from '../../core/model/empty';
import type { Recording, Unit } from '../../core/model/types';

/**
 * The workbench's reader of the CSV session-folder form (DESIGN.md section 3:
 * spikes.csv, optional pulses.csv, events.csv, trials.csv), used until the
 * core importer (core/io, with NPY, session.json and NWB) is wired in.
 * Problems are InputErrors naming file, row and column. Pulses without a
 * train column are single pulses (each its own train).
 */
export function readCsvSession(files: ReadonlyMap<string, string>): Recording {
  const spikesText = files.get('spikes.csv');
  if (spikesText === undefined) {
    throw new InputError({ file: 'spikes.csv', problem: 'the session has no spikes.csv', fix: 'pick the folder that holds spikes.csv (unit,time in seconds)' });
  }
  const sp = parseCsv('spikes.csv', spikesText, ['unit', 'time']);
  const byUnit = new Map<string, number[]>();
  const t = sp.num('time');
  sp.col('unit').forEach((u, i) => {
    if (!byUnit.has(u)) byUnit.set(u, []);
    byUnit.get(u)!.push(t[i]);
  });
  const ids = [...byUnit.keys()].sort((a, b) => a.localeCompare(b, 'en', { numeric: true }));
  const units: Unit[] = ids.map((id) => ({ id, spikeTimes: Float64Array.from(byUnit.get(id)!).sort(), meta: {} }));
  let latest = 0;
  for (const u of units) latest = Math.max(latest, u.spikeTimes[u.spikeTimes.length - 1] ?? 0);

  let pulses = emptyPulses();
  const pt = files.get('pulses.csv');
  if (pt !== undefined) {
    const p = parseCsv('pulses.csv', pt, ['onset']);
    const onset = p.num('onset');
    const order = [...onset.keys()].sort((a, b) => onset[a] - onset[b]);
    const pick = (name: string) => (p.has(name) ? Float64Array.from(order, (i) => p.num(name)[i]) : new Float64Array(order.length).fill(NaN));
    const train = p.has('train') ? Int32Array.from(order, (i) => p.num('train')[i]) : Int32Array.from(order, (_, k) => k);
    pulses = { onset: Float64Array.from(order, (i) => onset[i]), duration: pick('duration'), train, frequencyHz: pick('frequency'), powerMw: pick('power') };
    for (let i = 0; i < pulses.onset.length; i++) latest = Math.max(latest, pulses.onset[i] + (Number.isNaN(pulses.duration[i]) ? 0 : pulses.duration[i]));
  }

  let events = emptyEvents();
  const et = files.get('events.csv');
  if (et !== undefined) {
    const e = parseCsv('events.csv', et, ['time', 'event']);
    const time = e.num('time');
    const order = [...time.keys()].sort((a, b) => time[a] - time[b]);
    events = {
      time: Float64Array.from(order, (i) => time[i]),
      label: order.map((i) => e.col('event')[i]),
      trial: e.has('trial') ? Float64Array.from(order, (i) => e.num('trial')[i]) : new Float64Array(order.length).fill(NaN),
      kind: e.has('kind') ? order.map((i) => e.col('kind')[i]) : order.map(() => ''),
    };
    for (const x of events.time) latest = Math.max(latest, x);
  }

  let trials = emptyTrials();
  const tt = files.get('trials.csv');
  if (tt !== undefined) {
    const r = parseCsv('trials.csv', tt, ['trial', 'start', 'stop']);
    const start = r.num('start');
    const order = [...start.keys()].sort((a, b) => start[a] - start[b]);
    trials = {
      trial: Float64Array.from(order, (i) => r.num('trial')[i]),
      start: Float64Array.from(order, (i) => start[i]),
      stop: Float64Array.from(order, (i) => r.num('stop')[i]),
      condition: r.has('condition') ? order.map((i) => r.col('condition')[i]) : order.map(() => ''),
      covariates: {},
    };
    for (const x of trials.stop) latest = Math.max(latest, x);
  }
  return { units, pulses, events, trials, span: [0, latest], spanSource: 'inputs', waveformSampleRateHz: NaN };
}

interface Parsed {
  has(name: string): boolean;
  col(name: string): string[];
  num(name: string): Float64Array;
}

/** Comma-separated text with a header row (no quoted fields); blank lines skipped. */
function parseCsv(file: string, text: string, required: readonly string[]): Parsed {
  const lines = text.replace(/\r/g, '').split('\n');
  const header = (lines[0] ?? '').split(',').map((h) => h.trim());
  for (const r of required) {
    if (!header.includes(r)) throw new InputError({ file, row: 1, column: r, problem: `the header has no "${r}" column`, fix: `name the columns ${required.join(', ')}` });
  }
  const rows: { line: number; cells: string[] }[] = [];
  for (let i = 1; i < lines.length; i++) if (lines[i].trim() !== '') rows.push({ line: i + 1, cells: lines[i].split(',') });
  const cache = new Map<string, Float64Array>();
  const col = (name: string) => {
    const j = header.indexOf(name);
    return rows.map((r) => (r.cells[j] ?? '').trim());
  };
  return {
    has: (name) => header.includes(name),
    col,
    num(name) {
      if (!cache.has(name)) {
        const values = col(name);
        const out = new Float64Array(values.length);
        values.forEach((v, i) => {
          const x = v === '' ? NaN : Number(v);
          if (v !== '' && !Number.isFinite(x)) throw new InputError({ file, row: rows[i].line, column: name, value: v, problem: 'not a finite number' });
          out[i] = x;
        });
        cache.set(name, out);
      }
      return cache.get(name)!;
    },
  };
}
