/**
 * The file-system SessionSource of the Node edge: a session folder read with
 * fs, never written. Streams files in 4 MiB chunks (fs.readSync into one
 * reused buffer: the parser copies what it keeps), reads .npy files whole,
 * and offers random access (fs.readSync by offset, into a fresh or a given
 * buffer) for raw voltage files and .npy spike arrays; the descriptor stays
 * open until close() (raw voltage: for the life of the process).
 * Names may reach into subfolders ("sorting/spikes.csv") but never leave the
 * folder (checked again here, after the manifest check).
 */
import { closeSync, openSync, readdirSync, readFileSync, readSync, statSync } from 'node:fs';
import { basename, join, relative, resolve, sep } from 'node:path';
import { InputError } from '../errors';
import type { RandomAccessFile, SessionSource } from '../io/session-source';

const CHUNK = 4 * 1024 * 1024;

export function createFsSessionSource(dir: string): SessionSource {
  const root = resolve(dir);
  const full = (file: string) => {
    const p = resolve(root, file);
    const rel = relative(root, p);
    if (rel.startsWith('..') || rel.split(sep).includes('..')) throw new InputError({ file, problem: 'file names may not leave the session folder' });
    return p;
  };
  const listDir = (d: string, prefix: string, depth: number, out: string[]) => {
    for (const e of readdirSync(d, { withFileTypes: true })) {
      if (e.name.startsWith('.')) continue;
      if (e.isFile()) out.push(prefix + e.name);
      else if (e.isDirectory() && depth < 2) listDir(join(d, e.name), `${prefix}${e.name}/`, depth + 1, out);
    }
  };
  return {
    name: basename(root),
    async list() {
      const out: string[] = [];
      listDir(root, '', 0, out);
      return out;
    },
    async *stream(file: string) {
      const fd = openSync(full(file), 'r');
      try {
        const buf = new Uint8Array(CHUNK);
        for (;;) {
          const n = readSync(fd, buf, 0, CHUNK, null);
          if (n <= 0) break;
          yield buf.subarray(0, n);
        }
      } finally {
        closeSync(fd);
      }
    },
    async readAll(file: string) {
      const b = readFileSync(full(file));
      return new Uint8Array(b.buffer, b.byteOffset, b.byteLength);
    },
    async openRandomAccess(file: string): Promise<RandomAccessFile> {
      const p = full(file);
      const size = statSync(p).size;
      const fd = openSync(p, 'r');
      return {
        size,
        read(offset: number, length: number): Uint8Array {
          const n = Math.max(0, Math.min(length, size - offset));
          const out = new Uint8Array(n);
          let got = 0;
          while (got < n) {
            const k = readSync(fd, out, got, n - got, offset + got);
            if (k <= 0) break;
            got += k;
          }
          return got === n ? out : out.subarray(0, got);
        },
        readInto(offset: number, into: Uint8Array): number {
          const n = Math.max(0, Math.min(into.length, size - offset));
          let got = 0;
          while (got < n) {
            const k = readSync(fd, into, got, n - got, offset + got);
            if (k <= 0) break;
            got += k;
          }
          return got;
        },
        close(): void {
          closeSync(fd);
        },
      };
    },
  };
}
