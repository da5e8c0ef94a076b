/**
 * The small part of Electron's main-process API that tagbench uses, typed
 * here so the project type-checks and its main-process modules are testable
 * without the `electron` package (an optional dependency whose binary cannot
 * be downloaded on offline machines). main.ts loads the real module at run
 * time and treats it as this interface. Names and shapes follow Electron's
 * documented API (Electron 39).
 */

export interface WebFrameMainLike {
  readonly url: string;
}

export interface IpcMainInvokeEventLike {
  readonly senderFrame: WebFrameMainLike | null;
  readonly sender: { readonly id: number };
}

export interface IpcMainLike {
  handle(channel: string, listener: (event: IpcMainInvokeEventLike, ...args: unknown[]) => Promise<unknown> | unknown): void;
}

export interface RectangleLike {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface WebContentsLike {
  readonly id: number;
  send(channel: string, ...args: unknown[]): void;
  on(event: 'will-navigate', listener: (event: { preventDefault(): void; url?: string }, url: string) => void): void;
  on(event: 'render-process-gone', listener: (event: unknown, details: { reason: string }) => void): void;
  setWindowOpenHandler(handler: (details: { url: string }) => { action: 'deny' | 'allow' }): void;
}

export interface BrowserWindowLike {
  readonly webContents: WebContentsLike;
  loadURL(url: string): Promise<void>;
  getNormalBounds(): RectangleLike;
  isMaximized(): boolean;
  maximize(): void;
  show(): void;
  once(event: 'ready-to-show', listener: () => void): void;
  on(event: 'close', listener: () => void): void;
}

export interface BrowserWindowOptionsLike {
  x?: number;
  y?: number;
  width: number;
  height: number;
  minWidth?: number;
  minHeight?: number;
  show?: boolean;
  title?: string;
  backgroundColor?: string;
  webPreferences: {
    preload: string;
    contextIsolation: true;
    sandbox: true;
    nodeIntegration: false;
    nodeIntegrationInWorker: false;
    webSecurity: true;
    allowRunningInsecureContent: false;
    experimentalFeatures: false;
    enableBlinkFeatures?: undefined;
    spellcheck?: boolean;
  };
}

export interface OpenDialogOptionsLike {
  title?: string;
  properties: ('openFile' | 'openDirectory')[];
  filters?: { name: string; extensions: string[] }[];
}

export interface SaveDialogOptionsLike {
  title?: string;
  defaultPath?: string;
}

export interface DialogLike {
  showOpenDialog(window: BrowserWindowLike, options: OpenDialogOptionsLike): Promise<{ canceled: boolean; filePaths: string[] }>;
  showSaveDialog(window: BrowserWindowLike, options: SaveDialogOptionsLike): Promise<{ canceled: boolean; filePath?: string }>;
}

export interface MenuItemOptionsLike {
  label?: string;
  role?: string;
  type?: 'separator' | 'normal' | 'submenu';
  accelerator?: string;
  /** false: show the accelerator but let the page handle the key. */
  registerAccelerator?: boolean;
  submenu?: MenuItemOptionsLike[];
  click?: () => void;
}

export interface MenuLike {
  buildFromTemplate(template: MenuItemOptionsLike[]): unknown;
  setApplicationMenu(menu: unknown): void;
}

export interface ProtocolLike {
  registerSchemesAsPrivileged(
    schemes: { scheme: string; privileges: { standard?: boolean; secure?: boolean; supportFetchAPI?: boolean; corsEnabled?: boolean } }[],
  ): void;
  handle(scheme: string, handler: (request: { url: string }) => Promise<Response> | Response): void;
}

export interface SessionLike {
  setPermissionRequestHandler(handler: (webContents: unknown, permission: string, callback: (granted: boolean) => void) => void): void;
  setPermissionCheckHandler(handler: () => boolean): void;
}

export interface AppLike {
  whenReady(): Promise<void>;
  getPath(name: 'userData'): string;
  getVersion(): string;
  quit(): void;
  on(event: 'window-all-closed' | 'activate', listener: () => void): void;
  on(event: 'web-contents-created', listener: (event: unknown, contents: WebContentsLike) => void): void;
}

/** The Electron main-process module, as far as tagbench uses it. */
export interface ElectronMainLike {
  app: AppLike;
  BrowserWindow: (new (options: BrowserWindowOptionsLike) => BrowserWindowLike) & {
    getAllWindows(): BrowserWindowLike[];
    fromWebContents(contents: unknown): BrowserWindowLike | null;
  };
  ipcMain: IpcMainLike;
  dialog: DialogLike;
  Menu: MenuLike;
  protocol: ProtocolLike;
  session: { defaultSession: SessionLike };
}

/** The preload-side API (contextBridge, ipcRenderer), as far as the preload uses it. */
export interface ElectronPreloadLike {
  contextBridge: { exposeInMainWorld(key: string, api: unknown): void };
  ipcRenderer: {
    invoke(channel: string, ...args: unknown[]): Promise<unknown>;
    on(channel: string, listener: (event: unknown, ...args: unknown[]) => void): void;
    removeListener(channel: string, listener: (event: unknown, ...args: unknown[]) => void): void;
  };
}
