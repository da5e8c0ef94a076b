import type { MenuCommand } from './common/ipc-contract';
import type { MenuItemOptionsLike } from './electron-api';

/**
 * The application menu: every command with its accelerator. `send` forwards
 * a command to the focused window's renderer, which acts on it exactly as on
 * the same key in the page (renderer/app/shortcuts.ts lists the keys). Pure:
 * tested without Electron.
 */
export function menuTemplate(platform: string, send: (command: MenuCommand) => void): MenuItemOptionsLike[] {
  // Keys the page handles itself (renderer/app/shortcuts.ts) are shown in the
  // menu but not registered, so one key never fires twice.
  const item = (label: string, command: MenuCommand, accelerator?: string, pageHandles = false): MenuItemOptionsLike => ({
    label,
    accelerator,
    ...(pageHandles ? { registerAccelerator: false } : {}),
    click: () => send(command),
  });
  const sep: MenuItemOptionsLike = { type: 'separator' };
  const template: MenuItemOptionsLike[] = [
    {
      label: 'File',
      submenu: [
        item('Open session folder...', 'open-folder', 'CmdOrCtrl+O', true),
        item('Open NWB file...', 'open-nwb', 'CmdOrCtrl+Shift+O', true),
        item('Open demo session', 'open-demo'),
        sep,
        item('Save workbench state', 'save', 'CmdOrCtrl+S', true),
        item('Export...', 'screen:export', 'Alt+7', true),
        sep,
        platform === 'darwin' ? { role: 'close' } : { role: 'quit' },
      ],
    },
    {
      label: 'Edit',
      submenu: [
        item('Undo curation', 'undo', 'CmdOrCtrl+Z', true),
        item('Redo curation', 'redo', 'CmdOrCtrl+Shift+Z', true),
        sep,
        { role: 'cut' },
        { role: 'copy' },
        { role: 'paste' },
        { role: 'selectAll' },
      ],
    },
    {
      label: 'Go',
      submenu: [
        item('Start', 'screen:start', 'Alt+1', true),
        item('Session overview', 'screen:overview', 'Alt+2', true),
        item('Unit table', 'screen:table', 'Alt+3', true),
        item('Unit page', 'screen:unit', 'Alt+4', true),
        item('Population', 'screen:population', 'Alt+5', true),
        item('Analysis settings', 'screen:settings', 'Alt+6', true),
        item('Export', 'screen:export', 'Alt+7', true),
        sep,
        item('Next unit', 'next-unit', 'CmdOrCtrl+Down', true),
        item('Previous unit', 'previous-unit', 'CmdOrCtrl+Up', true),
        item('Write a note', 'focus-note', 'N', true),
      ],
    },
    {
      label: 'View',
      submenu: [{ role: 'resetZoom' }, { role: 'zoomIn' }, { role: 'zoomOut' }, sep, { role: 'togglefullscreen' }],
    },
    { label: 'Help', submenu: [item('Keyboard shortcuts', 'show-help', 'F1', true)] },
  ];
  if (platform === 'darwin') template.unshift({ role: 'appMenu' });
  return template;
}
