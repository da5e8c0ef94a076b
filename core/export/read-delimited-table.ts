import { InputError } from '../errors';
import type { Column, UnitTable } from '../table/types';
import { parseDelimited } from './parse-delimited';

/**
 * Reads a CSV/TSV unit table written by formatDelimited back into a
 * UnitTable (the export's round trip, and for scripts that post-process an
 * export). Column kinds come from `kinds` when given (e.g. from the JSON
 * export's column list); otherwise a column is numeric when it has a
 * non-empty cell and every non-empty cell is a number or inf/-inf/nan;
 * `unit` always stays text. Empty numeric cells read as NaN.
 * Errors (ragged rows, a number column holding text) name file, line and
 * column. Descriptions are not stored in CSV: they come back empty.
 */
export function readDelimitedTable(
  text: string,
  delimiter: string,
  file: string,
  kinds?: Readonly<Record<string, 'number' | 'string'>>,
): UnitTable {
  const rows = parseDelimited(text, delimiter, file);
  if (rows.length === 0) throw new InputError({ file, problem: 'the file is empty', fix: 'export the table again' });
  const header = rows[0];
  const body = rows.slice(1);
  const seen = new Set<string>();
  for (const h of header) {
    if (seen.has(h)) throw new InputError({ file, row: 1, column: h, problem: 'column name repeats' });
    seen.add(h);
  }
  body.forEach((r, i) => {
    if (r.length !== header.length) throw new InputError({ file, row: i + 2, problem: `expected ${header.length} fields, found ${r.length}` });
  });
  const columns: Column[] = header.map((name, j) => {
    const cells = body.map((r) => r[j]);
    const kind = kinds?.[name] ?? (name !== 'unit' && cells.every((c) => c === '' || parseCell(c) !== undefined) && cells.some((c) => c !== '') ? 'number' : 'string');
    if (kind === 'string') return { name, kind, values: cells, description: '' };
    const values = new Float64Array(cells.length);
    cells.forEach((c, i) => {
      const v = c === '' ? NaN : parseCell(c);
      if (v === undefined) throw new InputError({ file, row: i + 2, column: name, value: c, problem: 'expected a number' });
      values[i] = v;
    });
    return { name, kind, values, description: '' };
  });
  return { columns, rowCount: body.length };
}

function parseCell(c: string): number | undefined {
  const t = c.trim().toLowerCase();
  if (t === 'inf' || t === '+inf' || t === 'infinity') return Infinity;
  if (t === '-inf' || t === '-infinity') return -Infinity;
  if (t === 'nan') return NaN;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/.test(t)) return undefined;
  return Number(t);
}
