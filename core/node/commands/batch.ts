/**
 * `tagbench batch <sessions...|--list file.txt> --out <dir>`: runs `run` on
 * many sessions in parallel worker threads and writes, under <dir>:
 *   sessions/<name>/units.csv, run.json   one output folder per session
 *   units.csv                             all units, with a leading `session` column
 *   summary.html                          one self-contained page: sessions, verdict counts, failures
 *   batch.json                            state of every session (for resuming), rewritten after each one
 * Every file is written whole or not at all (temporary name, then rename).
 * Resumable: a session whose inputs and parameters are unchanged since the
 * last batch into the same <dir> is skipped unless --force (rule in
 * core/node/batch/run-batch-job.ts). Progress: bars per worker and overall on
 * a terminal, plain lines otherwise, NDJSON events with --json.
 * Exit codes: 0 every session ok or skipped; 2 bad batch input, or a session
 * failed on bad input (its message is in the summary); 1 a session hit an
 * internal error.
 */
import { existsSync, mkdirSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import type { Worker } from 'node:worker_threads';
import { createHash } from 'node:crypto';
import { batchSummaryHtml } from '../../batch/batch-summary-html';
import { combineUnitTables, type SessionCounts } from '../../batch/combine-unit-tables';
import { renderBatchProgress } from '../../batch/render-batch-progress';
import { sessionNames } from '../../batch/session-names';
import type { BatchJob, BatchJobResult, WorkerMessage, WorkerProgress } from '../../batch/types';
import { InputError } from '../../errors';
import { atomicWriteFile } from '../atomic-write-file';
import { runBatchJob } from '../batch/run-batch-job';
import { startWorkerThread } from '../start-worker-thread';
import { parseCliArgs } from '../parse-cli-args';
import { toolVersion } from '../tool-version';
import type { Command } from './types';

const STATE_FILE = 'batch.json';

interface BatchState {
  readonly tool: 'tagbench';
  readonly command: 'batch';
  readonly version: string;
  readonly updatedAt: string;
  readonly sessions: Record<string, BatchJobResult>;
}

export const batchCommand: Command = {
  name: 'batch',
  summary: 'Analyse many sessions in parallel; combined table and HTML summary',
  usage: [
    'Usage: tagbench batch <session...> --out <dir> [options]',
    '       tagbench batch --list sessions.txt --out <dir> [options]',
    '',
    '  --list <file>     a text file of sessions, one per line (# starts a comment;',
    '                    relative paths are relative to the list file\'s folder)',
    '  --out <dir>       batch output folder (created; may be an earlier batch output)',
    '  --config <file>   analysis parameters for every session, as for "tagbench run"',
    '  --workers <n>     parallel worker threads (default: number of CPUs; 0 = in this thread)',
    '  --force           run every session again, even when unchanged since the last batch',
    '  --json            machine-readable progress and results: one JSON object per line',
    '  --combine-only    analyse nothing: collect sessions/<name>/ outputs already in <dir> (written',
    '                    by "tagbench run", e.g. one cluster job per session) into units.csv and',
    '                    summary.html; sessions without an output are reported as failed',
    '',
    'Writes <dir>/sessions/<name>/{units.csv,run.json} per session, <dir>/units.csv (all units,',
    'with a leading "session" column), <dir>/summary.html and <dir>/batch.json (state for resuming).',
    'A session whose input files and parameters are unchanged since the last batch into <dir> is',
    'skipped (its earlier results are kept) unless --force.',
    'Exit codes: 0 all sessions ok or skipped; 2 bad input (the batch\'s, or a session\'s: see the',
    'summary); 1 internal error in some session.',
  ].join('\n'),
  async run(argv, io) {
    const a = parseCliArgs(argv, 'batch', ['--out', '--list', '--config', '--workers'], ['--help', '-h', '--force', '--json', '--combine-only']);
    if (a.flags.has('--help') || a.flags.has('-h')) {
      io.stdout(`${this.usage}\n`);
      return 0;
    }
    const json = a.flags.has('--json');
    const combineOnly = a.flags.has('--combine-only');
    const force = a.flags.has('--force');
    const out = a.options['--out'];
    if (!out) throw new InputError({ file: 'tagbench batch', problem: 'the --out folder is missing', fix: 'add --out <dir>' });
    const sessions = a.positionals.map((p) => resolve(p));
    if (a.options['--list']) sessions.push(...readList(a.options['--list']));
    if (sessions.length === 0) {
      throw new InputError({ file: 'tagbench batch', problem: 'no sessions given', fix: 'name session folders or .nwb files, or give --list sessions.txt' });
    }
    let workers = availableParallelism();
    if (a.options['--workers'] !== undefined) {
      workers = Number(a.options['--workers']);
      if (!Number.isInteger(workers) || workers < 0) {
        throw new InputError({ file: 'tagbench batch', column: '--workers', value: a.options['--workers'], problem: 'is not a whole number >= 0' });
      }
    }
    let configText = '';
    const config = a.options['--config'] ? resolve(a.options['--config']) : null;
    if (config) {
      if (!existsSync(config) || !statSync(config).isFile()) throw new InputError({ file: a.options['--config'], problem: 'the --config file does not exist' });
      configText = readFileSync(config, 'utf8');
    }
    const outDir = resolve(out);
    prepareOut(outDir, out);
    mkdirSync(join(outDir, 'sessions'), { recursive: true });

    const version = toolVersion();
    const parametersKey = createHash('sha256').update(`${version}\n${configText}`).digest('hex');
    const previous = readState(outDir);
    const names = sessionNames(sessions);
    const nWorkers = combineOnly ? 0 : Math.min(workers, sessions.length);
    // Each session's run may use a second thread (core/node/analyse-recording-threads.ts): share the CPUs.
    const threads = Math.max(1, Math.floor(availableParallelism() / Math.max(1, nWorkers)));
    const jobs: BatchJob[] = sessions.map((session, index) => {
      const name = names[index];
      const prev = previous?.sessions[name];
      return {
        index,
        session,
        name,
        outDir: join(outDir, 'sessions', name),
        threads,
        config,
        parametersKey,
        force,
        previous: prev && prev.status !== 'failed' && prev.session === session ? { listingKey: prev.listingKey, parametersKey: prev.parametersKey } : null,
      };
    });

    const started = performance.now();
    const results: BatchJobResult[] = [];
    const emit = (o: Record<string, unknown>) => io.stdout(`${JSON.stringify(o)}\n`);
    if (json) emit({ event: 'start', sessions: jobs.length, workers: nWorkers, out: outDir });
    else if (!io.isTty) io.stdout(`tagbench batch: ${jobs.length} session${jobs.length === 1 ? '' : 's'}, ${nWorkers || 'no'} worker thread${nWorkers === 1 ? '' : 's'}${nWorkers ? '' : ' (in process)'} -> ${outDir}\n`);

    // Live state for the progress display.
    const slots: { name: string | null; stage: string; since: number; bytes: number }[] = Array.from({ length: Math.max(1, nWorkers) }, () => ({ name: null, stage: '', since: 0, bytes: 0 }));
    const bytesOf = (j: BatchJob) => sizeOf(j.session);
    let okBytes = 0;
    let okSeconds = 0;
    const counts = () => ({
      ok: results.filter((r) => r.status === 'ok').length,
      skipped: results.filter((r) => r.status === 'skipped').length,
      failed: results.filter((r) => r.status === 'failed').length,
    });
    const tty = io.isTty && !json;
    let drawn = 0;
    const draw = () => {
      if (!tty) return;
      const now = performance.now();
      const wp: WorkerProgress[] = slots.map((s, i) => {
        const el = (now - s.since) / 1000;
        const est = okSeconds > 0 && s.bytes > 0 ? Math.min(0.99, el / (s.bytes / (okBytes / okSeconds))) : NaN;
        return { worker: i + 1, name: s.name, stage: s.stage, elapsedS: s.name ? el : 0, fraction: est };
      });
      const lines = renderBatchProgress({ total: jobs.length, ...counts(), elapsedS: (now - started) / 1000, workers: wp });
      io.stdout(`${drawn ? `\x1b[${drawn}A` : ''}${lines.map((l) => `\x1b[2K${l}\n`).join('')}`);
      drawn = lines.length;
    };
    const timer = tty ? setInterval(draw, 100) : null;

    const onStart = (slot: number, job: BatchJob) => {
      slots[slot] = { name: job.name, stage: 'starting', since: performance.now(), bytes: bytesOf(job) };
      if (json) emit({ event: 'session', session: job.name, path: job.session, status: 'running', worker: slot + 1 });
    };
    const onStage = (slot: number, stage: string) => {
      slots[slot] = { ...slots[slot], stage };
      if (json) emit({ event: 'stage', session: slots[slot].name, stage, worker: slot + 1 });
    };
    const onResult = (slot: number, r: BatchJobResult) => {
      results.push(r);
      if (r.status === 'ok') {
        okBytes += r.bytes;
        okSeconds += r.seconds;
      }
      slots[slot] = { name: null, stage: '', since: 0, bytes: 0 };
      writeState(outDir, version, previous, results);
      const done = results.length;
      if (json) emit({ event: 'session', session: r.name, path: r.session, status: r.status, seconds: Number(r.seconds.toFixed(3)), message: r.message, ...(r.failure ? { failure: r.failure } : {}), worker: slot + 1 });
      else if (!tty) io.stdout(`[${done}/${jobs.length}] ${r.status === 'failed' ? 'FAILED' : r.status} ${r.name} (${r.seconds.toFixed(1)} s)${r.status === 'failed' ? `: ${firstLine(r.message)}` : ''}\n`);
    };

    try {
      if (combineOnly) {
        for (const job of jobs) {
          onStart(0, job);
          onResult(0, collectOutput(job));
        }
      } else if (nWorkers === 0) {
        for (const job of jobs) {
          onStart(0, job);
          onResult(0, await runBatchJob(job, (s) => onStage(0, s)));
        }
      } else {
        await runPool(jobs, nWorkers, onStart, onStage, onResult);
      }
    } finally {
      if (timer) clearInterval(timer);
      draw();
    }

    // Combined outputs from every session that has results now.
    results.sort((x, y) => x.index - y.index);
    const good = results.filter((r) => r.status !== 'failed');
    const unreadable: string[] = [];
    const tables: { session: string; text: string }[] = [];
    for (const r of good) {
      const p = join(outDir, 'sessions', r.name, 'units.csv');
      try {
        tables.push({ session: r.name, text: readFileSync(p, 'utf8') });
      } catch {
        unreadable.push(r.name);
      }
    }
    const combined: { csv: string; rows: number; counts: Record<string, SessionCounts> } = combineUnitTables(tables);
    if (unreadable.length) io.stderr(`tagbench batch: the units.csv of ${unreadable.join(', ')} could not be read; left out of the combined table\n`);
    atomicWriteFile(join(outDir, 'units.csv'), combined.csv);
    atomicWriteFile(
      join(outDir, 'summary.html'),
      batchSummaryHtml({
        title: 'tagbench batch summary',
        toolVersion: version,
        generatedAt: new Date().toISOString(),
        results,
        counts: combined.counts,
        combinedTable: join(outDir, 'units.csv'),
      }),
    );
    writeState(outDir, version, previous, results);

    const c = counts();
    const failed = results.filter((r) => r.status === 'failed');
    const elapsed = (performance.now() - started) / 1000;
    if (json) {
      emit({ event: 'done', ...c, units: combined.rows, seconds: Number(elapsed.toFixed(3)), table: join(outDir, 'units.csv'), summary: join(outDir, 'summary.html'), failures: failed.map((f) => ({ session: f.name, path: f.session, failure: f.failure, message: f.message })) });
    } else {
      io.stdout(`tagbench batch: ${c.ok} ${combineOnly ? 'collected' : 'analysed'}, ${c.skipped} unchanged (skipped), ${c.failed} failed, in ${elapsed.toFixed(1)} s; ${combined.rows} units -> ${join(outDir, 'units.csv')}, ${join(outDir, 'summary.html')}\n`);
    }
    if (failed.length) {
      io.stderr(`tagbench batch: ${failed.length} of ${results.length} session${results.length === 1 ? '' : 's'} failed:\n`);
      for (const f of failed) io.stderr(`  ${f.name} (${f.session}): ${f.message.replace(/\n/g, '\n    ')}\n`);
    }
    if (failed.some((f) => f.failure === 'internal')) return 1;
    return failed.length ? 2 : 0;
  },
};

/** --combine-only: a session counts as ok when its output folder holds units.csv and a tagbench run.json. */
function collectOutput(job: BatchJob): BatchJobResult {
  const base = { index: job.index, name: job.name, session: job.session, seconds: 0, bytes: 0, listingKey: '', parametersKey: job.parametersKey };
  const runJson = join(job.outDir, 'run.json');
  let ok = existsSync(join(job.outDir, 'units.csv')) && existsSync(runJson);
  if (ok) {
    try {
      ok = (JSON.parse(readFileSync(runJson, 'utf8')) as { tool?: string }).tool === 'tagbench';
    } catch {
      ok = false;
    }
  }
  return ok
    ? { ...base, status: 'ok', message: 'collected (analysed earlier by tagbench run)' }
    : { ...base, status: 'failed', failure: 'input', message: `no tagbench output in ${job.outDir} (expected units.csv and run.json written by "tagbench run ${job.session} --out ${job.outDir}")` };
}

/** Runs jobs on a pool of worker threads, one job per worker at a time. */
function runPool(
  jobs: readonly BatchJob[],
  n: number,
  onStart: (slot: number, job: BatchJob) => void,
  onStage: (slot: number, stage: string) => void,
  onResult: (slot: number, r: BatchJobResult) => void,
): Promise<void> {
  return new Promise((resolveAll) => {
    let next = 0;
    let finished = 0;
    const current: (BatchJob | null)[] = new Array(n).fill(null);
    const launch = (slot: number) => {
      startWorkerThread('core/node/batch/batch-worker').then(
        (w) => attach(slot, w),
        (e: Error) => {
          // No thread could start: this slot's next session fails; the rest go to other slots or fail the same way.
          if (next < jobs.length) {
            const job = jobs[next++];
            onResult(slot, { index: job.index, name: job.name, session: job.session, status: 'failed', failure: 'internal', message: `worker thread could not start: ${e.message}`, seconds: 0, bytes: 0, listingKey: '', parametersKey: job.parametersKey });
            finished++;
            if (finished === jobs.length) resolveAll();
            launch(slot);
          }
        },
      );
    };
    const attach = (slot: number, w: Worker) => {
      const feed = () => {
        if (next >= jobs.length) {
          current[slot] = null;
          void w.terminate();
          return;
        }
        const job = jobs[next++];
        current[slot] = job;
        onStart(slot, job);
        w.postMessage(job);
      };
      w.on('message', (m: WorkerMessage) => {
        if (m.type === 'stage') onStage(slot, m.stage);
        else {
          onResult(slot, m.result);
          finished++;
          if (finished === jobs.length) resolveAll();
          feed();
        }
      });
      w.on('error', (e) => {
        // The worker died (e.g. out of memory): its session fails, a new worker takes over.
        const job = current[slot];
        current[slot] = null;
        if (job) {
          onResult(slot, { index: job.index, name: job.name, session: job.session, status: 'failed', failure: 'internal', message: `worker thread died: ${e.message}`, seconds: 0, bytes: 0, listingKey: '', parametersKey: job.parametersKey });
          finished++;
          if (finished === jobs.length) resolveAll();
        }
        if (next < jobs.length) launch(slot);
      });
      feed();
    };
    for (let i = 0; i < n; i++) launch(i);
  });
}

function readList(listFile: string): string[] {
  if (!existsSync(listFile) || !statSync(listFile).isFile()) throw new InputError({ file: listFile, problem: 'the --list file does not exist' });
  const base = dirname(resolve(listFile));
  const out: string[] = [];
  readFileSync(listFile, 'utf8')
    .replace(/^\uFEFF/, '')
    .split(/\r?\n/)
    .forEach((line) => {
      const t = line.replace(/#.*$/, '').trim();
      if (t) out.push(resolve(base, t));
    });
  if (out.length === 0) throw new InputError({ file: listFile, problem: 'lists no sessions', fix: 'write one session folder or .nwb file per line' });
  return out;
}

/** The batch output folder may be new, empty, or hold only batch outputs (sessions/, units.csv, summary.html, batch.json). */
function prepareOut(outDir: string, given: string): void {
  if (!existsSync(outDir)) {
    if (!existsSync(dirname(outDir))) throw new InputError({ file: given, problem: `the parent folder ${dirname(outDir)} does not exist`, fix: 'create it first or choose another --out' });
    mkdirSync(outDir);
    return;
  }
  if (!statSync(outDir).isDirectory()) throw new InputError({ file: given, problem: 'exists and is a file, not a folder', fix: 'choose another --out' });
  const ours = new Set(['sessions', 'units.csv', 'summary.html', STATE_FILE]);
  const entries = readdirSync(outDir).filter((e) => !e.startsWith('.') && !ours.has(e));
  if (entries.length > 0) {
    throw new InputError({ file: given, value: entries[0], problem: 'exists and holds files that are not a tagbench batch output, so it is left untouched', fix: 'choose a new or empty --out folder' });
  }
}

function readState(outDir: string): BatchState | null {
  const p = join(outDir, STATE_FILE);
  if (!existsSync(p)) return null;
  try {
    const s = JSON.parse(readFileSync(p, 'utf8')) as BatchState;
    return s && s.command === 'batch' && s.sessions ? s : null;
  } catch {
    return null;
  }
}

function writeState(outDir: string, version: string, previous: BatchState | null, results: readonly BatchJobResult[]): void {
  const sessions: Record<string, BatchJobResult> = { ...(previous?.sessions ?? {}) };
  for (const r of results) sessions[r.name] = r;
  const state: BatchState = { tool: 'tagbench', command: 'batch', version, updatedAt: new Date().toISOString(), sessions };
  atomicWriteFile(join(outDir, STATE_FILE), `${JSON.stringify(state, null, 2)}\n`);
}

function sizeOf(path: string): number {
  try {
    const st = statSync(path);
    if (!st.isDirectory()) return st.size;
    let b = 0;
    for (const d of readdirSync(path, { withFileTypes: true })) if (d.isFile()) b += statSync(join(path, d.name)).size;
    return b;
  } catch {
    return 0;
  }
}

function firstLine(s: string): string {
  const l = s.split('\n')[0];
  return l.length > 200 ? `${l.slice(0, 197)}...` : l;
}
