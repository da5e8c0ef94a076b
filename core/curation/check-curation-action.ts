import { verdictWords } from './verdict-words';
import type { CurationAction } from './types';

/**
 * Checks an action before it is dispatched: known unit, a verdict column, a
 * label word allowed for that column, a non-empty `by` and an ISO 8601 `at`.
 * Returns null when fine, else one sentence naming the problem and the fix
 * (the CLI and the app show it as is). `units` = the session's unit ids.
 */
export function checkCurationAction(action: CurationAction, units: ReadonlySet<string>): string | null {
  if (action.type === 'batch') {
    for (const a of action.actions) {
      const p = checkCurationAction(a, units);
      if (p) return p;
    }
    return null;
  }
  if (!units.has(action.unit)) {
    const some = [...units].slice(0, 8).join(', ');
    return `unit "${action.unit}" is not in this session (units: ${some}${units.size > 8 ? ', ...' : ''})`;
  }
  if (!action.by.trim()) return 'who made the decision is missing: give a user name';
  if (!ISO_UTC.test(action.at) || Number.isNaN(Date.parse(action.at))) return `time "${action.at}" is not an ISO 8601 UTC time such as 2026-03-01T14:05:00.000Z`;
  if (action.type === 'label') {
    const words = verdictWords(action.column);
    if (!words) return `"${action.column}" is not a verdict column: label one of tag, ramp, quality, jump_<kind>`;
    if (action.value !== null && !words.includes(action.value)) {
      return `"${action.value}" is not a ${action.column} verdict: use one of ${words.join(', ')}`;
    }
  }
  return null;
}

const ISO_UTC = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/;
