import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import type { ImportResult } from '../../../../core/io/import-result';
import type { Recording } from '../../../../core/model/types';
import type { CliIo } from '../../../../core/node/commands/types';
import type { SessionCommandDeps } from '../../../../core/node/session-command-deps';

/**
 * A stand-in for the import area's loader: the recording is given (a
 * simulated one), the input records are the real files of the folder with
 * their real SHA-256 (node:crypto), so editing a file changes its hash just
 * as with the real importer.
 */
export function fakeImporter(recording: Recording): SessionCommandDeps['importSource'] {
  return async (path: string): Promise<ImportResult> => {
    const inputs = readdirSync(path)
      .sort()
      .map((file) => {
        const bytes = readFileSync(join(path, file));
        return { file, bytes: bytes.length, sha256: createHash('sha256').update(bytes).digest('hex') };
      });
    return { recording, warnings: [], inputs, parameterSources: [], sourceKind: 'folder', name: basename(path) };
  };
}

export function testDeps(recording: Recording, plotly = '/* plotly stand-in */ window.Plotly = undefined;'): SessionCommandDeps {
  return {
    importSource: fakeImporter(recording),
    toolVersion: '0.1.0-test',
    now: () => new Date('2026-03-01T14:05:00.000Z'),
    user: () => 'tester',
    plotlySource: () => plotly,
  };
}

export function captureIo(): CliIo & { out: string[]; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  return { out, err, isTty: false, stdout: (t) => out.push(t), stderr: (t) => err.push(t) };
}
