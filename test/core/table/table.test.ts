import { describe, expect, it } from 'vitest';
import { assembleTable } from '../../../core/table/assemble-table';
import { formatDelimited } from '../../../core/table/format-delimited';
import { formatNumber, formatTimeS } from '../../../core/table/format-number';
import type { Column } from '../../../core/table/types';

const num = (name: string, v: number[]): Column => ({ name, kind: 'number', values: Float64Array.from(v), description: name });
const str = (name: string, v: string[]): Column => ({ name, kind: 'string', values: v, description: name });

describe('formatNumber', () => {
  it.each([
    [NaN, ''],
    [3, '3'],
    [0.1 + 0.2, '0.3'],
    [1 / 3, '0.333333'],
    [1.5e-7, '1.5e-7'],
    [Infinity, 'inf'],
    [-Infinity, '-inf'],
    [-2.5, '-2.5'],
  ])('%s -> %s', (x, s) => expect(formatNumber(x)).toBe(s));
});

describe('assembleTable', () => {
  it('puts contract columns first and groups jump columns by kind', () => {
    const t = assembleTable(
      [
        num('extra', [1]),
        num('rate_hz', [2]),
        str('jump_forward', ['none']),
        num('jump_backward_p', [0.5]),
        str('unit', ['a']),
        num('jump_forward_p', [0.1]),
        str('jump_backward', ['excited']),
        num('jump_forward_delta_hz', [1]),
        num('jump_backward_delta_hz', [2]),
      ],
      1,
    );
    expect(t.columns.map((c) => c.name)).toEqual([
      'unit',
      'rate_hz',
      'jump_backward',
      'jump_backward_delta_hz',
      'jump_backward_p',
      'jump_forward',
      'jump_forward_delta_hz',
      'jump_forward_p',
      'extra',
    ]);
  });
  it('rejects duplicate names and wrong lengths', () => {
    expect(() => assembleTable([num('a', [1]), num('a', [1])], 1)).toThrow(/duplicate/);
    expect(() => assembleTable([num('a', [1, 2])], 1)).toThrow(/rows/);
  });
});

describe('formatDelimited', () => {
  it('quotes per RFC 4180 and writes empty cells for NaN', () => {
    const t = assembleTable([str('unit', ['a,b', 'say "hi"']), num('n_spikes', [1, NaN])], 2);
    expect(formatDelimited(t)).toBe('unit,n_spikes\n"a,b",1\n"say ""hi""",\n');
    expect(formatDelimited(t, '\t')).toBe('unit\tn_spikes\na,b\t1\n"say ""hi"""\t\n');
  });
});

describe('formatTimeS', () => {
  it('writes recording times to the microsecond, trailing zeros removed', () => {
    // 30 Hz samples two hours in keep their spacing (six significant digits would give 7200.03, 7200.07)
    expect([0, 1, 2].map((k) => formatTimeS(7200 + k / 30))).toEqual(['7200', '7200.033333', '7200.066667']);
    expect(formatTimeS(999.9333333333)).toBe('999.933333');
    expect(formatTimeS(0.0000004)).toBe('0');
    expect(formatTimeS(-0.0000004)).toBe('0');
    expect(formatTimeS(-1.5)).toBe('-1.5');
    expect(formatTimeS(NaN)).toBe('');
    expect(formatTimeS(Infinity)).toBe('inf');
  });
});
