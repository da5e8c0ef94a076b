/**
 * A sub-command of the `tagbench` CLI (core/node/cli.ts dispatches on argv[0]).
 * run() returns the exit code. User-fixable problems are thrown as InputError
 * (the CLI prints the message alone and exits 2); anything else is a bug.
 */
export interface CliIo {
  readonly stdout: (text: string) => void;
  readonly stderr: (text: string) => void;
  /** True when stdout is a terminal (progress bars), false for pipes and files. */
  readonly isTty: boolean;
}

export interface Command {
  /** Sub-command word, e.g. "run". */
  readonly name: string;
  /** One line for `tagbench --help`. */
  readonly summary: string;
  /** Usage block for `tagbench <name> --help`. */
  readonly usage: string;
  run(argv: readonly string[], io: CliIo): Promise<number>;
}
