import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { FIXTURES, META_KEYS } from './fixtures';

// Meta-test (DESIGN.md section 8): the fixture names its generator and the
// versions that wrote it, and every section of reference values is read by
// some test (an unused fixture means a check silently went missing).
describe('kernel fixtures', () => {
  it('record their generator and versions', () => {
    expect(FIXTURES.generator).toBe('test/fixtures/kernels/make_kernel_fixtures.py');
    expect(Object.keys(FIXTURES.versions).sort()).toEqual(['numpy', 'python', 'scipy']);
    expect(typeof FIXTURES.seed).toBe('number');
  });
  it('are all used by a test', () => {
    const here = dirname(fileURLToPath(import.meta.url));
    const text = [here, join(here, '../align')]
      .flatMap((d) => readdirSync(d).filter((f) => f.endsWith('.test.ts') && f !== 'fixtures.test.ts').map((f) => join(d, f)))
      .map((f) => readFileSync(f, 'utf8'))
      .join('\n');
    const unused = Object.keys(FIXTURES).filter((k) => !META_KEYS.includes(k) && !text.includes(`FIXTURES.${k}`));
    expect(unused).toEqual([]);
  });
});
