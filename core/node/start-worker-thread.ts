/**
 * Starts a worker thread on one of tagbench's own modules, named by its path
 * in the project without extension (e.g. 'core/node/run-steps-worker').
 *
 * From the TypeScript sources (the usual case: npm run tagbench, tests) the
 * worker starts from the module's cached bundle (module-bundle.ts: ~0.1 s,
 * against 1.4 to 2.3 s for registering tsx's loader in each worker). When
 * bundling is impossible (vite missing, folder not writable), the worker
 * registers tsx's loader and imports the source: slower, same result. A
 * compiled build without sources starts the module's .js file directly.
 */
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import { bundledModule } from './module-bundle';
import { projectRoot } from './project-root';

export async function startWorkerThread(projectPath: string): Promise<Worker> {
  const { root } = projectRoot();
  const source = join(root, `${projectPath}.ts`);
  if (!existsSync(source)) {
    const compiled = join(root, `${projectPath}.js`);
    if (!existsSync(compiled)) throw new Error(`worker module ${projectPath} not found under ${root}`);
    return new Worker(compiled);
  }
  const bundle = await bundledModule(root, source).catch(() => null);
  if (bundle) return new Worker(bundle);
  const api = pathToFileURL(createRequire(join(root, 'package.json')).resolve('tsx/esm/api')).href;
  const boot = `import { register } from ${JSON.stringify(api)};\nregister();\nawait import(${JSON.stringify(pathToFileURL(source).href)});\n`;
  return new Worker(new URL(`data:text/javascript,${encodeURIComponent(boot)}`));
}
