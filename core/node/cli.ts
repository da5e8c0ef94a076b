/**
 * Entry of the `tagbench` command line (npm run tagbench -- ...).
 * All logic is in run-cli.ts; this file only binds it to the process.
 */
import { runCli } from './run-cli';

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
