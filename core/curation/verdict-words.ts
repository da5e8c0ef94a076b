import { QUALITY_VERDICTS } from '../quality/quality-verdict';
import { JUMP_VERDICTS, RAMP_VERDICTS, TAG_VERDICTS } from '../table/contract-columns';

/**
 * The words a person may give a verdict column, or null when the name cannot
 * be a verdict column: tag, ramp, quality, and jump_K for a jump kind K. By
 * name alone (used before any table exists, e.g. when checking a session
 * file), a jump_ name ending in a derived-column suffix (_reason, _shape,
 * _p, _q, _hz, _ms, _z, _events, _transience) is not a verdict column.
 * With a table, use verdictColumns, which also asks for the contract's
 * jump_K_delta_hz companion column.
 * Labels use the same words as the computed verdicts, so a final column
 * never holds a word the computed one could not.
 */
export function verdictWords(column: string): readonly string[] | null {
  if (column === 'tag') return TAG_VERDICTS;
  if (column === 'ramp') return RAMP_VERDICTS;
  if (column === 'quality') return QUALITY_VERDICTS;
  if (/^jump_.+$/.test(column) && !DERIVED.test(column)) return JUMP_VERDICTS;
  return null;
}

const DERIVED = /_(reason|shape|p|q|hz|ms|z|events|transience)$/;
