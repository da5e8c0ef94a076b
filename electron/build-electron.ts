/**
 * `npm run build:electron`: bundles the main process (ES module,
 * dist-electron/main.js) and the preload (CommonJS, dist-electron/preload.cjs,
 * as sandboxed preloads require) with vite's library mode. `electron` and
 * Node built-ins stay external.
 */
import { builtinModules } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export async function buildElectron(root: string): Promise<void> {
  const { build } = await import('vite');
  const external = ['electron', ...builtinModules, ...builtinModules.map((m) => `node:${m}`)];
  const entries: [string, 'es' | 'cjs', string][] = [
    ['electron/main.ts', 'es', 'main.js'],
    ['electron/preload.ts', 'cjs', 'preload.cjs'],
  ];
  for (const [entry, format, fileName] of entries) {
    await build({
      configFile: false,
      root,
      logLevel: 'warn',
      build: {
        outDir: join(root, 'dist-electron'),
        emptyOutDir: false,
        target: 'node20',
        minify: false,
        sourcemap: true,
        lib: { entry: join(root, entry), formats: [format], fileName: () => fileName },
        rollupOptions: { external },
      },
    });
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  buildElectron(join(dirname(fileURLToPath(import.meta.url)), '..')).then(
    () => console.log('dist-electron/main.js and dist-electron/preload.cjs written'),
    (e: unknown) => {
      console.error(`build:electron failed: ${(e as Error).message}`);
      process.exit(1);
    },
  );
}
