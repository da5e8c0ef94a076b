/**
 * analyseRecording on two threads: the light step (and any other step that
 * is not self-contained) runs on the calling thread while the self-contained
 * steps after it (ramp, jump, cluster, quality: see AnalysisStep.selfContained)
 * run in a worker thread on the same spike memory. The result is the same as
 * analyseRecording's, to the bit: every step runs the same code on the same
 * data, and the results are joined in the steps' list order
 * (combineStepResults).
 *
 * Falls back to analyseRecording (one thread) when:
 *   - fewer than 2 CPUs are available to this process (availableParallelism
 *     follows the process's CPU affinity, e.g. a cluster job given one core);
 *   - the recording is small (fewer than `minSpikes` spikes, default 2 M:
 *     starting the worker and loading its modules costs a few tenths of a
 *     second, more than the work it would take over; measured on the
 *     development machine, see README "Performance");
 *   - the spike times are not all on one SharedArrayBuffer (importSession's
 *     `sharedMemory` option): posting them would copy every spike, doubling
 *     the memory of the largest array.
 * Only steps after the last step that is not self-contained are moved, so no
 * step on the calling thread ever needs a column made in the worker.
 */
import { availableParallelism } from 'node:os';
import type { Worker } from 'node:worker_threads';
import type { Parameters } from '../defaults';
import { InputError, type InputProblem } from '../errors';
import type { Recording } from '../model/types';
import { analyseRecording, type AnalysisResult } from '../pipeline/analyse-recording';
import { combineStepResults } from '../pipeline/combine-step-results';
import { runSteps } from '../pipeline/run-steps';
import { STEPS } from '../pipeline/steps';
import type { AnalysisStep, StepResult } from '../pipeline/types';
import { startWorkerThread } from './start-worker-thread';

/** What the main thread posts to run-steps-worker.ts. */
export interface StepsRequest {
  /** The recording without `raw` (a file reader cannot cross threads). */
  readonly recording: Recording;
  readonly parameters: Parameters;
  /** Names of the steps to run, in list order. */
  readonly steps: readonly string[];
}

/** What run-steps-worker.ts posts back. */
export type StepsReply =
  | { readonly ok: true; readonly results: readonly { readonly name: string; readonly result: StepResult }[] }
  | { readonly ok: false; readonly problem?: InputProblem; readonly message: string; readonly stack?: string };

export interface ThreadOptions {
  /** Threads available (default: availableParallelism()). */
  readonly threads?: number;
  /** Smallest total spike count worth a second thread (default 2,000,000). */
  readonly minSpikes?: number;
  /** The steps (default STEPS); the worker runs the named steps of STEPS, so a custom list runs on one thread. */
  readonly steps?: readonly AnalysisStep[];
  /** Told the plan before the steps run (tests; a progress display). */
  readonly onPlan?: (plan: ThreadPlan) => void;
  /** A worker started ahead (startSpareThread), used if the plan needs one, else ended. */
  readonly spare?: SpareThread;
}

/**
 * A worker thread for analyseRecordingThreads started ahead of need, e.g.
 * before the session is imported, so that its start (~0.1 s) overlaps the
 * import on the other CPU. It never keeps the process alive (unref); pass it
 * to analyseRecordingThreads, and close() it when done either way (close is
 * idempotent and also ends a worker that was never used). Undefined (no
 * thread started) when fewer than 2 threads are available (`threads`,
 * default availableParallelism()).
 */
export interface SpareThread {
  readonly worker: Promise<Worker | null>;
  close(): Promise<void>;
}

export function startSpareThread(threads: number = availableParallelism()): SpareThread | undefined {
  if (threads < 2) return undefined;
  const worker = startWorkerThread('core/node/run-steps-worker').then(
    (w) => {
      w.unref();
      return w;
    },
    () => null,
  );
  let closed: Promise<void> | null = null;
  return {
    worker,
    close: () => (closed ??= worker.then(async (w) => void (await w?.terminate()))),
  };
}

/** Which steps go to the worker (none: one thread) and why. */
export interface ThreadPlan {
  readonly moved: readonly AnalysisStep[];
  readonly reason: string;
}

/**
 * Decides how analyseRecordingThreads runs: the self-contained steps after the
 * last step that is not self-contained go to the worker, unless one of the
 * fallbacks above applies (then `moved` is empty and `reason` says which).
 */
export function planThreads(recording: Recording, steps: readonly AnalysisStep[], threads: number, minSpikes: number): ThreadPlan {
  if (steps !== STEPS) return { moved: [], reason: 'a custom step list runs on one thread' };
  if (threads < 2) return { moved: [], reason: 'one CPU available' };
  let spikes = 0;
  for (const u of recording.units) spikes += u.spikeTimes.length;
  if (spikes < minSpikes) return { moved: [], reason: `${spikes} spikes: fewer than ${minSpikes}` };
  if (!recording.units.every((u) => u.spikeTimes.buffer instanceof SharedArrayBuffer)) return { moved: [], reason: 'spike times not on shared memory' };
  let last = -1;
  steps.forEach((s, i) => {
    if (!s.selfContained) last = i;
  });
  const moved = steps.slice(last + 1);
  if (moved.length === 0 || moved.length === steps.length) return { moved: [], reason: 'no split of the steps leaves work on both threads' };
  return { moved, reason: `${moved.map((s) => s.name).join(', ')} in a worker thread` };
}

/**
 * Runs `work` with a spare thread started first (startSpareThread(threads)),
 * handing it the thread to help the import (loadSession's importHelper:
 * hashing large inputs, faulting in the spike memory) and to pass to analyseRecordingThreads; ends
 * the thread afterwards, also when `work` throws. Without a second CPU both
 * are undefined and everything runs on this thread.
 */
export async function withSpareThread<T>(threads: number | undefined, work: (t: { readonly spare?: SpareThread; readonly importHelper?: Worker }) => Promise<T>): Promise<T> {
  const spare = startSpareThread(threads);
  try {
    return await work({ spare, importHelper: (await spare?.worker) ?? undefined });
  } finally {
    await spare?.close();
  }
}

export async function analyseRecordingThreads(recording: Recording, parameters: Parameters, opts: ThreadOptions = {}): Promise<AnalysisResult> {
  const steps = opts.steps ?? STEPS;
  const plan = planThreads(recording, steps, opts.threads ?? availableParallelism(), opts.minSpikes ?? 2_000_000);
  opts.onPlan?.(plan);
  const { moved } = plan;
  if (moved.length === 0) {
    await opts.spare?.close();
    return analyseRecording(recording, parameters, steps);
  }
  const worker = (await opts.spare?.worker) ?? (await startWorkerThread('core/node/run-steps-worker'));
  try {
    const reply = new Promise<StepsReply>((resolve, reject) => {
      const onMessage = (m: StepsReply | { kind: 'hash' }) => {
        if ('kind' in m) return; // a late hash reply (thread-hasher.ts) is not the answer
        worker.off('message', onMessage);
        resolve(m);
      };
      worker.on('message', onMessage);
      worker.once('error', reject);
      worker.once('exit', (code) => reject(new Error(`the analysis thread stopped before answering (exit code ${code})`)));
    });
    reply.catch(() => undefined); // handled below, or moot when a step here throws first
    const { raw: _fileReader, ...withoutRaw } = recording;
    const request: StepsRequest = { recording: withoutRaw, parameters, steps: moved.map((s) => s.name) };
    worker.postMessage(request);
    const results = runSteps(recording, parameters, steps.slice(0, steps.length - moved.length));
    const r = await reply;
    if (!r.ok) {
      if (r.problem) throw new InputError(r.problem);
      const e = new Error(`analysis thread: ${r.message}`);
      if (r.stack) e.stack = `${e.stack}\n--- in the analysis thread ---\n${r.stack}`;
      throw e;
    }
    return combineStepResults([...results, ...r.results], recording.units.length);
  } finally {
    await worker.terminate();
  }
}
