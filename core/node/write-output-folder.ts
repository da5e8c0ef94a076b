/**
 * Writes a run's output files so that no half-written output is ever left:
 * every file goes into a temporary sibling folder (".<name>.partial-<pid>-<n>"),
 * which is renamed to the output folder only after all files are written.
 *
 * An existing output folder is replaced, but only when it is empty or holds a
 * run.json written by tagbench (so a mistyped --out can never wipe unrelated
 * data): the old folder is first renamed aside (".<name>.previous-<pid>-<n>"),
 * the new one renamed into place, then the old one deleted. At every moment
 * either the complete old or the complete new output exists under a name.
 * The output may not lie inside the input session folder (inputs are
 * never written). On any failure the temporary folder is removed.
 *
 * `replace: 'any'` lets the caller replace any existing folder (used only
 * for folders tagbench itself generates, such as the bundled demo session
 * and test fixtures); the old-or-new guarantee is the same.
 */
import { existsSync, mkdirSync, readFileSync, readdirSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, relative, resolve, sep } from 'node:path';
import { InputError } from '../errors';

let counter = 0;

export interface WriteOutputFolderOptions {
  /** The input session folder: the output may not be it or lie inside it. */
  readonly inputDir?: string;
  /** Which existing folder may be replaced: only an empty one or an earlier tagbench output (default), or any. */
  readonly replace?: 'tagbench-output' | 'any';
}

export function writeOutputFolder(outDir: string, files: Readonly<Record<string, string | Uint8Array>>, options: WriteOutputFolderOptions = {}): void {
  const { inputDir, replace = 'tagbench-output' } = options;
  const out = resolve(outDir);
  if (inputDir !== undefined) {
    const input = resolve(inputDir);
    const rel = relative(input, out);
    if (rel === '' || (!rel.startsWith('..') && !rel.startsWith(sep) && !/^[a-zA-Z]:/.test(rel))) {
      throw new InputError({ file: outDir, problem: 'the output folder lies inside the input session folder, which tagbench never writes to', fix: 'choose an --out folder outside the session' });
    }
  }
  const parent = dirname(out);
  if (!existsSync(parent)) {
    throw new InputError({ file: outDir, problem: `the parent folder ${parent} does not exist`, fix: 'create it first or choose another --out' });
  }
  if (existsSync(out)) {
    if (!statSync(out).isDirectory()) throw new InputError({ file: outDir, problem: 'exists and is a file, not a folder', fix: 'choose another --out' });
    if (replace !== 'any' && !isReplaceable(out)) {
      throw new InputError({ file: outDir, problem: 'exists and is not an earlier tagbench output (no tagbench run.json in it), so it is left untouched', fix: 'choose a new or empty --out folder' });
    }
  }
  const tag = `${process.pid}-${++counter}`;
  const tmp = join(parent, `.${basename(out)}.partial-${tag}`);
  mkdirSync(tmp);
  try {
    for (const [name, text] of Object.entries(files)) writeFileSync(join(tmp, name), text);
    if (existsSync(out)) {
      const old = join(parent, `.${basename(out)}.previous-${tag}`);
      renameSync(out, old);
      try {
        renameSync(tmp, out);
      } catch (e) {
        renameSync(old, out); // put the old output back
        throw e;
      }
      rmSync(old, { recursive: true, force: true });
    } else {
      renameSync(tmp, out);
    }
  } catch (e) {
    rmSync(tmp, { recursive: true, force: true });
    throw e;
  }
}

function isReplaceable(dir: string): boolean {
  const entries = readdirSync(dir);
  if (entries.length === 0) return true;
  if (!entries.includes('run.json')) return false;
  try {
    const j = JSON.parse(readFileSync(join(dir, 'run.json'), 'utf8')) as { tool?: unknown };
    return j.tool === 'tagbench';
  } catch {
    return false;
  }
}
