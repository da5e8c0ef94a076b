import type { Parameters } from '../defaults';
import type { InputFileRecord } from '../io/import-result';
import type { CurationState } from './types';

/** Format tag and schema version of the session file. */
export const SESSION_FORMAT = 'tagbench-session';
export const SESSION_SCHEMA_VERSION = 1;

/**
 * Name of the session file the desktop app saves inside a session folder (beside an NWB file:
 * `<file>.nwb.` + this name), and offers in its exports. batch does not count it as an input.
 */
export const SAVED_SESSION_FILE = 'tagbench-session.json';

/**
 * The session file (JSON, schema version 1): what a person needs to reopen
 * their work and get the same table back.
 *
 * - `source`: the session folder or NWB file, as a path relative to the
 *   session file's folder (or absolute).
 * - `inputs`: every input file with its size and SHA-256 when the session was
 *   made; on reopening, a mismatch is reported, never silently applied.
 * - `parameters`: the full resolved analysis parameters.
 * - `units`: the unit ids of the recording (so curation can be checked
 *   without re-reading the inputs).
 * - `curation`: the person's decisions.
 * - `savedAt` / `savedWith`: provenance of the last save.
 */
export interface SessionFile {
  readonly format: typeof SESSION_FORMAT;
  readonly schemaVersion: typeof SESSION_SCHEMA_VERSION;
  readonly source: string;
  readonly inputs: readonly InputFileRecord[];
  readonly parameters: Parameters;
  readonly units: readonly string[];
  readonly curation: CurationState;
  readonly savedAt: string;
  readonly savedWith: string;
}
