/**
 * Meta-test of the stats fixtures: every JSON fixture under
 * test/fixtures/stats names its source and versions, has cases, and is read by
 * a test (a fixture nobody checks is a silent gap).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const DIR = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'fixtures', 'stats');
const TESTS = dirname(fileURLToPath(import.meta.url));

describe('stats fixtures', () => {
  const files = readdirSync(DIR).filter((f) => f.endsWith('.json'));
  const testText = readdirSync(TESTS)
    .filter((f) => f.endsWith('.test.ts') && f !== 'fixtures-meta.test.ts')
    .map((f) => readFileSync(join(TESTS, f), 'utf8'))
    .join('\n');
  it('has fixtures', () => expect(files.length).toBeGreaterThan(0));
  it.each(files)('%s is well formed and used', (f) => {
    const j = JSON.parse(readFileSync(join(DIR, f), 'utf8'));
    expect(typeof j.source).toBe('string');
    expect(j.source.length).toBeGreaterThan(5);
    expect(typeof j.versions).toBe('object');
    expect(Array.isArray(j.cases) && j.cases.length > 0).toBe(true);
    expect(testText.includes(`stats/${f}`)).toBe(true);
  });
});
