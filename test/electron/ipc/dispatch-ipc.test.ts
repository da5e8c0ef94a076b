import { mkdtemp, mkdir, readFile, readdir, symlink, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeEach, describe, expect, it } from 'vitest';
import { IPC_CHANNELS, MAX_READ_CHUNK_BYTES, SAVED_STATE_FILE, type GrantedSession } from '../../../electron/common/ipc-contract';
import type { IpcMainInvokeEventLike } from '../../../electron/electron-api';
import { createHandlers, type Handlers } from '../../../electron/ipc/create-handlers';
import { dispatchIpc } from '../../../electron/ipc/dispatch-ipc';
import { PathGrants } from '../../../electron/ipc/path-grants';
import { RecentSessions } from '../../../electron/ipc/recent-sessions';

const fromApp: IpcMainInvokeEventLike = { senderFrame: { url: 'app://tagbench/index.html' }, sender: { id: 1 } };
const fromElsewhere: IpcMainInvokeEventLike = { senderFrame: { url: 'https://example.org/' }, sender: { id: 2 } };

let dir: string;
let session: string;
let outside: string;
let picked: string | null;
let savePath: string | null;
let handlers: Handlers;
const logged: string[] = [];
const call = (channel: string, ...args: unknown[]) => dispatchIpc(handlers, fromApp, channel, args, (m) => logged.push(m));

beforeEach(async () => {
  dir = await mkdtemp(join(tmpdir(), 'tagbench-ipc-'));
  session = join(dir, 'session');
  outside = join(dir, 'outside');
  await mkdir(join(session, 'raw'), { recursive: true });
  await mkdir(outside);
  await writeFile(join(session, 'spikes.csv'), 'unit,time\n1,0.5\n2,0.25\n');
  await writeFile(join(session, 'raw', 'probe.bin'), new Uint8Array(1000).map((_, i) => i % 256));
  await writeFile(join(session, '.hidden'), 'x');
  await writeFile(join(outside, 'secret.txt'), 'not yours');
  await symlink(join(outside, 'secret.txt'), join(session, 'link.txt'));
  picked = session;
  savePath = null;
  handlers = createHandlers({
    grants: new PathGrants(),
    recent: new RecentSessions(join(dir, 'recent.json')),
    pickPath: async () => picked,
    pickSavePath: async () => savePath,
  });
});

async function open(): Promise<GrantedSession> {
  const r = await call('session:pick', 'folder');
  if (!r.ok) throw new Error(r.error);
  return r.value as GrantedSession;
}

describe('IPC dispatch: sender, channel and argument checks', () => {
  it('refuses messages from frames that are not the app', async () => {
    const r = await dispatchIpc(handlers, fromElsewhere, 'session:recent', []);
    expect(r).toEqual({ ok: false, error: 'Refused: the message did not come from the workbench window.' });
    expect((await dispatchIpc(handlers, { senderFrame: null, sender: { id: 3 } }, 'session:recent', [])).ok).toBe(false);
    expect((await dispatchIpc(handlers, { senderFrame: { url: 'app://other/x' }, sender: { id: 3 } }, 'session:recent', [])).ok).toBe(false);
  });
  it('refuses unknown channels', async () => {
    const r = await call('fs:readAnything', '/etc/passwd');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(/unknown channel/);
  });
  it.each([
    ['session:pick', ['anything']],
    ['session:pick', []],
    ['session:recent', ['extra']],
    ['file:read', ['g', 'spikes.csv', -1, 10]],
    ['file:read', ['g', 'spikes.csv', 0, MAX_READ_CHUNK_BYTES + 1]],
    ['file:read', ['g', 'spikes.csv', 0.5, 10]],
    ['file:read', ['g', 42, 0, 10]],
    ['session:save-state', ['g', { not: 'text' }]],
    ['export:save', ['../escape.csv', 'x']],
    ['export:save', ['units.csv', 42]],
  ])('refuses %s with bad arguments %j', async (channel, args) => {
    const r = await call(channel, ...args);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(/^Refused: /);
  });
  it('lists exactly the channels the handlers implement', () => {
    expect([...IPC_CHANNELS].sort()).toEqual(Object.keys(handlers).sort());
  });
});

describe('IPC handlers: sessions confined to what the user picked', () => {
  it('opens a picked folder, lists its files (no hidden files, no symlinks) and records it as recent', async () => {
    const g = await open();
    expect(g.kind).toBe('folder');
    expect(g.name).toBe('session');
    expect(g.files).toEqual([
      { name: 'raw/probe.bin', bytes: 1000 },
      { name: 'spikes.csv', bytes: 23 },
    ]);
    expect(g.savedState).toBeNull();
    const recent = await call('session:recent');
    expect(recent.ok && (recent.value as { name: string }[]).map((r) => r.name)).toEqual(['session']);
  });
  it('returns null when the dialog is cancelled', async () => {
    picked = null;
    expect(await call('session:pick', 'folder')).toEqual({ ok: true, value: null });
  });
  it('reads bytes of a granted file in chunks', async () => {
    const g = await open();
    const r = await call('file:read', g.grantId, 'raw/probe.bin', 990, 100);
    expect(r.ok).toBe(true);
    if (r.ok) expect([...(r.value as Uint8Array)]).toEqual([222, 223, 224, 225, 226, 227, 228, 229, 230, 231]);
    const text = await call('file:read', g.grantId, 'spikes.csv', 0, 9);
    if (text.ok) expect(new TextDecoder().decode(text.value as Uint8Array)).toBe('unit,time');
  });
  it.each([
    ['../outside/secret.txt', /not a plain relative file name/],
    ['/etc/passwd', /absolute path/],
    ['raw/../../outside/secret.txt', /not a plain relative file name/],
    ['link.txt', /outside the session folder/],
    ['raw\\..\\spikes.csv', /not allowed/],
    ['missing.csv', /was not found/],
  ])('refuses to read %s', async (name, re) => {
    const g = await open();
    const r = await call('file:read', g.grantId, name, 0, 10);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error).toMatch(re);
  });
  it('refuses reads under a grant id it never gave', async () => {
    await open();
    const r = await call('file:read', 'made-up-grant', 'spikes.csv', 0, 10);
    expect(r).toEqual({ ok: false, error: 'That session is no longer open; open it again.' });
  });
  it('refuses reads past the end of the file', async () => {
    const g = await open();
    const r = await call('file:read', g.grantId, 'spikes.csv', 26, 10);
    expect(r.ok).toBe(false);
  });
  it('opens an NWB grant and reads only that file', async () => {
    await writeFile(join(session, 'rec.nwb'), 'HDF');
    picked = join(session, 'rec.nwb');
    const r = await call('session:pick', 'nwb');
    expect(r.ok).toBe(true);
    const g = (r as { value: GrantedSession }).value;
    expect(g.files).toEqual([{ name: 'rec.nwb', bytes: 3 }]);
    expect((await call('file:read', g.grantId, 'spikes.csv', 0, 3)).ok).toBe(false);
    const ok = await call('file:read', g.grantId, 'rec.nwb', 0, 3);
    expect(ok.ok && new TextDecoder().decode(ok.value as Uint8Array)).toBe('HDF');
  });
  it('reopens a recent session only by an id on the list', async () => {
    await open();
    const list = await call('session:recent');
    const id = (list as { value: { id: string }[] }).value[0].id;
    const again = await call('session:open-recent', id);
    expect(again.ok).toBe(true);
    const bad = await call('session:open-recent', 'ffffffffffffffff');
    expect(bad).toEqual({ ok: false, error: 'That session is not on the recent list.' });
  });
  it('saves the workbench state atomically beside the session and offers it on the next open', async () => {
    const g = await open();
    const state = JSON.stringify({ curation: { '1': { label: 'uncertain' } } });
    const r = await call('session:save-state', g.grantId, state);
    expect(r).toEqual({ ok: true, value: { path: join(await realDir(session), SAVED_STATE_FILE) } });
    expect(await readFile(join(session, SAVED_STATE_FILE), 'utf8')).toBe(state);
    expect((await readdir(session)).filter((n) => n.endsWith('.tmp'))).toEqual([]);
    const g2 = await open();
    expect(g2.savedState).toBe(state);
    const bad = await call('session:save-state', g.grantId, '{not json');
    expect(bad).toEqual({ ok: false, error: 'The workbench state to save is not valid JSON.' });
  });
  it('writes an export where the user chose, or nothing when cancelled', async () => {
    savePath = join(outside, 'units.csv');
    expect(await call('export:save', 'units.csv', 'unit\n1\n')).toEqual({ ok: true, value: { path: savePath } });
    expect(await readFile(savePath, 'utf8')).toBe('unit\n1\n');
    savePath = null;
    expect(await call('export:save', 'units.csv', 'x')).toEqual({ ok: true, value: null });
  });
  it('reports system failures as one sentence without a stack', async () => {
    savePath = join(dir, 'no-such-folder', 'units.csv');
    const r = await call('export:save', 'units.csv', 'x');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error).toMatch(/^Could not complete export:save \(ENOENT\)/);
      expect(r.error).not.toMatch(/\n\s+at /);
    }
    expect(logged.at(-1)).toMatch(/export:save failed/);
  });
});

async function realDir(p: string): Promise<string> {
  const { realpath } = await import('node:fs/promises');
  return realpath(p);
}
