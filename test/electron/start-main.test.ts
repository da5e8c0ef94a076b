// The Electron main process's wiring (electron/start-main.ts), driven with a
// stand-in for Electron's main-process API (electron/electron-api.ts): the
// Electron binary cannot be downloaded on this machine, so the shell itself is
// not run here; everything main.ts does is checked through this stand-in.
import { mkdtemp, mkdir, readFile, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { IPC_CHANNELS } from '../../electron/common/ipc-contract';
import type { BrowserWindowLike, BrowserWindowOptionsLike, ElectronMainLike, IpcMainInvokeEventLike, MenuItemOptionsLike } from '../../electron/electron-api';
import { startMain, windowOptions } from '../../electron/start-main';
import { DEFAULT_WINDOW_STATE } from '../../electron/ipc/window-state';

interface Recorded {
  schemes: unknown[];
  appEvents: Map<string, (...a: unknown[]) => void>;
  windows: { options: BrowserWindowOptionsLike; url: string; events: Map<string, () => void>; shown: boolean; maximized: boolean }[];
  ipc: Map<string, (event: IpcMainInvokeEventLike, ...args: unknown[]) => unknown>;
  protocol: ((request: { url: string }) => Promise<Response> | Response) | null;
  permissionRequest: ((wc: unknown, p: string, cb: (g: boolean) => void) => void) | null;
  permissionCheck: (() => boolean) | null;
  menu: MenuItemOptionsLike[];
  quit: number;
}

function fakeElectron(userData: string): { electron: ElectronMainLike; rec: Recorded } {
  const rec: Recorded = { schemes: [], appEvents: new Map(), windows: [], ipc: new Map(), protocol: null, permissionRequest: null, permissionCheck: null, menu: [], quit: 0 };
  class Win implements BrowserWindowLike {
    readonly entry;
    readonly webContents = { id: 1, send: () => undefined, on: () => undefined, setWindowOpenHandler: () => undefined };
    constructor(options: BrowserWindowOptionsLike) {
      this.entry = { options, url: '', events: new Map<string, () => void>(), shown: false, maximized: false };
      rec.windows.push(this.entry);
    }
    async loadURL(url: string) {
      this.entry.url = url;
    }
    getNormalBounds() {
      return { x: 10, y: 20, width: 1100, height: 700 };
    }
    isMaximized() {
      return false;
    }
    maximize() {
      this.entry.maximized = true;
    }
    show() {
      this.entry.shown = true;
    }
    once(event: string, l: () => void) {
      this.entry.events.set(event, l);
    }
    on(event: string, l: () => void) {
      this.entry.events.set(event, l);
    }
    static getAllWindows() {
      return [];
    }
    static fromWebContents() {
      return null;
    }
  }
  const electron: ElectronMainLike = {
    app: {
      whenReady: async () => undefined,
      getPath: () => userData,
      getVersion: () => '0.1.0',
      quit: () => void rec.quit++,
      on: (event: string, l: (...a: unknown[]) => void) => void rec.appEvents.set(event, l),
    } as ElectronMainLike['app'],
    BrowserWindow: Win,
    ipcMain: { handle: (channel, l) => void rec.ipc.set(channel, l) },
    dialog: { showOpenDialog: async () => ({ canceled: true, filePaths: [] }), showSaveDialog: async () => ({ canceled: true }) },
    Menu: { buildFromTemplate: (t) => ((rec.menu = t), t), setApplicationMenu: () => undefined },
    protocol: { registerSchemesAsPrivileged: (s) => void rec.schemes.push(...s), handle: (_scheme, h) => void (rec.protocol = h) },
    session: { defaultSession: { setPermissionRequestHandler: (h) => void (rec.permissionRequest = h), setPermissionCheckHandler: (h) => void (rec.permissionCheck = h) } },
  };
  return { electron, rec };
}

let userData: string;
let buildDir: string;
beforeEach(async () => {
  userData = await mkdtemp(join(tmpdir(), 'tagbench-main-'));
  buildDir = join(userData, 'build');
  await mkdir(buildDir);
  await writeFile(join(buildDir, 'index.html'), '<!doctype html><title>tagbench</title>');
});

describe('startMain: the Electron main process wiring', () => {
  it('opens one sandboxed, context-isolated window without Node on the app:// page (with the demo when asked)', async () => {
    const { electron, rec } = fakeElectron(userData);
    await startMain(electron, { buildDir, preloadPath: '/x/preload.cjs', openDemo: true, platform: 'linux' });
    expect(rec.windows).toHaveLength(1);
    const w = rec.windows[0];
    expect(w.url).toBe('app://tagbench/index.html?open=demo');
    expect(w.options.webPreferences).toEqual({
      preload: '/x/preload.cjs',
      contextIsolation: true,
      sandbox: true,
      nodeIntegration: false,
      nodeIntegrationInWorker: false,
      webSecurity: true,
      allowRunningInsecureContent: false,
      experimentalFeatures: false,
      spellcheck: false,
    });
    expect(w.options.show).toBe(false);
    w.events.get('ready-to-show')!();
    expect(w.shown).toBe(true);
    expect(rec.schemes).toEqual([{ scheme: 'app', privileges: { standard: true, secure: true, supportFetchAPI: true } }]);
  });

  it('blocks navigation away from the app and every new window, in every web contents', async () => {
    const { electron, rec } = fakeElectron(userData);
    await startMain(electron, { buildDir, preloadPath: 'p', openDemo: false, platform: 'linux' });
    const listeners = new Map<string, (e: { preventDefault(): void }, url: string) => void>();
    let openHandler: ((d: { url: string }) => { action: string }) | null = null;
    rec.appEvents.get('web-contents-created')!({}, { id: 2, send: () => undefined, on: (ev: string, l: never) => listeners.set(ev, l), setWindowOpenHandler: (h: never) => (openHandler = h) });
    const navigate = (url: string) => {
      let prevented = false;
      listeners.get('will-navigate')!({ preventDefault: () => (prevented = true) }, url);
      return prevented;
    };
    expect(navigate('https://example.org/')).toBe(true);
    expect(navigate('app://tagbench.evil/index.html')).toBe(true);
    expect(navigate('file:///etc/passwd')).toBe(true);
    expect(navigate('app://tagbench/index.html?open=demo')).toBe(false);
    expect(openHandler!({ url: 'app://tagbench/index.html' })).toEqual({ action: 'deny' });
  });

  it('refuses every permission, and serves only the build on app://tagbench with the security headers', async () => {
    const { electron, rec } = fakeElectron(userData);
    await startMain(electron, { buildDir, preloadPath: 'p', openDemo: false, platform: 'linux' });
    let granted: boolean | null = null;
    rec.permissionRequest!({}, 'media', (g) => (granted = g));
    expect(granted).toBe(false);
    expect(rec.permissionCheck!()).toBe(false);
    const ok = await rec.protocol!({ url: 'app://tagbench/index.html' });
    expect(ok.status).toBe(200);
    expect(await ok.text()).toBe('<!doctype html><title>tagbench</title>');
    expect(ok.headers.get('Content-Security-Policy')).toContain("default-src 'self'");
    expect((await rec.protocol!({ url: 'app://elsewhere/index.html' })).status).toBe(404);
    expect((await rec.protocol!({ url: 'app://tagbench/../../etc/passwd' })).status).toBe(404);
  });

  it('handles every IPC channel of the contract through the checked dispatcher (foreign senders refused)', async () => {
    const { electron, rec } = fakeElectron(userData);
    await startMain(electron, { buildDir, preloadPath: 'p', openDemo: false, platform: 'linux' });
    expect([...rec.ipc.keys()].sort()).toEqual([...IPC_CHANNELS].sort());
    const fromApp: IpcMainInvokeEventLike = { senderFrame: { url: 'app://tagbench/index.html' }, sender: { id: 1 } };
    const fromElsewhere: IpcMainInvokeEventLike = { senderFrame: { url: 'https://example.org/' }, sender: { id: 1 } };
    expect(await rec.ipc.get('session:recent')!(fromApp)).toEqual({ ok: true, value: [] });
    expect(await rec.ipc.get('session:recent')!(fromElsewhere)).toEqual({ ok: false, error: 'Refused: the message did not come from the workbench window.' });
    expect(await rec.ipc.get('session:pick')!(fromApp)).toMatchObject({ ok: false });
    expect(await rec.ipc.get('session:pick')!(fromApp, 'folder')).toEqual({ ok: true, value: null }); // dialog cancelled
  });

  it('remembers the window state on close and reopens at it; quits when the last window closes (not on macOS)', async () => {
    const first = fakeElectron(userData);
    await startMain(first.electron, { buildDir, preloadPath: 'p', openDemo: false, platform: 'linux' });
    first.rec.windows[0].events.get('close')!();
    await expect.poll(async () => JSON.parse(await readFile(join(userData, 'window-state.json'), 'utf8'))).toEqual({ bounds: { x: 10, y: 20, width: 1100, height: 700 }, maximized: false });
    const second = fakeElectron(userData);
    await startMain(second.electron, { buildDir, preloadPath: 'p', openDemo: false, platform: 'darwin' });
    expect(second.rec.windows[0].options).toMatchObject({ x: 10, y: 20, width: 1100, height: 700 });
    second.rec.appEvents.get('window-all-closed')!();
    expect(second.rec.quit).toBe(0);
    first.rec.appEvents.get('window-all-closed')!();
    expect(first.rec.quit).toBe(1);
    expect(first.rec.menu.length).toBeGreaterThan(0);
  });

  it('windowOptions: first run centred at the default size', () => {
    const o = windowOptions(DEFAULT_WINDOW_STATE, 'p');
    expect('x' in o).toBe(false);
    expect([o.width, o.height]).toEqual([DEFAULT_WINDOW_STATE.bounds.width, DEFAULT_WINDOW_STATE.bounds.height]);
  });
});
