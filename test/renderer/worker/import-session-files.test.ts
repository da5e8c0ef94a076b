// The worker's import of what the user opened (renderer/worker/import-session-files.ts)
// over h5wasm's in-memory file system (renderer/worker/open-hdf5-bytes.ts): NWB
// files written by an independent writer (h5py + NumPy, test/fixtures/nwb/make_fixtures.py;
// expected values and versions in expected.json) must read exactly as written, and
// exactly as the headless command's loader (h5wasm on the real file system) reads them.
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { isInputError } from '../../../core/errors';
import { loadSession } from '../../../core/node/load-session';
import type { SessionFileInput } from '../../../renderer/worker/api';
import { importSessionFiles } from '../../../renderer/worker/import-session-files';
import { openHdf5Bytes } from '../../../renderer/worker/open-hdf5-bytes';
import { WorkbenchEngine } from '../../../renderer/worker/workbench-engine';

const DIR = join(__dirname, '../../fixtures/nwb');
const expected = JSON.parse(readFileSync(join(DIR, 'expected.json'), 'utf8'));
const fileInput = (name: string, bytes: Uint8Array | string): SessionFileInput => ({ name, blob: new Blob([bytes as BlobPart]) });
const fixture = (f: string) => fileInput(f, new Uint8Array(readFileSync(join(DIR, f))));
const tmp: string[] = [];
afterAll(() => tmp.forEach((d) => rmSync(d, { recursive: true, force: true })));

async function inputErrorOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
  } catch (e) {
    expect(isInputError(e)).toBe(true);
    return (e as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('importSessionFiles: NWB files in the worker (h5wasm in memory)', () => {
  it('reads session_uint8.nwb picked alone: unit ids and spike times as h5py wrote them, SHA-256 as node:crypto', async () => {
    const e = expected.files['session_uint8.nwb'];
    const bytes = readFileSync(join(DIR, 'session_uint8.nwb'));
    const r = await importSessionFiles('session_uint8.nwb', [fixture('session_uint8.nwb')]);
    expect(r.sourceKind).toBe('nwb');
    expect(r.name).toBe('session_uint8');
    expect(r.recording.units.map((u) => u.id)).toEqual(e.units.ids);
    // float64 written by NumPy, read back exactly (JSON keeps the shortest round-trip repr)
    expect(r.recording.units.map((u) => Array.from(u.spikeTimes))).toEqual(e.units.spike_times);
    expect(Array.from(r.recording.trials.start)).toEqual(e.trials.start);
    expect(r.inputs).toEqual([{ file: 'session_uint8.nwb', bytes: bytes.length, sha256: createHash('sha256').update(bytes).digest('hex') }]);
  });

  it('gives the same recording, warnings and inputs as the headless loader, for every readable fixture', async () => {
    for (const f of ['session_uint8.nwb', 'units_uint64.nwb', 'pulse_table.nwb']) {
      const mine = await importSessionFiles(f, [fixture(f)]);
      const cli = await loadSession(join(DIR, f));
      expect(mine.recording, f).toEqual(cli.recording);
      expect(mine.warnings, f).toEqual(cli.warnings);
      expect(mine.inputs, f).toEqual(cli.inputs);
    }
  });

  it('follows a folder whose session.json has an "nwb" section, with its parameters, as loadSession does', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tagbench-nwb-folder-'));
    tmp.push(dir);
    const manifest = JSON.stringify({ nwb: { file: 'rec.nwb' }, parameters: { span: { stopS: 100 } } });
    writeFileSync(join(dir, 'session.json'), manifest);
    writeFileSync(join(dir, 'rec.nwb'), readFileSync(join(DIR, 'session_uint8.nwb')));
    const mine = await importSessionFiles('folder', [fileInput('session.json', manifest), fileInput('rec.nwb', readFileSync(join(dir, 'rec.nwb')))]);
    const cli = await loadSession(dir);
    expect(mine.recording).toEqual(cli.recording);
    expect(mine.parameterSources).toEqual(cli.parameterSources);
    expect(mine.parameterSources).toEqual([{ file: 'session.json', overrides: { span: { stopS: 100 } } }]);
    const msg = await inputErrorOf(importSessionFiles('folder', [fileInput('session.json', JSON.stringify({ nwb: { file: 'other.nwb' } }))]));
    expect(msg).toBe('session.json, column "nwb.file": names a file that is not in the session folder (value "other.nwb").');
  });

  it('reports a file that is not HDF5, or a damaged one, as one paragraph naming the file', async () => {
    expect(await inputErrorOf(importSessionFiles('bad_not_hdf5.nwb', [fixture('bad_not_hdf5.nwb')]))).toBe(
      'bad_not_hdf5.nwb: this is not an HDF5 file (no HDF5 signature), so it cannot be an NWB 2.x file. Give an NWB 2.x file (HDF5), or a session folder.',
    );
    // The signature followed by garbage: HDF5 itself refuses it.
    const damaged = new Uint8Array(4096);
    damaged.set([0x89, 0x48, 0x44, 0x46, 0x0d, 0x0a, 0x1a, 0x0a]);
    const msg = await inputErrorOf(openHdf5Bytes(damaged, 'cut.nwb'));
    expect(msg).toMatch(/^cut\.nwb: the HDF5 library could not open the file \(.+\)/);
    expect(msg).not.toMatch(/\n\s+at /);
    // Same problems as the headless command for files that are HDF5 but not usable NWB.
    for (const f of ['bad_nwb1.nwb', 'bad_no_units.nwb', 'bad_unsorted_spike.nwb']) {
      const cliMsg = await inputErrorOf(loadSession(join(DIR, f)));
      expect(await inputErrorOf(importSessionFiles(f, [fixture(f)])), f).toBe(cliMsg);
    }
  });

  it('frees the in-memory file on close, so the same file opens again and two files stay apart', async () => {
    const a = await openHdf5Bytes(new Uint8Array(readFileSync(join(DIR, 'session_uint8.nwb'))), 'a.nwb');
    const b = await openHdf5Bytes(new Uint8Array(readFileSync(join(DIR, 'units_uint64.nwb'))), 'b.nwb');
    expect(Array.from(a.read('/units/id') as BigInt64Array, Number)).toEqual(expected.files['session_uint8.nwb'].units.ids.map(Number));
    expect(Array.from(b.read('/units/id') as BigInt64Array, Number)).toEqual(expected.files['units_uint64.nwb'].units.ids.map(Number));
    a.close();
    b.close();
    const again = await openHdf5Bytes(new Uint8Array(readFileSync(join(DIR, 'session_uint8.nwb'))), 'a.nwb');
    expect(again.kind('/units')).toBe('group');
    again.close();
  });

  it('opens an NWB file in the workbench engine and analyses it', async () => {
    const engine = new WorkbenchEngine();
    const out = await engine.open([fixture('session_uint8.nwb')], 'session_uint8.nwb', {}, () => undefined);
    const e = expected.files['session_uint8.nwb'];
    expect(out.table.columns.find((c) => c.name === 'unit')!.values).toEqual(e.units.ids);
    expect(Array.from(out.table.columns.find((c) => c.name === 'n_spikes')!.values as Float64Array)).toEqual(e.units.spike_times.map((s: number[]) => s.length));
    expect(out.summary.units).toBe(e.units.ids.length);
  });
});
