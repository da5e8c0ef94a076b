import { verdictWords } from '../../core/curation/verdict-words';

/**
 * True for a verdict column a person can label: its name is one of the
 * verdict families (core/curation/verdict-words.ts) and every value is one of
 * that family's words or empty, at least one not empty. The value check keeps text columns that only
 * share the name pattern (e.g. jump_K_reason) out of the curation controls.
 */
export function isVerdictColumn(column: { name: string; kind: string; values: ArrayLike<unknown> }): boolean {
  if (column.kind !== 'string') return false;
  const words = verdictWords(column.name);
  if (!words) return false;
  let any = false;
  for (let i = 0; i < column.values.length; i++) {
    const v = column.values[i] as string;
    if (v === '') continue;
    if (!words.includes(v)) return false;
    any = true;
  }
  return any;
}
