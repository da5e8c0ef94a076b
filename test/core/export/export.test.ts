import { describe, expect, it } from 'vitest';
import { formatTable } from '../../../core/export/format-table';
import { parseDelimited } from '../../../core/export/parse-delimited';
import { readDelimitedTable } from '../../../core/export/read-delimited-table';
import { readTableJson } from '../../../core/export/read-table-json';
import { InputError } from '../../../core/errors';
import { assembleTable } from '../../../core/table/assemble-table';
import type { UnitTable } from '../../../core/table/types';

/** A table with the awkward cases: quotes, delimiters, line breaks, unicode, NaN, +-inf, tiny and huge numbers. */
const table: UnitTable = assembleTable(
  [
    { name: 'unit', kind: 'string', values: ['1', 'a,b', 'tab\there', 'q"uote'], description: 'Unit id' },
    { name: 'n_spikes', kind: 'number', values: Float64Array.of(10, 0, 123456, 7), description: 'Number of spikes' },
    { name: 'rate_hz', kind: 'number', values: Float64Array.of(1 / 3, NaN, Infinity, -Infinity), digits: 5, description: 'Hz' },
    { name: 'contamination', kind: 'number', values: Float64Array.of(1.23456789e-9, 0.1 + 0.2, -2.5e21, 0), digits: 4, description: 'fraction' },
    { name: 'quality', kind: 'string', values: ['pass', 'review', 'review', 'pass'], description: 'screen' },
    { name: 'note', kind: 'string', values: ['line one\nline two', '', 'µV, Größe', 'ok'], description: 'note' },
  ],
  4,
);

/** Values equal, NaN equal to NaN. */
const sameValues = (a: UnitTable, b: UnitTable) => {
  expect(b.columns.map((c) => [c.name, c.kind])).toEqual(a.columns.map((c) => [c.name, c.kind]));
  expect(b.rowCount).toBe(a.rowCount);
  a.columns.forEach((c, j) => expect(Array.from(b.columns[j].values as ArrayLike<unknown>)).toEqual(Array.from(c.values as ArrayLike<unknown>)));
};

describe('export round trip', () => {
  it('JSON: the table read back equals the in-memory table exactly', () => {
    const back = readTableJson(formatTable(table, 'json'), 'units.json');
    sameValues(table, back);
    expect(back.columns.map((c) => c.description)).toEqual(table.columns.map((c) => c.description));
    // standard JSON (RFC 8259): any JSON parser reads it, and rows are records keyed in column order
    const j = JSON.parse(formatTable(table, 'json'));
    expect(Object.keys(j.rows[0])).toEqual(table.columns.map((c) => c.name));
    expect(j.rows[1].rate_hz).toBeNull();
    expect(j.rows[2].rate_hz).toBe('inf');
  });
  it.each([
    ['csv', ','],
    ['tsv', '\t'],
  ] as const)('%s: read back equals the table to the written precision, and writes the same bytes again', (fmt, delim) => {
    const text = formatTable(table, fmt);
    const kinds = Object.fromEntries(table.columns.map((c) => [c.name, c.kind]));
    const back = readDelimitedTable(text, delim, `units.${fmt}`, kinds);
    expect(formatTable({ columns: back.columns.map((c, j) => ({ ...table.columns[j], values: c.values }) as never), rowCount: back.rowCount }, fmt)).toBe(text);
    table.columns.forEach((c, j) => {
      const b = back.columns[j];
      if (c.kind === 'string') return expect(b.values).toEqual(c.values);
      // tolerance: half a unit in the last written significant digit, 0.5 * 10^(1 - digits), relative
      const tol = 0.5 * 10 ** (1 - (c.digits ?? 6));
      c.values.forEach((x, r) => {
        const y = b.values[r] as number;
        if (!Number.isFinite(x)) return expect(y).toBe(x);
        expect(Math.abs(y - x), `${c.name}[${r}]: value ${y}, expected ${x}, tol ${tol} relative`).toBeLessThanOrEqual(tol * Math.abs(x));
      });
    });
    // kinds inferred without the hint: the unit column stays text even when ids look numeric
    const inferred = readDelimitedTable(text, delim, `units.${fmt}`);
    expect(inferred.columns.map((c) => c.kind)).toEqual(['string', 'number', 'number', 'number', 'string', 'string']);
  });
});

describe('parseDelimited (RFC 4180)', () => {
  it('handles quotes, doubled quotes, embedded line breaks, CRLF and a BOM', () => {
    expect(parseDelimited('\ufeffa,b\r\n"x,1","say ""hi"""\r\n"two\nlines",\n\n', ',', 'f.csv')).toEqual([
      ['a', 'b'],
      ['x,1', 'say "hi"'],
      ['two\nlines', ''],
    ]);
  });
  it('names the file and line of an unclosed quote', () => {
    expect(() => parseDelimited('a\n"open,1\n2', ',', 'f.csv')).toThrow('f.csv, row 2: a quoted field is never closed. Close the quote or remove it.');
  });
});

describe('readers report bad files clearly', () => {
  it.each([
    [() => readDelimitedTable('unit,n\n1,2\n3\n', ',', 'u.csv'), /u\.csv, row 3: expected 2 fields, found 1/],
    [() => readDelimitedTable('unit,n\n1,x\n', ',', 'u.csv', { n: 'number' }), /u\.csv, row 2, column "n": expected a number \(value "x"\)/],
    [() => readTableJson('{"format":"other"}', 'u.json'), /u\.json: not a tagbench unit table/],
    [() => readTableJson('{"format":"tagbench-unit-table","version":1,"columns":[{"name":"n","kind":"number"}],"rows":[{"n":"3"}]}', 'u.json'), /field rows\[0\]\.n: expected a number/],
  ])('%#', (f, re) => {
    expect(f).toThrow(InputError);
    expect(f).toThrow(re);
  });
});
