import type { InputFileRecord } from '../io/import-result';

/** How the inputs on disk differ from those a session file recorded. */
export interface InputMismatch {
  /** Same name, different size or SHA-256. */
  readonly changed: readonly { file: string; recorded: InputFileRecord; current: InputFileRecord }[];
  /** Recorded but not read now. */
  readonly missing: readonly string[];
  /** Read now but not recorded. */
  readonly added: readonly string[];
  /** True when nothing differs. */
  readonly same: boolean;
}

/**
 * Compares recorded input hashes with current ones, by file name. Pure; the
 * caller decides what to do (the CLI refuses to apply curation to changed
 * inputs unless told to, and always says which files changed).
 */
export function compareInputs(recorded: readonly InputFileRecord[], current: readonly InputFileRecord[]): InputMismatch {
  const now = new Map(current.map((c) => [c.file, c]));
  const then = new Map(recorded.map((r) => [r.file, r]));
  const changed = [];
  const missing: string[] = [];
  for (const r of recorded) {
    const c = now.get(r.file);
    if (!c) missing.push(r.file);
    else if (c.sha256 !== r.sha256 || c.bytes !== r.bytes) changed.push({ file: r.file, recorded: r, current: c });
  }
  const added = current.filter((c) => !then.has(c.file)).map((c) => c.file);
  return { changed, missing, added, same: changed.length === 0 && missing.length === 0 && added.length === 0 };
}
