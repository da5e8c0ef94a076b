/**
 * `npm start`: opens the desktop app on the bundled demo session. Where the
 * Electron binary cannot be had (an offline machine: its download needs the
 * network), says so in one line and serves the same workbench on a loopback
 * address for a browser instead (as `npm run web --demo`).
 */
import { spawn } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildElectron } from './build-electron';
import { ensureRendererBuild } from './ensure-renderer-build';
import { findElectron } from './find-electron';
import { serveWeb } from './serve-web';

async function launch(): Promise<void> {
  const root = join(dirname(fileURLToPath(import.meta.url)), '..');
  const found = findElectron();
  if ('reason' in found) {
    console.log(`Desktop app unavailable here (${found.reason}); serving the same workbench for your browser instead.`);
    await serveWeb(process.argv.slice(2), true);
    return;
  }
  await ensureRendererBuild(root, (l) => console.log(l));
  await buildElectron(root);
  const child = spawn(found.path, [root, '--demo'], { stdio: 'inherit' });
  child.on('exit', (code) => process.exit(code ?? 0));
}

launch().catch((e: unknown) => {
  console.error(`Could not start the workbench: ${(e as Error).message}`);
  process.exit(1);
});
