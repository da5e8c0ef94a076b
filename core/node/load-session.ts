/**
 * Opens a session for the CLI and the desktop app: a session folder (read by
 * core/io/import-session.ts through the file-system source) or an NWB file.
 *
 * NWB dispatch point (the one place NWB input enters): a path ending in .nwb,
 * or a folder whose session.json has an "nwb" section ({"nwb": {"file": ...,
 * ...settings}}), goes to loadNwbSession with the path and the section as
 * given. Its validation belongs to the NWB reader.
 *
 * In the folder case `inputs` lists session.json first, then the NWB file.
 *
 * Hashing: unless options.createHash is given, every input is hashed with
 * node:crypto (nodeSha256) from the bytes the importer reads, as it reads them;
 * with options.importHelper, large files of a folder on that thread instead.
 * That thread also faults in the pages of a folder's shared spike array
 * while this one fills it (fault-in-pages.ts; with sharedMemory).
 *
 * options.sharedMemory (default false): the recording's spike times sit on
 * one SharedArrayBuffer (folders and NWB files alike; see buildRecording), so
 * it can be posted to a worker thread without a copy.
 *
 * Errors: InputError for a missing path, a file that is neither a folder nor
 * .nwb, and everything the importers report.
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import { basename, extname, join } from 'node:path';
import { InputError } from '../errors';
import { importSession, MANIFEST_FILE, type ImportOptions } from '../io/import-session';
import type { ImportResult } from '../io/import-result';
import { parseManifest } from '../io/parse-manifest';
import { createFsSessionSource } from './create-fs-session-source';
import { requestFaultIn } from './fault-in-pages';
import { loadNwbSession } from './load-nwb-session';
import { nodeSha256 } from './node-sha256';
import { threadHasher } from './thread-hasher';
import type { Worker } from 'node:worker_threads';

/** loadSession's options: the importer's, and a thread that helps import a session folder. */
export interface LoadOptions extends ImportOptions {
  /**
   * A worker running core/node/run-steps-worker.ts (e.g. startSpareThread's)
   * that helps import a session folder: files of at least 8 MiB are hashed
   * there while this thread reads them (thread-hasher.ts), and with
   * sharedMemory it faults in the spike array's pages while this thread
   * fills them (fault-in-pages.ts). NWB files are imported on this thread alone.
   */
  readonly importHelper?: Worker;
}

export async function loadSession(path: string, options: LoadOptions = {}): Promise<ImportResult> {
  const { importHelper, ...importOptions } = options;
  const opts: ImportOptions = { createHash: nodeSha256, ...importOptions };
  if (!existsSync(path)) {
    throw new InputError({ file: path, problem: 'no such file or folder', fix: 'give a session folder (spikes.csv, pulses.csv, ...) or an .nwb file' });
  }
  const st = statSync(path);
  if (st.isFile()) {
    if (extname(path).toLowerCase() === '.nwb') return loadNwbSession(path, undefined, opts);
    throw new InputError({ file: basename(path), problem: 'is a file, but a session is a folder of tables or an .nwb file', fix: 'give the folder that holds this file' });
  }
  const manifestPath = join(path, MANIFEST_FILE);
  if (existsSync(manifestPath)) {
    // read once: parsed here, and hashed below when it points at an NWB file
    const manifestBytes = readFileSync(manifestPath);
    let text = manifestBytes.toString('utf8');
    if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
    const m = parseManifest(text, MANIFEST_FILE);
    if (m.nwb !== undefined) {
      const sec = m.nwb as { file?: unknown } | null;
      if (typeof sec !== 'object' || sec === null || typeof sec.file !== 'string') {
        throw new InputError({ file: MANIFEST_FILE, column: 'nwb.file', problem: 'the nwb section needs the NWB file name', fix: 'write "nwb": {"file": "session.nwb"}' });
      }
      const nwbPath = join(path, sec.file);
      if (!existsSync(nwbPath)) throw new InputError({ file: MANIFEST_FILE, column: 'nwb.file', value: sec.file, problem: 'names a file that is not in the session folder' });
      const params = m.parameters !== undefined ? [{ file: MANIFEST_FILE, overrides: m.parameters }] : [];
      const r = await loadNwbSession(nwbPath, m.nwb, { ...opts, parameterSources: [...params, ...(opts.parameterSources ?? [])] });
      // session.json chose the file and may set parameters: it is an input too (size + SHA-256), and the
      // NWB file is named as session.json names it (relative to the folder)
      const h = (opts.createHash ?? nodeSha256)(MANIFEST_FILE);
      h.update(manifestBytes);
      return { ...r, inputs: [{ file: MANIFEST_FILE, bytes: manifestBytes.length, sha256: h.digestHex() }, ...r.inputs.map((i) => ({ ...i, file: sec.file as string }))] };
    }
  }
  if (!importHelper) return importSession(createFsSessionSource(path), opts);
  const hasher = threadHasher(path, importHelper);
  const r = await importSession(createFsSessionSource(path), {
    ...opts,
    createHash: (file) => hasher.createHash(file),
    onSharedSpikes: (memory) => {
      requestFaultIn(importHelper, memory);
      opts.onSharedSpikes?.(memory);
    },
  });
  return { ...r, inputs: await hasher.settle(r.inputs) };
}
