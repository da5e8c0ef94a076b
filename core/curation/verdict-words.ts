import { QUALITY_VERDICTS } from '../quality/quality-verdict';
import { JUMP_VERDICTS, RAMP_VERDICTS, TAG_VERDICTS } from '../table/contract-columns';

/**
 * The words a person may give a verdict column, or null when the column is
 * not a verdict column: tag, ramp, quality, and jump_K for any jump kind K
 * (a name starting "jump_" that is not a jump_K_delta_hz / jump_K_p column).
 * Labels use the same words as the computed verdicts, so a final column
 * never holds a word the computed one could not.
 */
export function verdictWords(column: string): readonly string[] | null {
  if (column === 'tag') return TAG_VERDICTS;
  if (column === 'ramp') return RAMP_VERDICTS;
  if (column === 'quality') return QUALITY_VERDICTS;
  if (/^jump_.+$/.test(column) && !/_(delta_hz|p)$/.test(column)) return JUMP_VERDICTS;
  return null;
}
