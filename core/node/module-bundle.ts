/**
 * One of tagbench's TypeScript modules as a single cached ES module, for
 * starting it without tsx: the CLI (bin/tagbench.mjs) and worker threads
 * (start-worker-thread.ts). Running from the sources through tsx transforms
 * and resolves every module on each start (2 to 3 s of CPU for the CLI, 1.4
 * to 2.3 s per worker thread on the development machine); the bundle loads in
 * about 0.1 s.
 *
 * The bundle of <root>/<path>.ts is
 * node_modules/.cache/tagbench-bundles/<name>-<first 12 hex of sha256(path)>.mjs,
 * with a manifest beside it (.json: the source path and [file, size, mtimeMs]
 * of every project file in the bundle). It is fresh while every listed file
 * has the same size and modification time (a file modified during the build
 * is recorded as never fresh); otherwise it is rebuilt (vite's
 * library build, ~0.3 s; packages and Node built-ins stay imports and resolve
 * from node_modules, which is why the bundle lives under it). Files are written
 * under temporary names and renamed, so concurrent processes never load half a
 * bundle. bin/tagbench.mjs repeats the location and freshness rule in plain
 * JavaScript (it runs before any TypeScript can load); a test holds the two
 * together.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';

export interface BundleManifest {
  readonly entry: string;
  /** [absolute path, size, mtimeMs] of every project file in the bundle. */
  readonly modules: readonly (readonly [string, number, number])[];
}

/** Bundle and manifest paths of an entry (absolute path of a .ts file under root). */
export function bundleLocation(root: string, entry: string): { readonly bundle: string; readonly manifest: string } {
  const dir = join(root, 'node_modules', '.cache', 'tagbench-bundles');
  const key = createHash('sha256').update(entry).digest('hex').slice(0, 12);
  const name = `${basename(entry).replace(/\.ts$/, '')}-${key}`;
  return { bundle: join(dir, `${name}.mjs`), manifest: join(dir, `${name}.json`) };
}

function fresh(loc: { bundle: string; manifest: string }, entry: string): boolean {
  if (!existsSync(loc.manifest) || !existsSync(loc.bundle)) return false;
  try {
    const m = JSON.parse(readFileSync(loc.manifest, 'utf8')) as BundleManifest;
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

const building = new Map<string, Promise<string>>();

/** Path of an up-to-date bundle of `entry` (an absolute .ts path under `root`), built when needed. */
export function bundledModule(root: string, entry: string): Promise<string> {
  const loc = bundleLocation(root, entry);
  if (fresh(loc, entry)) return Promise.resolve(loc.bundle);
  let p = building.get(entry);
  if (!p) {
    p = build(root, entry, loc);
    building.set(entry, p);
    p.finally(() => building.delete(entry)).catch(() => undefined);
  }
  return p;
}

async function build(root: string, entry: string, loc: { bundle: string; manifest: string }): Promise<string> {
  const started = Date.now();
  const { build: viteBuild } = await import('vite');
  const result = await viteBuild({
    configFile: false,
    logLevel: 'silent',
    root,
    build: {
      write: false,
      emptyOutDir: false,
      target: 'node20',
      minify: false,
      lib: { entry, formats: ['es'], fileName: () => 'bundle.mjs' },
      // Only the project's own files are bundled; packages and Node built-ins stay imports.
      rollupOptions: {
        external: (id: string) => !id.startsWith('.') && !id.startsWith('/') && !/^[A-Za-z]:[\\/]/.test(id) && !id.startsWith('\0'),
        output: { codeSplitting: false },
      },
    },
  });
  const outputs = (Array.isArray(result) ? result : [result]) as { output: { type: string; code?: string; moduleIds?: string[] }[] }[];
  const chunks = outputs[0]?.output.filter((o) => o.type === 'chunk') ?? [];
  if (chunks.length !== 1 || !chunks[0].code || !chunks[0].moduleIds) throw new Error(`bundling ${entry} gave ${chunks.length} chunks, expected 1`);
  const modules = chunks[0].moduleIds
    .filter((p) => existsSync(p))
    .map((p) => {
      const s = statSync(p);
      // A file changed while vite read it may not be in the bundle as it is now: size -1 never matches, so the next start rebuilds.
      return [p, s.mtimeMs >= started ? -1 : s.size, s.mtimeMs] as const;
    });
  mkdirSync(join(loc.bundle, '..'), { recursive: true });
  const tmp = `.${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2)}.tmp`;
  writeFileSync(loc.bundle + tmp, chunks[0].code);
  renameSync(loc.bundle + tmp, loc.bundle);
  const manifest: BundleManifest = { entry, modules };
  writeFileSync(loc.manifest + tmp, JSON.stringify(manifest));
  renameSync(loc.manifest + tmp, loc.manifest);
  return loc.bundle;
}
