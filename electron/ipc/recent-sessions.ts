import { createHash } from 'node:crypto';
import { readFile } from 'node:fs/promises';
import { basename } from 'node:path';
import type { RecentSession } from '../common/ipc-contract';
import { atomicWrite } from './atomic-write';

/** Longest recent-sessions list kept. */
export const MAX_RECENT = 12;

/** A recent entry as stored (with its absolute path, which stays in main). */
export interface StoredRecent extends RecentSession {
  readonly path: string;
}

/**
 * The recent-sessions list, kept as JSON in the app's user-data folder
 * (written atomically). A damaged or missing file is read as an empty list.
 * Entry ids are derived from the path, so reopening the same session moves
 * its entry to the top instead of adding another.
 */
export class RecentSessions {
  constructor(private readonly file: string) {}

  async list(): Promise<StoredRecent[]> {
    let raw: unknown;
    try {
      raw = JSON.parse(await readFile(this.file, 'utf8'));
    } catch {
      return [];
    }
    if (!Array.isArray(raw)) return [];
    return raw.filter(isStoredRecent).slice(0, MAX_RECENT);
  }

  /** Moves (or adds) a session to the top of the list. */
  async add(path: string, kind: 'folder' | 'nwb', now: Date = new Date()): Promise<StoredRecent> {
    const entry: StoredRecent = { id: recentId(path), kind, name: basename(path), displayPath: path, path, openedAt: now.toISOString() };
    const rest = (await this.list()).filter((r) => r.id !== entry.id);
    await atomicWrite(this.file, JSON.stringify([entry, ...rest].slice(0, MAX_RECENT), null, 1));
    return entry;
  }

  /** The entry with this id, or undefined. */
  async find(id: string): Promise<StoredRecent | undefined> {
    return (await this.list()).find((r) => r.id === id);
  }
}

/** Stable id of a path (first 16 hex digits of its SHA-256). */
export function recentId(path: string): string {
  return createHash('sha256').update(path).digest('hex').slice(0, 16);
}

function isStoredRecent(x: unknown): x is StoredRecent {
  if (typeof x !== 'object' || x === null) return false;
  const r = x as Record<string, unknown>;
  return (
    typeof r.id === 'string' &&
    (r.kind === 'folder' || r.kind === 'nwb') &&
    typeof r.name === 'string' &&
    typeof r.path === 'string' &&
    typeof r.displayPath === 'string' &&
    typeof r.openedAt === 'string'
  );
}
