import type { SessionFileInput } from '../worker/api';
import { browserStateKey, type Host, type OpenedSession, type RecentEntry } from './host';

const RECENT_KEY = 'tagbench:recent';

/** Reads local storage, tolerating browsers where it is disabled. */
export function readLocal(key: string): string | null {
  try {
    return localStorage.getItem(key);
  } catch {
    return null;
  }
}

export function writeLocal(key: string, value: string): boolean {
  try {
    localStorage.setItem(key, value);
    return true;
  } catch {
    return false;
  }
}

/** Files of a folder input (webkitdirectory) or of a drop, as session files named relative to the picked folder. */
export function filesToSession(files: readonly File[], kind: 'folder' | 'nwb'): OpenedSession | null {
  if (files.length === 0) return null;
  const rel = (f: File) => (f as File & { webkitRelativePath?: string }).webkitRelativePath || f.name;
  const first = rel(files[0]);
  const folder = kind === 'folder' && first.includes('/') ? first.split('/')[0] : '';
  const inputs: SessionFileInput[] = files
    .map((f) => ({ name: folder ? rel(f).slice(folder.length + 1) : rel(f), blob: f as Blob }))
    .filter((f) => !f.name.split('/').some((p) => p.startsWith('.')))
    .sort((a, b) => (a.name < b.name ? -1 : 1));
  const name = kind === 'nwb' ? files[0].name : folder || 'session';
  const stateKey = browserStateKey(name, inputs);
  return { name, kind, files: inputs, stateKey, savedState: readLocal(stateKey), displayPath: `${name} (picked in the browser)` };
}

function pickFiles(kind: 'folder' | 'nwb'): Promise<File[]> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    if (kind === 'folder') input.setAttribute('webkitdirectory', '');
    else input.accept = '.nwb';
    input.style.display = 'none';
    input.addEventListener('change', () => {
      resolve(input.files ? [...input.files] : []);
      input.remove();
    });
    input.addEventListener('cancel', () => {
      resolve([]);
      input.remove();
    });
    document.body.append(input);
    input.click();
  });
}

/** The host of plain-browser mode: file inputs, downloads and local storage. */
export function createBrowserHost(): Host {
  return {
    kind: 'browser',
    async pickSession(kind) {
      return filesToSession(await pickFiles(kind), kind);
    },
    async recent() {
      try {
        const list = JSON.parse(readLocal(RECENT_KEY) ?? '[]') as RecentEntry[];
        return Array.isArray(list) ? list.filter((r) => typeof r?.name === 'string').map((r) => ({ ...r, reopenable: r.id === 'demo' })) : [];
      } catch {
        return [];
      }
    },
    async openRecent() {
      throw new Error('In the browser a folder must be picked again to reopen it.');
    },
    noteOpened(session) {
      const id = session.kind === 'demo' ? 'demo' : session.stateKey;
      const entry: RecentEntry = { id, name: session.name, displayPath: session.displayPath, openedAt: new Date().toISOString(), reopenable: session.kind === 'demo' };
      void this.recent().then((list) => writeLocal(RECENT_KEY, JSON.stringify([entry, ...list.filter((r) => r.id !== id)].slice(0, 12))));
    },
    async saveState(session, text) {
      if (!writeLocal(session.stateKey, text)) throw new Error('This browser refused to store the workbench state (local storage is full or disabled); export the curation table to keep it.');
      return 'this browser';
    },
    async saveExport(fileName, data, mime) {
      const blob = new Blob([data as BlobPart], { type: mime });
      const url = URL.createObjectURL(blob);
      const a = document.createElement('a');
      a.href = url;
      a.download = fileName;
      document.body.append(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
      return `${fileName} (browser downloads)`;
    },
    onCommand() {
      return () => undefined;
    },
  };
}
