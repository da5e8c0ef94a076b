/**
 * Session files of a simulated session: the NPY form read back by NumPy
 * itself (python3 + numpy, when present on the machine; the byte layout of
 * encodeNpy is also pinned against np.save files in test/core/io), equal to
 * the CSV form; files for absent parts are left out; spikeTimeOrder is a
 * correct k-way merge (checked against a plain sort).
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { defaultScenario } from '../../../core/sim/default-scenario';
import { nullUnits } from '../../../core/sim/null-units';
import { sessionFiles } from '../../../core/sim/session-files';
import { simulateSession } from '../../../core/sim/simulate-session';
import { spikeTimeOrder } from '../../../core/sim/spike-time-order';
import { spikesCsvChunks } from '../../../core/sim/spikes-csv-chunks';
import { unitSpec } from '../../../core/sim/unit-spec';

const sim = simulateSession(
  defaultScenario({
    seed: 3,
    task: { ...defaultScenario().task!, trials: 10 },
    light: { ...defaultScenario().light!, singles: { count: 20, intervalS: [0.8, 1.2] }, trains: [{ frequencyHz: 40, trains: 2, pulsesPerTrain: 10 }] },
    units: [...nullUnits(5, 1).map((u, i) => ({ ...u, id: String(i + 10) }))],
  }),
);

describe('sessionFiles', () => {
  it('spikeTimeOrder merges units into time order (same as a plain sort)', () => {
    const o = spikeTimeOrder(sim.recording.units);
    const all: [number, number][] = [];
    sim.recording.units.forEach((u, k) => u.spikeTimes.forEach((t) => all.push([t, k])));
    all.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
    expect(o.time.length).toBe(all.length);
    expect(Array.from(o.time)).toEqual(all.map((x) => x[0]));
    expect(Array.from(o.unit)).toEqual(all.map((x) => x[1]));
  });
  it('streams spikes.csv in chunks that join to the whole file', () => {
    const o = spikeTimeOrder(sim.recording.units);
    const ids = sim.recording.units.map((u) => u.id);
    const chunks = [...spikesCsvChunks(ids, o.unit, o.time, 1000)];
    expect(chunks.length).toBe(1 + Math.ceil(o.time.length / 1000));
    expect(chunks.join('')).toBe(sessionFiles(sim).find((f) => f.name === 'spikes.csv')!.data);
  });
  it('leaves out files of absent parts', () => {
    const bare = simulateSession(defaultScenario({ task: null, light: null, preTaskS: 30, units: [unitSpec({ id: '1' })] }));
    expect(sessionFiles(bare, { unitInfo: false }).map((f) => f.name)).toEqual(['spikes.csv', 'session.json']);
  });
  it('refuses the NPY form for non-integer unit ids', () => {
    const s = simulateSession(defaultScenario({ task: null, light: null, preTaskS: 5, units: [unitSpec({ id: 'a' })] }));
    expect(() => sessionFiles(s, { spikes: 'npy' })).toThrow(/integer unit ids/);
  });
  const py = spawnSync('python3', ['-c', 'import numpy'], { encoding: 'utf8' });
  it.skipIf(py.status !== 0)('NumPy reads spikes.npy / units.npy / waveforms.npy equal to the CSV form', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tagbench-sim-'));
    try {
      const files = sessionFiles(sim, { spikes: 'both' });
      for (const f of files) writeFileSync(join(dir, f.name), f.data);
      const out = execFileSync(
        'python3',
        [
          '-c',
          `import numpy as np, sys, os
d = sys.argv[1]
t = np.load(os.path.join(d, 'spikes.npy')); u = np.load(os.path.join(d, 'units.npy'))
w = np.load(os.path.join(d, 'waveforms.npy'))
c = np.genfromtxt(os.path.join(d, 'spikes.csv'), delimiter=',', skip_header=1)
print(t.dtype.str, u.dtype.str, t.shape[0] == u.shape[0] == c.shape[0])
print(bool(np.all(c[:, 0] == u)), float(np.max(np.abs(c[:, 1] - t))))
print(w.dtype.str, w.shape, bool(np.all(np.diff(t) >= 0)))`,
          dir,
        ],
        { encoding: 'utf8' },
      ).trim().split('\n');
      expect(out[0]).toBe('<f8 <i4 True');
      const [same, maxDiff] = out[1].split(' ');
      expect(same).toBe('True');
      expect(Number(maxDiff)).toBeLessThanOrEqual(5e-7);
      expect(out[2]).toBe(`<f8 (5, ${sim.spec.waveformSamples}) True`);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
