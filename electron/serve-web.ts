/**
 * `npm run web`: serves the workbench (production build, built first when
 * missing or stale) on 127.0.0.1 and prints its URL. Options:
 *   --port N   preferred port (default 5178; the next free one is used if taken)
 *   --demo     print the URL that opens the bundled demo session directly
 * Stops on Ctrl+C.
 */
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureRendererBuild } from './ensure-renderer-build';
import { startWebServer } from './web-server';

export const DEFAULT_PORT = 5178;

export async function serveWeb(argv: readonly string[], openDemo: boolean): Promise<void> {
  const root = join(dirname(fileURLToPath(import.meta.url)), '..');
  const i = argv.indexOf('--port');
  const port = i >= 0 ? Number(argv[i + 1]) : DEFAULT_PORT;
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    console.error(`--port must be an integer from 0 to 65535 (got "${argv[i + 1]}").`);
    process.exit(2);
  }
  await ensureRendererBuild(root, (l) => console.log(l));
  const server = await startWebServer(join(root, 'dist', 'renderer'), port);
  const url = openDemo || argv.includes('--demo') ? `${server.url}?open=demo` : server.url;
  console.log(`tagbench workbench: ${url}  (loopback only; Ctrl+C stops it)`);
  const stop = () => void server.close().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  serveWeb(process.argv.slice(2), false).catch((e: unknown) => {
    console.error(`Could not serve the workbench: ${(e as Error).message}`);
    process.exit(1);
  });
}
