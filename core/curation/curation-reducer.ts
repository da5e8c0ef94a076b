import type { CurationAction, CurationState, UnitCuration } from './types';

/**
 * Applies one curation action to a curation state and returns the new state
 * (a pure reducer: the input is never modified; an action that changes
 * nothing returns the same object, so callers can skip a save and an undo
 * step). Clearing the last decision of a unit removes the unit's entry.
 *
 * The reducer does not check unit ids or label words: checkCurationAction
 * does that against the session's units and verdict columns, before dispatch.
 */
export function curationReducer(state: CurationState, action: CurationAction): CurationState {
  if (action.type === 'batch') return action.actions.reduce(curationReducer, state);
  const prev: UnitCuration = state.units[action.unit] ?? { labels: {} };
  let next: UnitCuration;
  const stamp = { by: action.by, at: action.at };
  switch (action.type) {
    case 'label': {
      const cur = prev.labels[action.column];
      if (action.value === null) {
        if (!cur) return state;
        const { [action.column]: _dropped, ...rest } = prev.labels;
        next = { ...prev, labels: rest };
      } else {
        if (cur && cur.value === action.value) return state;
        next = { ...prev, labels: { ...prev.labels, [action.column]: { value: action.value, ...stamp } } };
      }
      break;
    }
    case 'note': {
      if (action.text === '') {
        if (!prev.note) return state;
        const { note: _dropped, ...rest } = prev;
        next = rest;
      } else {
        if (prev.note && prev.note.text === action.text) return state;
        next = { ...prev, note: { text: action.text, ...stamp } };
      }
      break;
    }
    case 'include': {
      if (action.value === null) {
        if (!prev.include) return state;
        const { include: _dropped, ...rest } = prev;
        next = rest;
      } else {
        if (prev.include && prev.include.value === action.value) return state;
        next = { ...prev, include: { value: action.value, ...stamp } };
      }
      break;
    }
  }
  const units = { ...state.units };
  if (Object.keys(next.labels).length === 0 && !next.note && !next.include) delete units[action.unit];
  else units[action.unit] = next;
  return { units };
}
