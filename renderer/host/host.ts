import type { SessionFileInput } from '../worker/api';

/** A session the user opened, ready for the worker. */
export interface OpenedSession {
  readonly name: string;
  readonly kind: 'folder' | 'nwb' | 'demo';
  readonly files: readonly SessionFileInput[];
  /** Where the workbench state lives: a key for local storage, and the desktop grant when there is one. */
  readonly stateKey: string;
  readonly grantId?: string;
  /** Saved state found beside the session (desktop) or in local storage (browser), or null. */
  readonly savedState: string | null;
  /** Where the session came from, for display. */
  readonly displayPath: string;
}

export interface RecentEntry {
  readonly id: string;
  readonly name: string;
  readonly displayPath: string;
  readonly openedAt: string;
  /** false in the browser, which cannot reopen a folder without the user picking it again. */
  readonly reopenable: boolean;
}

/** Commands of the desktop menu (same words as electron/common/ipc-contract.ts MenuCommand). */
export type HostCommand = string;

/**
 * What the screens need from wherever they run: the desktop app (Electron
 * preload bridge) or a plain browser (file inputs, downloads, local storage).
 * One interface, two implementations; the screens never ask which.
 */
export interface Host {
  readonly kind: 'desktop' | 'browser';
  /** Lets the user pick a session folder or NWB file; null when cancelled. */
  pickSession(kind: 'folder' | 'nwb'): Promise<OpenedSession | null>;
  recent(): Promise<RecentEntry[]>;
  openRecent(id: string): Promise<OpenedSession>;
  /** Remembers a session the user opened (browser: its name only). */
  noteOpened(session: OpenedSession): void;
  /** Saves the workbench state; returns where it went, for the status line. */
  saveState(session: OpenedSession, text: string): Promise<string>;
  /** Saves an export; returns where it went, or null when the user cancelled. */
  saveExport(fileName: string, data: string | Uint8Array, mime: string): Promise<string | null>;
  /** Menu commands (desktop only); returns an unsubscribe function. */
  onCommand(listener: (command: HostCommand) => void): () => void;
}

/** Loads the bundled demo session (static files of the build, listed in demo/manifest.json). */
export async function loadDemoSession(readLocal: (key: string) => string | null): Promise<OpenedSession> {
  const res = await fetch('demo/manifest.json');
  if (!res.ok) throw new Error(`The bundled demo session is missing from this build (demo/manifest.json: HTTP ${res.status}).`);
  const manifest = (await res.json()) as { name: string; files: { name: string; bytes: number }[] };
  const files: SessionFileInput[] = [];
  for (const f of manifest.files) {
    const r = await fetch(`demo/${encodeURIComponent(f.name)}`);
    if (!r.ok) throw new Error(`The bundled demo file ${f.name} could not be read (HTTP ${r.status}).`);
    files.push({ name: f.name, blob: await r.blob() });
  }
  const stateKey = `tagbench:state:demo:${manifest.files.map((f) => `${f.name}=${f.bytes}`).join(',')}`;
  return { name: 'demo', kind: 'demo', files, stateKey, savedState: readLocal(stateKey), displayPath: 'bundled demo session' };
}

/** A stable local-storage key for a session picked in the browser: its name and its files' names and sizes. */
export function browserStateKey(name: string, files: readonly SessionFileInput[]): string {
  return `tagbench:state:${name}:${files.map((f) => `${f.name}=${f.blob.size}`).join(',')}`;
}
