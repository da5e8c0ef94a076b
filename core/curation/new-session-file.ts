import type { Parameters } from '../defaults';
import type { ImportResult } from '../io/import-result';
import { SESSION_FORMAT, SESSION_SCHEMA_VERSION, type SessionFile } from './session-file';
import { EMPTY_CURATION } from './types';

/**
 * A fresh session file for an imported recording: its input hashes, the
 * resolved parameters, its unit ids, no curation yet. `source` is the path
 * to store (relative to the session file's folder where possible; the Node
 * edge decides), `savedAt` an ISO time, `savedWith` e.g. "tagbench 0.1.0".
 */
export function newSessionFile(imported: ImportResult, parameters: Parameters, source: string, savedAt: string, savedWith: string): SessionFile {
  return {
    format: SESSION_FORMAT,
    schemaVersion: SESSION_SCHEMA_VERSION,
    source,
    inputs: imported.inputs.map((i) => ({ file: i.file, bytes: i.bytes, sha256: i.sha256 })),
    parameters: JSON.parse(JSON.stringify(parameters)) as Parameters,
    units: imported.recording.units.map((u) => u.id),
    curation: EMPTY_CURATION,
    savedAt,
    savedWith,
  };
}
