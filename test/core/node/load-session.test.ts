// loadSession's sharedMemory option on the bundled demo folder (CSV spikes, unit info, waveforms):
// the option changes only where the spike times live, never their values, the warnings or the inputs.
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadSession } from '../../../core/node/load-session';

const DEMO = join(__dirname, '../../../sample-data/demo');

describe('loadSession: sharedMemory', () => {
  it('puts the demo session\'s spike times on one SharedArrayBuffer, equal to the default import', async () => {
    const plain = await loadSession(DEMO);
    const shared = await loadSession(DEMO, { sharedMemory: true });
    const buffers = new Set(shared.recording.units.map((u) => u.spikeTimes.buffer));
    expect(buffers.size).toBe(1);
    const [buf] = buffers;
    expect(buf).toBeInstanceOf(SharedArrayBuffer);
    const total = plain.recording.units.reduce((a, u) => a + u.spikeTimes.length, 0);
    expect(total).toBeGreaterThan(1000);
    expect(buf.byteLength).toBe(total * 8);
    expect(shared.recording.units.length).toBe(plain.recording.units.length);
    shared.recording.units.forEach((u, i) => {
      expect(u.id).toBe(plain.recording.units[i].id);
      expect(u.spikeTimes).toEqual(plain.recording.units[i].spikeTimes);
    });
    expect(shared.warnings).toEqual(plain.warnings);
    expect(shared.inputs).toEqual(plain.inputs);
    expect(shared.recording.span).toEqual(plain.recording.span);
    for (const u of plain.recording.units) expect(u.spikeTimes.buffer).toBeInstanceOf(ArrayBuffer);
  });
});
