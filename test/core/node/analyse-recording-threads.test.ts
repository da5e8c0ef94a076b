// analyseRecordingThreads must give exactly analyseRecording's result (same code on the same
// data, joined in list order), on the bundled demo session, with a real worker thread.
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyseRecordingThreads, planThreads, startSpareThread } from '../../../core/node/analyse-recording-threads';
import { loadSession } from '../../../core/node/load-session';
import { startWorkerThread } from '../../../core/node/start-worker-thread';
import { isInputError } from '../../../core/errors';
import { analyseRecording } from '../../../core/pipeline/analyse-recording';
import { STEPS } from '../../../core/pipeline/steps';
import { resolveParameters } from '../../../core/resolve-parameters';
import { formatDelimited } from '../../../core/table/format-delimited';
import type { StepsReply } from '../../../core/node/analyse-recording-threads';

const DEMO = join(__dirname, '../../../sample-data/demo');

describe('analyseRecordingThreads', () => {
  it('gives the one-thread result to the bit, with ramp, jump, cluster and quality in a worker', async () => {
    const imported = await loadSession(DEMO, { sharedMemory: true });
    const p = resolveParameters(imported.parameterSources);
    const plan = planThreads(imported.recording, STEPS, 2, 0);
    expect(plan.moved.map((s) => s.name)).toEqual(['ramp', 'jump', 'cluster', 'quality']);
    const one = analyseRecording(imported.recording, p);
    const plans: string[] = [];
    const two = await analyseRecordingThreads(imported.recording, p, { threads: 2, minSpikes: 0, onPlan: (pl) => plans.push(pl.reason) });
    expect(plans).toEqual(['ramp, jump, cluster, quality in a worker thread']);
    expect(formatDelimited(two.table)).toBe(formatDelimited(one.table));
    expect(two.table.columns.map((c) => c.name)).toEqual(one.table.columns.map((c) => c.name));
    expect(JSON.stringify(two.summaries)).toBe(JSON.stringify(one.summaries));
    expect(Object.keys(two.summaries)).toEqual(['basic', 'light', 'ramp', 'jump', 'cluster', 'quality']);
    expect(JSON.stringify(two.warnings)).toBe(JSON.stringify(one.warnings));
  }, 120_000);

  it('re-throws a worker step\'s input problem as the same InputError', async () => {
    const imported = await loadSession(DEMO, { sharedMemory: true });
    // The demo has no behaviour.csv, so naming a progress variable is a user error of the ramp step.
    const p = resolveParameters([...imported.parameterSources, { file: 'analysis.json', overrides: { ramp: { progressVariable: 'position' } } }]);
    let one: unknown;
    try {
      analyseRecording(imported.recording, p);
    } catch (e) {
      one = e;
    }
    expect(isInputError(one)).toBe(true);
    const plans: number[] = [];
    const two = await analyseRecordingThreads(imported.recording, p, { threads: 2, minSpikes: 0, onPlan: (pl) => plans.push(pl.moved.length) }).then(
      () => null,
      (e: unknown) => e,
    );
    expect(plans).toEqual([4]);
    expect(isInputError(two)).toBe(true);
    expect((two as Error).message).toBe((one as Error).message);
    expect((two as Error).message).toContain('ramp.progressVariable');
  }, 120_000);

  it('uses a spare thread started ahead, and ends a spare it does not need', async () => {
    const imported = await loadSession(DEMO, { sharedMemory: true });
    const p = resolveParameters(imported.parameterSources);
    const one = analyseRecording(imported.recording, p);
    expect(startSpareThread(1)).toBeUndefined();
    const used = startSpareThread(2)!;
    const w = await used.worker;
    expect(w).not.toBeNull();
    let exited = false;
    w!.once('exit', () => (exited = true));
    const two = await analyseRecordingThreads(imported.recording, p, { threads: 2, minSpikes: 0, spare: used });
    expect(formatDelimited(two.table)).toBe(formatDelimited(one.table));
    expect(exited).toBe(true); // analyseRecordingThreads ended it
    await used.close(); // idempotent
    const unused = startSpareThread(2)!;
    const u = await unused.worker;
    let unusedExited = false;
    u!.once('exit', () => (unusedExited = true));
    const seq = await analyseRecordingThreads(imported.recording, p, { threads: 1, spare: unused });
    expect(formatDelimited(seq.table)).toBe(formatDelimited(one.table));
    expect(unusedExited).toBe(true);
  }, 120_000);

  it('the worker answers an unknown step with an error, not silence', async () => {
    const w = await startWorkerThread('core/node/run-steps-worker');
    try {
      const reply = await new Promise<StepsReply>((resolve, reject) => {
        w.once('message', resolve);
        w.once('error', reject);
        w.postMessage({ recording: { units: [] }, parameters: {}, steps: ['no-such-step'] });
      });
      expect(reply).toMatchObject({ ok: false, message: 'no analysis step named "no-such-step"' });
    } finally {
      await w.terminate();
    }
  }, 120_000);
});

describe('planThreads: when one thread is used', () => {
  it('names each fallback', async () => {
    const shared = (await loadSession(DEMO, { sharedMemory: true })).recording;
    const plain = (await loadSession(DEMO)).recording;
    let spikes = 0;
    for (const u of shared.units) spikes += u.spikeTimes.length;
    expect(planThreads(shared, STEPS, 1, 0)).toEqual({ moved: [], reason: 'one CPU available' });
    expect(planThreads(shared, STEPS, 2, spikes + 1)).toEqual({ moved: [], reason: `${spikes} spikes: fewer than ${spikes + 1}` });
    expect(planThreads(shared, STEPS, 2, spikes).moved.length).toBe(4);
    expect(planThreads(plain, STEPS, 2, 0)).toEqual({ moved: [], reason: 'spike times not on shared memory' });
    expect(planThreads(shared, STEPS.slice(), 2, 0).reason).toBe('a custom step list runs on one thread');
  });
});
