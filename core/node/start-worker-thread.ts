/**
 * Starts a worker thread on one of tagbench's own modules, named relative to
 * the caller's module without its extension (e.g.
 * startWorkerThread(import.meta.url, '../batch/batch-worker')).
 *
 * From compiled JavaScript the module is started directly. From the
 * TypeScript sources (npm run tagbench, via tsx) a worker does not inherit
 * tsx's loader, and registering it in the worker transforms every module
 * again (1.4 to 2.3 s per worker, measured on the 2-core development
 * machine). So the module and the project files it imports are bundled once
 * into one ES module under node_modules/.cache/tagbench-workers/ (vite's
 * library build, ~0.2 s; packages stay imports, resolved from node_modules),
 * and reused while none of its source files changed (sizes and modification
 * times in a manifest beside it): a worker then starts in ~0.1 s. The bundle
 * is written to a temporary name and renamed, so concurrent processes never
 * load half a file. When bundling is impossible (vite missing, folder not
 * writable), the worker registers tsx's loader instead: slower, same result.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';

interface Manifest {
  readonly entry: string;
  /** [absolute path, size, mtimeMs] of every project file in the bundle. */
  readonly modules: readonly (readonly [string, number, number])[];
}

const bundles = new Map<string, Promise<string | null>>();

export async function startWorkerThread(callerUrl: string, relativePath: string): Promise<Worker> {
  const ext = callerUrl.endsWith('.ts') ? '.ts' : '.js';
  const target = new URL(`${relativePath}${ext}`, callerUrl);
  if (ext === '.js') return new Worker(target);
  const entry = fileURLToPath(target);
  let bundle = bundles.get(entry);
  if (!bundle) {
    bundle = bundledModule(entry, callerUrl).catch(() => null);
    bundles.set(entry, bundle);
  }
  const file = await bundle;
  if (file) return new Worker(file);
  const api = pathToFileURL(createRequire(callerUrl).resolve('tsx/esm/api')).href;
  const boot = `import { register } from ${JSON.stringify(api)};\nregister();\nawait import(${JSON.stringify(target.href)});\n`;
  return new Worker(new URL(`data:text/javascript,${encodeURIComponent(boot)}`));
}

function isFresh(manifestFile: string, bundleFile: string, entry: string): boolean {
  if (!existsSync(manifestFile) || !existsSync(bundleFile)) return false;
  try {
    const m = JSON.parse(readFileSync(manifestFile, 'utf8')) as Manifest;
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

/** Path of an up-to-date bundle of `entry` (building it when needed). */
async function bundledModule(entry: string, callerUrl: string): Promise<string> {
  // node_modules of the project: the folder holding tsx (a bundle there resolves packages by walking up).
  const nodeModules = dirname(dirname(createRequire(callerUrl).resolve('tsx/package.json')));
  const dir = join(nodeModules, '.cache', 'tagbench-workers');
  const key = createHash('sha256').update(entry).digest('hex').slice(0, 12);
  const name = entry.replace(/^.*[\\/]/, '').replace(/\.ts$/, '');
  const bundleFile = join(dir, `${name}-${key}.mjs`);
  const manifestFile = join(dir, `${name}-${key}.json`);
  if (isFresh(manifestFile, bundleFile, entry)) return bundleFile;
  const { build } = await import('vite');
  const result = await build({
    configFile: false,
    logLevel: 'silent',
    root: dirname(nodeModules),
    build: {
      write: false,
      outDir: dir,
      emptyOutDir: false,
      target: 'node20',
      minify: false,
      lib: { entry, formats: ['es'], fileName: () => `${name}.mjs` },
      // Only the project's own files are bundled; packages and Node built-ins stay imports.
      rollupOptions: { external: (id: string) => !id.startsWith('.') && !id.startsWith('/') && !/^[A-Za-z]:[\\/]/.test(id) && !id.startsWith('\0') },
    },
  });
  const outputs = (Array.isArray(result) ? result : [result]) as { output: { type: string; code?: string; moduleIds?: string[] }[] }[];
  const chunk = outputs[0]?.output.find((o) => o.type === 'chunk');
  if (!chunk?.code || !chunk.moduleIds) throw new Error('vite returned no bundle');
  const modules = chunk.moduleIds.filter((p) => existsSync(p)).map((p) => {
    const s = statSync(p);
    return [p, s.size, s.mtimeMs] as const;
  });
  mkdirSync(dir, { recursive: true });
  const tmp = `.${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2)}`;
  writeFileSync(bundleFile + tmp, chunk.code);
  renameSync(bundleFile + tmp, bundleFile);
  const manifest: Manifest = { entry, modules };
  writeFileSync(manifestFile + tmp, JSON.stringify(manifest));
  renameSync(manifestFile + tmp, manifestFile);
  return bundleFile;
}
