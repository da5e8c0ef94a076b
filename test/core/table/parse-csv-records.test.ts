/**
 * parseCsvRecords against the rules and examples of RFC 4180 (Shafranovich
 * 2005, section 2: CRLF line breaks, optional final line break, quoted fields
 * holding commas, line breaks and doubled quotes), and a round trip through
 * formatDelimited (the writer of units.csv).
 */
import { describe, expect, it } from 'vitest';
import { formatDelimited } from '../../../core/table/format-delimited';
import { parseCsvRecords } from '../../../core/table/parse-csv-records';

describe('parseCsvRecords (RFC 4180)', () => {
  it.each([
    ['aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n', [['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]], // rule 1
    ['aaa,bbb,ccc\r\nzzz,yyy,xxx', [['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]], // rule 2
    ['"aaa","bbb","ccc"\r\nzzz,yyy,xxx', [['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]], // rule 5
    ['"aaa","b\r\nbb","ccc"\r\nzzz,yyy,xxx', [['aaa', 'b\r\nbb', 'ccc'], ['zzz', 'yyy', 'xxx']]], // rule 6
    ['"aaa","b""bb","ccc"', [['aaa', 'b"bb', 'ccc']]], // rule 7
    ['\uFEFFa,b\n1,\n', [['a', 'b'], ['1', '']]],
    ['', []],
    ['x', [['x']]],
    [',\n', [['', '']]],
  ])('%j', (text, want) => {
    expect(parseCsvRecords(text)).toEqual(want);
  });
  it('throws on a quote never closed', () => {
    expect(() => parseCsvRecords('a,"b\n')).toThrow(/never closed/);
  });
  it('reads back what formatDelimited writes', () => {
    const text = formatDelimited({
      rowCount: 2,
      columns: [
        { name: 'unit', kind: 'string', values: ['1', 'u,2'], description: '' },
        { name: 'x', kind: 'number', values: Float64Array.of(1.5, NaN), description: '' },
        { name: 'why', kind: 'string', values: ['said "no"', 'two\nlines'], description: '' },
      ],
    });
    expect(parseCsvRecords(text)).toEqual([
      ['unit', 'x', 'why'],
      ['1', '1.5', 'said "no"'],
      ['u,2', '', 'two\nlines'],
    ]);
  });
});
