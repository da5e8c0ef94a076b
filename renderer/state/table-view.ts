import type { TableColumnData, TableData } from '../worker/api';

export type SortDirection = 'ascending' | 'descending';

/**
 * Row order of the unit table sorted by one column. Numbers sort numerically
 * and text naturally ("2" before "10"); empty cells (NaN, "") go last in
 * either direction; ties keep unit order (stable).
 */
export function sortRows(table: TableData, column: string | null, direction: SortDirection): Int32Array {
  const order = Int32Array.from({ length: table.rowCount }, (_, i) => i);
  const col = column === null ? undefined : table.columns.find((c) => c.name === column);
  if (!col) return order;
  const sign = direction === 'ascending' ? 1 : -1;
  const collator = new Intl.Collator('en', { numeric: true });
  const rows = Array.from(order);
  if (col.kind === 'number') {
    const v = col.values;
    rows.sort((a, b) => {
      const x = v[a];
      const y = v[b];
      if (Number.isNaN(x) || Number.isNaN(y)) return Number.isNaN(x) === Number.isNaN(y) ? a - b : Number.isNaN(x) ? 1 : -1;
      return x === y ? a - b : (x < y ? -1 : 1) * sign;
    });
  } else {
    const v = col.values;
    rows.sort((a, b) => {
      if (v[a] === '' || v[b] === '') return (v[a] === '') === (v[b] === '') ? a - b : v[a] === '' ? 1 : -1;
      const c = collator.compare(v[a], v[b]);
      return c === 0 ? a - b : c * sign;
    });
  }
  return Int32Array.from(rows);
}

/** One condition of a filter: `column op value`, or free text matched against the unit id. */
export type FilterTerm =
  | { readonly kind: 'compare'; readonly column: string; readonly op: '<' | '<=' | '>' | '>=' | '=' | '!='; readonly value: string }
  | { readonly kind: 'text'; readonly text: string };

const TERM = /^([A-Za-z_][\w]*)\s*(<=|>=|!=|<|>|=)\s*(.+)$/;

/**
 * Parses a filter such as `tag=tagged rate_hz>2` (terms separated by spaces
 * or "and"; all must hold). Unknown columns give an error message naming
 * them; words that are not comparisons match unit ids (substring).
 */
export function parseFilter(query: string, columns: readonly TableColumnData[]): { terms: FilterTerm[]; error: string | null } {
  const terms: FilterTerm[] = [];
  const names = new Set(columns.map((c) => c.name));
  const normalised = query.replace(/\s*(<=|>=|!=|<|>|=)\s*/g, '$1');
  for (const word of normalised.split(/\s+/).filter((w) => w && w.toLowerCase() !== 'and')) {
    const m = TERM.exec(word);
    if (!m) {
      terms.push({ kind: 'text', text: word.toLowerCase() });
      continue;
    }
    if (!names.has(m[1])) return { terms: [], error: `No column "${m[1]}" in the table.` };
    terms.push({ kind: 'compare', column: m[1], op: m[2] as '<', value: m[3] });
  }
  return { terms, error: null };
}

/** Keeps the rows (in the given order) for which every term holds. */
export function filterRows(table: TableData, order: Int32Array, terms: readonly FilterTerm[], unitIds: readonly string[]): Int32Array {
  if (terms.length === 0) return order;
  const tests = terms.map((t): ((r: number) => boolean) => {
    if (t.kind === 'text') return (r) => unitIds[r].toLowerCase().includes(t.text);
    const col = table.columns.find((c) => c.name === t.column)!;
    if (col.kind === 'number') {
      const x = Number(t.value);
      const v = col.values;
      switch (t.op) {
        case '<': return (r) => v[r] < x;
        case '<=': return (r) => v[r] <= x;
        case '>': return (r) => v[r] > x;
        case '>=': return (r) => v[r] >= x;
        case '=': return (r) => v[r] === x;
        case '!=': return (r) => v[r] !== x;
      }
    }
    const v = col.values as readonly string[];
    const s = t.value.toLowerCase();
    switch (t.op) {
      case '=': return (r) => v[r].toLowerCase() === s;
      case '!=': return (r) => v[r].toLowerCase() !== s;
      default: {
        const c = new Intl.Collator('en', { numeric: true });
        const cmp = (r: number) => c.compare(v[r], t.value);
        return t.op === '<' ? (r) => cmp(r) < 0 : t.op === '<=' ? (r) => cmp(r) <= 0 : t.op === '>' ? (r) => cmp(r) > 0 : (r) => cmp(r) >= 0;
      }
    }
  });
  const out: number[] = [];
  for (const r of order) if (tests.every((f) => f(r))) out.push(r);
  return Int32Array.from(out);
}

/** Rows of a virtualised list to render: [first, last) with `overscan` extra rows each side. */
export function visibleRange(scrollTop: number, viewportPx: number, rowPx: number, rowCount: number, overscan = 8): [number, number] {
  const first = Math.max(0, Math.floor(scrollTop / rowPx) - overscan);
  const last = Math.min(rowCount, Math.ceil((scrollTop + viewportPx) / rowPx) + overscan);
  return [first, Math.max(first, last)];
}
