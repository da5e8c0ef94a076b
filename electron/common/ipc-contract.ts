/**
 * The one typed IPC contract between the Electron main process and the
 * renderer. Main implements every channel (electron/ipc/create-handlers.ts),
 * the preload passes exactly these channels through contextBridge
 * (electron/preload.ts), and the renderer imports this file as types only
 * (renderer/host/electron-host.ts).
 *
 * Every result crosses as {ok: true, value} | {ok: false, error}: a handler
 * never throws across the bridge, and `error` is one sentence for a person.
 *
 * The renderer never names absolute paths. Opening a session (dialog or a
 * recent entry) gives it a grant id; every later read names that grant and a
 * file name relative to what the user picked, and main refuses anything that
 * would leave it.
 */
import { SAVED_SESSION_FILE } from '../../core/curation/session-file';

/** A result that crosses the bridge. */
export type IpcResult<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly error: string };

/** One file of a picked session, relative to the picked folder (or the NWB file's base name). */
export interface SessionFileEntry {
  /** Relative name with forward slashes, e.g. "spikes.csv" or "raw/probe.bin". */
  readonly name: string;
  /** Size in bytes. */
  readonly bytes: number;
}

/** A session the user picked (folder or NWB file) and main granted access to. */
export interface GrantedSession {
  /** Opaque id naming the grant in later calls. */
  readonly grantId: string;
  /** "folder" or "nwb". */
  readonly kind: 'folder' | 'nwb';
  /** Display name (folder or file base name). */
  readonly name: string;
  /** Absolute path, for display only. */
  readonly displayPath: string;
  /** The readable files of the session. */
  readonly files: readonly SessionFileEntry[];
  /** Curation/settings saved earlier beside the session (JSON text), or null. */
  readonly savedState: string | null;
}

/** One entry of the recent-sessions list. */
export interface RecentSession {
  /** Stable id of the entry (used to reopen it). */
  readonly id: string;
  readonly kind: 'folder' | 'nwb';
  readonly name: string;
  readonly displayPath: string;
  /** ISO 8601 time the session was last opened. */
  readonly openedAt: string;
}

/** Largest chunk one file:read call returns, bytes (larger files are read in chunks). */
export const MAX_READ_CHUNK_BYTES = 16 * 1024 * 1024;

/** Largest export or saved-state payload, bytes. */
export const MAX_WRITE_BYTES = 512 * 1024 * 1024;

/** Menu commands main sends to the renderer (channel "menu:command"). */
export type MenuCommand =
  | 'open-folder'
  | 'open-nwb'
  | 'open-demo'
  | 'save'
  | 'undo'
  | 'redo'
  | 'next-unit'
  | 'previous-unit'
  | 'focus-note'
  | 'show-help'
  | 'screen:start'
  | 'screen:overview'
  | 'screen:table'
  | 'screen:unit'
  | 'screen:population'
  | 'screen:settings'
  | 'screen:export';

/** Every invoke channel: its argument tuple and the value of its result. */
export interface IpcContract {
  /** Native dialog: pick a session folder or an NWB file. null when cancelled. */
  'session:pick': { args: [kind: 'folder' | 'nwb']; value: GrantedSession | null };
  /** The recent-sessions list, newest first. */
  'session:recent': { args: []; value: RecentSession[] };
  /** Reopen a recent session by its id (it must be on the list and still exist). */
  'session:open-recent': { args: [id: string]; value: GrantedSession };
  /** Read bytes [offset, offset + length) of a granted file (length <= MAX_READ_CHUNK_BYTES). */
  'file:read': { args: [grantId: string, name: string, offset: number, length: number]; value: Uint8Array };
  /** Save the workbench state (curation, settings) beside a granted folder session, atomically. */
  'session:save-state': { args: [grantId: string, text: string]; value: { path: string } };
  /** Ask where to save an export (native dialog) and write it atomically. null when cancelled. */
  'export:save': { args: [suggestedName: string, data: string | Uint8Array]; value: { path: string } | null };
}

export type IpcChannel = keyof IpcContract;

/** The channels the preload lets through, in one list (checked by a test against IpcContract). */
export const IPC_CHANNELS: readonly IpcChannel[] = [
  'session:pick',
  'session:recent',
  'session:open-recent',
  'file:read',
  'session:save-state',
  'export:save',
];

/** The API the preload exposes as window.tagbench. */
export interface TagbenchBridge {
  invoke<C extends IpcChannel>(channel: C, ...args: IpcContract[C]['args']): Promise<IpcResult<IpcContract[C]['value']>>;
  /** Subscribe to menu commands; returns an unsubscribe function. */
  onMenuCommand(listener: (command: MenuCommand) => void): () => void;
  /** Platform, for shortcut labels ("darwin", "linux", "win32"). */
  readonly platform: string;
}

/** File name of the session file (curation and parameters) saved inside a session folder, or beside an NWB file. */
export const SAVED_STATE_FILE = SAVED_SESSION_FILE;
