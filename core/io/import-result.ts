import type { ParameterOverrides } from '../defaults';
import type { Recording, Warning } from '../model/types';

/** One input file that went into a recording (written to run.json). */
export interface InputFileRecord {
  /** Name relative to the session folder (or the NWB file's base name). */
  readonly file: string;
  /** Size in bytes. */
  readonly bytes: number;
  /** SHA-256 of the file's bytes, lowercase hex. */
  readonly sha256: string;
}

/** What importing a session (folder or NWB file) yields. */
export interface ImportResult {
  readonly recording: Recording;
  /** Counted benign problems found while importing. */
  readonly warnings: readonly Warning[];
  /** Every file read, with its hash, in the order read. */
  readonly inputs: readonly InputFileRecord[];
  /** Parameter overrides found in the session (session.json "parameters"), with their file. */
  readonly parameterSources: readonly { file: string; overrides: ParameterOverrides | unknown }[];
  /** "folder" for a session folder, "nwb" for an NWB file. */
  readonly sourceKind: 'folder' | 'nwb';
  /** Display name of the session (folder or file base name). */
  readonly name: string;
}
