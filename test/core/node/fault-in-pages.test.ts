// Faulting in the shared spike array on the helper thread (core/node/fault-in-pages.ts).
// The page orders are worked out by hand below; the import with the helper is compared bit for
// bit with the import without it (whose values the NPY reader tests check against files written
// by NumPy, test/core/io/read-npy.test.ts).
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { encodeNpy } from '../../../core/io/encode-npy';
import { faultInPages, fillOrderPages, FAULT_IN_MIN_BYTES } from '../../../core/node/fault-in-pages';
import { loadSession } from '../../../core/node/load-session';
import { startWorkerThread } from '../../../core/node/start-worker-thread';

const work = mkdtempSync(join(tmpdir(), 'tagbench-fault-in-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('fillOrderPages', () => {
  it('one group: the pages in address order', () => {
    expect([...fillOrderPages(Float64Array.of(0, 40), 10)]).toEqual([0, 1, 2, 3]);
  });

  it('two equal groups: interleaved, each group at the same relative pace (worked by hand)', () => {
    // group 0: elements 0-39 (pages 0-3), group 1: 40-79 (pages 4-7); page j of a group is needed
    // when the fill has gone j/4 of the way
    expect([...fillOrderPages(Float64Array.of(0, 40, 80), 10)]).toEqual([0, 4, 1, 5, 2, 6, 3, 7]);
  });

  it('a small group and a large one: the large group\'s later pages come last (worked by hand)', () => {
    // group 0: elements 0-9 (page 0); group 1: 10-49 (pages 1-4), page j at (10j - 10) / 40:
    // 0, 0.25, 0.5, 0.75
    expect([...fillOrderPages(Float64Array.of(0, 10, 50), 10)]).toEqual([0, 1, 2, 3, 4]);
    // group 0: 0-29 (pages 0-2: 0, 1/3, 2/3), group 1: 30-34 (page 3: 0), group 2: 35-79
    // (page 3 is shared: needed at once; pages 4-7 at 5/45, 15/45, 25/45, 35/45)
    expect([...fillOrderPages(Float64Array.of(0, 30, 35, 80), 10)]).toEqual([0, 3, 4, 1, 5, 6, 2, 7]);
  });

  it('every page exactly once, also with empty groups and a short last page', () => {
    const starts = Float64Array.of(0, 0, 1234, 1234, 5000, 5001, 99_999);
    const order = fillOrderPages(starts, 512);
    expect(order.length).toBe(Math.ceil(99_999 / 512));
    expect([...order].sort((a, b) => a - b)).toEqual(Array.from({ length: order.length }, (_, j) => j));
    expect(fillOrderPages(Float64Array.of(0), 512).length).toBe(0);
  });
});

describe('faultInPages', () => {
  it('leaves every value as it was', () => {
    const n = 100_003;
    const buffer = new SharedArrayBuffer(n * 8);
    const v = new Float64Array(buffer);
    for (let i = 0; i < n; i++) v[i] = Math.sin(i) * 1e3 - i;
    const copy = v.slice();
    expect(faultInPages({ buffer, starts: Float64Array.of(0, 30_000, n) })).toBe(Math.ceil((n * 8) / 4096));
    expect(Buffer.from(buffer).equals(Buffer.from(copy.buffer))).toBe(true);
  });
});

describe('loadSession with an import helper', () => {
  it('imports the same spike times to the bit while the helper faults the memory in', async () => {
    // 1.5 M spikes of 40 units, time-sorted (12 MiB of float64: above FAULT_IN_MIN_BYTES)
    const n = 1_500_000;
    expect(n * 8).toBeGreaterThan(FAULT_IN_MIN_BYTES);
    const times = new Float64Array(n);
    const units = new Int32Array(n);
    let t = 0;
    let seed = 12345;
    const rand = () => ((seed = (Math.imul(seed, 1103515245) + 12345) >>> 0) / 2 ** 32);
    for (let i = 0; i < n; i++) {
      t += -Math.log(1 - rand()) / 2000; // 2 kHz in all
      times[i] = t;
      units[i] = Math.floor(rand() * rand() * 40); // uneven unit sizes
    }
    const dir = join(work, 'large');
    mkdirSync(dir);
    writeFileSync(join(dir, 'spikes.npy'), encodeNpy(times));
    writeFileSync(join(dir, 'units.npy'), encodeNpy(units));
    const alone = await loadSession(dir, { sharedMemory: true });
    const w = await startWorkerThread('core/node/run-steps-worker');
    try {
      for (let rep = 0; rep < 2; rep++) {
        const helped = await loadSession(dir, { sharedMemory: true, importHelper: w });
        expect(helped.inputs).toEqual(alone.inputs); // the digests made on the helper too
        expect(helped.recording.units.map((u) => u.id)).toEqual(alone.recording.units.map((u) => u.id));
        helped.recording.units.forEach((u, k) => {
          const a = alone.recording.units[k].spikeTimes;
          expect(u.spikeTimes.length).toBe(a.length);
          expect(Buffer.from(u.spikeTimes.buffer, u.spikeTimes.byteOffset, u.spikeTimes.byteLength).equals(Buffer.from(a.buffer, a.byteOffset, a.byteLength))).toBe(true);
        });
      }
    } finally {
      await w.terminate();
    }
  }, 120_000);
});
