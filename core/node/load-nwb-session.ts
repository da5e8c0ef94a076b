/**
 * NWB entry of loadSession (see load-session.ts): loads an NWB 2.x file from
 * disk as a session and returns the same ImportResult a session folder gives
 * (sourceKind "nwb"), through core/io/nwb/read-nwb-session.ts and the shared
 * recording builder.
 *
 * `section` is the session.json "nwb" section as given (undefined for a bare
 * .nwb path); it is validated by core/io/nwb/read-nwb-import.ts (shared with
 * the browser worker). Parameters come from `options.parameterSources` as for
 * folders (span and its tolerance).
 *
 * The file is opened read-only through h5wasm on the real file system, so
 * only the datasets the session needs are read; it is hashed as a stream
 * (size + SHA-256 in `inputs`, with options.createHash or node:crypto).
 * Errors are InputError paragraphs naming the file.
 */
import { createReadStream, statSync } from 'node:fs';
import { basename } from 'node:path';
import type { ImportOptions } from '../io/import-session';
import type { ImportResult } from '../io/import-result';
import { readNwbImport } from '../io/nwb/read-nwb-import';
import { nodeSha256 } from './node-sha256';
import { openHdf5File } from './nwb/open-hdf5-file';

export async function loadNwbSession(path: string, section?: unknown, options: ImportOptions = {}): Promise<ImportResult> {
  const file = basename(path);
  const h5 = await openHdf5File(path);
  let session;
  try {
    session = readNwbImport(h5, file, section, options.parameterSources ?? [], { sharedMemory: options.sharedMemory ?? false });
  } finally {
    h5.close();
  }
  const hash = (options.createHash ?? nodeSha256)(file);
  await new Promise<void>((resolve, reject) => {
    createReadStream(path, { highWaterMark: 1 << 20 })
      .on('data', (chunk) => hash.update(chunk as Uint8Array))
      .on('error', reject)
      .on('end', () => resolve());
  });
  return { ...session, inputs: [{ file, bytes: statSync(path).size, sha256: hash.digestHex() }] };
}
