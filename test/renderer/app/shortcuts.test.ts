import { describe, expect, it } from 'vitest';
import { keyToCommand, SHORTCUTS } from '../../../renderer/app/shortcuts';
import { menuTemplate } from '../../../electron/menu-template';

const key = (k: string, mods: Partial<{ ctrl: boolean; meta: boolean; alt: boolean; shift: boolean }> = {}, code?: string) => ({
  key: k,
  code,
  ctrlKey: !!mods.ctrl,
  metaKey: !!mods.meta,
  altKey: !!mods.alt,
  shiftKey: !!mods.shift,
});

describe('keyboard shortcuts', () => {
  it.each([
    [key('ArrowDown', { ctrl: true }), false, 'next-unit'],
    [key('ArrowUp', { meta: true }), false, 'previous-unit'],
    [key('1'), false, 'label:tagged'],
    [key('2'), false, 'label:borderline'],
    [key('3'), false, 'label:untagged'],
    [key('0'), false, 'label:clear'],
    [key('X', { shift: true }), false, 'toggle-include'],
    [key('n'), false, 'focus-note'],
    [key('z', { ctrl: true }), false, 'undo'],
    [key('Z', { ctrl: true, shift: true }), false, 'redo'],
    [key('y', { ctrl: true }), false, 'redo'],
    [key('s', { ctrl: true }), true, 'save'],
    [key('?', { shift: true }), false, 'show-help'],
    [key('F1'), true, 'show-help'],
    [key('Escape'), true, 'close-overlay'],
    [key('¡', { alt: true }, 'Digit1'), false, 'screen:start'],
    [key('7', { alt: true }, 'Digit7'), false, 'screen:export'],
  ])('%j (in a text field: %s) -> %s', (e, inText, cmd) => expect(keyToCommand(e, inText)).toBe(cmd));
  it('leaves typing and text undo to text fields', () => {
    expect(keyToCommand(key('1'), true)).toBeNull();
    expect(keyToCommand(key('n'), true)).toBeNull();
    expect(keyToCommand(key('z', { ctrl: true }), true)).toBeNull();
    expect(keyToCommand(key('q'), false)).toBeNull();
  });
  it('every command of the help table is reachable by its key, and the menu shows the same keys', () => {
    expect(SHORTCUTS.length).toBeGreaterThan(10);
    const menuAccels = JSON.stringify(menuTemplate('linux', () => undefined));
    for (const a of ['CmdOrCtrl+Down', 'CmdOrCtrl+Up', 'CmdOrCtrl+Z', 'CmdOrCtrl+Shift+Z', 'CmdOrCtrl+S', 'Alt+1', 'F1']) expect(menuAccels).toContain(a);
  });
});
