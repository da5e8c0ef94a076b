/**
 * Electron main process: thin wiring only. Every decision lives in a plain,
 * tested module (electron/ipc/*, app-protocol.ts, serve-asset.ts,
 * menu-template.ts, ipc/window-state.ts). Secure defaults follow Electron's
 * security checklist: context isolation, sandboxed renderer, no Node
 * integration, a CSP with script-src 'self', pages only from the app's own
 * app:// protocol, navigation and new windows blocked, every permission
 * denied, every IPC message validated (sender, channel, arguments).
 */
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { IPC_CHANNELS, type MenuCommand } from './common/ipc-contract';
import type { BrowserWindowLike, ElectronMainLike } from './electron-api';
import { createHandlers } from './ipc/create-handlers';
import { dispatchIpc } from './ipc/dispatch-ipc';
import { PathGrants } from './ipc/path-grants';
import { RecentSessions } from './ipc/recent-sessions';
import { APP_ORIGIN } from './ipc/validate-sender';
import { loadWindowState, MIN_HEIGHT, MIN_WIDTH, saveWindowState } from './ipc/window-state';
import { menuTemplate } from './menu-template';
import { serveAsset } from './serve-asset';

const here = dirname(fileURLToPath(import.meta.url));
const buildDir = join(here, '..', 'dist', 'renderer');
const electron = createRequire(import.meta.url)('electron') as ElectronMainLike;
const { app, BrowserWindow, ipcMain, dialog, Menu, protocol, session } = electron;

protocol.registerSchemesAsPrivileged([{ scheme: 'app', privileges: { standard: true, secure: true, supportFetchAPI: true } }]);

app.on('web-contents-created', (_event, contents) => {
  contents.on('will-navigate', (event, url) => {
    if (!url.startsWith(`${APP_ORIGIN}/`)) event.preventDefault();
  });
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
});

let mainWindow: BrowserWindowLike | null = null;
const focused = (): BrowserWindowLike => {
  if (!mainWindow) throw new Error('no window');
  return mainWindow;
};

async function createWindow(): Promise<void> {
  const stateFile = join(app.getPath('userData'), 'window-state.json');
  const state = await loadWindowState(stateFile);
  const win = new BrowserWindow({
    ...(Number.isFinite(state.bounds.x) ? { x: state.bounds.x, y: state.bounds.y } : {}),
    width: state.bounds.width,
    height: state.bounds.height,
    minWidth: MIN_WIDTH,
    minHeight: MIN_HEIGHT,
    show: false,
    title: 'tagbench',
    backgroundColor: '#f7f7f5',
    webPreferences: {
      preload: join(here, 'preload.cjs'),
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
      experimentalFeatures: false,
      spellcheck: false,
    },
  });
  mainWindow = win;
  if (state.maximized) win.maximize();
  win.once('ready-to-show', () => win.show());
  win.on('close', () => {
    void saveWindowState(stateFile, { bounds: win.getNormalBounds(), maximized: win.isMaximized() });
  });
  const openDemo = process.argv.includes('--demo') || process.env.TAGBENCH_OPEN_DEMO === '1';
  await win.loadURL(`${APP_ORIGIN}/index.html${openDemo ? '?open=demo' : ''}`);
}

void app.whenReady().then(async () => {
  session.defaultSession.setPermissionRequestHandler((_wc, _permission, callback) => callback(false));
  session.defaultSession.setPermissionCheckHandler(() => false);
  protocol.handle('app', async (request) => {
    const url = new URL(request.url);
    const res = url.host === 'tagbench' ? await serveAsset(buildDir, 'GET', url.pathname) : await serveAsset(buildDir, 'GET', '/\0');
    return new Response(res.body as Uint8Array<ArrayBuffer>, { status: res.status, headers: res.headers });
  });

  const handlers = createHandlers({
    grants: new PathGrants(),
    recent: new RecentSessions(join(app.getPath('userData'), 'recent-sessions.json')),
    async pickPath(kind) {
      const r = await dialog.showOpenDialog(focused(), {
        title: kind === 'folder' ? 'Open a session folder' : 'Open an NWB file',
        properties: [kind === 'folder' ? 'openDirectory' : 'openFile'],
        ...(kind === 'nwb' ? { filters: [{ name: 'NWB files', extensions: ['nwb'] }] } : {}),
      });
      return r.canceled || r.filePaths.length === 0 ? null : r.filePaths[0];
    },
    async pickSavePath(suggestedName) {
      const r = await dialog.showSaveDialog(focused(), { title: 'Export', defaultPath: suggestedName });
      return r.canceled || !r.filePath ? null : r.filePath;
    },
  });
  for (const channel of IPC_CHANNELS) {
    ipcMain.handle(channel, (event, ...args) => dispatchIpc(handlers, event, channel, args));
  }

  const send = (command: MenuCommand) => mainWindow?.webContents.send('menu:command', command);
  Menu.setApplicationMenu(Menu.buildFromTemplate(menuTemplate(process.platform, send)));

  await createWindow();
  app.on('activate', () => {
    if (BrowserWindow.getAllWindows().length === 0) void createWindow();
  });
});

app.on('window-all-closed', () => {
  if (process.platform !== 'darwin') app.quit();
});
