import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeCurateCommand } from '../../core/node/commands/curate';
import { makeReportCommand } from '../../core/node/commands/report';
import { readPlotlySource } from '../../core/node/session-command-deps';
import { demoScenario } from '../../core/sim/demo-scenario';
import { simulateSession } from '../../core/sim/simulate-session';
import { captureIo, testDeps } from '../core/node/commands/helpers';

/**
 * The HTML report in a real browser (Debian's Chromium driven by
 * playwright-core), offline: every request other than the file itself is
 * blocked and counted; the population figures must draw at load and a
 * unit's figures when its section is opened, with no page errors.
 * A screenshot goes to test-artifacts/report.png for a person to look at.
 */
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
let browser: Browser;
let root: string;
beforeAll(async () => {
  browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox'], timeout: 120_000 });
  root = mkdtempSync(join(tmpdir(), 'tagbench-report-'));
});
afterAll(async () => {
  await browser?.close();
  rmSync(root, { recursive: true, force: true });
});

describe('HTML report in Chromium', () => {
  it('opens offline and draws its interactive figures', async () => {
    expect(existsSync(CHROMIUM)).toBe(true);
    const data = join(root, 'demo');
    mkdirSync(data);
    writeFileSync(join(data, 'spikes.csv'), 'unit,time\n1,0.5\n');
    const deps = { ...testDeps(simulateSession(demoScenario()).recording), plotlySource: readPlotlySource };
    const sf = join(root, 's.session.json');
    await makeCurateCommand(deps).run([sf, '--create', data], captureIo());
    await makeCurateCommand(deps).run([sf, '--unit', '2', '--note', '</script><script>window.__pwned=1</script>'], captureIo());
    const out = join(root, 'report.html');
    expect(await makeReportCommand(deps).run([sf, '--out', out], captureIo())).toBe(0);

    const page = await browser.newPage({ viewport: { width: 1280, height: 1600 } });
    const errors: string[] = [];
    const requests: string[] = [];
    page.on('pageerror', (e) => errors.push(String(e)));
    page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
    await page.route('**/*', (route) => {
      const url = route.request().url();
      if (url === pathToFileURL(out).href) return route.continue();
      requests.push(url);
      return route.abort();
    });
    // generous timeouts: the page is ~5 MB of inline script and CI machines may be busy
    await page.goto(pathToFileURL(out).href, { waitUntil: 'domcontentloaded', timeout: 180_000 });
    await page.waitForFunction(() => document.querySelectorAll('#population .fig .main-svg, #verdicts .fig .main-svg').length >= 2, undefined, { timeout: 120_000 });
    expect(await page.evaluate(() => (window as unknown as { __pwned?: number }).__pwned)).toBeUndefined();
    mkdirSync(resolve('test-artifacts'), { recursive: true });
    await page.screenshot({ path: resolve('test-artifacts/report.png') });
    expect(await page.locator('#unit-1 .fig .main-svg').count()).toBe(0); // drawn only when opened
    await page.locator('#units table a', { hasText: /^2$/ }).click();
    await page.waitForFunction(() => document.querySelectorAll('#unit-1 .fig .main-svg').length > 0, undefined, { timeout: 120_000 });
    expect(await page.locator('#unit-1 .fig').count()).toBeGreaterThanOrEqual(4);
    expect(await page.locator('#unit-1 .fig[aria-label="Autocorrelogram"] .main-svg').count()).toBeGreaterThan(0);
    expect(await page.locator('#unit-1').textContent()).toContain('</script><script>window.__pwned=1</script>');
    await page.fill('#unit-filter', '4');
    expect(await page.locator('#unit-table tbody tr:visible').count()).toBe(13); // 4, 14, 24, 34, 40-48
    await page.fill('#unit-filter', '');
    await page.locator('#unit-1').scrollIntoViewIfNeeded();
    await page.screenshot({ path: resolve('test-artifacts/report-unit.png') });
    expect(errors).toEqual([]);
    expect(requests).toEqual([]);
    await page.close();
  }, 400_000);
});
