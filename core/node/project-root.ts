/**
 * The folder of tagbench's package.json: the nearest package.json named
 * "tagbench" above this module (read once). Found the same way from the
 * TypeScript sources, from a bundle cached under node_modules/.cache
 * (module-bundle.ts) and from a packaged build.
 */
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

let cached: { root: string; version: string } | undefined;

export function projectRoot(): { readonly root: string; readonly version: string } {
  if (cached === undefined) {
    const here = fileURLToPath(import.meta.url);
    let dir = dirname(here);
    for (;;) {
      const f = join(dir, 'package.json');
      if (existsSync(f)) {
        const pkg = JSON.parse(readFileSync(f, 'utf8')) as { name?: string; version?: string };
        if (pkg.name === 'tagbench' && typeof pkg.version === 'string') {
          cached = { root: dir, version: pkg.version };
          break;
        }
      }
      const up = dirname(dir);
      if (up === dir) throw new Error(`no package.json of tagbench above ${here}`);
      dir = up;
    }
  }
  return cached;
}
