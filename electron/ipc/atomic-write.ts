import { randomBytes } from 'node:crypto';
import { open, rename, rm } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';

/**
 * Writes a file atomically: the data go to a temporary file in the same
 * folder, which is flushed to disk and then renamed over the target, so a
 * reader (or a crash) sees either the old file or the whole new one, never a
 * half-written file. The temporary file is removed on failure.
 */
export async function atomicWrite(path: string, data: string | Uint8Array): Promise<void> {
  const tmp = join(dirname(path), `.${basename(path)}.${randomBytes(6).toString('hex')}.tmp`);
  let handle;
  try {
    handle = await open(tmp, 'wx', 0o644);
    await handle.writeFile(data);
    await handle.sync();
    await handle.close();
    handle = undefined;
    await rename(tmp, path);
  } catch (e) {
    if (handle) await handle.close().catch(() => undefined);
    await rm(tmp, { force: true }).catch(() => undefined);
    throw e;
  }
}
