import type { Column, StringColumn, UnitTable } from '../table/types';
import { verdictWords } from './verdict-words';

/**
 * The verdict columns of a table, in table order: string columns tag, ramp,
 * quality, and jump_K where the table also has the contract's
 * jump_K_delta_hz (so jump_K_reason, jump_K_shape and the like never count).
 */
export function verdictColumns(table: UnitTable): StringColumn[] {
  const names = new Set(table.columns.map((c) => c.name));
  return table.columns.filter(
    (c: Column): c is StringColumn =>
      c.kind === 'string' && verdictWords(c.name) !== null && (!c.name.startsWith('jump_') || names.has(`${c.name}_delta_hz`)),
  );
}
