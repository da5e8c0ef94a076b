import { CURATION_LABELS, EMPTY_CURATION, type CurationState, type UnitCuration } from './curation';

/** The workbench's saved state of one session: parameter overrides and curation. */
export interface SavedWorkbenchState {
  readonly format: 'tagbench-workbench';
  readonly version: 1;
  readonly session: string;
  readonly savedAt: string;
  /** Parameter overrides as in session.json "parameters" (sections of changed values). */
  readonly parameters: Record<string, Record<string, unknown>>;
  readonly curation: Readonly<Record<string, UnitCuration>>;
}

/** Serialises the state (undo history is not saved). */
export function serialiseState(session: string, parameters: Record<string, Record<string, unknown>>, curation: CurationState, now: Date): string {
  const s: SavedWorkbenchState = { format: 'tagbench-workbench', version: 1, session, savedAt: now.toISOString(), parameters, curation: curation.byUnit };
  return JSON.stringify(s, null, 1);
}

/**
 * Reads saved state back. Damaged text, another format, or entries of the
 * wrong shape are dropped with a message (never thrown), so a bad file can
 * never stop a session from opening; the message says what was ignored.
 */
export function parseSavedState(text: string | null): { parameters: Record<string, Record<string, unknown>>; curation: CurationState; message: string | null } {
  const none = { parameters: {}, curation: EMPTY_CURATION, message: null };
  if (!text) return none;
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    return { ...none, message: 'The saved workbench state is damaged (not JSON) and was ignored.' };
  }
  const r = raw as Partial<SavedWorkbenchState>;
  if (typeof r !== 'object' || r === null || r.format !== 'tagbench-workbench' || r.version !== 1) {
    return { ...none, message: 'The saved workbench state is of an unknown format and was ignored.' };
  }
  const byUnit: Record<string, UnitCuration> = {};
  let dropped = 0;
  for (const [id, c] of Object.entries(r.curation ?? {})) {
    const ok =
      typeof c === 'object' && c !== null &&
      (c.label === null || (CURATION_LABELS as readonly string[]).includes(c.label as string)) &&
      typeof c.note === 'string' && typeof c.included === 'boolean';
    if (ok) byUnit[id] = { label: c.label, note: c.note, included: c.included };
    else dropped++;
  }
  const parameters = typeof r.parameters === 'object' && r.parameters !== null ? r.parameters : {};
  return {
    parameters,
    curation: { byUnit, undo: [], redo: [] },
    message: dropped > 0 ? `${dropped} damaged curation entr${dropped === 1 ? 'y was' : 'ies were'} ignored.` : null,
  };
}
