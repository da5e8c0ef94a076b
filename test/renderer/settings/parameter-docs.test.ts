import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import { parseParameterDocs, unitOfKey } from '../../../renderer/settings/parameter-docs';
import { PARAMETER_HELP } from '../../../renderer/settings/parameter-help';

const source = readFileSync(resolve(__dirname, '../../../core/defaults.ts'), 'utf8');

describe('parameter explanations for the Analysis settings screen', () => {
  const docs = parseParameterDocs(source);
  it('reads doc comments of core/defaults.ts per key', () => {
    expect(docs.get('light.saltBinMs')?.text).toBe('SALT latency bin, ms.');
    expect(docs.get('quality.refractoryMs')?.text).toMatch(/^ISI refractory period, ms/);
    expect(docs.get('light.')?.text).toMatch(/Light identification/);
    // A comment above a run of keys documents each of them.
    expect(parseParameterDocs('export const DEFAULTS = {\n  a: {\n    /** Window, s. */\n    startS: 0,\n    stopS: 1,\n\n    other: 2,\n  },\n};').get('a.stopS')?.text).toBe('Window, s.');
    expect(parseParameterDocs('export const DEFAULTS = {\n  a: {\n    /** Window, s. */\n    startS: 0,\n\n    other: 2,\n  },\n};').get('a.other')?.text).toBe('');
  });
  it('every parameter of DEFAULTS has an explanation (its comment in core/defaults.ts or parameter-help.ts)', () => {
    const missing: string[] = [];
    for (const [section, values] of Object.entries(DEFAULTS)) {
      for (const key of Object.keys(values)) {
        const id = `${section}.${key}`;
        if (!docs.get(id)?.text && !PARAMETER_HELP[id]) missing.push(id);
      }
    }
    expect(missing).toEqual([]);
  });
  it('derives units from name suffixes', () => {
    expect([unitOfKey('windowEndMs'), unitOfKey('binS'), unitOfKey('frequencyHz'), unitOfKey('alpha'), unitOfKey('minSpikes')]).toEqual(['ms', 's', 'Hz', '', '']);
  });
});
