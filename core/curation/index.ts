/** Curation model, session file and autosave policy (public barrel). */
export * from './types';
export { applyCuration, CURATION_COLUMNS } from './apply-curation';
export { autosave, autosaveDue, AUTOSAVE_CLEAN, AUTOSAVE_DEFAULTS, type AutosaveEvent, type AutosaveOptions, type AutosaveState } from './autosave';
export { checkCurationAction } from './check-curation-action';
export { compareInputs, type InputMismatch } from './compare-inputs';
export { curationReducer } from './curation-reducer';
export { describeInputMismatch } from './describe-input-mismatch';
export { HISTORY_LIMIT, historyDispatch, historyRedo, historyUndo, newHistory, type CurationHistory } from './history';
export { serializeSessionFile } from './serialize-session-file';
export { SESSION_FORMAT, SESSION_SCHEMA_VERSION, type SessionFile } from './session-file';
export { validateSessionFile } from './validate-session-file';
export { verdictWords } from './verdict-words';
export { newSessionFile } from './new-session-file';
export { verdictColumns } from './verdict-columns';
