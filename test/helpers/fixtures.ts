import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const DIR = join(dirname(fileURLToPath(import.meta.url)), '..', 'fixtures');

/** Fixtures read by the tests, so the meta-test can flag unused ones. */
export const USED_FIXTURES = new Set<string>();

/** Reads test/fixtures/<path> (JSON with source, versions, cases). */
export function loadFixture<T>(path: string): { source: string; versions: Record<string, string>; cases: T[] } {
  USED_FIXTURES.add(path);
  return JSON.parse(readFileSync(join(DIR, path), 'utf8'));
}
