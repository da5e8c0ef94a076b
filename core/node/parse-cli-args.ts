/**
 * Splits a command's argv into positionals and --options. Options take one
 * value (`--out dir` or `--out=dir`) unless listed as flags. Unknown options,
 * missing values and repeated options are InputErrors (exit code 2) naming
 * the option and the command's usage.
 */
import { InputError } from '../errors';

export function parseCliArgs(
  argv: readonly string[],
  command: string,
  valued: readonly string[],
  flags: readonly string[] = ['--help', '-h'],
): { positionals: string[]; options: Record<string, string>; flags: Set<string> } {
  const positionals: string[] = [];
  const options: Record<string, string> = {};
  const seen = new Set<string>();
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a.startsWith('-') && a !== '-') {
      const eq = a.indexOf('=');
      const name = eq > 0 ? a.slice(0, eq) : a;
      if (flags.includes(name)) {
        seen.add(name);
        continue;
      }
      if (!valued.includes(name)) {
        throw new InputError({ file: `tagbench ${command}`, value: a, problem: 'unknown option', fix: `see "tagbench ${command} --help"` });
      }
      if (name in options) throw new InputError({ file: `tagbench ${command}`, value: name, problem: 'option given twice' });
      const v = eq > 0 ? a.slice(eq + 1) : argv[++i];
      if (v === undefined || v === '') throw new InputError({ file: `tagbench ${command}`, value: name, problem: 'option needs a value', fix: `see "tagbench ${command} --help"` });
      options[name] = v;
    } else positionals.push(a);
  }
  return { positionals, options, flags: seen };
}
