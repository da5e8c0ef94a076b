import type { ImportResult } from '../../core/io/import-result';
import type { Recording } from '../../core/model/types';
import type { CliIo } from '../../core/node/commands/types';

/** An in-memory session loader for command tests (no files read). */
export function memoryLoader(recording: Recording, parameterSources: ImportResult['parameterSources'] = []) {
  return async (path: string): Promise<ImportResult> => ({ recording, warnings: [], inputs: [], parameterSources, sourceKind: 'folder', name: path });
}

/** Captures a command's stdout and stderr. */
export function captureIo(): CliIo & { out: string[]; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  return { out, err, isTty: false, stdout: (t) => void out.push(t), stderr: (t) => void err.push(t) };
}
