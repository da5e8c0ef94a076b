/**
 * Loads an NWB 2.x file from disk as a session: the Node edge of
 * core/io/nwb/read-nwb-session.ts. Returns the same ImportResult a session
 * folder gives (sourceKind "nwb").
 *
 * `manifest` carries what session.json says, when the session comes from a
 * folder whose session.json has an `nwb` section (the caller resolves
 * nwb.file against the folder and passes the section through untouched):
 * the section is validated here (parseNwbManifest), the span and tolerance
 * come from session.json parameters.
 *
 * The file is hashed as a stream (size + SHA-256 in `inputs`), then opened
 * read-only through h5wasm on the real file system: only the datasets the
 * session needs are read. Errors are InputError paragraphs naming the file.
 */
import { basename } from 'node:path';
import { DEFAULTS } from '../../defaults';
import type { ImportResult } from '../../io/import-result';
import { parseNwbManifest } from '../../io/nwb/parse-nwb-manifest';
import { readNwbSession } from '../../io/nwb/read-nwb-session';
import { hashFile } from './hash-file';
import { openHdf5File } from './open-hdf5-file';

export interface NwbManifestInput {
  /** The `nwb` section of session.json, as parsed JSON (validated here). */
  readonly section?: unknown;
  /** Manifest file name for messages (default "session.json"). */
  readonly file?: string;
  /** Span limits from session.json parameters (null = not given). */
  readonly span?: { readonly startS: number | null; readonly stopS: number | null };
  /** Allowed overshoot of the span, s (default DEFAULTS.span.toleranceS). */
  readonly toleranceS?: number;
}

export async function loadNwbSession(path: string, manifest?: NwbManifestInput): Promise<ImportResult> {
  const file = basename(path);
  const manifestFile = manifest?.file ?? 'session.json';
  const parsed = parseNwbManifest(manifest?.section, manifestFile);
  const h5 = await openHdf5File(path);
  let session;
  try {
    session = readNwbSession(h5, file, {
      manifest: parsed,
      manifestFile,
      ...(manifest?.span ? { span: { ...manifest.span, file: manifestFile } } : {}),
      toleranceS: manifest?.toleranceS ?? DEFAULTS.span.toleranceS,
    });
  } finally {
    h5.close();
  }
  const { bytes, sha256 } = await hashFile(path);
  return {
    recording: session.recording,
    warnings: session.warnings,
    inputs: [{ file, bytes, sha256 }],
    parameterSources: [],
    sourceKind: 'nwb',
    name: file.replace(/\.nwb$/i, ''),
  };
}
