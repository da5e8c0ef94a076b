/**
 * Production build of the workbench (npm run build:web; also run on demand by
 * npm start / npm run web and by the browser end-to-end tests). Output:
 * dist/renderer/. The bundled demo session's files are copied in as static
 * assets under demo/ with a manifest (demo/manifest.json), so the Start screen
 * opens it in one click in the desktop app and in the browser alike.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig, type Plugin } from 'vite';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '..');

/** Data files of a session folder that the demo bundle carries. */
const DEMO_FILE = /\.(csv|npy|json|nwb|bin|dat)$/i;

/**
 * The demo session folder bundled into the build: TAGBENCH_DEMO_DIR when set
 * (the renderer benchmark bundles a 1,000-unit session this way), else the
 * project's demo (sample-data/demo), else the end-to-end tests' tiny session.
 */
export function demoDir(): string {
  if (process.env.TAGBENCH_DEMO_DIR) return resolve(process.env.TAGBENCH_DEMO_DIR);
  const demo = join(root, 'sample-data', 'demo');
  return existsSync(join(demo, 'spikes.csv')) || existsSync(join(demo, 'spikes.npy'))
    ? demo
    : join(root, 'test', 'fixtures', 'desktop', 'tiny-session');
}

function demoAssets(): Plugin {
  return {
    name: 'tagbench-demo-assets',
    generateBundle() {
      const dir = demoDir();
      const files: { name: string; bytes: number }[] = [];
      for (const name of readdirSync(dir).sort()) {
        const p = join(dir, name);
        if (!statSync(p).isFile() || !DEMO_FILE.test(name) || name === 'generator.json') continue;
        const source = readFileSync(p);
        this.emitFile({ type: 'asset', fileName: `demo/${name}`, source });
        files.push({ name, bytes: source.byteLength });
      }
      this.emitFile({
        type: 'asset',
        fileName: 'demo/manifest.json',
        source: JSON.stringify({ name: 'demo', files }, null, 1),
      });
    },
  };
}

export default defineConfig({
  root: here,
  base: './',
  publicDir: false,
  define: { __TAGBENCH_VERSION__: JSON.stringify((JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { version: string }).version) },
  plugins: [react(), demoAssets()],
  worker: { format: 'es' },
  build: {
    outDir: join(root, 'dist', 'renderer'),
    emptyOutDir: true,
    target: 'es2022',
    chunkSizeWarningLimit: 6000,
    reportCompressedSize: false,
    rolldownOptions: { checks: { pluginTimings: false } },
  },
});
