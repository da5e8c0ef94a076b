// Hashing input files on the analysis worker while the importer reads them (core/node/thread-hasher.ts).
// Reference: the importer's own hashes (node:crypto, checked against the SHA-256 test vectors
// in test/core/io/create-sha256.test.ts) of the same files.
import { cpSync, mkdtempSync, readFileSync, rmSync, statSync, utimesSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { isInputError } from '../../../core/errors';
import { importSession } from '../../../core/io/import-session';
import { createFsSessionSource } from '../../../core/node/create-fs-session-source';
import { loadSession } from '../../../core/node/load-session';
import { nodeSha256 } from '../../../core/node/node-sha256';
import { startWorkerThread } from '../../../core/node/start-worker-thread';
import { threadHasher } from '../../../core/node/thread-hasher';

const DEMO = join(__dirname, '../../../sample-data/demo');
const work = mkdtempSync(join(tmpdir(), 'tagbench-hash-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('threadHasher', () => {
  it('gives the importer\'s own digests, every file hashed on the worker', async () => {
    const w = await startWorkerThread('core/node/run-steps-worker');
    try {
      const here = await loadSession(DEMO);
      const hasher = threadHasher(DEMO, w, 0);
      const r = await importSession(createFsSessionSource(DEMO), { createHash: (f) => hasher.createHash(f) });
      expect(r.inputs.every((i) => i.sha256.startsWith('hashing-in-thread:'))).toBe(true); // all went to the worker
      const settled = await hasher.settle(r.inputs);
      expect(settled).toEqual(here.inputs);
      // and through loadSession's option (files under 8 MiB stay on this thread)
      const viaOption = await loadSession(DEMO, { importHelper: w });
      expect(viaOption.inputs).toEqual(here.inputs);
    } finally {
      await w.terminate();
    }
  }, 120_000);

  it('refuses a digest when the file changed or the byte counts differ', async () => {
    const dir = join(work, 'copy');
    cpSync(DEMO, dir, { recursive: true });
    const w = await startWorkerThread('core/node/run-steps-worker');
    try {
      const file = 'pulses.csv';
      const size = statSync(join(dir, file)).size;
      const expected = nodeSha256();
      expected.update(new Uint8Array(readFileSync(join(dir, file))));
      const digest = expected.digestHex();

      const ok = threadHasher(dir, w, 0);
      const a = ok.createHash(file);
      expect(await ok.settle([{ file, bytes: size, sha256: a.digestHex() }])).toEqual([{ file, bytes: size, sha256: digest }]);

      const touched = threadHasher(dir, w, 0);
      const b = touched.createHash(file);
      const later = new Date(statSync(join(dir, file)).mtimeMs + 5000);
      utimesSync(join(dir, file), later, later); // as if written to while being read
      const e1 = await touched.settle([{ file, bytes: size, sha256: b.digestHex() }]).then(() => null, (e: unknown) => e);
      expect(isInputError(e1)).toBe(true);
      expect((e1 as Error).message).toBe('pulses.csv: the file changed while it was being read. Wait until the files are completely written, then import again.');

      const short = threadHasher(dir, w, 0);
      const c = short.createHash(file);
      const e2 = await short.settle([{ file, bytes: size - 1, sha256: c.digestHex() }]).then(() => null, (e: unknown) => e);
      expect(isInputError(e2)).toBe(true);
    } finally {
      await w.terminate();
    }
  }, 120_000);
});
