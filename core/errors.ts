/**
 * User-fixable input problems. One paragraph: file, row/column, value, fix.
 * The CLI prints `message` alone (no stack) and exits non-zero; anything that
 * is not an InputError is a bug and may throw with a stack.
 */
export interface InputProblem {
  /** Input file name as the user knows it (e.g. "spikes.csv"). */
  file: string;
  /** 1-based line number in the file (header is line 1), or element index for binary files. */
  row?: number;
  /** Column name, if the problem is in one column. */
  column?: string;
  /** The offending value, shown verbatim (truncated). */
  value?: string;
  /** What is wrong, one clause. */
  problem: string;
  /** How to fix it, one clause. */
  fix?: string;
}

export class InputError extends Error {
  readonly problem: InputProblem;
  constructor(p: InputProblem) {
    super(formatProblem(p));
    this.name = 'InputError';
    this.problem = p;
  }
}

/** Formats an input problem as the one-paragraph message users see. */
export function formatProblem(p: InputProblem): string {
  let where = p.file;
  if (p.row !== undefined) where += `, row ${p.row}`;
  if (p.column !== undefined) where += `, column "${p.column}"`;
  let msg = `${where}: ${p.problem}`;
  if (p.value !== undefined) {
    const v = p.value.length > 60 ? `${p.value.slice(0, 57)}...` : p.value;
    msg += ` (value "${v}")`;
  }
  msg += '.';
  if (p.fix) msg += ` ${p.fix.charAt(0).toUpperCase()}${p.fix.slice(1)}${p.fix.endsWith('.') ? '' : '.'}`;
  return msg;
}

/** True for errors the user can fix (show the message only, never a stack). */
export function isInputError(e: unknown): e is InputError {
  return e instanceof InputError;
}
