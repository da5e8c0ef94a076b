import type { UnitTable } from './types';
import { formatNumber } from './format-number';

/**
 * Writes a unit table as delimited text (RFC 4180 quoting: fields holding the
 * delimiter, a quote, CR or LF are quoted and quotes doubled). Lines end in
 * "\n"; a header row holds the column names.
 */
export function formatDelimited(table: UnitTable, delimiter = ','): string {
  const quote = (s: string) =>
    s.includes(delimiter) || s.includes('"') || s.includes('\n') || s.includes('\r')
      ? `"${s.replace(/"/g, '""')}"`
      : s;
  const lines: string[] = [table.columns.map((c) => quote(c.name)).join(delimiter)];
  for (let r = 0; r < table.rowCount; r++) {
    const cells: string[] = [];
    for (const c of table.columns) {
      cells.push(c.kind === 'number' ? formatNumber(c.values[r], c.digits ?? 6) : quote(c.values[r]));
    }
    lines.push(cells.join(delimiter));
  }
  return `${lines.join('\n')}\n`;
}
