import { encodeNpy } from '../io/encode-npy';
import type { SimulatedSession } from './types';
import { spikeTimeOrder } from './spike-time-order';
import { spikesCsvChunks } from './spikes-csv-chunks';

/** One file of a session folder: name and content (text or bytes). */
export interface SessionFile {
  readonly name: string;
  readonly data: string | Uint8Array;
}

export interface SessionFileOptions {
  /** `csv`: spikes.csv; `npy`: spikes.npy (float64 s) + units.npy (int32 unit id per spike); `both`; `none` (a streaming writer writes them). Default csv. */
  readonly spikes?: 'csv' | 'npy' | 'both' | 'none';
  /** Write unit_info.csv and waveforms.npy (default true). */
  readonly unitInfo?: boolean;
  /** Digits after the point for times in CSV files (default 6). */
  readonly decimals?: number;
  /** Free text written into session.json's "description". */
  readonly description?: string;
}

/**
 * The session-folder files of DESIGN.md section 3 for a simulated session,
 * as strings and bytes (pure; the Node edge writes them):
 * - spikes.csv `unit,time` in time order (as sorters write them), and/or
 *   spikes.npy (float64 seconds) + units.npy (int32 unit id per spike; the
 *   simulator's ids are integers, so the NPY form carries them as numbers);
 * - pulses.csv `onset,duration,train,frequency,power` (frequency empty for
 *   single pulses);
 * - events.csv `time,event,trial,kind` (kind empty except for jumps);
 * - trials.csv `trial,start,stop,condition,sweep_s,jump_shift_s`;
 * - unit_info.csv `unit,channel,depth_um` and waveforms.npy (units x
 *   samples float64 microvolts, row r = unit_info row r);
 * - session.json: the recording span (parameters.span), the waveforms' file
 *   and sample rate, and a description.
 * Files for absent parts (no pulses, no task) are left out.
 */
export function sessionFiles(sim: SimulatedSession, options: SessionFileOptions = {}): SessionFile[] {
  const rec = sim.recording;
  const dec = options.decimals ?? 6;
  const mode = options.spikes ?? 'csv';
  const withInfo = options.unitInfo ?? true;
  const files: SessionFile[] = [];
  const ids = rec.units.map((u) => u.id);
  const order = mode === 'none' ? { unit: new Int32Array(0), time: new Float64Array(0) } : spikeTimeOrder(rec.units);
  if (mode === 'csv' || mode === 'both') {
    files.push({ name: 'spikes.csv', data: [...spikesCsvChunks(ids, order.unit, order.time, 100_000, dec)].join('') });
  }
  if (mode === 'npy' || mode === 'both') {
    const numeric = ids.map((id) => Number(id));
    if (numeric.some((x) => !Number.isInteger(x) || x < -2147483648 || x > 2147483647)) {
      throw new Error('sessionFiles: the NPY form needs integer unit ids');
    }
    const unitCol = new Int32Array(order.unit.length);
    for (let i = 0; i < unitCol.length; i++) unitCol[i] = numeric[order.unit[i]];
    files.push({ name: 'spikes.npy', data: encodeNpy(order.time) });
    files.push({ name: 'units.npy', data: encodeNpy(unitCol) });
  }
  const p = rec.pulses;
  if (p.onset.length > 0) {
    const rows = ['onset,duration,train,frequency,power'];
    for (let i = 0; i < p.onset.length; i++) {
      rows.push(`${p.onset[i].toFixed(dec)},${num(p.duration[i])},${p.train[i]},${num(p.frequencyHz[i])},${num(p.powerMw[i])}`);
    }
    files.push({ name: 'pulses.csv', data: rows.join('\n') + '\n' });
  }
  const e = rec.events;
  if (e.time.length > 0) {
    const rows = ['time,event,trial,kind'];
    for (let i = 0; i < e.time.length; i++) rows.push(`${e.time[i].toFixed(dec)},${e.label[i]},${num(e.trial[i])},${e.kind[i]}`);
    files.push({ name: 'events.csv', data: rows.join('\n') + '\n' });
  }
  const t = rec.trials;
  if (t.trial.length > 0) {
    const covNames = Object.keys(t.covariates);
    const rows = [['trial', 'start', 'stop', 'condition', ...covNames].join(',')];
    for (let i = 0; i < t.trial.length; i++) {
      const cov = covNames.map((c) => {
        const col = t.covariates[c];
        return col instanceof Float64Array ? num(col[i]) : col[i];
      });
      rows.push([num(t.trial[i]), t.start[i].toFixed(dec), t.stop[i].toFixed(dec), t.condition[i], ...cov].join(','));
    }
    files.push({ name: 'trials.csv', data: rows.join('\n') + '\n' });
  }
  const manifest: Record<string, unknown> = {
    description: options.description ?? 'Simulated session (tagbench seeded simulator).',
    parameters: { span: { startS: rec.span[0], stopS: Number(rec.span[1].toFixed(dec)) } },
  };
  if (withInfo) {
    const rows = ['unit,channel,depth_um'];
    for (const u of rec.units) rows.push(`${u.id},${u.meta.channel ?? ''},${u.meta.depth_um ?? ''}`);
    files.push({ name: 'unit_info.csv', data: rows.join('\n') + '\n' });
    files.push({ name: 'waveforms.npy', data: encodeNpy(sim.waveforms, [rec.units.length, sim.spec.waveformSamples]) });
    manifest.waveforms = { file: 'waveforms.npy', sample_rate: sim.spec.waveformSampleRateHz };
  }
  files.push({ name: 'session.json', data: JSON.stringify(manifest, null, 2) + '\n' });
  return files;
}

/** Shortest round-trip text of a number; empty for NaN. */
function num(x: number): string {
  return Number.isNaN(x) ? '' : String(x);
}
