/**
 * Entry of the `tagbench` command line (npm run tagbench -- ...).
 * All logic is in run-cli.ts; this file only binds it to the process.
 */
import { runCli } from './run-cli';

// A reader that stops early (`... | head`) closes the pipe: end quietly, as command-line tools
// do, instead of an unhandled EPIPE error with a stack trace. Files the command writes are
// written (atomically) before anything goes to standard output.
process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  if (e.code === 'EPIPE') process.exit(0);
  process.stderr.write(`tagbench: cannot write to standard output: ${e.message}\n`);
  process.exit(1);
});

runCli(process.argv.slice(2), {
  stdout: (t) => process.stdout.write(t),
  stderr: (t) => process.stderr.write(t),
  isTty: Boolean(process.stdout.isTTY),
}).then(
  (code) => {
    process.exitCode = code;
  },
  (e) => {
    process.stderr.write(`tagbench: internal error: ${(e as Error)?.stack ?? String(e)}\n`);
    process.exitCode = 1;
  },
);
