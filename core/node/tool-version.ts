/** The tool's version, from package.json (read once). */
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

let cached: string | undefined;

export function toolVersion(): string {
  if (cached === undefined) {
    const pkg = JSON.parse(readFileSync(join(dirname(fileURLToPath(import.meta.url)), '../../package.json'), 'utf8')) as { version: string };
    cached = pkg.version;
  }
  return cached;
}
