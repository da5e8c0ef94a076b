/**
 * Hand curation of units: a label, a note and include/exclude per unit, with
 * undo and redo. Pure functions over immutable state; the screens keep the
 * state and save it with the session (renderer/state/saved-state.ts).
 */

/** The curator's own call on a unit, beside (never instead of) the computed verdicts. */
export const CURATION_LABELS = ['identified', 'not identified', 'unsure'] as const;
export type CurationLabel = (typeof CURATION_LABELS)[number];

export interface UnitCuration {
  /** null = no label given. */
  readonly label: CurationLabel | null;
  readonly note: string;
  /** false = excluded from population summaries and marked in exports. */
  readonly included: boolean;
}

export const UNCURATED: UnitCuration = { label: null, note: '', included: true };

export interface CurationEdit {
  readonly unitId: string;
  readonly before: UnitCuration;
  readonly after: UnitCuration;
  /** What the edit did, for the status line ("label unit 7: unsure"). */
  readonly what: string;
}

export interface CurationState {
  readonly byUnit: Readonly<Record<string, UnitCuration>>;
  readonly undo: readonly CurationEdit[];
  readonly redo: readonly CurationEdit[];
}

export const EMPTY_CURATION: CurationState = { byUnit: {}, undo: [], redo: [] };

/** Longest undo history kept. */
export const MAX_UNDO = 500;

export function curationOf(state: CurationState, unitId: string): UnitCuration {
  return state.byUnit[unitId] ?? UNCURATED;
}

/** Applies a change to one unit; a change that alters nothing returns the same state (no undo step). */
export function editCuration(state: CurationState, unitId: string, change: Partial<UnitCuration>): CurationState {
  const before = curationOf(state, unitId);
  const after: UnitCuration = { ...before, ...change };
  if (after.label === before.label && after.note === before.note && after.included === before.included) return state;
  const what = describe(unitId, before, after);
  return {
    byUnit: withUnit(state.byUnit, unitId, after),
    undo: [...state.undo, { unitId, before, after, what }].slice(-MAX_UNDO),
    redo: [],
  };
}

/** Undoes the last edit; returns the state and the edit undone (null when there is none). */
export function undoCuration(state: CurationState): { state: CurationState; edit: CurationEdit | null } {
  const edit = state.undo.at(-1);
  if (!edit) return { state, edit: null };
  return {
    state: { byUnit: withUnit(state.byUnit, edit.unitId, edit.before), undo: state.undo.slice(0, -1), redo: [...state.redo, edit] },
    edit,
  };
}

/** Redoes the last undone edit. */
export function redoCuration(state: CurationState): { state: CurationState; edit: CurationEdit | null } {
  const edit = state.redo.at(-1);
  if (!edit) return { state, edit: null };
  return {
    state: { byUnit: withUnit(state.byUnit, edit.unitId, edit.after), undo: [...state.undo, edit], redo: state.redo.slice(0, -1) },
    edit,
  };
}

function withUnit(byUnit: Readonly<Record<string, UnitCuration>>, unitId: string, c: UnitCuration): Record<string, UnitCuration> {
  const next = { ...byUnit };
  if (c.label === null && c.note === '' && c.included) delete next[unitId];
  else next[unitId] = c;
  return next;
}

function describe(unitId: string, b: UnitCuration, a: UnitCuration): string {
  if (a.label !== b.label) return `unit ${unitId}: label ${a.label ?? '(none)'}`;
  if (a.included !== b.included) return `unit ${unitId}: ${a.included ? 'included' : 'excluded'}`;
  return `unit ${unitId}: note ${a.note ? 'changed' : 'cleared'}`;
}

/** Curation as CSV text: unit, label, included, note (RFC 4180 quoting). One row per unit id given. */
export function curationCsv(state: CurationState, unitIds: readonly string[]): string {
  const q = (s: string) => (/[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);
  const rows = ['unit,label,included,note'];
  for (const id of unitIds) {
    const c = curationOf(state, id);
    rows.push([q(id), q(c.label ?? ''), c.included ? 'yes' : 'no', q(c.note)].join(','));
  }
  return `${rows.join('\n')}\n`;
}
