import { InputError } from '../../errors';
import { describeImport } from '../../io/describe-import';
import { loadSession } from '../load-session';
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
    const result = await loadSession(a.positionals[0]);
    io.stdout(describeImport(result));
    return 0;
  },
};
