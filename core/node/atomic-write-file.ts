import { closeSync, copyFileSync, fsyncSync, linkSync, openSync, renameSync, unlinkSync, writeSync, existsSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/**
 * Replaces `path` with `data` so that at every instant the file on disk is
 * either the complete old version or the complete new one, even if the
 * process is killed or the machine loses power mid-save:
 *
 * 1. write the data to a temporary file in the same folder and fsync it;
 * 2. when `backup` is set and the old file exists, make `<path>.bak` the old
 *    version (hard link to a temporary name, then rename over the backup:
 *    the backup itself is also never half-written; file systems without hard
 *    links get a copy, fsynced);
 * 3. rename the temporary file over `path` (atomic on POSIX and on NTFS);
 * 4. fsync the folder so the rename itself survives a power cut (skipped
 *    where a folder cannot be opened, e.g. on Windows).
 *
 * A temporary file left by a killed save is named `.<name>.tmp-<pid>-<n>`
 * and never mistaken for the real file. Throws on I/O errors (the old file is
 * then untouched).
 */
let counter = 0;

export function atomicWriteFile(path: string, data: string | Uint8Array, options: { backup?: boolean } = {}): void {
  const dir = dirname(path);
  const name = basename(path);
  const tag = `${process.pid}-${Date.now().toString(36)}-${counter++}`;
  const tmp = join(dir, `.${name}.tmp-${tag}`);
  const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
  const fd = openSync(tmp, 'wx', 0o644);
  try {
    let off = 0;
    while (off < bytes.length) off += writeSync(fd, bytes, off, bytes.length - off);
    fsyncSync(fd);
  } catch (e) {
    closeSync(fd);
    safeUnlink(tmp);
    throw e;
  }
  closeSync(fd);
  try {
    if (options.backup && existsSync(path)) {
      const bakTmp = join(dir, `.${name}.bak-${tag}`);
      try {
        linkSync(path, bakTmp);
      } catch {
        copyFileSync(path, bakTmp);
        const bfd = openSync(bakTmp, 'r+');
        fsyncSync(bfd);
        closeSync(bfd);
      }
      renameSync(bakTmp, `${path}.bak`);
    }
    renameSync(tmp, path);
  } catch (e) {
    safeUnlink(tmp);
    throw e;
  }
  fsyncDir(dir);
}

function safeUnlink(p: string): void {
  try {
    unlinkSync(p);
  } catch {
    /* already gone */
  }
}

function fsyncDir(dir: string): void {
  let fd = -1;
  try {
    fd = openSync(dir, 'r');
    fsyncSync(fd);
  } catch {
    /* folders cannot be opened or synced on some platforms (Windows) */
  } finally {
    if (fd >= 0) closeSync(fd);
  }
}
