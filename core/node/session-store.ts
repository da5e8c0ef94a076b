import { existsSync, readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { serializeSessionFile } from '../curation/serialize-session-file';
import type { SessionFile } from '../curation/session-file';
import { validateSessionFile } from '../curation/validate-session-file';
import { InputError, isInputError } from '../errors';
import { atomicWriteFile } from './atomic-write-file';

/**
 * Saves a session file atomically, keeping the previous version as
 * `<path>.bak` when it is a loadable session (see atomicWriteFile). The text is validated before writing,
 * so a bug can never put a file on disk that would not load.
 */
export function saveSessionFile(path: string, session: SessionFile): void {
  const text = serializeSessionFile(session);
  validateSessionFile(text, basename(path));
  // Only a good file becomes the backup: after loading from the backup because
  // the main file was broken, the broken file must not replace the good backup.
  atomicWriteFile(path, text, { backup: isLoadable(path) });
}

function isLoadable(path: string): boolean {
  try {
    validateSessionFile(readFileSync(path, 'utf8'), basename(path));
    return true;
  } catch {
    return false;
  }
}

/** A loaded session, and whether it came from the backup (with the reason). */
export interface LoadedSession {
  readonly session: SessionFile;
  /** Non-empty when the main file was broken or missing and `<path>.bak` was used. */
  readonly notice: string;
  readonly fromBackup: boolean;
}

/**
 * Loads and validates a session file. When the main file is missing or
 * broken (not JSON, or fails validation) and `<path>.bak` loads, the backup
 * is used and `notice` says so, naming the main file's problem; the broken
 * file is left as it is for the person to inspect. When neither loads, the
 * main file's problem is thrown as an InputError.
 */
export function loadSessionFile(path: string): LoadedSession {
  const name = basename(path);
  let mainProblem: string;
  try {
    if (!existsSync(path)) throw new InputError({ file: name, problem: 'session file not found', fix: 'check the path' });
    return { session: validateSessionFile(readFileSync(path, 'utf8'), name), notice: '', fromBackup: false };
  } catch (e) {
    if (!isInputError(e)) throw e;
    mainProblem = e.message;
    const bak = `${path}.bak`;
    if (!existsSync(bak)) throw e;
    let session: SessionFile;
    try {
      session = validateSessionFile(readFileSync(bak, 'utf8'), `${name}.bak`);
    } catch (e2) {
      if (!isInputError(e2)) throw e2;
      throw new InputError({ file: name, problem: `the session file and its backup are both unreadable (${mainProblem} Backup: ${e2.message})` });
    }
    return {
      session,
      fromBackup: true,
      notice: `Loaded the backup ${name}.bak because the session file could not be used: ${mainProblem} The next save replaces the broken file.`,
    };
  }
}
