/**
 * The workbench's keyboard shortcuts: one table, used by the key handler and
 * shown in the help overlay (and mirrored by the desktop menu's accelerators,
 * electron/menu-template.ts). Plain keys act only when no text field has the
 * focus; keys with Ctrl/Cmd or Alt act everywhere except undo/redo, which
 * stay with a text field's own editing while one has the focus.
 */
export type Command =
  | 'next-unit'
  | 'previous-unit'
  | 'label:tagged'
  | 'label:borderline'
  | 'label:untagged'
  | 'label:clear'
  | 'toggle-include'
  | 'focus-note'
  | 'undo'
  | 'redo'
  | 'save'
  | 'open-folder'
  | 'open-nwb'
  | 'show-help'
  | 'close-overlay'
  | 'screen:start'
  | 'screen:overview'
  | 'screen:table'
  | 'screen:unit'
  | 'screen:population'
  | 'screen:settings'
  | 'screen:export';

export interface Shortcut {
  /** What the user presses, as shown in the help overlay. */
  readonly keys: string;
  readonly command: Command;
  readonly description: string;
}

export const SHORTCUTS: readonly Shortcut[] = [
  { keys: 'Ctrl/Cmd + Down', command: 'next-unit', description: 'Next unit (table order)' },
  { keys: 'Ctrl/Cmd + Up', command: 'previous-unit', description: 'Previous unit' },
  { keys: '1', command: 'label:tagged', description: 'Label the unit\'s tag "tagged" (your call beside the computed verdict)' },
  { keys: '2', command: 'label:borderline', description: 'Label the tag "borderline"' },
  { keys: '3', command: 'label:untagged', description: 'Label the tag "untagged"' },
  { keys: '0', command: 'label:clear', description: 'Clear your tag label (the computed verdict stays)' },
  { keys: 'X', command: 'toggle-include', description: 'Include or exclude the unit' },
  { keys: 'N', command: 'focus-note', description: 'Write a note (Esc leaves the note)' },
  { keys: 'Ctrl/Cmd + Z', command: 'undo', description: 'Undo the last curation change' },
  { keys: 'Ctrl/Cmd + Shift + Z', command: 'redo', description: 'Redo' },
  { keys: 'Ctrl/Cmd + S', command: 'save', description: 'Save the workbench state' },
  { keys: 'Ctrl/Cmd + O', command: 'open-folder', description: 'Open a session folder' },
  { keys: 'Alt + 1 ... 7', command: 'screen:start', description: 'Start, Overview, Unit table, Unit page, Population, Settings, Export' },
  { keys: '? or F1', command: 'show-help', description: 'This help' },
];

const SCREEN_KEYS: readonly Command[] = ['screen:start', 'screen:overview', 'screen:table', 'screen:unit', 'screen:population', 'screen:settings', 'screen:export'];

/** The parts of a KeyboardEvent the mapping reads. */
export interface KeyLike {
  readonly key: string;
  readonly code?: string;
  readonly ctrlKey: boolean;
  readonly metaKey: boolean;
  readonly altKey: boolean;
  readonly shiftKey: boolean;
}

/** The command of a key press, or null. `inText` = a text field has the focus. */
export function keyToCommand(e: KeyLike, inText: boolean): Command | null {
  const mod = e.ctrlKey || e.metaKey;
  const k = e.key.length === 1 ? e.key.toLowerCase() : e.key;
  if (e.key === 'Escape') return 'close-overlay';
  if (e.key === 'F1') return 'show-help';
  if (e.altKey && !mod) {
    const digit = e.code?.startsWith('Digit') ? Number(e.code.slice(5)) : Number(e.key);
    if (digit >= 1 && digit <= 7) return SCREEN_KEYS[digit - 1];
    return null;
  }
  if (mod) {
    if (k === 'ArrowDown') return 'next-unit';
    if (k === 'ArrowUp') return 'previous-unit';
    if (k === 's') return 'save';
    if (k === 'o') return e.shiftKey ? 'open-nwb' : 'open-folder';
    if (inText) return null;
    if (k === 'z') return e.shiftKey ? 'redo' : 'undo';
    if (k === 'y') return 'redo';
    return null;
  }
  if (inText) return null;
  switch (k) {
    case '1': return 'label:tagged';
    case '2': return 'label:borderline';
    case '3': return 'label:untagged';
    case '0': return 'label:clear';
    case 'x': return 'toggle-include';
    case 'n': return 'focus-note';
    case '?': return 'show-help';
    default: return null;
  }
}
