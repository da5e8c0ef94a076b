import { assembleTable } from '../table/assemble-table';
import type { Column, UnitTable } from '../table/types';
import type { CurationState } from './types';
import { verdictColumns } from './verdict-columns';

/** Curation columns appended after every computed column, in this order. */
export const CURATION_COLUMNS = ['included', 'note', 'curated', 'curated_by', 'curated_at'] as const;

/**
 * Shows computed and final values side by side. Returns the table with, for
 * every verdict column V present (tag, ramp, quality, jump_K, in table
 * order), a column `final_V` = the person's label where set, else the
 * computed value; then `included` ("yes"/"no": excluded units stay in the
 * table, marked), `note`, `curated` (which decisions a person made, e.g.
 * "tag;include"), `curated_by` and `curated_at` (the latest decision).
 * Computed columns are passed through untouched. A label for a verdict
 * column the table lacks still gets its final_V column (empty where unlabelled).
 *
 * The `final_` prefix keeps these columns out of the jump_K column pattern of
 * the headless contract. Curation of units absent from the table is not
 * applied; their ids are returned in `orphans` for the caller to report.
 */
export function applyCuration(table: UnitTable, curation: CurationState): { table: UnitTable; orphans: string[] } {
  const unitCol = table.columns.find((c) => c.name === 'unit');
  if (!unitCol || unitCol.kind !== 'string') throw new Error('unit table has no string "unit" column');
  const ids = unitCol.values;
  const present = new Set(ids);
  const orphans = Object.keys(curation.units).filter((u) => !present.has(u)).sort();
  const n = table.rowCount;
  const added: Column[] = [];
  for (const c of verdictColumns(table)) {
    const vals = ids.map((id, r) => curation.units[id]?.labels[c.name]?.value ?? c.values[r]);
    added.push({ name: `final_${c.name}`, kind: 'string', values: vals, description: `Final ${c.name}: the person's label where set, else the computed ${c.name}` });
  }
  // Labels of verdict columns this table lacks (e.g. tag without pulses) still show, never vanish.
  const have = new Set(table.columns.map((c) => c.name));
  const extra = new Set<string>();
  for (const id of ids) for (const col of Object.keys(curation.units[id]?.labels ?? {})) if (!have.has(col)) extra.add(col);
  for (const col of [...extra].sort()) {
    added.push({ name: `final_${col}`, kind: 'string', values: ids.map((id) => curation.units[id]?.labels[col]?.value ?? ''), description: `Final ${col}: the person's label (no computed ${col} in this run)` });
  }
  const included: string[] = [];
  const notes: string[] = [];
  const curated: string[] = [];
  const by: string[] = [];
  const at: string[] = [];
  for (let r = 0; r < n; r++) {
    const u = curation.units[ids[r]];
    included.push(u?.include?.value === false ? 'no' : 'yes');
    notes.push(u?.note?.text ?? '');
    const fields: string[] = [];
    const stamps = [];
    if (u) {
      for (const [col, d] of Object.entries(u.labels)) {
        fields.push(col);
        stamps.push(d);
      }
      if (u.include) {
        fields.push('include');
        stamps.push(u.include);
      }
      if (u.note) {
        fields.push('note');
        stamps.push(u.note);
      }
    }
    const latest = stamps.reduce<(typeof stamps)[number] | null>((a, s) => (a === null || s.at > a.at ? s : a), null);
    curated.push(fields.join(';'));
    by.push(latest?.by ?? '');
    at.push(latest?.at ?? '');
  }
  added.push(
    { name: 'included', kind: 'string', values: included, description: 'yes, or no when a person excluded the unit' },
    { name: 'note', kind: 'string', values: notes, description: "A person's note on the unit" },
    { name: 'curated', kind: 'string', values: curated, description: 'Which decisions a person made (labelled verdict columns, include, note), ";"-separated' },
    { name: 'curated_by', kind: 'string', values: by, description: 'Who made the latest decision' },
    { name: 'curated_at', kind: 'string', values: at, description: 'When the latest decision was made (ISO 8601 UTC)' },
  );
  return { table: assembleTable([...table.columns, ...added], n), orphans };
}
