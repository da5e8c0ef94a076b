import { InputError } from '../errors';
import type { Column, UnitTable } from '../table/types';
import { TABLE_JSON_FORMAT, TABLE_JSON_VERSION } from './format-table-json';

/**
 * Reads a JSON unit table written by formatTableJson back into a UnitTable,
 * exactly (null -> NaN, "inf"/"-inf" -> +-Infinity). Problems name the file
 * and the field (row index is 0-based within "rows").
 */
export function readTableJson(text: string, file: string): UnitTable {
  let j: unknown;
  try {
    j = JSON.parse(text);
  } catch (e) {
    throw new InputError({ file, problem: `not valid JSON (${(e as Error).message})` });
  }
  const fail = (problem: string): never => {
    throw new InputError({ file, problem });
  };
  const o = j as { format?: unknown; version?: unknown; columns?: unknown; rows?: unknown };
  if (typeof j !== 'object' || j === null || o.format !== TABLE_JSON_FORMAT) fail(`not a tagbench unit table (field format must be "${TABLE_JSON_FORMAT}")`);
  if (o.version !== TABLE_JSON_VERSION) fail(`field version: expected ${TABLE_JSON_VERSION}, found ${JSON.stringify(o.version)}`);
  if (!Array.isArray(o.columns)) fail('field columns: expected a list');
  if (!Array.isArray(o.rows)) fail('field rows: expected a list');
  const rows = o.rows as Record<string, unknown>[];
  const columns: Column[] = (o.columns as { name?: unknown; kind?: unknown; description?: unknown; digits?: unknown }[]).map((c, k) => {
    if (typeof c?.name !== 'string') fail(`field columns[${k}].name: expected a string`);
    const name = c.name as string;
    const description = typeof c.description === 'string' ? c.description : '';
    if (c.kind === 'string') {
      return {
        name,
        kind: 'string',
        description,
        values: rows.map((r, i) => {
          const v = r?.[name];
          if (typeof v !== 'string') fail(`field rows[${i}].${name}: expected a string`);
          return v as string;
        }),
      };
    }
    if (c.kind !== 'number') fail(`field columns[${k}].kind: expected "number" or "string"`);
    const values = new Float64Array(rows.length);
    rows.forEach((r, i) => {
      const v = r?.[name];
      if (v === null) values[i] = NaN;
      else if (v === 'inf') values[i] = Infinity;
      else if (v === '-inf') values[i] = -Infinity;
      else if (typeof v === 'number') values[i] = v;
      else fail(`field rows[${i}].${name}: expected a number, null, "inf" or "-inf"`);
    });
    return { name, kind: 'number', description, values, ...(typeof c.digits === 'number' ? { digits: c.digits } : {}) };
  });
  return { columns, rowCount: rows.length };
}
