import { existsSync, statSync } from 'node:fs';
import { basename, dirname, isAbsolute, resolve } from 'node:path';
import { applyCuration } from '../curation/apply-curation';
import { compareInputs, type InputMismatch } from '../curation/compare-inputs';
import { describeInputMismatch } from '../curation/describe-input-mismatch';
import type { CurationState } from '../curation/types';
import { EMPTY_CURATION } from '../curation/types';
import type { Parameters } from '../defaults';
import { InputError } from '../errors';
import type { ImportResult } from '../io/import-result';
import type { AnalysisResult } from '../pipeline/analyse-recording';
import { resolveParameters } from '../resolve-parameters';
import type { UnitTable } from '../table/types';
import type { Worker } from 'node:worker_threads';
import { analyseRecordingThreads, withSpareThread, type SpareThread } from './analyse-recording-threads';
import { loadSessionFile } from './session-store';

/**
 * Reads a session folder or NWB file into an ImportResult (the import area's
 * loader). `importHelper`, when given, is a thread that may help the import
 * (hash large input files, fault in the spike memory: loadSession's option of
 * that name).
 */
export type ImportSource = (path: string, opts?: { readonly importHelper?: Worker }) => Promise<ImportResult>;

/** A session opened for export or report: analysed, with curation applied. */
export interface OpenedSession {
  /** The session file, or null when a data source was opened directly. */
  readonly sessionFile: string | null;
  /** The data source path as resolved. */
  readonly source: string;
  readonly imported: ImportResult;
  readonly parameters: Parameters;
  readonly analysis: AnalysisResult;
  /** The analysis table with curation columns (final_V, included, note, ...). */
  readonly table: UnitTable;
  readonly curation: CurationState;
  /** Things to tell the user (backup used, inputs changed, curation of unknown units). */
  readonly notices: readonly string[];
  readonly mismatch: InputMismatch | null;
  readonly orphans: readonly string[];
}

/** True when a path names a session file (a .json file) rather than a data source. */
export function isSessionFilePath(path: string): boolean {
  return /\.json$/i.test(path) && (!existsSync(path) || statSync(path).isFile());
}

/**
 * Opens a session file (or a data source directly, without curation):
 * loads and validates the session file (falling back to its backup, with a
 * notice), imports its source (path relative to the session file's folder),
 * compares the input hashes, analyses with the session's parameters and
 * applies the curation.
 *
 * Changed inputs: an InputError naming every changed file, unless
 * `allowChangedInputs`, in which case the curation is applied and the
 * mismatch is a notice (written to stderr, run.json and the report).
 */
export async function openSession(path: string, importSource: ImportSource, opts: { allowChangedInputs?: boolean } = {}): Promise<OpenedSession> {
  // As in `run`: the analysis worker starts now, hashes large inputs during the import, then analyses.
  return withSpareThread(undefined, ({ spare, importHelper }) => open(path, importSource, opts, spare, importHelper));
}

async function open(path: string, importSource: ImportSource, opts: { allowChangedInputs?: boolean }, spare: SpareThread | undefined, importHelper: Worker | undefined): Promise<OpenedSession> {
  if (!isSessionFilePath(path)) {
    const imported = await importSource(path, { importHelper });
    const parameters = resolveParameters(imported.parameterSources);
    const analysis = await analyseRecordingThreads(imported.recording, parameters, { spare });
    const { table } = applyCuration(analysis.table, EMPTY_CURATION);
    return { sessionFile: null, source: path, imported, parameters, analysis, table, curation: EMPTY_CURATION, notices: [], mismatch: null, orphans: [] };
  }
  const loaded = loadSessionFile(path);
  const notices: string[] = loaded.notice ? [loaded.notice] : [];
  const s = loaded.session;
  const source = isAbsolute(s.source) ? s.source : resolve(dirname(path), s.source);
  const imported = await importSource(source, { importHelper });
  const mismatch = compareInputs(s.inputs, imported.inputs);
  if (!mismatch.same) {
    const msg = describeInputMismatch(mismatch, basename(path));
    if (!opts.allowChangedInputs) {
      throw new InputError({ file: basename(path), problem: msg.slice(basename(path).length + 2).replace(/\.$/, ''), fix: 'if the change is intended (e.g. a corrected file), rerun with --allow-changed-inputs; the report and run.json will then say so' });
    }
    notices.push(msg);
  }
  const analysis = await analyseRecordingThreads(imported.recording, s.parameters, { spare });
  const { table, orphans } = applyCuration(analysis.table, s.curation);
  if (orphans.length) notices.push(`${basename(path)}: curation of ${orphans.length} unit(s) not in the recording was not applied: ${orphans.slice(0, 10).join(', ')}${orphans.length > 10 ? ', ...' : ''}.`);
  return { sessionFile: path, source, imported, parameters: s.parameters, analysis, table, curation: s.curation, notices, mismatch: mismatch.same ? null : mismatch, orphans };
}
