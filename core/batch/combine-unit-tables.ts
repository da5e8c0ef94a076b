import { parseCsvRecords } from '../table/parse-csv-records';

/** Verdict counts of one session's units.csv (contract columns, DESIGN.md section 3). */
export interface SessionCounts {
  readonly units: number;
  /** Counts of `tag` values (tagged, borderline, untagged). */
  readonly tag: Readonly<Record<string, number>>;
  /** Counts of `ramp` values (up, down, flat). */
  readonly ramp: Readonly<Record<string, number>>;
  /** Per jump kind K (column jump_K): counts of its values (excited, suppressed, none). */
  readonly jump: Readonly<Record<string, Readonly<Record<string, number>>>>;
}

/**
 * Combines the units.csv tables of several sessions into one table with a
 * leading `session` column. Columns are the union of all tables' columns in
 * first-seen order (so the contract columns stay first); a session without a
 * column gets empty cells. Cells are re-quoted as RFC 4180 requires. Also
 * counts each session's verdicts for the batch summary.
 * Throws when a table has a row whose cell count differs from its header, or
 * has no `unit` column (a units.csv not written by tagbench).
 */
export function combineUnitTables(tables: readonly { readonly session: string; readonly text: string }[]): {
  csv: string;
  rows: number;
  columns: string[];
  counts: Record<string, SessionCounts>;
} {
  const columns: string[] = ['session'];
  const index = new Map<string, number>([['session', 0]]);
  const parsed = tables.map((t) => {
    const recs = parseCsvRecords(t.text);
    if (recs.length === 0 || !recs[0].includes('unit')) throw new Error(`units.csv of session "${t.session}" has no unit column`);
    const header = recs[0];
    for (const h of header) {
      if (!index.has(h)) {
        index.set(h, columns.length);
        columns.push(h);
      }
    }
    recs.slice(1).forEach((r, i) => {
      if (r.length !== header.length) throw new Error(`units.csv of session "${t.session}", row ${i + 2}: ${r.length} cells for ${header.length} columns`);
    });
    return { session: t.session, header, rows: recs.slice(1) };
  });
  const quote = (s: string) => (/[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
  const lines = [columns.map(quote).join(',')];
  const counts: Record<string, SessionCounts> = {};
  let rows = 0;
  for (const p of parsed) {
    const pos = p.header.map((h) => index.get(h)!);
    const tag: Record<string, number> = {};
    const ramp: Record<string, number> = {};
    const jump: Record<string, Record<string, number>> = {};
    const col = (name: string) => p.header.indexOf(name);
    const tagCol = col('tag');
    const rampCol = col('ramp');
    // jump_K verdict columns: named jump_<kind>, holding only verdict words
    const verdicts = new Set(['excited', 'suppressed', 'none', '']);
    const jumpCols = p.header
      .map((h, i) => [h, i] as const)
      .filter(([h, i]) => h.startsWith('jump_') && p.rows.length > 0 && p.rows.every((r) => verdicts.has(r[i])))
      .map(([h, i]) => [h.slice(5), i] as const);
    for (const r of p.rows) {
      const cells = new Array<string>(columns.length).fill('');
      cells[0] = p.session;
      r.forEach((v, i) => (cells[pos[i]] = v));
      lines.push(cells.map(quote).join(','));
      rows++;
      if (tagCol >= 0) tag[r[tagCol]] = (tag[r[tagCol]] ?? 0) + 1;
      if (rampCol >= 0) ramp[r[rampCol]] = (ramp[r[rampCol]] ?? 0) + 1;
      for (const [k, i] of jumpCols) {
        const m = (jump[k] ??= {});
        m[r[i]] = (m[r[i]] ?? 0) + 1;
      }
    }
    counts[p.session] = { units: p.rows.length, tag, ramp, jump };
  }
  return { csv: lines.join('\n') + '\n', rows, columns, counts };
}
