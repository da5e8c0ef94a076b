/**
 * Worker-thread entry of `tagbench batch`: receives BatchJob messages one at
 * a time, runs each with runBatchJob, and posts stage and result messages
 * (core/batch/types.ts WorkerMessage) back to the coordinator.
 */
import { parentPort } from 'node:worker_threads';
import type { BatchJob, WorkerMessage } from '../../batch/types';
import { runBatchJob } from './run-batch-job';

const port = parentPort;
if (!port) throw new Error('batch-worker.ts must run in a worker thread');
port.on('message', async (job: BatchJob) => {
  const post = (m: WorkerMessage) => port.postMessage(m);
  const result = await runBatchJob(job, (stage) => post({ type: 'stage', index: job.index, stage }));
  post({ type: 'result', result });
});
