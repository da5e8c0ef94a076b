import { mkdirSync } from 'node:fs';
import { dirname } from 'node:path';
import { InputError } from '../errors';
import { atomicWriteFile } from './atomic-write-file';

/**
 * Writes a command's output file whole or not at all (atomicWriteFile),
 * creating its folder. A file that cannot be written (permissions, a folder
 * in the way, a full disk) is an InputError naming it, not a stack trace.
 */
export function writeOutputFile(path: string, text: string): void {
  try {
    mkdirSync(dirname(path), { recursive: true });
    atomicWriteFile(path, text);
  } catch (e) {
    const code = (e as { code?: string }).code ?? (e as Error).message;
    throw new InputError({ file: path, problem: `cannot write the output file (${code})`, fix: 'choose a writable path' });
  }
}
