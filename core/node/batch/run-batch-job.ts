/**
 * Runs one session of a batch (in a worker thread or in process): decides
 * whether the earlier result can be kept, otherwise runs `tagbench run` on
 * it, and reports the outcome without throwing.
 *
 * Resume rule: the session is skipped (earlier units.csv and run.json kept)
 * when, unless `force`, (1) the last batch recorded a success for it with the
 * same listing key (names and sizes of the files in the session folder, or
 * of the .nwb file) and the same parameters key (tool version and --config
 * text), (2) its output folder still holds units.csv and run.json, and (3)
 * every input file the earlier run read (run.json "inputs") still has the
 * SHA-256 recorded there. Anything else runs the session again.
 */
import { createHash } from 'node:crypto';
import { createReadStream, existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import type { BatchJob, BatchJobResult } from '../../batch/types';
import { SAVED_SESSION_FILE } from '../../curation/session-file';
import { isInputError } from '../../errors';
import { runCommand } from '../commands/run';

export async function runBatchJob(job: BatchJob, onStage: (stage: string) => void = () => {}): Promise<BatchJobResult> {
  const t0 = performance.now();
  const base = { index: job.index, name: job.name, session: job.session, parametersKey: job.parametersKey };
  const done = (status: BatchJobResult['status'], message: string, listingKey: string, bytes: number, failure?: 'input' | 'internal'): BatchJobResult => ({
    ...base,
    status,
    message,
    listingKey,
    bytes,
    seconds: (performance.now() - t0) / 1000,
    ...(failure ? { failure } : {}),
  });
  let listingKey = '';
  let bytes = 0;
  try {
    onStage('checking inputs');
    const listing = listSession(job.session);
    listingKey = listing.key;
    bytes = listing.bytes;
    if (!job.force && job.previous && job.previous.listingKey === listingKey && job.previous.parametersKey === job.parametersKey) {
      if (await earlierInputsUnchanged(job, onStage)) return done('skipped', 'inputs and parameters unchanged since the last run; earlier results kept', listingKey, bytes);
    }
    onStage('running');
    const err: string[] = [];
    const args = [job.session, '--out', job.outDir, '--threads', String(job.threads), ...(job.config ? ['--config', job.config] : [])];
    const code = await runCommand.run(args, { stdout: () => {}, stderr: (s) => err.push(s), isTty: false });
    if (code !== 0) return done('failed', err.join('').trim() || `run exited with code ${code}`, listingKey, bytes, code === 2 ? 'input' : 'internal');
    return done('ok', 'analysed', listingKey, bytes);
  } catch (e) {
    if (isInputError(e)) return done('failed', e.message, listingKey, bytes, 'input');
    const x = e as Error;
    return done('failed', `internal error (a bug; please report it): ${x?.stack ?? String(e)}`, listingKey, bytes, 'internal');
  }
}

/**
 * The desktop app's autosaved curation (SAVED_SESSION_FILE in the session folder, or
 * <file>.nwb.<that name> beside an NWB file) and its backup (.bak): tagbench's own files, not
 * inputs, so saving a label does not make batch analyse the session again.
 */
function isCurationFile(name: string): boolean {
  const base = name.endsWith('.bak') ? name.slice(0, -4) : name;
  return base === SAVED_SESSION_FILE || base.endsWith(`.${SAVED_SESSION_FILE}`);
}

/** Names and sizes of the session's files (not hashed: cheap), as one key; hidden files and curation files left out. */
function listSession(session: string): { key: string; bytes: number } {
  if (!existsSync(session)) return { key: 'missing', bytes: 0 };
  const st = statSync(session);
  const entries: string[] = [];
  let bytes = 0;
  if (st.isDirectory()) {
    for (const d of readdirSync(session, { withFileTypes: true })) {
      if (d.name.startsWith('.') || !d.isFile() || isCurationFile(d.name)) continue;
      const size = statSync(join(session, d.name)).size;
      bytes += size;
      entries.push(`${d.name}\t${size}`);
    }
  } else {
    bytes = st.size;
    entries.push(`${basename(session)}\t${st.size}`);
  }
  entries.sort();
  return { key: createHash('sha256').update(entries.join('\n')).digest('hex'), bytes };
}

async function earlierInputsUnchanged(job: BatchJob, onStage: (stage: string) => void): Promise<boolean> {
  const runJson = join(job.outDir, 'run.json');
  if (!existsSync(runJson) || !existsSync(join(job.outDir, 'units.csv'))) return false;
  let inputs: { file: string; sha256: string }[];
  try {
    inputs = (JSON.parse(readFileSync(runJson, 'utf8')) as { inputs?: { file: string; sha256: string }[] }).inputs ?? [];
  } catch {
    return false;
  }
  if (inputs.length === 0) return false;
  const folder = statSync(job.session).isDirectory() ? job.session : dirname(job.session);
  onStage('hashing inputs');
  for (const f of inputs) {
    const p = join(folder, f.file);
    if (!existsSync(p)) return false;
    if ((await sha256File(p)) !== f.sha256) return false;
  }
  return true;
}

function sha256File(path: string): Promise<string> {
  return new Promise((resolve, reject) => {
    const h = createHash('sha256');
    createReadStream(path)
      .on('data', (c) => h.update(c))
      .on('error', reject)
      .on('end', () => resolve(h.digest('hex')));
  });
}
