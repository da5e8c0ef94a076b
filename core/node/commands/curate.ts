import { existsSync } from 'node:fs';
import { basename, dirname, relative, resolve } from 'node:path';
import { checkCurationAction } from '../../curation/check-curation-action';
import { curationReducer } from '../../curation/curation-reducer';
import { newSessionFile } from '../../curation/new-session-file';
import type { CurationAction } from '../../curation/types';
import { InputError } from '../../errors';
import { resolveParameters } from '../../resolve-parameters';
import { loadSessionFile, saveSessionFile } from '../session-store';
import { defaultSessionDeps, type SessionCommandDeps } from '../session-command-deps';
import { splitOptions } from './split-options';
import type { Command } from './types';

const USAGE = `Usage:
  tagbench curate <session-file> --create <session-dir|file.nwb>
  tagbench curate <session-file> --unit <id> [--label <word> [--column <verdict>]] [--clear-label]
                  [--note <text>] [--clear-note] [--include | --exclude | --clear-include] [--by <name>]
  tagbench curate <session-file> --show
  tagbench curate <session-file> --undo

Stores a person's decisions beside the computed results in a session file
(JSON; saved atomically, the previous version kept as <session-file>.bak).
Computed verdicts are never changed: exports and the report show both the
computed column (e.g. tag) and the final one (final_tag).

  --create <source>   make a new session file for a session folder or NWB file
  --unit <id>         the unit to curate
  --label <word>      label for the verdict column (default column: tag), e.g. tagged
  --column <verdict>  tag, ramp, quality or jump_<kind>
  --clear-label       remove the label of that column
  --note <text>       set the unit's note (--clear-note removes it)
  --include/--exclude mark the unit included or excluded (--clear-include: back to default)
  --by <name>         who decides (default: the login name, or $TAGBENCH_USER)
  --show              list the curation of every curated unit
  --undo              go back to the version before the last save (the .bak file);
                      the undone version becomes the .bak, so --undo again redoes it`;

/** `tagbench curate`: scripted curation of a session file. */
export function makeCurateCommand(deps: SessionCommandDeps): Command {
  return {
    name: 'curate',
    summary: 'Label, note, include or exclude units in a session file (computed verdicts are kept)',
    usage: USAGE,
    async run(argv, io) {
      const { positionals, options, flags } = splitOptions(argv, 'curate', ['--create', '--unit', '--label', '--column', '--note', '--by'], ['--clear-label', '--clear-note', '--include', '--exclude', '--clear-include', '--show', '--undo']);
      if (flags.has('--help') || flags.has('-h')) {
        io.stdout(`${USAGE}\n`);
        return 0;
      }
      if (positionals.length !== 1) throw new InputError({ file: 'tagbench curate', problem: 'give exactly one session file', fix: 'see "tagbench curate --help"' });
      const file = positionals[0];
      const name = basename(file);
      const stamp = () => ({ by: options['--by'] ?? deps.user(), at: deps.now().toISOString() });

      if (options['--create'] !== undefined) {
        if (existsSync(file)) throw new InputError({ file: name, problem: 'already exists; --create never overwrites a session file', fix: 'choose a new file name' });
        const src = options['--create'];
        const imported = await deps.importSource(src);
        const parameters = resolveParameters(imported.parameterSources);
        // stored relative to the session file's folder, so the two can move together
        const stored = relative(dirname(resolve(file)), resolve(src)) || '.';
        saveSessionFile(file, newSessionFile(imported, parameters, stored, stamp().at, `tagbench ${deps.toolVersion}`));
        io.stdout(`Created ${file}: ${imported.recording.units.length} units, ${imported.inputs.length} input files recorded with their SHA-256.\n`);
        return 0;
      }

      const loaded = loadSessionFile(file);
      if (loaded.notice) io.stderr(`${loaded.notice}\n`);
      const s = loaded.session;
      if (flags.has('--show')) {
        const ids = Object.keys(s.curation.units);
        if (ids.length === 0) io.stdout('No unit is curated yet.\n');
        for (const id of s.units.filter((u) => s.curation.units[u])) {
          const u = s.curation.units[id];
          const bits = Object.entries(u.labels).map(([c, l]) => `${c}=${l.value} (${l.by}, ${l.at})`);
          if (u.include) bits.push(`${u.include.value ? 'included' : 'excluded'} (${u.include.by}, ${u.include.at})`);
          if (u.note) bits.push(`note "${u.note.text}" (${u.note.by}, ${u.note.at})`);
          io.stdout(`unit ${id}: ${bits.join('; ')}\n`);
        }
        return 0;
      }

      if (flags.has('--undo')) {
        if (loaded.fromBackup) throw new InputError({ file: name, problem: 'the session file could not be used and its backup was loaded, so there is no later version to undo', fix: 'save a decision first (the broken file is then replaced), or inspect the two files' });
        const bak = `${file}.bak`;
        if (!existsSync(bak)) throw new InputError({ file: name, problem: 'there is nothing to undo: no earlier version (.bak) exists yet' });
        const before = loadSessionFile(bak);
        if (before.fromBackup) throw new InputError({ file: `${name}.bak`, problem: 'the earlier version cannot be read', fix: 'inspect the file; the current session file was left as it is' });
        if (before.session.source !== s.source) throw new InputError({ file: `${name}.bak`, problem: `belongs to another data source (${before.session.source}, not ${s.source})`, fix: 'the current session file was left as it is' });
        // saving the earlier version makes the current one the new .bak: a second --undo redoes
        saveSessionFile(file, before.session);
        const count = (x: typeof s) => Object.keys(x.curation.units).length;
        io.stdout(`Restored the version of ${name} saved at ${before.session.savedAt} (${count(before.session)} curated unit(s); the undone version, ${count(s)} unit(s), is now ${name}.bak: run --undo again to redo).\n`);
        return 0;
      }

      const unit = options['--unit'];
      if (unit === undefined) throw new InputError({ file: 'tagbench curate', problem: 'say which unit with --unit', fix: 'see "tagbench curate --help"' });
      const st = stamp();
      const column = options['--column'] ?? 'tag';
      const actions: CurationAction[] = [];
      if (options['--label'] !== undefined && flags.has('--clear-label')) throw new InputError({ file: 'tagbench curate', problem: '--label and --clear-label contradict each other' });
      if (options['--note'] !== undefined && flags.has('--clear-note')) throw new InputError({ file: 'tagbench curate', problem: '--note and --clear-note contradict each other' });
      if ([flags.has('--include'), flags.has('--exclude'), flags.has('--clear-include')].filter(Boolean).length > 1) {
        throw new InputError({ file: 'tagbench curate', problem: 'give only one of --include, --exclude, --clear-include' });
      }
      if (options['--label'] !== undefined) actions.push({ type: 'label', unit, column, value: options['--label'], ...st });
      if (flags.has('--clear-label')) actions.push({ type: 'label', unit, column, value: null, ...st });
      if (options['--note'] !== undefined) {
        if (options['--note'].trim() === '') throw new InputError({ file: 'tagbench curate', problem: '--note is empty', fix: 'use --clear-note to remove a note' });
        actions.push({ type: 'note', unit, text: options['--note'], ...st });
      }
      if (flags.has('--clear-note')) actions.push({ type: 'note', unit, text: '', ...st });
      if (flags.has('--include')) actions.push({ type: 'include', unit, value: true, ...st });
      if (flags.has('--exclude')) actions.push({ type: 'include', unit, value: false, ...st });
      if (flags.has('--clear-include')) actions.push({ type: 'include', unit, value: null, ...st });
      if (actions.length === 0) throw new InputError({ file: 'tagbench curate', problem: 'nothing to do', fix: 'give --label, --note, --include or --exclude (see "tagbench curate --help")' });
      const batch: CurationAction = { type: 'batch', actions };
      const problem = checkCurationAction(batch, new Set(s.units));
      if (problem) throw new InputError({ file: name, problem });
      const next = curationReducer(s.curation, batch);
      if (next === s.curation && !loaded.fromBackup) {
        io.stdout(`unit ${unit}: nothing changed.\n`);
        return 0;
      }
      saveSessionFile(file, { ...s, curation: next, savedAt: st.at, savedWith: `tagbench ${deps.toolVersion}` });
      io.stdout(`unit ${unit}: saved ${actions.length} decision(s) by ${st.by} to ${file}.\n`);
      return 0;
    },
  };
}

/** `tagbench curate` with the real loader and clock. */
export const curateCommand: Command = lazyCommand(() => makeCurateCommand(defaultSessionDeps()));

/** Builds a command's dependencies on first use (reading package.json and the clock only when run). */
export function lazyCommand(make: () => Command): Command {
  let c: Command | undefined;
  const get = () => (c ??= make());
  return {
    get name() {
      return get().name;
    },
    get summary() {
      return get().summary;
    },
    get usage() {
      return get().usage;
    },
    run: (argv, io) => get().run(argv, io),
  };
}
