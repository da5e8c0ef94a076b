/**
 * Worker-thread entry of analyseRecordingThreads: receives one
 * StepsRequest, runs the named steps of the run pipeline (STEPS) on the
 * recording, in list order, and posts one StepsReply: the steps' results, or
 * the error (an InputError's problem is sent as data, so the main thread
 * throws the same user-facing message).
 */
import { parentPort } from 'node:worker_threads';
import { isInputError } from '../errors';
import { runSteps } from '../pipeline/run-steps';
import { STEPS } from '../pipeline/steps';
import type { StepsReply, StepsRequest } from './analyse-recording-threads';

const port = parentPort;
if (!port) throw new Error('run-steps-worker.ts must run in a worker thread');
port.on('message', (req: StepsRequest) => {
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
