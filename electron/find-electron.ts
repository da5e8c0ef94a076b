import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';

/**
 * Path of the Electron binary, or null with the reason when it cannot be had.
 * The `electron` npm package exports the binary's path and throws when its
 * download did not happen (offline machines, or npm not running its install
 * script). `requireFrom` is injected for tests.
 */
export function findElectron(requireFrom: (id: string) => unknown = createRequire(import.meta.url)): { path: string } | { reason: string } {
  let exported: unknown;
  try {
    exported = requireFrom('electron');
  } catch {
    return { reason: 'the electron package is not installed' };
  }
  if (typeof exported !== 'string') return { reason: 'the electron package did not name its binary' };
  if (!existsSync(exported)) return { reason: `the Electron binary is missing (${exported})` };
  return { path: exported };
}
