/**
 * Starts one batch worker thread. When tagbench runs from its TypeScript
 * sources (npm run tagbench, via tsx), a worker does not inherit the
 * TypeScript loader, so the worker is started from a two-line bootstrap that
 * registers tsx's loader in the worker (tsx/esm/api register()) and then
 * imports batch-worker.ts. From compiled JavaScript the worker file is
 * started directly.
 */
import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';

export function startBatchWorker(): Worker {
  const self = import.meta.url;
  const ext = self.endsWith('.ts') ? '.ts' : '.js';
  const target = new URL(`./batch-worker${ext}`, self);
  if (ext === '.js') return new Worker(target);
  const api = pathToFileURL(createRequire(self).resolve('tsx/esm/api')).href;
  const boot = `import { register } from ${JSON.stringify(api)};\nregister();\nawait import(${JSON.stringify(target.href)});\n`;
  return new Worker(new URL(`data:text/javascript,${encodeURIComponent(boot)}`));
}
