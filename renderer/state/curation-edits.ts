import type { CurationAction, CurationState, UnitCuration } from '../../core/curation/types';
import type { CurationHistory } from '../../core/curation/history';

/** A curation action before it is stamped with who and when. */
export type UnstampedAction =
  | { readonly type: 'label'; readonly unit: string; readonly column: string; readonly value: string | null }
  | { readonly type: 'note'; readonly unit: string; readonly text: string }
  | { readonly type: 'include'; readonly unit: string; readonly value: boolean | null };

/** Stamps an action with the curator's name and the time (ISO 8601 UTC). */
export function stamp(a: UnstampedAction, by: string, now: Date): CurationAction {
  return { ...a, by, at: now.toISOString() } as CurationAction;
}

/** One line for the status bar: what an action does. */
export function describeAction(a: UnstampedAction): string {
  switch (a.type) {
    case 'label':
      return a.value === null ? `unit ${a.unit}: ${a.column} label cleared` : `unit ${a.unit}: ${a.column} labelled ${a.value}`;
    case 'note':
      return a.text ? `unit ${a.unit}: note saved` : `unit ${a.unit}: note cleared`;
    case 'include':
      return `unit ${a.unit}: ${a.value === false ? 'excluded' : 'included'}`;
  }
}

const NOTHING: UnitCuration = { labels: {} };

/** The curation of one unit (empty when nothing was decided). */
export function unitCurationOf(state: CurationState, unit: string): UnitCuration {
  return state.units[unit] ?? NOTHING;
}

/** True unless the person excluded the unit. */
export function isIncluded(state: CurationState, unit: string): boolean {
  return state.units[unit]?.include?.value !== false;
}

/**
 * The unit whose curation differs between two states (the one an undo or redo
 * touched), or null when none does. Curation states share structure, so
 * unchanged units are the same objects.
 */
export function changedUnit(a: CurationState, b: CurationState): string | null {
  for (const id of new Set([...Object.keys(a.units), ...Object.keys(b.units)])) if (a.units[id] !== b.units[id]) return id;
  return null;
}

/** Short text of a unit's labels, e.g. "tag: untagged; ramp: up" ("" when none). */
export function labelSummary(c: UnitCuration): string {
  return Object.entries(c.labels)
    .map(([col, d]) => `${col}: ${d.value}`)
    .join('; ');
}

/** Steps an undo/redo moved through, for tests and the status line. */
export function historyDepth(h: CurationHistory): { undo: number; redo: number } {
  return { undo: h.past.length, redo: h.future.length };
}
