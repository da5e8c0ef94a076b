// The cached bundles that start the CLI and worker threads without tsx (core/node/module-bundle.ts)
// and the launcher bin/tagbench.mjs, which repeats their location and freshness rule in JavaScript.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { bundleLocation, bundledModule, type BundleManifest } from '../../../core/node/module-bundle';

const ROOT = resolve(__dirname, '../../..');
const work = mkdtempSync(join(tmpdir(), 'tagbench-bundle-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('bundledModule', () => {
  it('bundles an entry with the project files it imports, reuses it while they are unchanged, rebuilds when one changes', async () => {
    writeFileSync(join(work, 'entry.ts'), "import { two } from './part';\nexport const answer: number = two() * 21;\n");
    writeFileSync(join(work, 'part.ts'), 'export function two(): number {\n  return 2;\n}\n');
    const entry = join(work, 'entry.ts');
    const settle = () => new Promise((r) => setTimeout(r, 50)); // files written in the same instant a build starts count as changed during it
    await settle();
    const first = await bundledModule(work, entry);
    expect(first).toBe(bundleLocation(work, entry).bundle);
    const m = JSON.parse(readFileSync(bundleLocation(work, entry).manifest, 'utf8')) as BundleManifest;
    expect(m.entry).toBe(entry);
    expect(m.modules.map(([p]) => p).sort()).toEqual([entry, join(work, 'part.ts')].sort());
    expect(((await import(`${pathToFileURL(first).href}?v=1`)) as { answer: number }).answer).toBe(42);
    const builtAt = statSync(first).mtimeMs;
    expect(await bundledModule(work, entry)).toBe(first);
    expect(statSync(first).mtimeMs).toBe(builtAt); // fresh: not rebuilt
    writeFileSync(join(work, 'part.ts'), 'export function two(): number {\n  return 3;\n}\n'); // size changes too
    await settle();
    const again = await bundledModule(work, entry);
    expect(again).toBe(first);
    expect(((await import(`${pathToFileURL(again).href}?v=2`)) as { answer: number }).answer).toBe(63);
    // No file changed during these builds, so every size is recorded (a file changed during one gets -1: never fresh).
    const m2 = JSON.parse(readFileSync(bundleLocation(work, entry).manifest, 'utf8')) as BundleManifest;
    expect(m2.modules.every(([, size]) => size > 0)).toBe(true);
  }, 60_000);
});

describe('bin/tagbench.mjs', () => {
  it('uses the bundle module-bundle.ts names and keeps it while the sources are unchanged', () => {
    const run = () => spawnSync(process.execPath, [join(ROOT, 'bin/tagbench.mjs'), '--version'], { encoding: 'utf8', env: { ...process.env, TAGBENCH_SHOW_START: '1' } });
    const a = run();
    expect(a.status).toBe(0);
    expect(a.stderr).toMatch(/^tagbench started from: (bundle|built)\n$/);
    expect(a.stdout.trim()).toBe((JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { version: string }).version);
    const loc = bundleLocation(ROOT, join(ROOT, 'core', 'node', 'cli.ts'));
    const m = JSON.parse(readFileSync(loc.manifest, 'utf8')) as BundleManifest;
    expect(m.entry).toBe(join(ROOT, 'core', 'node', 'cli.ts'));
    expect(m.modules.map(([p]) => p)).toContain(join(ROOT, 'core', 'node', 'commands', 'run.ts'));
    const b = run();
    expect(b.status).toBe(0);
    expect(b.stderr).toBe('tagbench started from: bundle\n'); // found fresh by the launcher's copy of the rule
  }, 120_000);
});
