/**
 * Test helper: writes a Recording as an NWB 2.x file with h5wasm's writer,
 * laid out as the published NWB schema says (Units with ragged spike_times +
 * uint64 spike_times_index and obs_intervals, waveform_mean in volts with
 * sampling_rate; /intervals/trials with the trial numbers as ids; one
 * TimeIntervals table per event label with kind and trial columns; laser
 * pulses as /intervals/laser_pulses with power (mW), train and frequency).
 * Used by the folder-versus-NWB comparison; the h5py-written fixtures test
 * the reader against a writer outside the project.
 */
import type { Recording } from '../../../../core/model/types';

type H5 = typeof import('h5wasm');
type Group = import('h5wasm').Group;

export async function writeNwbFromRecording(rec: Recording, path: string): Promise<void> {
  const h5 = (await import('h5wasm/node')) as unknown as H5;
  await h5.ready;
  const f = new h5.File(path, 'w');
  try {
    f.create_attribute('nwb_version', '2.7.0');
    f.create_attribute('neurodata_type', 'NWBFile');
    f.create_attribute('namespace', 'core');
    f.create_dataset({ name: 'identifier', data: 'round-trip' });
    f.create_dataset({ name: 'session_description', data: 'simulated session, written for the folder-versus-NWB comparison' });
    f.create_dataset({ name: 'session_start_time', data: '2026-01-05T10:00:00+00:00' });
    for (const g of ['acquisition', 'analysis', 'processing', 'stimulus', 'general', 'intervals']) f.create_group(g);

    const table = (parent: Group, name: string, type: string, ids: BigInt64Array, description: string): Group => {
      const g = parent.create_group(name);
      g.create_attribute('neurodata_type', type);
      g.create_attribute('namespace', 'core');
      g.create_attribute('description', description);
      g.create_dataset({ name: 'id', data: ids, dtype: '<q' });
      return g;
    };
    const setColnames = (g: Group, names: string[]) => g.create_attribute('colnames', names);

    // Units
    const n = rec.units.length;
    const u = table(f, 'units', 'Units', BigInt64Array.from(rec.units, (x) => BigInt(x.id)), 'simulated units');
    const total = rec.units.reduce((s, x) => s + x.spikeTimes.length, 0);
    const times = new Float64Array(total);
    const ends = new BigUint64Array(n);
    let k = 0;
    rec.units.forEach((x, i) => {
      times.set(x.spikeTimes, k);
      k += x.spikeTimes.length;
      ends[i] = BigInt(k);
    });
    u.create_dataset({ name: 'spike_times', data: times, dtype: '<d' });
    u.create_dataset({ name: 'spike_times_index', data: ends, dtype: '<Q' });
    // each unit's observedIntervals when it has them, else the span
    const pairs = rec.units.map((x) => x.observedIntervals ?? Float64Array.from(rec.span));
    const obs = new Float64Array(pairs.reduce((s, x) => s + x.length, 0));
    const obsEnds = new BigUint64Array(n);
    let o = 0;
    pairs.forEach((x, i) => {
      obs.set(x, o);
      o += x.length;
      obsEnds[i] = BigInt(o / 2);
    });
    u.create_dataset({ name: 'obs_intervals', data: obs, shape: [obs.length / 2, 2], dtype: '<d' });
    u.create_dataset({ name: 'obs_intervals_index', data: obsEnds, dtype: '<Q' });
    const cols = ['spike_times', 'obs_intervals'];
    const metaKeys = [...new Set(rec.units.flatMap((x) => Object.keys(x.meta)))];
    for (const key of metaKeys) {
      const vals = rec.units.map((x) => x.meta[key]);
      if (vals.every((v) => typeof v === 'number')) u.create_dataset({ name: key, data: Float64Array.from(vals as number[]), dtype: '<d' });
      else u.create_dataset({ name: key, data: vals.map((v) => String(v ?? '')) });
      cols.push(key);
    }
    const ns = rec.units[0]?.waveformMean?.length ?? 0;
    if (ns > 0) {
      const wf = new Float64Array(n * ns);
      rec.units.forEach((x, i) => wf.set(Float64Array.from(x.waveformMean!, (v) => v / 1e6), i * ns)); // volts
      u.create_dataset({ name: 'waveform_mean', data: wf, shape: [n, ns], dtype: '<d' });
      const w = u.get('waveform_mean') as import('h5wasm').Dataset;
      w.create_attribute('sampling_rate', [rec.waveformSampleRateHz], [], '<f');
      w.create_attribute('unit', 'volts');
      cols.push('waveform_mean');
    }
    setColnames(u, cols);

    const intervals = f.get('intervals') as Group;
    // Trials
    const t = rec.trials;
    if (t.trial.length) {
      const g = table(intervals, 'trials', 'TimeIntervals', BigInt64Array.from(t.trial, (x) => BigInt(x)), 'trials');
      g.create_dataset({ name: 'start_time', data: t.start, dtype: '<d' });
      g.create_dataset({ name: 'stop_time', data: t.stop, dtype: '<d' });
      g.create_dataset({ name: 'condition', data: [...t.condition] });
      const tc = ['start_time', 'stop_time', 'condition'];
      for (const [name, col] of Object.entries(t.covariates)) {
        if (col instanceof Float64Array) g.create_dataset({ name, data: col, dtype: '<d' });
        else g.create_dataset({ name, data: [...col] });
        tc.push(name);
      }
      setColnames(g, tc);
    }
    // Events: one table per label
    const e = rec.events;
    for (const label of [...new Set(e.label)]) {
      const idx = e.label.flatMap((l, i) => (l === label ? [i] : []));
      const g = table(intervals, label, 'TimeIntervals', BigInt64Array.from(idx, (_, j) => BigInt(j)), `${label} events`);
      const tv = Float64Array.from(idx, (i) => e.time[i]);
      g.create_dataset({ name: 'start_time', data: tv, dtype: '<d' });
      g.create_dataset({ name: 'stop_time', data: tv, dtype: '<d' });
      g.create_dataset({ name: 'trial', data: Float64Array.from(idx, (i) => e.trial[i]), dtype: '<d' });
      g.create_dataset({ name: 'kind', data: idx.map((i) => e.kind[i]) });
      setColnames(g, ['start_time', 'stop_time', 'trial', 'kind']);
    }
    // Pulses
    const p = rec.pulses;
    if (p.onset.length) {
      const g = table(intervals, 'laser_pulses', 'TimeIntervals', BigInt64Array.from(p.onset, (_, i) => BigInt(i)), 'laser pulses; power in mW');
      g.create_dataset({ name: 'start_time', data: p.onset, dtype: '<d' });
      g.create_dataset({ name: 'stop_time', data: Float64Array.from(p.onset, (on, i) => on + p.duration[i]), dtype: '<d' });
      g.create_dataset({ name: 'power', data: p.powerMw, dtype: '<d' });
      g.create_dataset({ name: 'train', data: BigInt64Array.from(p.train, (x) => BigInt(x)), dtype: '<q' });
      g.create_dataset({ name: 'frequency', data: p.frequencyHz, dtype: '<d' });
      setColnames(g, ['start_time', 'stop_time', 'power', 'train', 'frequency']);
    }
  } finally {
    f.close();
  }
}
