import { describe, expect, it } from 'vitest';
import { isVerdictColumn } from '../../../renderer/state/verdict-columns';

describe('verdict columns a person can label', () => {
  it.each([
    [{ name: 'tag', kind: 'string', values: ['tagged', '', 'untagged'] }, true],
    [{ name: 'jump_forward', kind: 'string', values: ['none', 'excited'] }, true],
    [{ name: 'jump_forward_reason', kind: 'string', values: ['only 2 events (fewer than 6)'] }, false],
    [{ name: 'jump_forward_p', kind: 'number', values: [0.5] }, false],
    [{ name: 'rate_hz', kind: 'number', values: [1] }, false],
    [{ name: 'jump_forward_shape', kind: 'string', values: ['', ''] }, false],
    [{ name: 'unit', kind: 'string', values: ['1'] }, false],
  ])('%j -> %s', (c, yes) => expect(isVerdictColumn(c)).toBe(yes));
});
