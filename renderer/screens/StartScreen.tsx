import { useEffect, useState } from 'react';
import type { Host, OpenedSession, RecentEntry } from '../host/host';
import { filesToSession } from '../host/browser-host';

/** Reads every file below a dropped folder (File System entries API). */
async function entriesToFiles(entry: FileSystemEntry, prefix: string, out: File[]): Promise<void> {
  if (entry.isFile) {
    const file = await new Promise<File>((res, rej) => (entry as FileSystemFileEntry).file(res, rej));
    Object.defineProperty(file, 'webkitRelativePath', { value: `${prefix}${file.name}` });
    out.push(file);
  } else if (entry.isDirectory) {
    const reader = (entry as FileSystemDirectoryEntry).createReader();
    for (;;) {
      const batch = await new Promise<FileSystemEntry[]>((res, rej) => reader.readEntries(res, rej));
      if (batch.length === 0) break;
      for (const e of batch) await entriesToFiles(e, `${prefix}${entry.name}/`, out);
    }
  }
}

/** Start: open the bundled demo, a session folder or an NWB file (buttons or drag and drop), or a recent session. */
export function StartScreen(props: {
  host: Host;
  onDemo: () => void;
  onPick: (kind: 'folder' | 'nwb') => void;
  onOpenWith: (get: () => Promise<OpenedSession | null>) => void;
  busy: boolean;
}) {
  const { host, onDemo, onPick, onOpenWith, busy } = props;
  const [recent, setRecent] = useState<RecentEntry[]>([]);
  const [over, setOver] = useState(false);
  useEffect(() => {
    void host.recent().then(setRecent, () => setRecent([]));
  }, [host]);

  const onDrop = (e: React.DragEvent) => {
    e.preventDefault();
    setOver(false);
    const items = [...e.dataTransfer.items].map((i) => i.webkitGetAsEntry()).filter((x): x is FileSystemEntry => !!x);
    // Without file-system entries (some browsers, files dropped from a program): the plain files, one .nwb or a flat folder.
    const plain = items.length === 0 ? [...e.dataTransfer.files] : [];
    onOpenWith(async () => {
      if (plain.length > 0) return filesToSession(plain, plain.length === 1 && /\.nwb$/i.test(plain[0].name) ? 'nwb' : 'folder');
      const files: File[] = [];
      if (items.length === 1 && items[0].isFile && /\.nwb$/i.test(items[0].name)) {
        await entriesToFiles(items[0], '', files);
        return filesToSession(files, 'nwb');
      }
      for (const it of items) await entriesToFiles(it, it.isDirectory ? '' : 'dropped/', files);
      return filesToSession(files, 'folder');
    });
  };

  return (
    <div className="start">
      <section className="start-main">
        <h1>Open a recording session</h1>
        <p className="lead">
          A session is a folder of sorted spikes with the laser pulses, task events and trials (CSV or NumPy .npy), or one NWB file.
        </p>
        <div className="start-actions">
          <button className="primary" onClick={onDemo} disabled={busy} data-testid="open-demo">
            Open the demo session
          </button>
          <button onClick={() => onPick('folder')} disabled={busy}>
            Open session folder...
          </button>
          <button onClick={() => onPick('nwb')} disabled={busy}>
            Open NWB file...
          </button>
        </div>
        <div
          className={over ? 'dropzone over' : 'dropzone'}
          onDragOver={(e) => {
            e.preventDefault();
            setOver(true);
          }}
          onDragLeave={() => setOver(false)}
          onDrop={onDrop}
          data-testid="dropzone"
        >
          or drop a session folder or an .nwb file here
        </div>
        <p className="muted">
          The demo is an invented session: a head-fixed mouse hears a tone sweep up for 4 s before a drop of sweetened water; on probe
          trials the sweep jumps ahead or back; a light block of 5 ms pulses ends the session. Every number in it is simulated.
        </p>
      </section>
      <aside className="start-side">
        <h2>Recent sessions</h2>
        {recent.length === 0 ? (
          <p className="muted">None yet.</p>
        ) : (
          <ul className="recent">
            {recent.map((r) => (
              <li key={r.id}>
                {r.reopenable ? (
                  <button className="link" onClick={() => (r.id === 'demo' ? onDemo() : onOpenWith(() => host.openRecent(r.id)))} disabled={busy}>
                    {r.name}
                  </button>
                ) : (
                  <span title="Pick the folder again to reopen it in the browser">{r.name}</span>
                )}
                <span className="muted small"> {r.displayPath} · {new Date(r.openedAt).toLocaleString()}</span>
              </li>
            ))}
          </ul>
        )}
        <h2>Before you rely on a verdict</h2>
        <ul className="cautions">
          <li>Every verdict is a statistical screen, not proof of a cell's identity. Read the reasons and look at the rasters.</li>
          <li>Laser work follows your institution's laser-safety rules and your approved animal protocols.</li>
          <li>Light can heat tissue and change firing without any opsin, and can make photoelectric artefacts at the electrode that look like fast, jitter-free responses. Run the controls.</li>
        </ul>
      </aside>
    </div>
  );
}
