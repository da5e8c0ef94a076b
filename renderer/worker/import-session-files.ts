/**
 * Imports what the user opened, in the analysis worker: a session folder's
 * files, or an NWB file (picked, dropped, or read through the desktop
 * bridge), by the same dispatch rule as the headless command
 * (core/node/load-session.ts):
 *  - one file whose name ends in .nwb: that NWB file;
 *  - a folder whose session.json has an "nwb" section: the NWB file it names
 *    (inside the folder), with that section and the folder's "parameters";
 *  - anything else: a session folder (core/io/import-session.ts).
 *
 * NWB files are read by core's NWB reader (readNwbImport) over h5wasm's
 * in-memory file system (openHdf5Bytes) and hashed with core's SHA-256, so the
 * recording, warnings and input record equal the headless command's.
 * `openBytes` is injectable for tests in Node.
 */
import { createSha256 } from '../../core/io/create-sha256';
import { InputError } from '../../core/errors';
import { importSession, MANIFEST_FILE } from '../../core/io/import-session';
import type { ImportResult } from '../../core/io/import-result';
import type { OpenHdf5File } from '../../core/io/nwb/hdf5-access';
import { readNwbImport } from '../../core/io/nwb/read-nwb-import';
import { parseManifest } from '../../core/io/parse-manifest';
import type { SessionFileInput } from './api';
import { createBlobSessionSource } from './blob-session-source';

export type OpenHdf5Bytes = (bytes: Uint8Array, name: string) => Promise<OpenHdf5File>;

export async function importSessionFiles(name: string, files: readonly SessionFileInput[], openBytes?: OpenHdf5Bytes): Promise<ImportResult> {
  const target = await nwbTarget(files);
  if (!target) return importSession(createBlobSessionSource(name, files));
  const open = openBytes ?? (await import('./open-hdf5-bytes')).openHdf5Bytes;
  const file = target.file.name.split('/').pop()!;
  const bytes = new Uint8Array(await target.file.blob.arrayBuffer());
  const h5 = await open(bytes, file);
  let result;
  try {
    result = readNwbImport(h5, file, target.section, target.parameterSources);
  } finally {
    h5.close();
  }
  const hash = createSha256();
  hash.update(bytes);
  return { ...result, inputs: [{ file, bytes: bytes.length, sha256: hash.digestHex() }] };
}

interface NwbTarget {
  readonly file: SessionFileInput;
  readonly section: unknown;
  readonly parameterSources: { file: string; overrides: unknown }[];
}

/** The NWB file (and session.json "nwb" section) the opened files point to, or null for a folder of tables. */
async function nwbTarget(files: readonly SessionFileInput[]): Promise<NwbTarget | null> {
  if (files.length === 1 && /\.nwb$/i.test(files[0].name)) return { file: files[0], section: undefined, parameterSources: [] };
  const manifestFile = files.find((f) => f.name === MANIFEST_FILE);
  if (!manifestFile) return null;
  let text = await manifestFile.blob.text();
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const m = parseManifest(text, MANIFEST_FILE);
  if (m.nwb === undefined) return null;
  const sec = m.nwb as { file?: unknown } | null;
  if (typeof sec !== 'object' || sec === null || typeof sec.file !== 'string') {
    throw new InputError({ file: MANIFEST_FILE, column: 'nwb.file', problem: 'the nwb section needs the NWB file name', fix: 'write "nwb": {"file": "session.nwb"}' });
  }
  const wanted = sec.file.replace(/^\.\//, '');
  const file = files.find((f) => f.name === wanted);
  if (!file) throw new InputError({ file: MANIFEST_FILE, column: 'nwb.file', value: sec.file, problem: 'names a file that is not in the session folder' });
  return { file, section: m.nwb, parameterSources: m.parameters !== undefined ? [{ file: MANIFEST_FILE, overrides: m.parameters }] : [] };
}
