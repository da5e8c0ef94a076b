import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { serializeSessionFile } from '../../../core/curation/serialize-session-file';
import { atomicWriteFile } from '../../../core/node/atomic-write-file';
import { loadSessionFile, saveSessionFile } from '../../../core/node/session-store';
import { isInputError } from '../../../core/errors';
import { makeSession } from './helpers/make-session';

const HERE = dirname(fileURLToPath(import.meta.url));
const ROOT = resolve(HERE, '../../..');
const dirs: string[] = [];
const tmp = () => {
  const d = mkdtempSync(join(tmpdir(), 'tagbench-session-'));
  dirs.push(d);
  return d;
};
afterAll(() => dirs.forEach((d) => rmSync(d, { recursive: true, force: true })));

/** A loadable file; notes that name a version name the file's own version (one whole version). */
const wholeVersion = (path: string) => {
  const { session, fromBackup } = loadSessionFile(path);
  const v = Number(/^version (\d+)$/.exec(session.savedWith)![1]);
  for (const [id, u] of Object.entries(session.curation.units)) {
    const t = u.note!.text;
    expect(t.startsWith(`version ${v} of ${id}:`) || t.startsWith(`note of ${id}:`)).toBe(true);
  }
  return { v, fromBackup };
};

describe('atomicWriteFile', () => {
  it('replaces the file and keeps the previous version as .bak', () => {
    const d = tmp();
    const p = join(d, 'a.json');
    atomicWriteFile(p, 'one', { backup: true });
    expect(existsSync(`${p}.bak`)).toBe(false);
    atomicWriteFile(p, 'two', { backup: true });
    atomicWriteFile(p, 'three', { backup: true });
    expect(readFileSync(p, 'utf8')).toBe('three');
    expect(readFileSync(`${p}.bak`, 'utf8')).toBe('two');
    expect(readdirSync(d).sort()).toEqual(['a.json', 'a.json.bak']); // no temporary files left
  });
});

describe('session file save and load', () => {
  it('round-trips a session exactly', () => {
    const p = join(tmp(), 's.json');
    const s = makeSession(3, 5);
    saveSessionFile(p, s);
    const back = loadSessionFile(p);
    expect(back.fromBackup).toBe(false);
    expect(back.notice).toBe('');
    expect(serializeSessionFile(back.session)).toBe(serializeSessionFile(s));
  });
  it('falls back to the backup when the main file is broken, says so, and keeps the good backup on the next save', () => {
    const p = join(tmp(), 's.json');
    saveSessionFile(p, makeSession(1, 3));
    saveSessionFile(p, makeSession(2, 3));
    writeFileSync(p, '{"format": "tagbench-session", "schemaVers'); // a file cut short
    const got = loadSessionFile(p);
    expect(got.fromBackup).toBe(true);
    expect(got.session.savedWith).toBe('version 1');
    expect(got.notice).toMatch(/^Loaded the backup s\.json\.bak because the session file could not be used: s\.json: not valid JSON/);
    saveSessionFile(p, makeSession(3, 3));
    expect(loadSessionFile(`${p}.bak`).session.savedWith).toBe('version 1'); // the broken file did not become the backup
    expect(loadSessionFile(p).session.savedWith).toBe('version 3');
  });
  it('names both problems when main file and backup are broken, and the missing file when there is none', () => {
    const d = tmp();
    const p = join(d, 's.json');
    writeFileSync(p, '[]');
    writeFileSync(`${p}.bak`, '{}');
    expect(() => loadSessionFile(p)).toThrow(/s\.json: the session file and its backup are both unreadable \(s\.json: field \(top level\): expected a JSON object.*Backup: s\.json\.bak: field format/);
    let err: unknown;
    try {
      loadSessionFile(join(d, 'none.json'));
    } catch (e) {
      err = e;
    }
    expect(isInputError(err)).toBe(true);
    expect((err as Error).message).toBe('none.json: session file not found. Check the path.');
  });
});

describe('kill the process during a save (SIGKILL, many times)', () => {
  it('leaves the session file as the old or the new version, never broken', async () => {
    const d = tmp();
    const p = join(d, 'session.json');
    const child = join(HERE, 'helpers/save-loop.ts');
    const kills = 10;
    let nextFirst = 1;
    let lastSeen = 0;
    let leftovers = 0;
    let live: ReturnType<typeof spawn> | null = null;
    try {
    for (let k = 0; k < kills; k++) {
      // node itself runs the saver (tsx as a loader), so SIGKILL hits the process that writes
      const proc = spawn(process.execPath, ['--import', 'tsx', child, p, '3000', String(nextFirst)], { cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
      live = proc;
      let stderr = '';
      proc.stderr!.on('data', (b) => (stderr += b));
      await new Promise<void>((res, rej) => {
        proc.stdout!.on('data', (b) => String(b).includes('ready') && res());
        proc.on('exit', () => rej(new Error(`save loop ended early: ${stderr}`)));
      });
      // kill at a different point of the write cycle each time
      await new Promise((r) => setTimeout(r, 20 + ((k * 37) % 120)));
      const exited = new Promise((r) => proc.on('exit', r));
      proc.kill('SIGKILL');
      await exited;
      live = null;
      // the main file is a whole version, loaded without falling back to the backup
      const { v, fromBackup } = wholeVersion(p);
      expect(fromBackup).toBe(false);
      expect(v).toBeGreaterThanOrEqual(Math.max(nextFirst, lastSeen));
      // and the backup is a whole version, not newer (equal when the kill fell between backup and rename)
      // (no backup yet when the kill fell inside the second save, before the backup step)
      if (existsSync(`${p}.bak`)) expect(wholeVersion(`${p}.bak`).v).toBeLessThanOrEqual(v);
      else expect(v).toBe(nextFirst);
      lastSeen = v;
      nextFirst = v + 1000;
      leftovers += readdirSync(d).filter((f) => f.includes('.tmp-')).length > 0 ? 1 : 0;
      for (const f of readdirSync(d)) if (f.includes('.tmp-') || f.includes('.bak-')) rmSync(join(d, f));
    }
    } finally {
      // never leave a saver running (e.g. when the test times out on a busy machine)
      live?.kill('SIGKILL');
    }
    // Evidence that kills landed mid-write (a temporary file was left behind) at least once;
    // otherwise this test would prove nothing.
    expect(leftovers).toBeGreaterThan(0);
  }, 600_000);
});
