import { open } from 'node:fs/promises';
import type { GrantedSession, IpcChannel, IpcContract, RecentSession } from '../common/ipc-contract';
import { SAVED_STATE_FILE } from '../common/ipc-contract';
import { atomicWrite } from './atomic-write';
import { HandlerError } from './handler-error';
import { listSessionFiles } from './list-session-files';
import type { PathGrants } from './path-grants';
import type { RecentSessions, StoredRecent } from './recent-sessions';
import { readFile } from 'node:fs/promises';

/** What the handlers need from the outside (native dialogs are injected so tests can stand in for the user). */
export interface HandlerDeps {
  readonly grants: PathGrants;
  readonly recent: RecentSessions;
  /** Shows the open dialog; returns the picked absolute path or null when cancelled. */
  pickPath(kind: 'folder' | 'nwb'): Promise<string | null>;
  /** Shows the save dialog; returns the chosen absolute path or null when cancelled. */
  pickSavePath(suggestedName: string): Promise<string | null>;
}

export type Handlers = {
  [C in IpcChannel]: (...args: IpcContract[C]['args']) => Promise<IpcContract[C]['value']>;
};

/**
 * The main-process side of the IPC contract. Arguments arrive already
 * validated (dispatchIpc); these functions enforce what validation cannot:
 * paths confined to what the user picked, reads within the file, atomic writes.
 */
export function createHandlers(deps: HandlerDeps): Handlers {
  const { grants, recent } = deps;

  const openGranted = async (path: string, kind: 'folder' | 'nwb'): Promise<GrantedSession> => {
    const g = await grants.grant(path, kind);
    const files = await listSessionFiles(g.root, kind);
    let savedState: string | null = null;
    try {
      savedState = await readFile(grants.statePath(g.id, SAVED_STATE_FILE), 'utf8');
    } catch {
      savedState = null;
    }
    const entry = await recent.add(path, kind);
    return { grantId: g.id, kind, name: entry.name, displayPath: entry.displayPath, files, savedState };
  };

  const publicRecent = (r: StoredRecent): RecentSession => ({ id: r.id, kind: r.kind, name: r.name, displayPath: r.displayPath, openedAt: r.openedAt });

  return {
    async 'session:pick'(kind) {
      const path = await deps.pickPath(kind);
      return path === null ? null : openGranted(path, kind);
    },
    async 'session:recent'() {
      return (await recent.list()).map(publicRecent);
    },
    async 'session:open-recent'(id) {
      const r = await recent.find(id);
      if (!r) throw new HandlerError('That session is not on the recent list.');
      return openGranted(r.path, r.kind);
    },
    async 'file:read'(grantId, name, offset, length) {
      const path = await grants.resolve(grantId, name);
      const fh = await open(path, 'r');
      try {
        const size = (await fh.stat()).size;
        if (offset > size) throw new HandlerError(`Offset ${offset} lies beyond the end of "${name}" (${size} bytes).`);
        const n = Math.min(length, size - offset);
        const buf = new Uint8Array(n);
        let got = 0;
        while (got < n) {
          const { bytesRead } = await fh.read(buf, got, n - got, offset + got);
          if (bytesRead === 0) break;
          got += bytesRead;
        }
        return got === n ? buf : buf.subarray(0, got);
      } finally {
        await fh.close();
      }
    },
    async 'session:save-state'(grantId, text) {
      try {
        JSON.parse(text);
      } catch {
        throw new HandlerError('The workbench state to save is not valid JSON.');
      }
      const path = grants.statePath(grantId, SAVED_STATE_FILE);
      await atomicWrite(path, text);
      return { path };
    },
    async 'export:save'(suggestedName, data) {
      const path = await deps.pickSavePath(suggestedName);
      if (path === null) return null;
      await atomicWrite(path, data);
      return { path };
    },
  };
}
