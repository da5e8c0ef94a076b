// NWB fixtures written by an independent writer (h5py + NumPy, following the
// published NWB 2.x schema: test/fixtures/nwb/make_fixtures.py; versions in
// expected.json). Expected values are what that script wrote, computed there
// with NumPy (best channel = argmax of peak-to-peak; waveform in microvolts =
// float32 volts widened to float64 times 1e6).
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../../../core/errors';
import { inspectNwbFile } from '../../../../core/node/nwb/inspect-nwb-file';
import { loadNwbSession } from '../../../../core/node/load-nwb-session';
import { loadSession } from '../../../../core/node/load-session';

const DIR = join(__dirname, '../../../fixtures/nwb');
const expected = JSON.parse(readFileSync(join(DIR, 'expected.json'), 'utf8'));
const path = (f: string) => join(DIR, f);

interface ExpectedUnits {
  ids: string[];
  spike_times: number[][];
  obs_intervals?: number[][][];
  best_electrode_id?: number[];
  best_channel?: number[];
  waveform_uv?: number[][];
  waveform_rate_hz?: number;
  quality?: string[];
  depth_um?: number[];
}

function checkUnits(rec: Awaited<ReturnType<typeof loadNwbSession>>['recording'], e: ExpectedUnits): void {
  expect(rec.units.map((u) => u.id)).toEqual(e.ids);
  // spike times: float64 written by NumPy, read back exactly (JSON keeps the shortest round-trip repr)
  expect(rec.units.map((u) => Array.from(u.spikeTimes))).toEqual(e.spike_times);
  if (e.obs_intervals) {
    expect(rec.units.map((u) => Array.from(u.observedIntervals ?? []))).toEqual(e.obs_intervals.map((pairs) => pairs.flat()));
    expect(rec.spanSource).toBe('observation-intervals');
    expect(rec.span).toEqual([0, 100]);
  }
  if (e.waveform_uv) {
    expect(rec.waveformSampleRateHz).toBe(e.waveform_rate_hz);
    expect(rec.units.map((u) => Array.from(u.waveformMean!))).toEqual(e.waveform_uv);
    expect(rec.units.map((u) => u.meta.waveform_channel)).toEqual(e.best_channel);
    expect(rec.units.map((u) => u.meta.channel)).toEqual(e.best_electrode_id);
    expect(rec.units.map((u) => u.meta.quality)).toEqual(e.quality);
    expect(rec.units.map((u) => u.meta.depth_um)).toEqual(e.depth_um);
    expect(rec.units.every((u) => u.meta.location === 'dorsal raphe')).toBe(true);
  }
}

describe('loadNwbSession on h5py-written fixtures', () => {
  it('session_uint8.nwb: ragged units (uint8 index), trials, events, OptogeneticSeries pulses, site metadata', async () => {
    const e = expected.files['session_uint8.nwb'];
    const r = await loadNwbSession(path('session_uint8.nwb'));
    expect(r.sourceKind).toBe('nwb');
    expect(r.name).toBe('session_uint8');
    expect(r.warnings).toEqual([]);
    checkUnits(r.recording, e.units);
    const t = r.recording.trials;
    expect(Array.from(t.start)).toEqual(e.trials.start);
    expect(Array.from(t.stop)).toEqual(e.trials.stop);
    expect(t.condition).toEqual(e.trials.condition);
    expect(Array.from(t.trial)).toEqual([0, 1, 2, 3, 4, 5]); // NWB row ids
    expect(Object.keys(t.covariates)).toEqual(['tone_start_hz']);
    // events: reward from the trials reward_time column (NaN cell = no reward, skipped), lick and jump tables
    const ev = r.recording.events;
    const byLabel = (l: string) => Array.from(ev.time).filter((_, i) => ev.label[i] === l);
    expect(byLabel('reward')).toEqual(e.trials.reward_time.filter((x: number | null) => x !== null));
    expect(byLabel('lick')).toEqual(e.events.lick);
    expect(byLabel('jump')).toEqual(e.events.jump);
    expect(ev.kind.filter((_, i) => ev.label[i] === 'jump')).toEqual(e.events.jump_kind);
    expect(Array.from(ev.trial).filter((_, i) => ev.label[i] === 'jump')).toEqual(e.events.jump_trial);
    expect(Array.from(ev.trial).filter((_, i) => ev.label[i] === 'reward')).toEqual([0, 2, 3, 4, 5]);
    // pulses: square 5 ms, 10 mW (0.010 W) pulses sampled at 1 kHz from t0 = 0.5 s.
    // Onsets land on the sample grid (t0 + i / rate, computed the same way by NumPy): tolerance 1e-9 s
    // for the rounding of that sum; duration to one sample (1 ms), the grid's resolution.
    const p = r.recording.pulses;
    expect(p.onset.length).toBe(e.pulses.onset.length);
    p.onset.forEach((x, i) => expect(Math.abs(x - e.pulses.onset[i])).toBeLessThan(1e-9));
    p.duration.forEach((d) => expect(Math.abs(d - e.pulses.duration_s)).toBeLessThanOrEqual(0.001 + 1e-9));
    p.powerMw.forEach((w) => expect(w).toBeCloseTo(e.pulses.power_mw, 12));
    // builder's train inference: three single pulses 1 s apart, then one 10 Hz train of three
    expect(Array.from(p.train)).toEqual([0, 1, 2, 3, 3, 3]);
    expect(r.recording.meta?.stimulus_site_description).toBe(e.site_description);
    expect(r.recording.meta?.excitation_lambda_nm).toBe(473);
    expect(r.recording.meta?.nwb_version).toBe('2.7.0');
  });

  it('units_uint64.nwb: uint64 indexes (BigInt), NWB 2.2.5, OptogeneticSeries with timestamps', async () => {
    const e = expected.files['units_uint64.nwb'];
    const r = await loadNwbSession(path('units_uint64.nwb'));
    checkUnits(r.recording, e.units);
    const p = r.recording.pulses;
    expect(p.onset.length).toBe(3);
    p.onset.forEach((x, i) => expect(Math.abs(x - e.pulses.onset[i])).toBeLessThan(1e-9));
    p.duration.forEach((d) => expect(Math.abs(d - e.pulses.duration_s)).toBeLessThanOrEqual(0.0005 + 1e-9)); // 2 kHz grid
    expect(r.recording.trials.trial.length).toBe(0);
    expect(r.recording.meta?.nwb_version).toBe('2.2.5');
  });

  it('pulse_table.nwb: pulses from an interval table, an empty unit, int32 index, span from the inputs', async () => {
    const e = expected.files['pulse_table.nwb'];
    const r = await loadNwbSession(path('pulse_table.nwb'));
    checkUnits(r.recording, e.units);
    expect(r.recording.spanSource).toBe('inputs');
    const p = r.recording.pulses;
    expect(Array.from(p.onset)).toEqual(e.pulses.onset);
    p.duration.forEach((d) => expect(d).toBeCloseTo(e.pulses.duration_s, 12));
    expect(Array.from(p.powerMw)).toEqual(e.pulses.power_mw);
    expect(Array.from(p.train)).toEqual(e.pulses.train);
    expect(Array.from(p.frequencyHz).slice(3)).toEqual([20, 20, 20]);
    expect(r.warnings.map((w) => w.code)).toEqual(['units-without-spikes']);
  });

  it('sharedMemory: the NWB path puts every unit on one SharedArrayBuffer with the same values', async () => {
    const plain = await loadSession(path('pulse_table.nwb'));
    const shared = await loadSession(path('pulse_table.nwb'), { sharedMemory: true });
    const buffers = new Set(shared.recording.units.map((u) => u.spikeTimes.buffer));
    expect(buffers.size).toBe(1);
    expect([...buffers][0]).toBeInstanceOf(SharedArrayBuffer);
    expect(shared.recording.units.map((u) => Array.from(u.spikeTimes))).toEqual(plain.recording.units.map((u) => Array.from(u.spikeTimes)));
    expect(shared.recording.units.map((u) => Array.from(u.spikeTimes))).toEqual(expected.files['pulse_table.nwb'].units.spike_times);
    for (const u of plain.recording.units) expect(u.spikeTimes.buffer).toBeInstanceOf(ArrayBuffer);
  });

  it('records the file size and SHA-256 (checked against node:crypto on the bytes) and leaves the file unchanged', async () => {
    const before = createHash('sha256').update(readFileSync(path('pulse_table.nwb'))).digest('hex');
    const r = await loadNwbSession(path('pulse_table.nwb'));
    expect(r.inputs).toEqual([{ file: 'pulse_table.nwb', bytes: readFileSync(path('pulse_table.nwb')).length, sha256: before }]);
    expect(createHash('sha256').update(readFileSync(path('pulse_table.nwb'))).digest('hex')).toBe(before);
  });

  it('follows a manifest: pulses off, events from one table with a fixed label, condition column named', async () => {
    const r = await loadNwbSession(path('session_uint8.nwb'), { pulses: false, events: [{ table: '/intervals/jump', label: 'jump', kind_column: 'kind' }], trials: { condition_column: 'condition' } });
    expect(r.recording.pulses.onset.length).toBe(0);
    expect(r.recording.events.label).toEqual(['jump', 'jump']);
    expect(r.recording.meta?.stimulus_site_description).toBeUndefined();
  });

  it('takes the span from session.json over the observation intervals', async () => {
    const r = await loadNwbSession(path('session_uint8.nwb'), undefined, { parameterSources: [{ file: 'analysis.json', overrides: { span: { stopS: 120 } } }] });
    expect(r.recording.span).toEqual([0, 120]);
    expect(r.recording.spanSource).toBe('manifest');
  });
});

describe('loadNwbSession errors: one paragraph naming the file and the problem', () => {
  const bad: Record<string, string> = expected.bad;
  it.each(Object.entries(bad))('%s -> "%s"', async (file, fragment) => {
    let err: unknown;
    try {
      await loadNwbSession(path(file));
    } catch (e) {
      err = e;
    }
    expect(isInputError(err)).toBe(true);
    const msg = (err as Error).message;
    expect(msg.startsWith(file)).toBe(true);
    expect(msg).toContain(fragment);
    expect(msg).not.toMatch(/\n|HDF5-DIAG|at .*\.ts:/);
  });
  it('a missing file', async () => {
    await expect(loadNwbSession(path('no-such-file.nwb'))).rejects.toThrow(/no-such-file\.nwb: the file .* does not exist/);
  });
  it('unsupported versions say which are supported', async () => {
    await expect(loadNwbSession(path('bad_version3.nwb'))).rejects.toThrow(/reads NWB 2\.x \(2\.0\.0 and later 2\.\* releases\)/);
  });
  it('a manifest path the file does not hold names the manifest key', async () => {
    await expect(loadNwbSession(path('session_uint8.nwb'), { units: '/processing/units' })).rejects.toThrow(/session\.json, column "nwb\.units".*no table at this path/);
  });
});

describe('inspectNwbFile', () => {
  it('lists tables, columns, series, sites and the roles a run would use', async () => {
    const text = await inspectNwbFile(path('session_uint8.nwb'));
    for (const line of [
      'session_uint8.nwb: NWB 2.7.0',
      '/units  [Units, 3 rows]',
      'spike_times: number, ragged',
      'waveform_mean: number x [32 x 4]',
      '/intervals/trials  [TimeIntervals, 6 rows]',
      'condition: text',
      '/stimulus/presentation/blue_light  [OptogeneticSeries, 11500 samples, watts, 1000 Hz from 0.5 s]',
      '/general/optogenetics/blue_site: fibre above dorsal raphe, 200 um core; dorsal raphe, 473 nm',
      'pulses: /stimulus/presentation/blue_light (the only OptogeneticSeries), threshold crossing',
      'events: trials column reward_time as "reward"; /intervals/jump as "jump"; /intervals/lick as "lick"',
    ]) expect(text).toContain(line);
  });
  it('the interval-table pulse file', async () => {
    const text = await inspectNwbFile(path('pulse_table.nwb'));
    expect(text).toContain('pulses: /intervals/laser_pulses (the only interval table named for light stimulation), one row per pulse');
  });
});

describe('fixtures', () => {
  it('every NWB fixture is used by a test above (meta-test)', () => {
    const files = readdirSync(DIR).filter((f) => f.endsWith('.nwb')).sort();
    const used = [...Object.keys(expected.files), ...Object.keys(expected.bad)].sort();
    expect(files).toEqual(used);
  });
  it('records its writer and versions', () => {
    expect(expected.generator).toBe('test/fixtures/nwb/make_fixtures.py');
    expect(Object.keys(expected.versions)).toEqual(['h5py', 'numpy', 'hdf5']);
  });
});

describe('NWB through loadSession and the CLI', () => {
  it('a folder whose session.json has an nwb section reads the file with those choices and parameters', async () => {
    const { mkdtempSync, copyFileSync, writeFileSync, rmSync } = await import('node:fs');
    const { tmpdir } = await import('node:os');
    const dir = mkdtempSync(join(tmpdir(), 'tagbench-nwb-manifest-'));
    try {
      copyFileSync(path('session_uint8.nwb'), join(dir, 'rec.nwb'));
      writeFileSync(join(dir, 'session.json'), JSON.stringify({ nwb: { file: 'rec.nwb', pulses: false, events: [{ trials_column: 'reward_time', label: 'water' }] }, parameters: { span: { stopS: 150 } } }));
      const r = await loadSession(dir);
      expect(r.sourceKind).toBe('nwb');
      expect(r.recording.pulses.onset.length).toBe(0);
      expect([...new Set(r.recording.events.label)]).toEqual(['water']);
      expect(r.recording.span).toEqual([0, 150]);
      expect(r.recording.spanSource).toBe('manifest');
      // both files are inputs, hashed (reference: node:crypto over the bytes on disk)
      const sha = (f: string) => createHash('sha256').update(readFileSync(join(dir, f))).digest('hex');
      expect(r.inputs).toEqual([
        { file: 'session.json', bytes: readFileSync(join(dir, 'session.json')).length, sha256: sha('session.json') },
        { file: 'rec.nwb', bytes: readFileSync(join(dir, 'rec.nwb')).length, sha256: sha('rec.nwb') },
      ]);
      writeFileSync(join(dir, 'session.json'), JSON.stringify({ nwb: { file: 'rec.nwb', pulse: false } }));
      await expect(loadSession(dir)).rejects.toThrow(/session\.json, column "nwb\.pulse": unknown key/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('tagbench inspect file.nwb prints the NWB listing, then the session summary', async () => {
    const { runCli } = await import('../../../../core/node/run-cli');
    const out: string[] = [];
    const err: string[] = [];
    const code = await runCli(['inspect', path('pulse_table.nwb')], { stdout: (t) => void out.push(t), stderr: (t) => void err.push(t), isTty: false });
    expect(err.join('')).toBe('');
    expect(code).toBe(0);
    const text = out.join('');
    expect(text).toContain('/intervals/laser_pulses  [TimeIntervals, 6 rows]');
    expect(text).toContain('A run would use:');
    expect(text.indexOf('A run would use:')).toBeLessThan(text.indexOf('Session: pulse_table (NWB file)'));
    const out2: string[] = [];
    expect(await runCli(['inspect', path('session_uint8.nwb')], { stdout: (t) => void out2.push(t), stderr: () => {}, isTty: false })).toBe(0);
    expect(out2.join('')).toContain('stimulus_site_description = fibre above dorsal raphe, 200 um core');
    expect(out2.join('')).toContain('observation intervals: 3 units (1 with gaps)');
  });

  it('tagbench run on a bad NWB file: exit 2, one paragraph on stderr, no stack', async () => {
    const { runCli } = await import('../../../../core/node/run-cli');
    const err: string[] = [];
    const code = await runCli(['run', path('bad_index_range.nwb'), '--out', join(DIR, 'never-written')], { stdout: () => {}, stderr: (t) => void err.push(t), isTty: false });
    expect(code).toBe(2);
    expect(err.join('').trim().split('\n')).toHaveLength(1);
    expect(err.join('')).toContain('bad_index_range.nwb, column "/units/spike_times_index": index out of range');
    expect(readdirSync(DIR)).not.toContain('never-written');
  });
});
