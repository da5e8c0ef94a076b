/**
 * Which NWB file (and session.json "nwb" section) a session path points to,
 * by the same rule as loadSession: a path ending in .nwb, or a folder whose
 * session.json has an "nwb" section with a "file". Null for anything else
 * (folders of tables, missing paths: loadSession reports those).
 * Used by `inspect` to print the NWB listing before the session summary.
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import { extname, join } from 'node:path';
import { MANIFEST_FILE } from '../../io/import-session';
import { parseManifest } from '../../io/parse-manifest';

export function findNwbTarget(path: string): { readonly file: string; readonly section: unknown } | null {
  if (!existsSync(path)) return null;
  if (statSync(path).isFile()) return extname(path).toLowerCase() === '.nwb' ? { file: path, section: undefined } : null;
  const manifestPath = join(path, MANIFEST_FILE);
  if (!existsSync(manifestPath)) return null;
  let text = readFileSync(manifestPath, 'utf8');
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const m = parseManifest(text, MANIFEST_FILE);
  const sec = m.nwb as { file?: unknown } | null | undefined;
  if (!sec || typeof sec !== 'object' || typeof sec.file !== 'string') return null;
  const file = join(path, sec.file);
  return existsSync(file) ? { file, section: m.nwb } : null;
}
