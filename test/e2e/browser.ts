/**
 * Helpers of the browser end-to-end tests: a production build of the
 * workbench served on 127.0.0.1 and Debian's Chromium driven by
 * playwright-core with a fresh profile (user-data dir).
 */
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { ensureRendererBuild } from '../../electron/ensure-renderer-build';
import { startWebServer, type WebServer } from '../../electron/web-server';

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
export const ARTIFACTS = join(ROOT, 'test-artifacts', 'e2e');
export const CHROMIUM = process.env.TAGBENCH_CHROMIUM ?? '/usr/bin/chromium';

export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

export interface Workbench {
  readonly server: WebServer;
  readonly context: BrowserContext;
  readonly page: Page;
  /** Problems the page reported (uncaught errors, console errors other than a missing favicon). */
  readonly pageErrors: string[];
  close(): Promise<void>;
}

/** Builds the renderer when missing or stale, serves it, and opens it in a fresh Chromium profile. */
export async function openWorkbench(viewport = { width: 1366, height: 800 }): Promise<Workbench> {
  await ensureRendererBuild(ROOT);
  mkdirSync(ARTIFACTS, { recursive: true });
  const server = await startWebServer(join(ROOT, 'dist', 'renderer'), 0);
  const profile = mkdtempSync(join(tmpdir(), 'tagbench-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: CHROMIUM_ARGS,
    viewport,
    acceptDownloads: true,
  });
  const page = context.pages()[0] ?? (await context.newPage());
  // Generous: CI machines have 2 cores, and the page parses plotly.js (4.5 MB) once.
  page.setDefaultTimeout(120_000);
  page.setDefaultNavigationTimeout(120_000);
  const pageErrors: string[] = [];
  page.on('pageerror', (e) => pageErrors.push(e.message));
  page.on('console', (m) => {
    if (m.type() === 'error' && !/favicon|status of 404/.test(m.text())) pageErrors.push(m.text());
  });
  return {
    server,
    context,
    page,
    pageErrors,
    async close() {
      await context.close();
      await server.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}
