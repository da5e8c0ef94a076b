/**
 * NWB entry of loadSession (see load-session.ts). The NWB reader is developed
 * on its own branch; when it is merged, this function calls it with the file
 * path, the session.json "nwb" section (or undefined) and the import options,
 * and returns its ImportResult (sourceKind "nwb"). Until then an NWB input is
 * reported as a user-facing error, never a crash.
 */
import { basename } from 'node:path';
import { InputError } from '../errors';
import type { ImportOptions } from '../io/import-session';
import type { ImportResult } from '../io/import-result';

export async function loadNwbSession(path: string, _settings: unknown, _options: ImportOptions): Promise<ImportResult> {
  throw new InputError({ file: basename(path), problem: 'NWB input is not part of this build yet', fix: 'export the session as a folder of tables (README, "Input formats")' });
}
