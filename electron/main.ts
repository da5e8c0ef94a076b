/**
 * Electron main process entry: loads `electron` at run time and hands it to
 * startMain (start-main.ts), where every decision lives and is tested with a
 * stand-in for Electron. Nothing else belongs here.
 */
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { ElectronMainLike } from './electron-api';
import { startMain } from './start-main';

const here = dirname(fileURLToPath(import.meta.url));
const electron = createRequire(import.meta.url)('electron') as ElectronMainLike;

startMain(electron, {
  buildDir: join(here, '..', 'dist', 'renderer'),
  preloadPath: join(here, 'preload.cjs'),
  openDemo: process.argv.includes('--demo') || process.env.TAGBENCH_OPEN_DEMO === '1',
  platform: process.platform,
}).catch((e: unknown) => {
  console.error(`tagbench could not start: ${(e as Error).message}`);
  electron.app.quit();
});
