import { mkdtemp, readdir, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { atomicWrite } from '../../../electron/ipc/atomic-write';
import { checkRelativeName, isInside } from '../../../electron/ipc/path-grants';
import { MAX_RECENT, RecentSessions, recentId } from '../../../electron/ipc/recent-sessions';
import { DEFAULT_WINDOW_STATE, loadWindowState, saveWindowState } from '../../../electron/ipc/window-state';

describe('recent sessions', () => {
  it('moves a reopened session to the top, keeps at most MAX_RECENT, and survives a damaged file', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'tagbench-recent-'));
    const store = new RecentSessions(join(dir, 'recent.json'));
    for (let i = 0; i < MAX_RECENT + 3; i++) await store.add(`/data/s${i}`, 'folder', new Date(Date.UTC(2026, 0, 1, 0, i)));
    await store.add('/data/s0', 'folder', new Date(Date.UTC(2026, 0, 2)));
    const list = await store.list();
    expect(list).toHaveLength(MAX_RECENT);
    expect(list[0]).toMatchObject({ id: recentId('/data/s0'), name: 's0', openedAt: '2026-01-02T00:00:00.000Z' });
    expect(list[1].name).toBe(`s${MAX_RECENT + 2}`);
    await writeFile(join(dir, 'recent.json'), '[{"broken": tru');
    expect(await store.list()).toEqual([]);
  });
});

describe('window state', () => {
  it('round-trips bounds and falls back to the default for damaged or absurd values', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'tagbench-win-'));
    const f = join(dir, 'w.json');
    expect(await loadWindowState(f)).toBe(DEFAULT_WINDOW_STATE);
    const st = { bounds: { x: 10, y: 20, width: 1400, height: 900 }, maximized: true };
    await saveWindowState(f, st);
    expect(await loadWindowState(f)).toEqual(st);
    await writeFile(f, JSON.stringify({ bounds: { x: 0, y: 0, width: 50, height: 900 } }));
    expect(await loadWindowState(f)).toBe(DEFAULT_WINDOW_STATE);
    await writeFile(f, 'garbage');
    expect(await loadWindowState(f)).toBe(DEFAULT_WINDOW_STATE);
  });
});

describe('atomic write', () => {
  it('replaces the file whole and leaves no temporary file', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'tagbench-atomic-'));
    const f = join(dir, 'state.json');
    await atomicWrite(f, 'first');
    await atomicWrite(f, new TextEncoder().encode('second'));
    expect(await readdir(dir)).toEqual(['state.json']);
    await expect(atomicWrite(join(dir, 'missing', 'x.json'), 'x')).rejects.toThrow();
    expect(await readdir(dir)).toEqual(['state.json']);
  });
});

describe('path rules', () => {
  it.each(['spikes.csv', 'raw/probe.bin', 'a b/c.csv'])('accepts %s', (n) => expect(() => checkRelativeName(n)).not.toThrow());
  it.each(['', '/abs', 'C:/x', '..', 'a/../b', './a', 'a//b', 'a\\b', 'a\0b'])('refuses %j', (n) => expect(() => checkRelativeName(n)).toThrow());
  it('isInside compares path segments, not string prefixes', () => {
    expect(isInside('/data/session', '/data/session/spikes.csv')).toBe(true);
    expect(isInside('/data/session', '/data/session')).toBe(true);
    expect(isInside('/data/session', '/data/session2/spikes.csv')).toBe(false);
    expect(isInside('/data/session', '/data')).toBe(false);
  });
});
