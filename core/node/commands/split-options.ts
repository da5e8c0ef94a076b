import { InputError } from '../../errors';

/**
 * Splits argv into positionals, valued options (`--out dir` or `--out=dir`)
 * and flags, for the session commands. Unknown options, a missing value and
 * a repeated option are InputErrors naming the option and pointing at
 * `tagbench <command> --help`. (Same rules as the CLI's shared parser; kept
 * here so these commands stand alone.)
 */
export function splitOptions(
  argv: readonly string[],
  command: string,
  valued: readonly string[],
  flags: readonly string[],
): { positionals: string[]; options: Record<string, string>; flags: Set<string> } {
  const positionals: string[] = [];
  const options: Record<string, string> = {};
  const seen = new Set<string>();
  const allFlags = [...flags, '--help', '-h'];
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a.startsWith('-') && a !== '-') {
      const eq = a.indexOf('=');
      const name = eq > 0 ? a.slice(0, eq) : a;
      if (allFlags.includes(name) && eq < 0) {
        seen.add(name);
        continue;
      }
      if (!valued.includes(name)) throw new InputError({ file: `tagbench ${command}`, value: a, problem: 'unknown option', fix: `see "tagbench ${command} --help"` });
      if (name in options) throw new InputError({ file: `tagbench ${command}`, value: name, problem: 'option given twice' });
      const v = eq > 0 ? a.slice(eq + 1) : argv[++i];
      if (v === undefined) throw new InputError({ file: `tagbench ${command}`, value: name, problem: 'option needs a value', fix: `see "tagbench ${command} --help"` });
      options[name] = v;
    } else positionals.push(a);
  }
  return { positionals, options, flags: seen };
}
