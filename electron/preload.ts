/**
 * Preload (sandboxed, context-isolated): exposes window.tagbench, which lets
 * exactly the contract's channels through (IPC_CHANNELS) and the menu-command
 * events; nothing of Node or Electron reaches the page. Built as CommonJS
 * (sandboxed preloads cannot be ES modules).
 */
import { IPC_CHANNELS, type IpcResult, type MenuCommand, type TagbenchBridge } from './common/ipc-contract';
import type { ElectronPreloadLike } from './electron-api';

const { contextBridge, ipcRenderer } = require('electron') as ElectronPreloadLike;

const bridge: TagbenchBridge = {
  invoke(channel, ...args) {
    if (!IPC_CHANNELS.includes(channel)) {
      return Promise.resolve({ ok: false, error: `Refused: unknown channel ${String(channel)}.` }) as never;
    }
    return ipcRenderer.invoke(channel, ...args) as Promise<IpcResult<never>>;
  },
  onMenuCommand(listener) {
    const wrapped = (_event: unknown, ...args: unknown[]) => {
      if (typeof args[0] === 'string') listener(args[0] as MenuCommand);
    };
    ipcRenderer.on('menu:command', wrapped);
    return () => ipcRenderer.removeListener('menu:command', wrapped);
  },
  platform: process.platform,
};

contextBridge.exposeInMainWorld('tagbench', bridge);
