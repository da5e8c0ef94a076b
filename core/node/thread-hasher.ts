/**
 * SHA-256 of large input files on another thread while the importer reads
 * them on this one. `run` starts its analysis worker before importing
 * (startSpareThread); during the import that CPU is otherwise idle, and
 * hashing the reference session's 234 MB costs ~0.2 s on this one.
 *
 * createHash(file) is the importer's hash factory (ImportOptions.createHash).
 * For a file of at least `minBytes` it asks the worker to hash the file by
 * path (run-steps-worker.ts reads it in 4 MiB pieces) and returns a stand-in
 * whose update() does nothing and whose digestHex() is a placeholder; smaller
 * files are hashed here as before (node:crypto). settle(inputs) waits for the
 * worker's digests and puts them in place of the placeholders.
 *
 * The digest must describe the bytes the importer read, which a second read
 * only does if the file did not change in between. So the file's modification
 * time is noted here before the importer reads it, the worker notes it before
 * and after its own read, and settle() checks it once more; the worker's byte
 * count must equal the importer's. Any difference is the same InputError as
 * a file that changes while the importer reads it twice.
 */
import { statSync } from 'node:fs';
import { join } from 'node:path';
import type { Worker } from 'node:worker_threads';
import { InputError } from '../errors';
import type { Sha256 } from '../io/create-sha256';
import type { InputFileRecord } from '../io/import-result';
import { nodeSha256 } from './node-sha256';

/** What the main thread posts to run-steps-worker.ts to hash a file. */
export interface HashRequest {
  readonly kind: 'hash';
  readonly id: number;
  readonly path: string;
}

/** The worker's answer. */
export type HashReply =
  | { readonly kind: 'hash'; readonly id: number; readonly sha256: string; readonly bytes: number; readonly mtimeBefore: number; readonly mtimeAfter: number }
  | { readonly kind: 'hash'; readonly id: number; readonly error: string };

export interface ThreadHasher {
  createHash(file: string): Sha256;
  settle(inputs: readonly InputFileRecord[]): Promise<InputFileRecord[]>;
}

const PLACEHOLDER = 'hashing-in-thread:';

export function threadHasher(dir: string, worker: Worker, minBytes = 8 * 1024 * 1024): ThreadHasher {
  let next = 0;
  const pending = new Map<string, { file: string; path: string; mtime: number; reply: Promise<HashReply> }>();
  return {
    createHash(file: string): Sha256 {
      const path = join(dir, file);
      let mtime: number;
      let size: number;
      try {
        const st = statSync(path);
        mtime = st.mtimeMs;
        size = st.size;
      } catch {
        return nodeSha256();
      }
      if (size < minBytes) return nodeSha256();
      const id = next++;
      const reply = new Promise<HashReply>((resolve) => {
        const onMessage = (m: unknown) => {
          const r = m as HashReply;
          if (r && r.kind === 'hash' && r.id === id) {
            worker.off('message', onMessage);
            resolve(r);
          }
        };
        worker.on('message', onMessage);
      });
      const request: HashRequest = { kind: 'hash', id, path };
      worker.postMessage(request);
      const key = `${PLACEHOLDER}${id}`;
      pending.set(key, { file, path, mtime, reply });
      return { update: () => undefined, digestHex: () => key };
    },
    async settle(inputs) {
      const out: InputFileRecord[] = [];
      for (const input of inputs) {
        const p = pending.get(input.sha256);
        if (!p) {
          out.push(input);
          continue;
        }
        const r = await p.reply;
        if ('error' in r) throw new Error(`hashing ${p.path} on the analysis thread failed: ${r.error}`);
        let mtimeNow = NaN;
        try {
          mtimeNow = statSync(p.path).mtimeMs;
        } catch {
          // gone: reported below
        }
        if (r.bytes !== input.bytes || r.mtimeBefore !== p.mtime || r.mtimeAfter !== p.mtime || mtimeNow !== p.mtime) {
          throw new InputError({ file: p.file, problem: 'the file changed while it was being read', fix: 'wait until the files are completely written, then import again' });
        }
        out.push({ ...input, sha256: r.sha256 });
      }
      return out;
    },
  };
}
