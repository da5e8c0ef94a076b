/**
 * Everything the Electron main process does, as a plain function over the
 * Electron API it is given (electron-api.ts), so it is tested with a stand-in
 * (test/electron/start-main.test.ts) on machines without the Electron binary.
 * main.ts only loads `electron` and calls this.
 *
 * Secure defaults (Electron's security checklist): the app:// scheme serves
 * only the renderer build (serve-asset.ts: CSP and security headers; any other
 * host is a 404); navigation away from the app's origin is prevented and
 * window.open denied in every web contents; every permission request and
 * check is refused; windows run sandboxed with context isolation, no Node
 * integration (also not in workers), web security on; every IPC channel of the
 * contract goes through dispatchIpc (sender, channel, argument checks); the
 * window state is remembered (ipc/window-state.ts) and menus come from
 * menu-template.ts.
 */
import { join } from 'node:path';
import { IPC_CHANNELS, type MenuCommand } from './common/ipc-contract';
import type { BrowserWindowLike, BrowserWindowOptionsLike, ElectronMainLike, WebContentsLike } from './electron-api';
import { createHandlers } from './ipc/create-handlers';
import { dispatchIpc } from './ipc/dispatch-ipc';
import { PathGrants } from './ipc/path-grants';
import { RecentSessions } from './ipc/recent-sessions';
import { APP_ORIGIN } from './ipc/validate-sender';
import { loadWindowState, MIN_HEIGHT, MIN_WIDTH, saveWindowState, type WindowState } from './ipc/window-state';
import { menuTemplate } from './menu-template';
import { serveAsset } from './serve-asset';

export interface MainOptions {
  /** The renderer build (dist/renderer). */
  readonly buildDir: string;
  /** The bundled preload script (dist-electron/preload.cjs). */
  readonly preloadPath: string;
  /** Open the bundled demo in the first window (npm start: --demo). */
  readonly openDemo: boolean;
  readonly platform: string;
}

/** The options of the app's windows: remembered bounds and the secure webPreferences. */
export function windowOptions(state: WindowState, preloadPath: string): BrowserWindowOptionsLike {
  return {
    ...(Number.isFinite(state.bounds.x) ? { x: state.bounds.x, y: state.bounds.y } : {}),
    width: state.bounds.width,
    height: state.bounds.height,
    minWidth: MIN_WIDTH,
    minHeight: MIN_HEIGHT,
    show: false,
    title: 'tagbench',
    backgroundColor: '#f7f7f5',
    webPreferences: {
      preload: preloadPath,
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
      experimentalFeatures: false,
      spellcheck: false,
    },
  };
}

/** Wires the app; resolves once the first window has loaded. */
export async function startMain(electron: ElectronMainLike, options: MainOptions): Promise<void> {
  const { app, BrowserWindow, ipcMain, dialog, Menu, protocol, session } = electron;

  protocol.registerSchemesAsPrivileged([{ scheme: 'app', privileges: { standard: true, secure: true, supportFetchAPI: true } }]);

  app.on('web-contents-created', (_event, contents: WebContentsLike) => {
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

  const createWindow = async (): Promise<void> => {
    const stateFile = join(app.getPath('userData'), 'window-state.json');
    const state = await loadWindowState(stateFile);
    const win = new BrowserWindow(windowOptions(state, options.preloadPath));
    mainWindow = win;
    if (state.maximized) win.maximize();
    win.once('ready-to-show', () => win.show());
    win.on('close', () => {
      void saveWindowState(stateFile, { bounds: win.getNormalBounds(), maximized: win.isMaximized() });
    });
    await win.loadURL(`${APP_ORIGIN}/index.html${options.openDemo ? '?open=demo' : ''}`);
  };

  app.on('window-all-closed', () => {
    if (options.platform !== 'darwin') app.quit();
  });

  await app.whenReady();
  session.defaultSession.setPermissionRequestHandler((_wc, _permission, callback) => callback(false));
  session.defaultSession.setPermissionCheckHandler(() => false);
  protocol.handle('app', async (request) => {
    const url = new URL(request.url);
    const res = url.host === 'tagbench' ? await serveAsset(options.buildDir, 'GET', url.pathname) : await serveAsset(options.buildDir, 'GET', '/\0');
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
  Menu.setApplicationMenu(Menu.buildFromTemplate(menuTemplate(options.platform, send)));

  app.on('activate', () => {
    if (BrowserWindow.getAllWindows().length === 0) void createWindow();
  });
  await createWindow();
}
