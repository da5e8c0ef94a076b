import { curationReducer } from './curation-reducer';
import type { CurationAction, CurationState } from './types';

/**
 * Undo/redo over curation states (pure: every function returns a new
 * history). `present` is what the table shows and what gets saved; `past`
 * and `future` hold whole states (curation states are small and share
 * structure, so this costs little and cannot drift out of step the way
 * inverse actions can).
 *
 * The four functions live together because they share this one type.
 */
export interface CurationHistory {
  readonly past: readonly CurationState[];
  readonly present: CurationState;
  readonly future: readonly CurationState[];
}

/** How many undo steps are kept (older ones are dropped; the present is never lost). */
export const HISTORY_LIMIT = 1000;

export function newHistory(present: CurationState): CurationHistory {
  return { past: [], present, future: [] };
}

/** Applies an action as one undoable step; a no-op action leaves the history unchanged. */
export function historyDispatch(h: CurationHistory, action: CurationAction, limit = HISTORY_LIMIT): CurationHistory {
  const next = curationReducer(h.present, action);
  if (next === h.present) return h;
  const past = [...h.past, h.present];
  return { past: past.length > limit ? past.slice(past.length - limit) : past, present: next, future: [] };
}

export function historyUndo(h: CurationHistory): CurationHistory {
  if (h.past.length === 0) return h;
  return { past: h.past.slice(0, -1), present: h.past[h.past.length - 1], future: [h.present, ...h.future] };
}

export function historyRedo(h: CurationHistory): CurationHistory {
  if (h.future.length === 0) return h;
  return { past: [...h.past, h.present], present: h.future[0], future: h.future.slice(1) };
}
