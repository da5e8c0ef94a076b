import { InputError } from '../../errors';

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
