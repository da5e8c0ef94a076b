/**
 * NWB entry of loadSession (see load-session.ts): loads an NWB 2.x file from
 * disk as a session and returns the same ImportResult a session folder gives
 * (sourceKind "nwb"), through core/io/nwb/read-nwb-session.ts and the shared
 * recording builder.
 *
 * `section` is the session.json "nwb" section as given (undefined for a bare
 * .nwb path); it is validated here (parseNwbManifest). Parameters come from
 * `options.parameterSources` as for folders (span and its tolerance).
 *
 * The file is opened read-only through h5wasm on the real file system, so
 * only the datasets the session needs are read; it is hashed as a stream
 * (size + SHA-256 in `inputs`, with options.createHash or node:crypto).
 * Errors are InputError paragraphs naming the file.
 */
import { createReadStream, statSync } from 'node:fs';
import { basename } from 'node:path';
import { DEFAULTS } from '../defaults';
import type { ImportOptions } from '../io/import-session';
import type { ImportResult } from '../io/import-result';
import { parseNwbManifest } from '../io/nwb/parse-nwb-manifest';
import { readNwbSession } from '../io/nwb/read-nwb-session';
import { resolveParameters } from '../resolve-parameters';
import { nodeSha256 } from './node-sha256';
import { openHdf5File } from './nwb/open-hdf5-file';

export async function loadNwbSession(path: string, section?: unknown, options: ImportOptions = {}): Promise<ImportResult> {
  const file = basename(path);
  const manifestFile = 'session.json';
  const manifest = parseNwbManifest(section, manifestFile);
  const parameterSources = [...(options.parameterSources ?? [])];
  const parameters = resolveParameters(parameterSources);
  const span = spanFrom(parameters, parameterSources);
  const h5 = await openHdf5File(path);
  let session;
  try {
    session = readNwbSession(h5, file, { manifest, manifestFile, ...(span ? { span } : {}), toleranceS: parameters.span.toleranceS });
  } finally {
    h5.close();
  }
  const hash = (options.createHash ?? nodeSha256)();
  await new Promise<void>((resolve, reject) => {
    createReadStream(path, { highWaterMark: 1 << 20 })
      .on('data', (chunk) => hash.update(chunk as Uint8Array))
      .on('error', reject)
      .on('end', () => resolve());
  });
  return {
    recording: session.recording,
    warnings: session.warnings,
    inputs: [{ file, bytes: statSync(path).size, sha256: hash.digestHex() }],
    parameterSources,
    sourceKind: 'nwb',
    name: file.replace(/\.nwb$/i, ''),
  };
}

/** The explicit span from the parameters (null = not set), with the file that set it last. */
function spanFrom(p: ReturnType<typeof resolveParameters>, sources: readonly { file: string; overrides: unknown }[]) {
  if (p.span.startS === DEFAULTS.span.startS && p.span.stopS === DEFAULTS.span.stopS) return undefined;
  let file = 'session.json';
  for (const s of sources) {
    const sec = (s.overrides as { span?: Record<string, unknown> } | null)?.span;
    if (sec && ('startS' in sec || 'stopS' in sec)) file = s.file;
  }
  return { startS: p.span.startS, stopS: p.span.stopS, file };
}
