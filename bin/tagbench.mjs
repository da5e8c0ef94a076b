#!/usr/bin/env node
/**
 * `npm run tagbench -- ...`: starts the command line (core/node/cli.ts) from
 * its cached bundle, which loads in about a tenth of the time the TypeScript
 * sources take through tsx. core/node/module-bundle.ts explains the bundle
 * and when it is fresh; the location and freshness rule are repeated here in
 * plain JavaScript because no TypeScript can load before this file decides
 * (test/core/node/module-bundle.test.ts holds the two together). A missing or
 * stale bundle is rebuilt through tsx's loader (bundledModule), then started;
 * if bundling fails, the CLI runs from its sources through tsx. With the
 * environment variable TAGBENCH_SHOW_START=1 it says on stderr which way it
 * started: "bundle" (fresh), "built" (rebuilt first) or "sources".
 */
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, statSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const entry = join(root, 'core', 'node', 'cli.ts');
const key = createHash('sha256').update(entry).digest('hex').slice(0, 12);
const name = `${basename(entry).replace(/\.ts$/, '')}-${key}`;
const dir = join(root, 'node_modules', '.cache', 'tagbench-bundles');
const bundle = join(dir, `${name}.mjs`);
const manifest = join(dir, `${name}.json`);

function fresh() {
  if (!existsSync(manifest) || !existsSync(bundle)) return false;
  try {
    const m = JSON.parse(readFileSync(manifest, 'utf8'));
    if (m.entry !== entry || !Array.isArray(m.modules) || m.modules.length === 0) return false;
    return m.modules.every(([path, size, mtimeMs]) => {
      if (!existsSync(path)) return false;
      const s = statSync(path);
      return s.size === size && s.mtimeMs === mtimeMs;
    });
  } catch {
    return false;
  }
}

const show = (how) => {
  if (process.env.TAGBENCH_SHOW_START === '1') process.stderr.write(`tagbench started from: ${how}\n`);
};
if (fresh()) {
  show('bundle');
  await import(pathToFileURL(bundle).href);
} else {
  const { register } = await import('tsx/esm/api');
  register();
  let built = null;
  try {
    const { bundledModule } = await import(pathToFileURL(join(root, 'core', 'node', 'module-bundle.ts')).href);
    built = await bundledModule(root, entry);
  } catch {
    built = null; // run from the sources below
  }
  show(built ? 'built' : 'sources');
  await import(pathToFileURL(built ?? entry).href);
}
