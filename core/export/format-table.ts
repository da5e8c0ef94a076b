import { formatDelimited } from '../table/format-delimited';
import type { UnitTable } from '../table/types';
import { formatTableJson } from './format-table-json';

/** Export formats of the unit table. */
export const TABLE_FORMATS = ['csv', 'tsv', 'json'] as const;
export type TableFormat = (typeof TABLE_FORMATS)[number];

/**
 * Writes a unit table in one export format: CSV (comma, RFC 4180 quoting),
 * TSV (tab, same quoting) or JSON (formatTableJson). Column order is the
 * table's own (contract columns first, see core/table/assemble-table.ts).
 */
export function formatTable(table: UnitTable, format: TableFormat): string {
  if (format === 'json') return formatTableJson(table);
  return formatDelimited(table, format === 'tsv' ? '\t' : ',');
}
