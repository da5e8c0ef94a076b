import { readdir, stat } from 'node:fs/promises';
import { basename, join } from 'node:path';
import type { SessionFileEntry } from '../common/ipc-contract';

/** At most this many files are listed (a session folder holds a handful). */
export const MAX_LISTED_FILES = 2000;
/** Folders deeper than this below the session folder are not listed. */
export const MAX_DEPTH = 3;

/**
 * The regular files of a granted session: for a folder, every file up to
 * MAX_DEPTH levels down (hidden files and symlinked entries skipped: a symlink
 * could point outside the folder), names relative with forward slashes, sorted;
 * for an NWB file, the file itself.
 */
export async function listSessionFiles(root: string, kind: 'folder' | 'nwb'): Promise<SessionFileEntry[]> {
  if (kind === 'nwb') return [{ name: basename(root), bytes: (await stat(root)).size }];
  const out: SessionFileEntry[] = [];
  const walk = async (dir: string, prefix: string, depth: number): Promise<void> => {
    const entries = await readdir(dir, { withFileTypes: true });
    for (const e of entries) {
      if (out.length >= MAX_LISTED_FILES) return;
      if (e.name.startsWith('.')) continue;
      const rel = prefix ? `${prefix}/${e.name}` : e.name;
      if (e.isFile()) out.push({ name: rel, bytes: (await stat(join(dir, e.name))).size });
      else if (e.isDirectory() && depth < MAX_DEPTH) await walk(join(dir, e.name), rel, depth + 1);
    }
  };
  await walk(root, '', 0);
  return out.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
}
