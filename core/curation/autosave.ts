/**
 * Autosave policy as a pure state machine (no timers, no clock: the caller
 * passes `nowMs` and sets its own timer from `waitMs`).
 *
 * - Every edit bumps `revision` and marks the state dirty.
 * - A save is due `debounceMs` after the last edit, but never later than
 *   `maxDelayMs` after the first unsaved edit (steady editing still saves).
 * - One save at a time; an edit during a save makes the state dirty again,
 *   and the revision written is remembered, so a save finishing late never
 *   marks newer edits as saved.
 * - A failed save keeps the state dirty and retries after `retryMs`.
 */
export interface AutosaveState {
  readonly revision: number;
  readonly savedRevision: number;
  /** Time of the last edit, ms. */
  readonly lastEditMs: number;
  /** Time of the first edit not yet saved, ms (NaN when clean). */
  readonly firstUnsavedMs: number;
  /** Revision being written, or -1. */
  readonly savingRevision: number;
  /** Time the last save failed, ms (NaN if none since the last success). */
  readonly failedAtMs: number;
}

export interface AutosaveOptions {
  readonly debounceMs: number;
  readonly maxDelayMs: number;
  readonly retryMs: number;
}

/** Defaults for the app: 1.5 s after the last edit, at most 10 s, retry after 5 s (our choice). */
export const AUTOSAVE_DEFAULTS: AutosaveOptions = { debounceMs: 1500, maxDelayMs: 10_000, retryMs: 5000 };

export type AutosaveEvent =
  | { readonly type: 'edit'; readonly nowMs: number }
  | { readonly type: 'save-start'; readonly nowMs: number }
  | { readonly type: 'save-done'; readonly nowMs: number }
  | { readonly type: 'save-failed'; readonly nowMs: number };

export const AUTOSAVE_CLEAN: AutosaveState = { revision: 0, savedRevision: 0, lastEditMs: NaN, firstUnsavedMs: NaN, savingRevision: -1, failedAtMs: NaN };

export function autosave(state: AutosaveState, event: AutosaveEvent): AutosaveState {
  switch (event.type) {
    case 'edit':
      return {
        ...state,
        revision: state.revision + 1,
        lastEditMs: event.nowMs,
        firstUnsavedMs: state.revision === state.savedRevision ? event.nowMs : state.firstUnsavedMs,
      };
    case 'save-start':
      return { ...state, savingRevision: state.revision };
    case 'save-done': {
      const saved = state.savingRevision >= 0 ? state.savingRevision : state.savedRevision;
      return {
        ...state,
        savedRevision: saved,
        savingRevision: -1,
        failedAtMs: NaN,
        firstUnsavedMs: saved === state.revision ? NaN : state.firstUnsavedMs,
      };
    }
    case 'save-failed':
      return { ...state, savingRevision: -1, failedAtMs: event.nowMs };
  }
}

/** Is a save due now? If not and the state is dirty, how long to wait (ms). */
export function autosaveDue(state: AutosaveState, nowMs: number, opts: AutosaveOptions = AUTOSAVE_DEFAULTS): { dirty: boolean; due: boolean; waitMs: number } {
  const dirty = state.revision !== state.savedRevision;
  if (!dirty) return { dirty, due: false, waitMs: Infinity };
  if (state.savingRevision >= 0) return { dirty, due: false, waitMs: Infinity };
  let at = Math.min(state.lastEditMs + opts.debounceMs, state.firstUnsavedMs + opts.maxDelayMs);
  if (!Number.isNaN(state.failedAtMs)) at = Math.max(at, state.failedAtMs + opts.retryMs);
  return { dirty, due: nowMs >= at, waitMs: Math.max(0, at - nowMs) };
}
