/**
 * The tool's version, from tagbench's package.json (read once): the nearest
 * package.json named "tagbench" above this module, so it is found from the
 * sources, from a bundled worker module under node_modules/.cache
 * (start-worker-thread.ts) and from a packaged build alike.
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

let cached: string | undefined;

export function toolVersion(): string {
  if (cached === undefined) {
    let dir = dirname(fileURLToPath(import.meta.url));
    for (;;) {
      const f = join(dir, 'package.json');
      if (existsSync(f)) {
        const pkg = JSON.parse(readFileSync(f, 'utf8')) as { name?: string; version?: string };
        if (pkg.name === 'tagbench' && typeof pkg.version === 'string') {
          cached = pkg.version;
          break;
        }
      }
      const up = dirname(dir);
      if (up === dir) throw new Error(`no package.json of tagbench above ${fileURLToPath(import.meta.url)}`);
      dir = up;
    }
  }
  return cached;
}
