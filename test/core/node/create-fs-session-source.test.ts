import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { InputError } from '../../../core/errors';
import { createRawSource } from '../../../core/io/create-raw-source';
import { createFsSessionSource } from '../../../core/node/create-fs-session-source';

const dir = mkdtempSync(join(tmpdir(), 'tagbench-fs-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('createFsSessionSource', () => {
  mkdirSync(join(dir, 'sorting'));
  writeFileSync(join(dir, 'spikes.csv'), 'unit,time\n1,0.5\n');
  writeFileSync(join(dir, 'sorting', 'clusters.tsv'), 'unit\n1\n');
  writeFileSync(join(dir, '.hidden'), 'x');
  // 5 frames x 3 channels of int16: value = 100 * frame + channel, negative on odd frames
  const frames = new Int16Array(15).map((_, i) => (Math.floor(i / 3) % 2 ? -1 : 1) * (100 * Math.floor(i / 3) + (i % 3)));
  writeFileSync(join(dir, 'raw.bin'), new Uint8Array(frames.buffer));

  it('lists files (subfolders as a/b, hidden files skipped)', async () => {
    const s = createFsSessionSource(dir);
    expect([...(await s.list())].sort()).toEqual(['raw.bin', 'sorting/clusters.tsv', 'spikes.csv']);
  });

  it('streams and reads whole files', async () => {
    const s = createFsSessionSource(dir);
    const parts: Uint8Array[] = [];
    for await (const c of s.stream('sorting/clusters.tsv')) parts.push(c.slice());
    expect(Buffer.concat(parts).toString()).toBe('unit\n1\n');
    expect(Buffer.from(await s.readAll('spikes.csv')).toString()).toBe('unit,time\n1,0.5\n');
  });

  it('reads raw frames by offset without loading the file', async () => {
    const s = createFsSessionSource(dir);
    const raw = createRawSource(await s.openRandomAccess!('raw.bin'), { file: 'raw.bin', channelCount: 3, sampleRateHz: 1000, gainUvPerBit: 0.5, startS: 2 });
    expect(raw.frameCount).toBe(5);
    expect(Array.from(raw.readFrames(1, 2))).toEqual([-100, -101, -102, 200, 201, 202]);
    expect(Array.from(raw.readFrames(4, 5))).toEqual([400, 401, 402]);
    expect(Array.from(raw.readFrames(-2, 3))).toEqual([0, 1, 2]);
  });

  it('refuses names that leave the folder', async () => {
    const s = createFsSessionSource(join(dir, 'sorting'));
    await expect(s.readAll('../spikes.csv')).rejects.toBeInstanceOf(InputError);
  });
});
