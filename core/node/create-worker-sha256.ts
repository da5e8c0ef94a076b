/**
 * SHA-256 (node:crypto) computed on a second thread while the importer
 * parses, for the Node edge: hashing a 20 M-spike session's 300 MB takes
 * ~0.3 s of CPU that then no longer delays the import on a multi-core machine.
 *
 * createWorkerSha256() returns a factory with the Sha256 interface of
 * core/io/create-sha256.ts (same digests: checked against node:crypto in
 * test/core/node/create-worker-sha256.test.ts) and close(). Each hash first
 * hashes on the calling thread; once a stream passes INLINE_BYTES (1 MiB)
 * its bytes go through a ring of shared-memory slots (4 x 1 MiB, reused: no
 * allocation per update) to one worker thread, which hashes them in order.
 * update() copies the bytes into the ring (waiting only when the ring is
 * full); digestHex() waits for the worker's digest. So small files never wait
 * for the worker, and the input bytes are hashed exactly as read.
 * Several hashes may be open at once. The worker is unref'd and ended by
 * close(); where no worker can be started, hashes stay on the calling thread.
 * A worker failure (or no answer within 60 s) is an Error (a bug, not an
 * input problem).
 */
import { createHash } from 'node:crypto';
import { Worker } from 'node:worker_threads';
import type { Sha256 } from '../io/create-sha256';

const SLOTS = 4;
const SLOT_BYTES = 1 << 20;
const INLINE_BYTES = 1 << 20;
const WAIT_MS = 60_000;

// control words (Int32): produced slots, consumed slots, digests done, worker error flag
const HEAD = 0;
const TAIL = 1;
const DONE = 2;
const FAILED = 3;
// per slot header (Int32): stream id, kind, byte length
const KIND_DATA = 0;
const KIND_DIGEST = 1;

const WORKER_SOURCE = `
const { workerData } = require('node:worker_threads');
const { createHash } = require('node:crypto');
const { control, headers, data, result, slots, slotBytes } = workerData;
const c = new Int32Array(control);
const h = new Int32Array(headers);
const res = new Uint8Array(result);
const hashes = new Map();
try {
  for (let tail = 0; ; tail++) {
    while (Atomics.load(c, 0) === tail) Atomics.wait(c, 0, tail);
    const s = tail % slots;
    const id = h[3 * s], kind = h[3 * s + 1], len = h[3 * s + 2];
    let hash = hashes.get(id);
    if (!hash) hashes.set(id, (hash = createHash('sha256')));
    if (kind === 0) hash.update(new Uint8Array(data, s * slotBytes, len));
    else {
      res.set(Buffer.from(hash.digest('hex'), 'latin1'));
      hashes.delete(id);
      Atomics.store(c, 2, Atomics.load(c, 2) + 1);
      Atomics.notify(c, 2);
    }
    Atomics.store(c, 1, tail + 1);
    Atomics.notify(c, 1);
  }
} catch (e) {
  Atomics.store(c, 3, 1);
  Atomics.notify(c, 1);
  Atomics.notify(c, 2);
  throw e;
}
`;

export interface WorkerSha256 {
  /** A new incremental hash (Sha256 interface). */
  readonly createHash: () => Sha256;
  /** Ends the worker (pending digests must have been taken). */
  close(): void;
}

export function createWorkerSha256(): WorkerSha256 {
  let worker: Worker | null = null;
  let control: Int32Array;
  let headers: Int32Array;
  let data: Uint8Array;
  let result: Uint8Array;
  let head = 0;
  let digests = 0;
  let nextId = 1;

  let unavailable = false;
  /** Starts the worker once; false when this host cannot run one (then every hash stays inline). */
  const ready = (): boolean => {
    if (worker) return true;
    if (unavailable) return false;
    try {
      start();
      return true;
    } catch {
      unavailable = true;
      return false;
    }
  };
  const start = () => {
    const sab = (n: number) => new SharedArrayBuffer(n);
    const c = sab(4 * 4);
    const h = sab(3 * 4 * SLOTS);
    const d = sab(SLOT_BYTES * SLOTS);
    const r = sab(64);
    control = new Int32Array(c);
    headers = new Int32Array(h);
    data = new Uint8Array(d);
    result = new Uint8Array(r);
    worker = new Worker(WORKER_SOURCE, { eval: true, workerData: { control: c, headers: h, data: d, result: r, slots: SLOTS, slotBytes: SLOT_BYTES } });
    worker.unref();
    worker.on('error', () => {}); // reported through the FAILED word
  };
  const waitWhile = (index: number, value: number) => {
    const t0 = Date.now();
    while (Atomics.load(control, index) === value) {
      if (Atomics.load(control, FAILED)) throw new Error('sha256 worker failed');
      Atomics.wait(control, index, value, 1000);
      if (Date.now() - t0 > WAIT_MS) throw new Error('sha256 worker did not answer');
    }
  };
  /** Claims the next slot (waiting while all are in use) and publishes it after fill(). */
  const send = (id: number, kind: number, bytes: Uint8Array | null) => {
    for (;;) {
      const tail = Atomics.load(control, TAIL);
      if (head - tail < SLOTS) break;
      waitWhile(TAIL, tail);
    }
    const s = head % SLOTS;
    headers[3 * s] = id;
    headers[3 * s + 1] = kind;
    headers[3 * s + 2] = bytes ? bytes.length : 0;
    if (bytes) data.set(bytes, s * SLOT_BYTES);
    head++;
    Atomics.store(control, HEAD, head);
    Atomics.notify(control, HEAD);
  };

  return {
    createHash(): Sha256 {
      const id = nextId++;
      let inline: ReturnType<typeof createHash> | null = createHash('sha256');
      let seen = 0;
      let pending: Uint8Array[] = []; // bytes hashed inline so far, replayed to the worker on switching
      let done = false;
      const toWorker = (bytes: Uint8Array) => {
        for (let o = 0; o < bytes.length; o += SLOT_BYTES) send(id, KIND_DATA, bytes.subarray(o, Math.min(bytes.length, o + SLOT_BYTES)));
      };
      return {
        update(bytes: Uint8Array): void {
          if (done) throw new Error('sha256: update after digest');
          if (inline) {
            if (seen + bytes.length <= INLINE_BYTES) {
              inline.update(bytes);
              pending.push(bytes.slice());
              seen += bytes.length;
              return;
            }
            if (!ready()) {
              // no worker on this host: hash on this thread
              inline.update(bytes);
              pending = [];
              seen = Infinity;
              return;
            }
            inline = null; // switch: the worker hashes from the first byte
            for (const p of pending) toWorker(p);
            pending = [];
          }
          toWorker(bytes);
        },
        digestHex(): string {
          if (done) throw new Error('sha256: digest called twice');
          done = true;
          if (inline) return inline.digest('hex');
          const want = ++digests;
          send(id, KIND_DIGEST, null);
          while (Atomics.load(control, DONE) < want) waitWhile(DONE, Atomics.load(control, DONE));
          // digests are answered in order, one at a time: the result area holds this one
          return Buffer.from(result).toString('latin1');
        },
      };
    },
    close(): void {
      if (worker) void worker.terminate();
      worker = null;
    },
  };
}
