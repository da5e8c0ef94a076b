import { readFileSync, existsSync, statSync } from 'node:fs';
import { basename, resolve } from 'node:path';
import { InputError } from '../../errors';
import { buildRunRecord } from '../../export/build-run-record';
import { resolveParameters } from '../../resolve-parameters';
import { formatDelimited } from '../../table/format-delimited';
import { analyseRecordingThreads, withSpareThread } from '../analyse-recording-threads';
import { loadSession } from '../load-session';
import { parseCliArgs } from '../parse-cli-args';
import { toolVersion } from '../tool-version';
import { writeOutputFolder } from '../write-output-folder';
import type { Command } from './types';

/**
 * `tagbench run <session> --out <dir> [--config analysis.json]`: imports,
 * analyses and writes units.csv and run.json (DESIGN.md section 3) through
 * writeOutputFolder (nothing half-written; an earlier output is replaced).
 */
export const runCommand: Command = {
  name: 'run',
  summary: 'Analyse a session and write units.csv and run.json',
  usage: [
    'Usage: tagbench run <session-dir|file.nwb> --out <out-dir> [--config analysis.json] [--threads <n>]',
    '',
    '  --out <dir>       output folder (created; an earlier tagbench output there is replaced)',
    '  --config <file>   analysis parameters as JSON sections, e.g. {"light": {"windowEndMs": 8}};',
    '                    applied after the session\'s own "parameters"',
    '  --threads <n>     threads for the analysis (default: the CPUs available to this process;',
    '                    1 = one thread). Large sessions run the ramp, jump, cluster and quality',
    '                    steps beside the light step; the results are the same either way',
    '',
    'Writes <out-dir>/units.csv (one row per unit) and <out-dir>/run.json (tool version,',
    'parameters, SHA-256 and size of every input file, warnings, step summaries, time).',
    'Exit codes: 0 success; 2 bad input (one paragraph on stderr); 1 internal error.',
  ].join('\n'),
  async run(argv, io) {
    const a = parseCliArgs(argv, 'run', ['--out', '--config', '--threads']);
    if (a.flags.has('--help') || a.flags.has('-h')) {
      io.stdout(`${this.usage}\n`);
      return 0;
    }
    if (a.positionals.length !== 1) {
      throw new InputError({ file: 'tagbench run', problem: a.positionals.length ? 'expects one session, got several' : 'expects the session folder or .nwb file', fix: 'run "tagbench run <session-dir> --out <out-dir>"' });
    }
    const out = a.options['--out'];
    if (!out) throw new InputError({ file: 'tagbench run', problem: 'the --out folder is missing', fix: 'add --out <out-dir>' });
    const session = a.positionals[0];
    let threads: number | undefined;
    if (a.options['--threads'] !== undefined) {
      threads = Number(a.options['--threads']);
      if (!Number.isInteger(threads) || threads < 1) throw new InputError({ file: 'tagbench run', column: '--threads', value: a.options['--threads'], problem: 'is not a whole number >= 1' });
    }
    const started = new Date();
    const extra: { file: string; overrides: unknown }[] = [];
    if (a.options['--config']) {
      const cfg = a.options['--config'];
      if (!existsSync(cfg) || !statSync(cfg).isFile()) throw new InputError({ file: cfg, problem: 'the --config file does not exist' });
      let text = readFileSync(cfg, 'utf8');
      if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
      try {
        extra.push({ file: basename(cfg), overrides: JSON.parse(text) });
      } catch (e) {
        throw new InputError({ file: basename(cfg), problem: `not valid JSON (${(e as Error).message})` });
      }
    }
    // Large sessions analyse on two threads: the second starts now, hashes the large inputs while
    // this one imports them, then takes its share of the steps.
    const { imported, parameters, analysis } = await withSpareThread(threads, async ({ spare, importHelper }) => {
      const imported = await loadSession(session, { parameterSources: extra, sharedMemory: true, importHelper });
      const parameters = resolveParameters(imported.parameterSources);
      return { imported, parameters, analysis: await analyseRecordingThreads(imported.recording, parameters, { threads, spare }) };
    });
    const rec = imported.recording;
    const warnings = [...imported.warnings, ...analysis.warnings];
    const runJson = buildRunRecord({
      version: toolVersion(),
      command: 'run',
      startedAt: started.toISOString(),
      finishedAt: new Date().toISOString(),
      session: { name: imported.name, path: resolve(session), kind: imported.sourceKind },
      sessionFile: null,
      inputs: imported.inputs,
      parameterFiles: imported.parameterSources.map((s) => s.file),
      parameters,
      recording: rec,
      warnings,
      steps: analysis.summaries,
      outputs: ['units.csv'],
      table: analysis.table,
    });
    writeOutputFolder(out, { 'units.csv': formatDelimited(analysis.table), 'run.json': runJson }, { inputDir: statSync(session).isDirectory() ? session : undefined });
    const w = warnings.length;
    io.stdout(`tagbench run: ${rec.units.length} units -> ${resolve(out)}/units.csv, run.json${w ? ` (${w} warning${w > 1 ? 's' : ''}: see run.json)` : ''}\n`);
    return 0;
  },
};
