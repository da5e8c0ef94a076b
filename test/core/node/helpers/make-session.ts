import type { SessionFile } from '../../../../core/curation/session-file';
import { DEFAULTS } from '../../../../core/defaults';

/**
 * A session file for tests: `nUnits` units, every unit carrying a note that
 * names `version`, so a file read back can be checked for being one whole
 * version (all notes agree with savedWith).
 */
export function makeSession(version: number, nUnits: number, source = '../demo'): SessionFile {
  const units = Array.from({ length: nUnits }, (_, i) => `u${i}`);
  const cur: Record<string, { labels: Record<string, { value: string; by: string; at: string }>; note: { text: string; by: string; at: string } }> = {};
  for (const u of units) {
    cur[u] = {
      labels: { tag: { value: version % 2 ? 'tagged' : 'untagged', by: 'test', at: '2026-03-01T00:00:00.000Z' } },
      note: { text: `version ${version} of ${u}: ${'x'.repeat(120)}`, by: 'test', at: '2026-03-01T00:00:00.000Z' },
    };
  }
  return {
    format: 'tagbench-session',
    schemaVersion: 1,
    source,
    inputs: [{ file: 'spikes.csv', bytes: 12, sha256: 'a'.repeat(64) }],
    parameters: JSON.parse(JSON.stringify(DEFAULTS)),
    units,
    curation: { units: cur },
    savedAt: '2026-03-01T00:00:00.000Z',
    savedWith: `version ${version}`,
  };
}
