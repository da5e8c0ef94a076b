import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

/** Folders whose files go into the renderer build (relative to the project root). */
export const RENDERER_SOURCES = ['renderer', 'core', 'electron/common', 'sample-data/demo', 'package-lock.json'];

/** Newest modification time (ms) of any file under the given paths; 0 when none exist. */
export function newestMtimeMs(root: string, paths: readonly string[]): number {
  let newest = 0;
  const visit = (p: string) => {
    let st;
    try {
      st = statSync(p);
    } catch {
      return;
    }
    if (st.isDirectory()) {
      for (const name of readdirSync(p)) if (name !== 'node_modules' && !name.startsWith('.')) visit(join(p, name));
    } else if (st.mtimeMs > newest) newest = st.mtimeMs;
  };
  for (const p of paths) visit(join(root, p));
  return newest;
}

/**
 * True when the renderer build is missing or older than its sources (any file
 * under RENDERER_SOURCES changed after the build's index.html was written).
 */
export function isRendererBuildStale(root: string, buildDir: string): boolean {
  let built: number;
  try {
    built = statSync(join(buildDir, 'index.html')).mtimeMs;
  } catch {
    return true;
  }
  return newestMtimeMs(root, RENDERER_SOURCES) > built;
}

/** Builds the renderer (production, vite) into dist/renderer when it is missing or stale. Returns true when it built. */
export async function ensureRendererBuild(root: string, log: (line: string) => void = () => undefined): Promise<boolean> {
  const buildDir = join(root, 'dist', 'renderer');
  if (!isRendererBuildStale(root, buildDir)) return false;
  log('Building the workbench (production build, once per change)...');
  const { build } = await import('vite');
  // Vite keeps an existing NODE_ENV; inside the test runner it is "test", which would bundle React's
  // development build and development JSX. The build is always a production build.
  const before = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  try {
    await build({ configFile: join(root, 'renderer', 'vite.config.ts'), logLevel: 'warn', mode: 'production' });
  } finally {
    if (before === undefined) delete process.env.NODE_ENV;
    else process.env.NODE_ENV = before;
  }
  return true;
}
