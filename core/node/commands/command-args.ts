import { InputError } from '../../errors';

/**
 * Splits a sub-command's argv into positionals, valued options (`--bin 20`
 * or `--bin=20`) and flags. Unknown options, missing values and repeated
 * options are InputErrors naming the command. (Same rules as the CLI's
 * shared argument parser, kept local to the psth and predict commands.)
 */
export function commandArgs(
  argv: readonly string[],
  command: string,
  valued: readonly string[],
  flags: readonly string[] = [],
): { positionals: string[]; options: Map<string, string>; flags: Set<string> } {
  const positionals: string[] = [];
  const options = new Map<string, string>();
  const seen = new Set<string>();
  const where = `tagbench ${command}`;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a.startsWith('--') || a === '-h') {
      const eq = a.indexOf('=');
      const name = eq > 0 ? a.slice(0, eq) : a;
      if (name === '--help' || name === '-h' || flags.includes(name)) {
        seen.add(name === '-h' ? '--help' : name);
        continue;
      }
      if (!valued.includes(name)) throw new InputError({ file: where, value: a, problem: 'unknown option', fix: `see "${where} --help"` });
      if (options.has(name)) throw new InputError({ file: where, value: name, problem: 'option given twice' });
      const v = eq > 0 ? a.slice(eq + 1) : argv[++i];
      if (v === undefined || v === '') throw new InputError({ file: where, value: name, problem: 'option needs a value', fix: `see "${where} --help"` });
      options.set(name, v);
    } else positionals.push(a);
  }
  return { positionals, options, flags: seen };
}

/** A finite number option, or an InputError naming it. */
export function numberOption(v: string, name: string, command: string): number {
  const x = Number(v);
  if (v.trim() === '' || !Number.isFinite(x)) throw new InputError({ file: `tagbench ${command}`, column: name, value: v, problem: 'expected a number' });
  return x;
}

/** "a,b" as two increasing numbers, or an InputError naming the option. */
export function rangeOption(v: string, name: string, command: string): [number, number] {
  const parts = v.split(',');
  if (parts.length !== 2) throw new InputError({ file: `tagbench ${command}`, column: name, value: v, problem: 'expected two numbers "start,stop" (seconds)', fix: `e.g. ${name} -1,2` });
  const a = numberOption(parts[0], name, command);
  const b = numberOption(parts[1], name, command);
  if (!(b > a)) throw new InputError({ file: `tagbench ${command}`, column: name, value: v, problem: 'the stop must be after the start' });
  return [a, b];
}
