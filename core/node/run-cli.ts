/**
 * The CLI without the process: argv (after the script name) -> exit code.
 * 0 success; 2 bad input or usage (one paragraph on stderr, no stack);
 * 1 internal error (a bug: message and stack on stderr, with a request to
 * report it). core/node/cli.ts calls it and exits with the code.
 */
import { isInputError } from '../errors';
import { COMMANDS } from './commands/index';
import type { CliIo } from './commands/types';
import { toolVersion } from './tool-version';

export async function runCli(argv: readonly string[], io: CliIo): Promise<number> {
  const help = () =>
    [
      `tagbench ${toolVersion()}: light identification and task responses of sorted units`,
      '',
      'Usage: tagbench <command> [options]      (npm run tagbench -- <command> ...)',
      '',
      'Commands:',
      ...COMMANDS.map((c) => `  ${c.name.padEnd(10)}${c.summary}`),
      '',
      'Options: --help, --version. "tagbench <command> --help" explains a command.',
      'Exit codes: 0 success, 2 bad input (message on stderr), 1 internal error.',
      '',
    ].join('\n');
  try {
    const [first, ...rest] = argv;
    if (first === undefined || first === '--help' || first === '-h' || first === 'help') {
      io.stdout(help());
      return first === undefined ? 2 : 0;
    }
    if (first === '--version' || first === '-v') {
      io.stdout(`${toolVersion()}\n`);
      return 0;
    }
    const cmd = COMMANDS.find((c) => c.name === first);
    if (!cmd) {
      io.stderr(`tagbench: unknown command "${first}". Commands: ${COMMANDS.map((c) => c.name).join(', ')}. See "tagbench --help".\n`);
      return 2;
    }
    return await cmd.run(rest, io);
  } catch (e) {
    if (isInputError(e)) {
      io.stderr(`${e.message}\n`);
      return 2;
    }
    const err = e as Error;
    io.stderr(`tagbench: internal error (a bug; please report it with this text):\n${err?.stack ?? String(e)}\n`);
    return 1;
  }
}
