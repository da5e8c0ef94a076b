import type { GrantedSession, IpcResult, TagbenchBridge } from '../../electron/common/ipc-contract';
import type { SessionFileInput } from '../worker/api';
import type { Host, OpenedSession } from './host';
import { readLocal, writeLocal } from './browser-host';

/** Chunk size of file reads through the bridge, bytes (the contract allows up to 16 MiB). */
export const READ_CHUNK_BYTES = 8 * 1024 * 1024;

function unwrap<T>(r: IpcResult<T>): T {
  if (!r.ok) throw new Error(r.error);
  return r.value;
}

/** The host of the desktop app: the preload's window.tagbench bridge. */
export function createElectronHost(bridge: TagbenchBridge): Host {
  const toSession = async (g: GrantedSession): Promise<OpenedSession> => {
    const files: SessionFileInput[] = [];
    for (const f of g.files) {
      const parts: Uint8Array[] = [];
      for (let offset = 0; offset < f.bytes || (offset === 0 && f.bytes === 0); offset += READ_CHUNK_BYTES) {
        const chunk = unwrap(await bridge.invoke('file:read', g.grantId, f.name, offset, Math.min(READ_CHUNK_BYTES, f.bytes - offset)));
        parts.push(chunk);
        if (f.bytes === 0) break;
      }
      files.push({ name: f.name, blob: new Blob(parts as BlobPart[]) });
    }
    const stateKey = `tagbench:state:desktop:${g.displayPath}`;
    return { name: g.name, kind: g.kind, files, stateKey, grantId: g.grantId, savedState: g.savedState ?? readLocal(stateKey), displayPath: g.displayPath };
  };
  return {
    kind: 'desktop',
    async pickSession(kind) {
      const g = unwrap(await bridge.invoke('session:pick', kind));
      return g ? toSession(g) : null;
    },
    async recent() {
      return unwrap(await bridge.invoke('session:recent')).map((r) => ({ ...r, reopenable: true }));
    },
    async openRecent(id) {
      return toSession(unwrap(await bridge.invoke('session:open-recent', id)));
    },
    noteOpened() {
      /* main records sessions opened through its dialogs */
    },
    async saveState(session, text) {
      writeLocal(session.stateKey, text);
      if (!session.grantId) return 'this computer (app storage)';
      return unwrap(await bridge.invoke('session:save-state', session.grantId, text)).path;
    },
    async saveExport(fileName, data) {
      const r = unwrap(await bridge.invoke('export:save', fileName, data));
      return r ? r.path : null;
    },
    onCommand(listener) {
      return bridge.onMenuCommand(listener);
    },
  };
}
