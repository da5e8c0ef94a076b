import { createHash } from 'node:crypto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors';
import { importSession } from '../../../core/io/import-session';
import { memorySource } from '../../helpers/memory-source';
import { npyBytes } from '../../helpers/npy-bytes';

async function errorOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as Error).message;
  }
  throw new Error('expected an InputError');
}

const SPIKES = 'unit,time\n1,0.5\n2,1.5\n1,2.5\n';

describe('importSession: formats and manifest', () => {
  it('reads a CSV session and hashes every file (reference: node:crypto SHA-256)', async () => {
    const r = await importSession(memorySource({ 'spikes.csv': SPIKES, 'events.csv': 'time,event\n1,reward\n' }));
    expect(r.recording.units.map((u) => [u.id, Array.from(u.spikeTimes)])).toEqual([
      ['1', [0.5, 2.5]],
      ['2', [1.5]],
    ]);
    expect(r.inputs.map((i) => [i.file, i.bytes])).toEqual([
      ['spikes.csv', SPIKES.length],
      ['events.csv', 20],
    ]);
    expect(r.inputs[0].sha256).toBe(createHash('sha256').update(SPIKES).digest('hex'));
    expect(r.sourceKind).toBe('folder');
  });

  it('converts ms and samples, maps column names, reads unit info and waveforms', async () => {
    const manifest = {
      time_unit: 'ms',
      sample_rate: 30000,
      spikes: { file: 'sorted.tsv', columns: { unit: 'cluster', time: 't' }, time_unit: 'samples' },
      events: { columns: { event: 'label' } },
      unit_info: { file: 'clusters.csv', columns: { unit: 'cluster' } },
      waveforms: { file: 'w.npy', sample_rate: 30000 },
      parameters: { span: { stopS: 10 } },
    };
    const r = await importSession(
      memorySource({
        'session.json': JSON.stringify(manifest),
        'sorted.tsv': 'cluster\tt\n7\t30000\n3\t60000\n',
        'events.csv': 'time,label\n1500,reward\n',
        'clusters.csv': 'cluster,channel,depth,label\n3,12,250.5,good\n7,40,,mua\n',
        'w.npy': npyBytes(Float64Array.from([1, 2, 3, 4, 5, 6]), [2, 3]),
      }),
    );
    const rec = r.recording;
    expect(rec.units.map((u) => u.id)).toEqual(['3', '7']);
    expect(Array.from(rec.units[0].spikeTimes)).toEqual([2]);
    expect(Array.from(rec.units[1].spikeTimes)).toEqual([1]);
    expect(rec.units[0].meta).toEqual({ channel: 12, depth: 250.5, label: 'good' });
    expect(rec.units[1].meta).toEqual({ channel: 40, label: 'mua' });
    expect(Array.from(rec.units[1].waveformMean!)).toEqual([4, 5, 6]);
    expect(rec.waveformSampleRateHz).toBe(30000);
    expect(Array.from(rec.events.time)).toEqual([1.5]);
    expect(rec.span).toEqual([0, 10]);
    expect(rec.spanSource).toBe('manifest');
    expect(r.parameterSources).toEqual([{ file: 'session.json', overrides: { span: { stopS: 10 } } }]);
  });

  it('reads spikes.npy (float64 s) + units.npy', async () => {
    const r = await importSession(
      memorySource({ 'spikes.npy': npyBytes(Float64Array.from([0.1, 0.2, 0.3])), 'units.npy': npyBytes(BigInt64Array.from([5n, 2n, 5n])) }),
    );
    expect(r.recording.units.map((u) => [u.id, Array.from(u.spikeTimes)])).toEqual([
      ['2', [0.2]],
      ['5', [0.1, 0.3]],
    ]);
  });

  it('sharedMemory: CSV and NPY spike times on one SharedArrayBuffer, equal to the default path', async () => {
    const forms: Record<string, string | Uint8Array>[] = [
      { 'spikes.csv': 'unit,time\n2,0.3\n1,0.5\n2,0.1\n3,7\n' },
      { 'spikes.npy': npyBytes(Float64Array.from([0.3, 0.5, 0.1, 7])), 'units.npy': npyBytes(Int32Array.from([2, 1, 2, 3])) },
    ];
    for (const files of forms) {
      const plain = await importSession(memorySource(files));
      const shared = await importSession(memorySource(files), { sharedMemory: true });
      const buffers = new Set(shared.recording.units.map((u) => u.spikeTimes.buffer));
      expect(buffers.size).toBe(1);
      expect([...buffers][0]).toBeInstanceOf(SharedArrayBuffer);
      expect(shared.recording.units.map((u) => [u.id, Array.from(u.spikeTimes)])).toEqual([
        ['1', [0.5]],
        ['2', [0.1, 0.3]],
        ['3', [7]],
      ]);
      expect(shared.recording.units.map((u) => Array.from(u.spikeTimes))).toEqual(plain.recording.units.map((u) => Array.from(u.spikeTimes)));
      expect(shared.warnings).toEqual(plain.warnings);
      expect(shared.inputs).toEqual(plain.inputs);
      for (const u of plain.recording.units) expect(u.spikeTimes.buffer).toBeInstanceOf(ArrayBuffer);
    }
  });

  it('integer spikes.npy means sample counts and needs sample_rate', async () => {
    const files = { 'spikes.npy': npyBytes(Int32Array.from([300, 600])), 'units.npy': npyBytes(Int32Array.from([1, 1])) };
    expect(await errorOf(importSession(memorySource(files)))).toMatch(/session\.json, column "spikes\.time_unit": spikes\.npy has times in samples but no "sample_rate" is given/);
    const r = await importSession(memorySource({ ...files, 'session.json': '{"sample_rate": 300}' }));
    expect(Array.from(r.recording.units[0].spikeTimes)).toEqual([1, 2]);
  });

  it('detects pulses in a laser trace named in the manifest', async () => {
    const fs = 1000;
    const trace = new Float64Array(5 * fs);
    for (const on of [1, 1.1, 1.2, 3]) for (let i = 0; i < 5; i++) trace[Math.round(on * fs) + i] = 4.5;
    const r = await importSession(
      memorySource({ 'spikes.csv': 'unit,time\n1,4.9\n', 'laser.npy': npyBytes(trace), 'session.json': JSON.stringify({ laser: { sample_rate: fs, power_mw: 8 } }) }),
    );
    const p = r.recording.pulses;
    expect(Array.from(p.onset)).toEqual([1, 1.1, 1.2, 3]);
    expect(Array.from(p.duration)).toEqual([0.005, 0.005, 0.005, 0.005]);
    expect(Array.from(p.powerMw)).toEqual([8, 8, 8, 8]);
    expect(p.frequencyHz[0]).toBeCloseTo(10, 9);
    expect(p.frequencyHz[3]).toBeNaN();
  });

  it('opens a raw int16 file by offset', async () => {
    const frames = Int16Array.from([1, -2, 3, -4, 5, -6, 32767, -32768]); // 4 frames x 2 channels
    const r = await importSession(
      memorySource({
        'spikes.csv': SPIKES,
        'raw.bin': new Uint8Array(frames.buffer),
        'session.json': JSON.stringify({ raw: { file: 'raw.bin', channel_count: 2, sample_rate: 30000, gain_uv_per_bit: 0.195 } }),
      }),
    );
    const raw = r.recording.raw!;
    expect([raw.frameCount, raw.channelCount, raw.sampleRateHz, raw.gainUvPerBit, raw.startS]).toEqual([4, 2, 30000, 0.195, 0]);
    expect(Array.from(raw.readFrames(1, 2))).toEqual([3, -4, 5, -6]);
    expect(Array.from(raw.readFrames(3, 10))).toEqual([32767, -32768]);
    expect(raw.readFrames(9, 1).length).toBe(0);
    expect(r.inputs.map((i) => i.file)).toContain('raw.bin');
    expect(raw.channelIds).toBeUndefined();
  });

  it('reads the raw file channel map and refuses a wrong one, naming the key', async () => {
    const frames = new Uint8Array(new Int16Array(6).buffer); // 2 frames x 3 channels
    const manifest = (map: unknown) => JSON.stringify({ raw: { file: 'raw.bin', channel_count: 3, sample_rate: 30000, gain_uv_per_bit: 1, channel_map: map } });
    const open = (map: unknown) => importSession(memorySource({ 'spikes.csv': SPIKES, 'raw.bin': frames, 'session.json': manifest(map) }));
    expect((await open([17, 'B2', 3])).recording.raw!.channelIds).toEqual(['17', 'B2', '3']);
    await expect(open([1, 2])).rejects.toThrow(/session\.json, column "raw\.channel_map": lists 2 channel ids but raw\.channel_count is 3/);
    await expect(open([1, 2, 1])).rejects.toThrow(/column "raw\.channel_map\[2\]": repeats a channel id \(value "1"\)/);
    await expect(open([1, 2.5, 3])).rejects.toThrow(/column "raw\.channel_map\[1\]": expected a whole number or a non-empty text/);
    await expect(open('0-2')).rejects.toThrow(/column "raw\.channel_map": expected a list of channel ids/);
  });

  it('warns about columns it does not use', async () => {
    const r = await importSession(memorySource({ 'spikes.csv': SPIKES, 'pulses.csv': 'onset,duraton\n1,0.005\n' }));
    expect(r.warnings).toEqual([expect.objectContaining({ code: 'ignored-columns', file: 'pulses.csv', message: 'pulses.csv: column(s) not used: duraton' })]);
  });

  it('a null section skips a default file', async () => {
    const r = await importSession(memorySource({ 'spikes.csv': SPIKES, 'trials.csv': 'broken', 'session.json': '{"trials": null}' }));
    expect(r.recording.trials.trial.length).toBe(0);
  });

  it.each([
    [{ 'events.csv': 'time,event\n1,reward\n' }, /mem: no spike table found \(looked for spikes\.csv, spikes\.tsv, spikes\.txt, spikes\.npy; the folder holds: events\.csv\)/],
    [{ 'spikes.csv': SPIKES, 'session.json': '{"spikes": {"file": "Spikes.csv"}}' }, /session\.json, column "spikes\.file": names a file that is not in the session folder "mem" \(value "Spikes\.csv"\)/],
    [{ 'spikes.csv': SPIKES, 'session.json': '{"spiks": {}}' }, /session\.json, column "spiks": unknown key\. Known keys: description, time_unit/],
    [{ 'spikes.csv': SPIKES, 'session.json': '{"time_unit": "sec"}' }, /column "time_unit": expected "s", "ms" or "samples" \(value "sec"\)/],
    [{ 'spikes.csv': SPIKES, 'session.json': '{"spikes": {"time_unit": "samples"}}' }, /spikes\.csv has times in samples but no "sample_rate" is given/],
    [{ 'spikes.csv': SPIKES, 'session.json': '{"parameters": {"light": {"windowEndMS": 8}}}' }, /session\.json, column "light\.windowEndMS": unknown parameter/],
    [{ 'spikes.csv': SPIKES, 'session.json': '{\n "spikes": {,}\n}' }, /session\.json, row 2: not valid JSON/],
    [{ 'spikes.csv': SPIKES, 'session.json': '{"spikes": {"file": "../x.csv"}}' }, /may not leave it/],
    [{ 'spikes.csv': SPIKES, 'pulses.csv': 'onset\n1\n', 'laser.npy': npyBytes(new Float64Array(10)), 'session.json': '{"laser": {"sample_rate": 1000}}' }, /both a laser trace \(laser\.npy\) and a pulse table \(pulses\.csv\) are given/],
    [{ 'spikes.csv': SPIKES, 'waveforms.npy': npyBytes(new Float64Array(4), [2, 2]) }, /waveforms\.npy: mean waveforms need their sample rate/],
    [{ 'spikes.npy': npyBytes(Float64Array.from([1, 2])), 'units.npy': npyBytes(Int32Array.from([1])) }, /units\.npy: holds 1 unit ids but spikes\.npy holds 2 spike times/],
    [{ 'spikes.npy': npyBytes(Float64Array.from([1, 2])) }, /spikes\.npy: spike times in \.npy form need units\.npy beside them/],
    [{ 'spikes.csv': SPIKES, 'raw.bin': new Uint8Array(7), 'session.json': '{"raw": {"file": "raw.bin", "channel_count": 2, "sample_rate": 30000, "gain_uv_per_bit": 0.2}}' }, /raw\.bin: the file size in bytes is not a whole number of frames of 2 int16 channels \(value "7"\)/],
    [{ 'spikes.csv': SPIKES, 'session.json': '{"raw": {"file": "raw.bin", "channel_count": 2.5}}' }, /column "raw\.sample_rate": is missing|column "raw\.file"/],
    [{ 'spikes.csv': '' }, /spikes\.csv: the file is empty/],
    [{ 'spikes.csv': 'unit,time\n' }, /spikes\.csv: the spike table has no rows/],
  ])('error %#', async (files, re) => {
    expect(await errorOf(importSession(memorySource(files as Record<string, string | Uint8Array>)))).toMatch(re);
  });
});

// ---------------------------------------------------------------------------
// Property: write a random valid session (any delimiter, quoting, line ending,
// BOM, chunk size, row order), read it back, get the same recording.
// ---------------------------------------------------------------------------
const ID_POOL = ['0', '1', '2', '10', '17', '123456', 'A-1', 'b 2', 'x,y', 'say "q"', 'unité'];
const time = fc.double({ min: 1, max: 100, noNaN: true });

const sessionArb = fc.record({
  units: fc.uniqueArray(fc.constantFrom(...ID_POOL), { minLength: 1, maxLength: 6 }),
  spikeTimes: fc.array(fc.array(time, { minLength: 1, maxLength: 12 }), { minLength: 6, maxLength: 6 }),
  order: fc.array(fc.nat(), { maxLength: 80 }),
  pulses: fc.array(time, { maxLength: 8 }),
  trials: fc.array(fc.tuple(time, fc.double({ min: 0, max: 5, noNaN: true }), fc.constantFrom('standard', 'probe', '')), { maxLength: 5 }),
  events: fc.array(fc.tuple(time, fc.constantFrom('reward', 'jump', 'tone on'), fc.constantFrom('', 'forward', 'backward'), fc.nat()), { maxLength: 8 }),
  delimiter: fc.constantFrom(',', '\t', ';'),
  eol: fc.constantFrom('\n', '\r\n'),
  bom: fc.boolean(),
  quoteAll: fc.boolean(),
  chunk: fc.integer({ min: 1, max: 200 }),
});

function cell(v: string, d: string, quoteAll: boolean): string {
  return quoteAll || v.includes(d) || v.includes('"') || v.includes('\n') ? `"${v.replace(/"/g, '""')}"` : v;
}
function csv(header: string[], rows: string[][], d: string, eol: string, bom: boolean, quoteAll: boolean): string {
  return (bom ? '\uFEFF' : '') + [header, ...rows].map((r) => r.map((c) => cell(c, d, quoteAll)).join(d)).join(eol) + eol;
}

describe('importSession round trip (fast-check)', () => {
  it('reads back exactly what was written', async () => {
    await fc.assert(
      fc.asyncProperty(sessionArb, async (s) => {
        const rows: [string, number][] = [];
        s.units.forEach((u, k) => s.spikeTimes[k].forEach((t) => rows.push([u, t])));
        // shuffle by the random keys
        const keyed = rows.map((r, i) => ({ r, k: s.order[i] ?? i }));
        keyed.sort((a, b) => a.k - b.k);
        const w = (h: string[], r: string[][]) => csv(h, r, s.delimiter, s.eol, s.bom, s.quoteAll);
        const files: Record<string, string> = { 'spikes.csv': w(['unit', 'time'], keyed.map(({ r }) => [r[0], String(r[1])])) };
        if (s.pulses.length) files['pulses.csv'] = w(['onset', 'duration'], s.pulses.map((p) => [String(p), '0.005']));
        const trialRows = s.trials.map(([start, len, cond], i) => [String(i + 1), String(start), String(start + len), cond, String(i * 0.5)]);
        if (s.trials.length) files['trials.csv'] = w(['trial', 'start', 'stop', 'condition', 'difficulty'], trialRows);
        const evRows = s.events.map(([t, label, kind, tr]) => [String(t), label, s.trials.length ? String((tr % s.trials.length) + 1) : '', kind]);
        if (s.events.length) files['events.csv'] = w(['time', 'event', 'trial', 'kind'], evRows);

        const rec = (await importSession(memorySource(files, s.chunk))).recording;

        const want = new Map(s.units.map((u, k) => [u, [...s.spikeTimes[k]].sort((a, b) => a - b)]));
        expect(new Map(rec.units.map((u) => [u.id, Array.from(u.spikeTimes)]))).toEqual(want);
        const ends = [...s.spikeTimes.slice(0, s.units.length).flat(), ...s.pulses.map((p) => p + 0.005), ...s.events.map((e) => e[0]), ...s.trials.map(([a, l]) => a + l)];
        expect(rec.span).toEqual([0, Math.max(...ends)]);
        expect(Array.from(rec.pulses.onset)).toEqual([...s.pulses].sort((a, b) => a - b));
        const ev = s.events.map((e, i) => ({ e, i, row: evRows[i] })).sort((a, b) => a.e[0] - b.e[0] || a.i - b.i);
        expect(Array.from(rec.events.time)).toEqual(ev.map((x) => x.e[0]));
        expect(rec.events.label).toEqual(ev.map((x) => x.e[1]));
        expect(rec.events.kind).toEqual(ev.map((x) => x.e[2]));
        expect(Array.from(rec.events.trial)).toEqual(ev.map((x) => (x.row[2] === '' ? NaN : Number(x.row[2]))));
        const tr = s.trials.map((t, i) => ({ t, i })).sort((a, b) => a.t[0] - b.t[0] || a.i - b.i);
        expect(Array.from(rec.trials.trial)).toEqual(tr.map((x) => x.i + 1));
        expect(Array.from(rec.trials.start)).toEqual(tr.map((x) => x.t[0]));
        expect(Array.from(rec.trials.stop)).toEqual(tr.map((x) => x.t[0] + x.t[1]));
        expect(rec.trials.condition).toEqual(tr.map((x) => x.t[2]));
        if (s.trials.length) expect(Array.from(rec.trials.covariates.difficulty as Float64Array)).toEqual(tr.map((x) => x.i * 0.5));
      }),
      { numRuns: 150 },
    );
  });
});
