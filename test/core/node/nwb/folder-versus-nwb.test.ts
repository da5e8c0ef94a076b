// The same simulated session (core/sim, seeded) as a session folder and as an
// NWB file gives an identical units.csv from `tagbench run`. The folder is
// what the simulator's sessionFiles writes (spikes as float64 NPY, tables as
// CSV); the NWB file holds exactly what the folder import read (written with
// h5wasm in the layout of the published NWB 2.x schema, see
// write-nwb-from-recording.ts), so both runs see the same data through the two
// readers.
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadSession } from '../../../../core/node/load-session';
import { runCli } from '../../../../core/node/run-cli';
import { demoScenario } from '../../../../core/sim/demo-scenario';
import { sessionFiles } from '../../../../core/sim/session-files';
import { simulateSession } from '../../../../core/sim/simulate-session';
import { writeNwbFromRecording } from './write-nwb-from-recording';

const dir = mkdtempSync(join(tmpdir(), 'tagbench-nwb-folder-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(session: string, out: string): Promise<string> {
  const err: string[] = [];
  const code = await runCli(['run', session, '--out', out], { stdout: () => {}, stderr: (t) => void err.push(t), isTty: false });
  expect(err.join('')).toBe('');
  expect(code).toBe(0);
  return readFileSync(join(out, 'units.csv'), 'utf8');
}

describe('folder versus NWB', () => {
  it('identical units.csv', async () => {
    const spec = demoScenario(77);
    // the first 16 units of the demo population: light-identified, indirect, ramping and jump units among them
    const sim = simulateSession({ ...spec, units: spec.units.slice(0, 16) });
    const folder = join(dir, 'folder');
    mkdirSync(folder);
    for (const f of sessionFiles(sim, { spikes: 'npy' })) {
      let data = f.data;
      if (f.name === 'session.json' && typeof data === 'string') {
        // the simulator's session.json may carry waveforms.unit, which the importer does not know yet (NOTICES 01:32)
        const m = JSON.parse(data);
        if (m.waveforms) delete m.waveforms.unit;
        data = JSON.stringify(m, null, 2);
      }
      writeFileSync(join(folder, f.name), data);
    }
    const imported = await loadSession(folder);
    const nwb = join(dir, 'session.nwb');
    await writeNwbFromRecording(imported.recording, nwb);

    const a = await run(folder, join(dir, 'out-folder'));
    const b = await run(nwb, join(dir, 'out-nwb'));
    const rows = a.trim().split('\n');
    expect(rows.length).toBe(17);
    expect(a).toContain('tagged'); // the comparison covers light-identified units too
    expect(b).toBe(a);
  });
});
