import type { UnitTable } from '../table/types';

/** Format tag and version of the JSON unit table. */
export const TABLE_JSON_FORMAT = 'tagbench-unit-table';
export const TABLE_JSON_VERSION = 1;

/**
 * Writes a unit table as JSON:
 *     {"format": "tagbench-unit-table", "version": 1,
 *      "columns": [{"name", "kind": "number"|"string", "description", "digits"?}],
 *      "rows": [{"unit": "12", "n_spikes": 5321, ...}, ...]}
 * Rows are objects keyed by column name with keys in the table's column
 * order (pandas: `pd.DataFrame(json.load(f)["rows"])`). Numbers keep full
 * double precision (JSON's shortest round-trip form); NaN is written as null,
 * +-Infinity as the strings "inf" / "-inf" (JSON has no such numbers).
 */
export function formatTableJson(table: UnitTable): string {
  const columns = table.columns.map((c) => ({
    name: c.name,
    kind: c.kind,
    description: c.description,
    ...(c.kind === 'number' && c.digits !== undefined ? { digits: c.digits } : {}),
  }));
  const rows: string[] = [];
  for (let r = 0; r < table.rowCount; r++) {
    const cells = table.columns.map((c) => {
      const v = c.values[r];
      let s: string;
      if (c.kind === 'string') s = JSON.stringify(v);
      else if (Number.isNaN(v)) s = 'null';
      else if (v === Infinity) s = '"inf"';
      else if (v === -Infinity) s = '"-inf"';
      else s = JSON.stringify(v);
      return `${JSON.stringify(c.name)}: ${s}`;
    });
    rows.push(`    {${cells.join(', ')}}`);
  }
  const head = JSON.stringify({ format: TABLE_JSON_FORMAT, version: TABLE_JSON_VERSION, columns }, null, 2);
  return `${head.slice(0, -2)},\n  "rows": [\n${rows.join(',\n')}\n  ]\n}\n`;
}
