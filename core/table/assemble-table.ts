import type { Column, UnitTable } from './types';
import { CONTRACT_COLUMNS } from './contract-columns';

const JUMP_COLUMN = /^jump_(.+?)(_delta_hz|_p)?$/;

/**
 * Orders columns into the units.csv layout: contract columns first (DESIGN.md
 * section 3 order), then the per-kind jump triples (jump_K, jump_K_delta_hz,
 * jump_K_p; kinds sorted), then all others in the order given.
 * Throws on duplicate names or columns of the wrong length (both are bugs).
 */
export function assembleTable(columns: readonly Column[], rowCount: number): UnitTable {
  const byName = new Map<string, Column>();
  for (const c of columns) {
    if (byName.has(c.name)) throw new Error(`duplicate column ${c.name}`);
    if (c.values.length !== rowCount) throw new Error(`column ${c.name} has ${c.values.length} rows, expected ${rowCount}`);
    byName.set(c.name, c);
  }
  const ordered: Column[] = [];
  const used = new Set<string>();
  const take = (name: string) => {
    const c = byName.get(name);
    if (c && !used.has(name)) {
      ordered.push(c);
      used.add(name);
    }
  };
  for (const name of CONTRACT_COLUMNS) take(name);
  const kinds = new Set<string>();
  for (const c of columns) {
    const m = JUMP_COLUMN.exec(c.name);
    // A kind needs its verdict (string) and its p column, so extra string columns such
    // as jump_K_reason are not mistaken for kinds.
    if (m && byName.get(`jump_${m[1]}`)?.kind === 'string' && byName.has(`jump_${m[1]}_p`)) kinds.add(m[1]);
  }
  for (const k of [...kinds].sort()) {
    take(`jump_${k}`);
    take(`jump_${k}_delta_hz`);
    take(`jump_${k}_p`);
  }
  for (const c of columns) take(c.name);
  return { columns: ordered, rowCount };
}
