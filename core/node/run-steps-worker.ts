/**
 * Worker-thread entry of analyseRecordingThreads: receives one
 * StepsRequest, runs the named steps of the run pipeline (STEPS) on the
 * recording, in list order, and posts one StepsReply: the steps' results, or
 * the error (an InputError's problem is sent as data, so the main thread
 * throws the same user-facing message). Before that, while the main thread
 * imports, it may receive HashRequests (thread-hasher.ts): it hashes each
 * file by path and posts a HashReply; and a FaultInRequest
 * (fault-in-pages.ts): it faults in the pages of the spike array the
 * importer is filling. That request goes first: the importer is waiting on
 * those pages now, on the digests only at its end. So files are hashed in
 * 4 MiB pieces, one per turn of the event loop, and a FaultInRequest that
 * arrives meanwhile runs between two pieces.
 */
import { createHash } from 'node:crypto';
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { setImmediate as nextTurn } from 'node:timers/promises';
import { parentPort } from 'node:worker_threads';
import { isInputError } from '../errors';
import { runSteps } from '../pipeline/run-steps';
import { STEPS } from '../pipeline/steps';
import type { StepsReply, StepsRequest } from './analyse-recording-threads';
import { faultInPages, type FaultInRequest } from './fault-in-pages';
import type { HashReply, HashRequest } from './thread-hasher';

const port = parentPort;
if (!port) throw new Error('run-steps-worker.ts must run in a worker thread');

let buffer: Buffer | null = null;
async function hashFile(req: HashRequest): Promise<HashReply> {
  let fd = -1;
  try {
    fd = openSync(req.path, 'r');
    const mtimeBefore = fstatSync(fd).mtimeMs;
    const h = createHash('sha256');
    buffer ??= Buffer.allocUnsafe(4 * 1024 * 1024);
    let bytes = 0;
    for (;;) {
      const n = readSync(fd, buffer, 0, buffer.length, bytes);
      if (n === 0) break;
      h.update(buffer.subarray(0, n));
      bytes += n;
      await nextTurn(); // lets a FaultInRequest in
    }
    const mtimeAfter = fstatSync(fd).mtimeMs;
    return { kind: 'hash', id: req.id, sha256: h.digest('hex'), bytes, mtimeBefore, mtimeAfter };
  } catch (e) {
    return { kind: 'hash', id: req.id, error: (e as Error).message };
  } finally {
    if (fd >= 0) closeSync(fd);
  }
}

// Files are hashed one at a time, in the order asked (they share `buffer`).
const hashQueue: HashRequest[] = [];
let hashing = false;
async function hashQueued(): Promise<void> {
  if (hashing) return;
  hashing = true;
  for (let req = hashQueue.shift(); req; req = hashQueue.shift()) port!.postMessage(await hashFile(req));
  hashing = false;
}

port.on('message', (req: StepsRequest | HashRequest | FaultInRequest) => {
  if ('kind' in req) {
    if (req.kind === 'fault-in') {
      try {
        faultInPages(req);
      } catch {
        // only a head start: the importer takes the faults itself
      }
      return;
    }
    hashQueue.push(req);
    void hashQueued();
    return;
  }
  let reply: StepsReply;
  try {
    const steps = req.steps.map((name) => {
      const step = STEPS.find((s) => s.name === name);
      if (!step) throw new Error(`no analysis step named "${name}"`);
      return step;
    });
    reply = { ok: true, results: runSteps(req.recording, req.parameters, steps) };
  } catch (e) {
    const err = e as Error;
    reply = isInputError(e) ? { ok: false, problem: e.problem, message: e.message } : { ok: false, message: String(err?.message ?? e), stack: err?.stack };
  }
  port.postMessage(reply);
});
