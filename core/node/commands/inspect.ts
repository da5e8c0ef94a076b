import { InputError } from '../../errors';
import { describeImport } from '../../io/describe-import';
import { loadSession } from '../load-session';
import { findNwbTarget } from '../nwb/find-nwb-target';
import { inspectNwbFile } from '../nwb/inspect-nwb-file';
import { parseCliArgs } from '../parse-cli-args';
import type { Command } from './types';

/** `tagbench inspect <session>`: a readable summary of a session; writes nothing. */
export const inspectCommand: Command = {
  name: 'inspect',
  summary: 'Summarise a session: units, spikes, span, pulses and trains, events, trials, warnings',
  usage: [
    'Usage: tagbench inspect <session-dir|file.nwb>',
    '',
    'Reads the session as `run` would (same checks, same error messages) and prints',
    'what it found: units and spikes, the recording span, laser pulses and trains,',
    'events by label and kind, trials by condition, metadata and warnings.',
    'For an NWB file it first lists what the file holds (tables, columns, series,',
    'stimulus sites) and which of them a run would use.',
    'Nothing is written.',
  ].join('\n'),
  async run(argv, io) {
    const a = parseCliArgs(argv, 'inspect', []);
    if (a.flags.has('--help') || a.flags.has('-h')) {
      io.stdout(`${this.usage}\n`);
      return 0;
    }
    if (a.positionals.length !== 1) {
      throw new InputError({ file: 'tagbench inspect', problem: a.positionals.length ? 'expects one session, got several' : 'expects the session folder or .nwb file', fix: 'run "tagbench inspect <session-dir>"' });
    }
    // NWB: first what the file holds and which parts a run would use (so a user can choose roles in session.json).
    const nwb = findNwbTarget(a.positionals[0]);
    if (nwb) io.stdout(`${await inspectNwbFile(nwb.file, nwb.section)}\n`);
    const result = await loadSession(a.positionals[0]);
    io.stdout(describeImport(result));
    return 0;
  },
};
