import { existsSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { collectReportFigures } from '../../report/collect-report-figures';
import { buildReport } from '../../report/build-report';
import { InputError } from '../../errors';
import { atomicWriteFile } from '../atomic-write-file';
import { openSession } from '../open-session';
import { defaultSessionDeps, type SessionCommandDeps } from '../session-command-deps';
import { lazyCommand } from './curate';
import { refuseInsideInputs } from './export';
import { splitOptions } from './split-options';
import type { Command } from './types';

const USAGE = `Usage:
  tagbench report <session-file|session-dir|file.nwb> --out <report.html> [--title <text>] [--allow-changed-inputs]

Writes one self-contained HTML file (opens offline; interactive figures):
counts per verdict (computed and after curation), the light-identification
criteria and what the light analysis reported about them, the quality
screen, population figures, group averages, and a section per unit with
every column and its figures. A session file whose input files changed is
refused unless --allow-changed-inputs is given (the report then says so).`;

/** `tagbench report`: the self-contained HTML report. */
export function makeReportCommand(deps: SessionCommandDeps): Command {
  return {
    name: 'report',
    summary: 'Write a self-contained HTML report (interactive figures, a section per unit)',
    usage: USAGE,
    async run(argv, io) {
      const { positionals, options, flags } = splitOptions(argv, 'report', ['--out', '--title'], ['--allow-changed-inputs']);
      if (flags.has('--help') || flags.has('-h')) {
        io.stdout(`${USAGE}\n`);
        return 0;
      }
      if (positionals.length !== 1) throw new InputError({ file: 'tagbench report', problem: 'give exactly one session file or data source', fix: 'see "tagbench report --help"' });
      const out = options['--out'];
      if (!out) throw new InputError({ file: 'tagbench report', problem: 'say where to write with --out <report.html>' });
      if (!/\.html?$/i.test(out)) throw new InputError({ file: 'tagbench report', column: '--out', value: out, problem: 'the report is one HTML file: its name should end in .html', fix: 'e.g. --out report.html' });
      const outAbs = resolve(out);
      if (!existsSync(dirname(outAbs))) throw new InputError({ file: out, problem: `the folder ${dirname(outAbs)} does not exist`, fix: 'create it first or choose another --out' });
      const opened = await openSession(positionals[0], deps.importSource, { allowChangedInputs: flags.has('--allow-changed-inputs') });
      for (const n of opened.notices) io.stderr(`${n}\n`);
      refuseInsideInputs(outAbs, opened);
      const figures = collectReportFigures({ recording: opened.imported.recording, parameters: opened.parameters, table: opened.table });
      const html = buildReport({
        title: options['--title'] ?? `tagbench report: ${opened.imported.name}`,
        createdAt: deps.now().toISOString(),
        toolVersion: deps.toolVersion,
        source: opened.source,
        sessionFile: opened.sessionFile,
        table: opened.table,
        parameters: opened.parameters,
        summaries: opened.analysis.summaries,
        inputs: opened.imported.inputs,
        warnings: [...opened.imported.warnings, ...opened.analysis.warnings],
        notices: opened.notices,
        figures,
        plotlySource: deps.plotlySource(),
      });
      atomicWriteFile(outAbs, html);
      io.stdout(`Wrote ${out} (${opened.table.rowCount} units, ${(html.length / 1e6).toFixed(1)} MB, opens offline).\n`);
      return 0;
    },
  };
}

/** `tagbench report` with the real loader and clock. */
export const reportCommand: Command = lazyCommand(() => makeReportCommand(defaultSessionDeps()));
