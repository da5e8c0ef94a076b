import { describe, expect, it } from 'vitest';
import { formatCell } from '../../../renderer/state/format-cell';

describe('number display in the screens', () => {
  it.each([
    [0, '0'],
    [1234, '1234'],
    [0.123456, '0.1235'],
    [0.001, '0.001'],
    [0.000001234, '1.23e-6'],
    [-0.0005, '-5e-4'],
    [12345678, '1.23e7'],
    [NaN, ''],
    [Infinity, 'inf'],
  ])('%s -> %s', (x, s) => expect(formatCell(x)).toBe(s));
});
