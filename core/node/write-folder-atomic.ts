import { existsSync, mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/**
 * Writes a folder of files all-or-nothing: into a hidden sibling folder
 * first, then, when every file is written, the old folder (if any) is
 * removed and the new one renamed into place. On failure the partial folder
 * is removed and the old one is left untouched, so no half-written folder
 * is ever seen under `dir`.
 */
export function writeFolderAtomic(dir: string, files: readonly { name: string; data: string | Uint8Array }[]): void {
  const parent = dirname(dir);
  mkdirSync(parent, { recursive: true });
  const tmp = join(parent, `.${basename(dir)}.partial-${process.pid}-${Date.now()}`);
  mkdirSync(tmp);
  try {
    for (const f of files) writeFileSync(join(tmp, f.name), f.data);
    if (existsSync(dir)) rmSync(dir, { recursive: true, force: true });
    renameSync(tmp, dir);
  } catch (e) {
    rmSync(tmp, { recursive: true, force: true });
    throw e;
  }
}
