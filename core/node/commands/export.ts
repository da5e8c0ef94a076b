import { existsSync, statSync } from 'node:fs';
import { basename, dirname, resolve } from 'node:path';
import { buildRunRecord } from '../../export/build-run-record';
import { formatTable, TABLE_FORMATS, type TableFormat } from '../../export/format-table';
import { InputError } from '../../errors';
import { openSession, type OpenedSession } from '../open-session';
import { defaultSessionDeps, type SessionCommandDeps } from '../session-command-deps';
import { writeOutputFolder } from '../write-output-folder';
import { lazyCommand } from './curate';
import { splitOptions } from './split-options';
import type { Command } from './types';

const USAGE = `Usage:
  tagbench export <session-file|session-dir|file.nwb> --out <folder> [--format csv,tsv,json] [--allow-changed-inputs]

Writes the per-unit table (every metric, computed and final verdicts, reasons,
notes) as units.csv, units.tsv and/or units.json (default: all three), and
run.json beside them (tool version, parameters, input SHA-256, warnings,
curation counts, time). Column order: the contract columns first, then the
other analysis columns, then final_<verdict>, included, note, curated,
curated_by, curated_at (see the README).

The --out folder is created; an earlier tagbench output there is replaced,
any other existing folder is refused. A session file whose input files
changed since it was saved is refused
unless --allow-changed-inputs is given (run.json then records the change).`;

/** `tagbench export`: the unit table in CSV/TSV/JSON with run.json provenance. */
export function makeExportCommand(deps: SessionCommandDeps): Command {
  return {
    name: 'export',
    summary: 'Write the per-unit table (CSV, TSV, JSON) with computed and final verdicts, and run.json',
    usage: USAGE,
    async run(argv, io) {
      const { positionals, options, flags } = splitOptions(argv, 'export', ['--out', '--format'], ['--allow-changed-inputs']);
      if (flags.has('--help') || flags.has('-h')) {
        io.stdout(`${USAGE}\n`);
        return 0;
      }
      if (positionals.length !== 1) throw new InputError({ file: 'tagbench export', problem: 'give exactly one session file or data source', fix: 'see "tagbench export --help"' });
      const out = options['--out'];
      if (!out) throw new InputError({ file: 'tagbench export', problem: 'say where to write with --out <folder>' });
      const formats = (options['--format'] ?? TABLE_FORMATS.join(',')).split(',').map((f) => f.trim().toLowerCase());
      for (const f of formats) {
        if (!(TABLE_FORMATS as readonly string[]).includes(f)) throw new InputError({ file: 'tagbench export', column: '--format', value: f, problem: 'unknown format', fix: `use ${TABLE_FORMATS.join(', ')}` });
      }
      const outAbs = resolve(out);

      const startedAt = deps.now().toISOString();
      const opened = await openSession(positionals[0], deps.importSource, { allowChangedInputs: flags.has('--allow-changed-inputs') });
      for (const n of opened.notices) io.stderr(`${n}\n`);
      refuseInsideInputs(outAbs, opened);
      const files: Record<string, string> = {};
      for (const f of formats as TableFormat[]) files[`units.${f}`] = formatTable(opened.table, f);
      files['run.json'] = provenanceOf(opened, deps, 'export', Object.keys(files), startedAt);
      // all files or none (an earlier tagbench output there is replaced; anything else is refused)
      writeOutputFolder(outAbs, files);
      io.stdout(`Wrote ${Object.keys(files).join(', ')} to ${out} (${opened.table.rowCount} units, ${opened.table.columns.length} columns).\n`);
      return 0;
    },
  };
}

/** Inputs are never written: the output may not be, or lie inside, the input session folder. */
export function refuseInsideInputs(outAbs: string, opened: OpenedSession): void {
  const src = resolve(opened.source);
  const srcDir = existsSync(src) && statSync(src).isDirectory() ? src : dirname(src);
  const inputs = opened.imported.inputs.map((i) => resolve(srcDir, i.file));
  if (inputs.includes(outAbs) || outAbs === src || (existsSync(src) && statSync(src).isDirectory() && (outAbs + '/').startsWith(src + '/'))) {
    throw new InputError({ file: basename(outAbs), problem: 'lies inside the input session folder, which tagbench never writes to', fix: 'choose an --out outside the session folder' });
  }
}

/** run.json text for an output made from an opened (possibly curated) session. */
export function provenanceOf(opened: OpenedSession, deps: SessionCommandDeps, command: string, outputs: readonly string[], startedAt: string): string {
  const src = resolve(opened.source);
  return buildRunRecord({
    version: deps.toolVersion,
    command,
    startedAt,
    finishedAt: deps.now().toISOString(),
    session: { name: opened.imported.name, path: src, kind: opened.imported.sourceKind },
    sessionFile: opened.sessionFile,
    inputs: opened.imported.inputs,
    parameterFiles: opened.imported.parameterSources.map((s) => s.file),
    parameters: opened.parameters,
    recording: opened.imported.recording,
    warnings: [...opened.imported.warnings, ...opened.analysis.warnings],
    steps: opened.analysis.summaries,
    curation: { state: opened.curation, orphans: opened.orphans },
    notices: opened.notices,
    outputs: outputs.filter((o) => o !== 'run.json'),
    table: opened.table,
  });
}

/** `tagbench export` with the real loader and clock. */
export const exportCommand: Command = lazyCommand(() => makeExportCommand(defaultSessionDeps()));
