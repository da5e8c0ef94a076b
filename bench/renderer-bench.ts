/**
 * Renderer benchmark (DESIGN.md section 7 targets: demo open to drawn unit
 * table < 2 s; unit-to-unit switch < 100 ms). Prints figures; never asserts.
 *
 *   npx tsx bench/renderer-bench.ts [units=1000] [durationS=600] [switches=20]
 *
 * 1. The bundled demo: production build served on 127.0.0.1, Debian's
 *    Chromium (playwright-core); time from the click on "Open the demo
 *    session" to the unit table's rows on screen.
 * 2. A generated session of `units` units (seeded Poisson trains at 2-12 Hz
 *    over `durationS` s, spikes.npy + units.npy, 1 Hz light pulses in the last
 *    5 minutes, a trial with a reward every 6 s) bundled into a second build
 *    as its demo: open to drawn table, then unit-to-unit switches on the Unit
 *    page (Ctrl+Down), each timed from the key press until the new unit's
 *    figures are all drawn.
 * Figures depend on the machine's load; run it on a quiet machine.
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Page } from 'playwright-core';
import { encodeNpy } from '../core/io/encode-npy';
import { Rng } from '../core/random/rng';
import { ensureRendererBuild } from '../electron/ensure-renderer-build';
import { startWebServer } from '../electron/web-server';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const units = Number(process.argv[2] ?? 1000);
const durationS = Number(process.argv[3] ?? 600);
const switches = Number(process.argv[4] ?? 20);
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];

/** Writes the generated session; returns its folder and spike count. */
function makeSession(dir: string): number {
  const rng = new Rng(20261202);
  const times: number[] = [];
  const ids: number[] = [];
  for (let u = 0; u < units; u++) {
    const rate = 2 + 10 * rng.uniform();
    for (let t = rng.exponential() / rate; t < durationS; t += rng.exponential() / rate) {
      times.push(t);
      ids.push(u + 1);
    }
  }
  writeFileSync(join(dir, 'spikes.npy'), encodeNpy(Float64Array.from(times)));
  writeFileSync(join(dir, 'units.npy'), encodeNpy(Int32Array.from(ids)));
  // The light block: 1 Hz pulses over the last 5 minutes (the last half of a shorter session).
  const lightS = Math.min(300, durationS / 2);
  const pulses = ['onset,duration'];
  for (let t = durationS - lightS; t < durationS - 1; t += 1) pulses.push(`${t.toFixed(4)},0.005`);
  writeFileSync(join(dir, 'pulses.csv'), `${pulses.join('\n')}\n`);
  const events = ['time,event,trial'];
  const trials = ['trial,start,stop,condition'];
  let k = 1;
  for (let t = 2; t + 6 < durationS - lightS; t += 6, k++) {
    trials.push(`${k},${t},${t + 5},${k % 4 ? 'standard' : 'probe'}`);
    events.push(`${t + 4},reward,${k}`);
  }
  writeFileSync(join(dir, 'events.csv'), `${events.join('\n')}\n`);
  writeFileSync(join(dir, 'trials.csv'), `${trials.join('\n')}\n`);
  return times.length;
}

async function openToTable(page: Page, url: string): Promise<number> {
  await page.goto(url, { waitUntil: 'domcontentloaded', timeout: 300_000 });
  await page.getByTestId('open-demo').waitFor({ timeout: 300_000 });
  const t0 = Date.now();
  await page.getByTestId('open-demo').click();
  await page.locator('.facts, .error-screen').first().waitFor({ timeout: 600_000 });
  if (await page.locator('.error-screen').count()) throw new Error(`the session did not open: ${await page.locator('.error-screen').innerText()}`);
  const opened = Date.now() - t0;
  await page.getByRole('button', { name: 'Unit table' }).click();
  await page.locator('.trow').first().waitFor();
  return Math.max(opened, Date.now() - t0);
}

/**
 * One switch, run inside the page (plain JavaScript text: tsx's helpers do not
 * exist there): press Ctrl+Down, then poll every animation frame until the
 * title changed and every figure in view is drawn.
 */
const SWITCH_ONCE = `new Promise((resolve, reject) => {
  const prev = document.querySelector('[data-testid=unit-title]')?.textContent;
  const t0 = performance.now();
  document.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowDown', code: 'ArrowDown', ctrlKey: true, bubbles: true }));
  // Arrival of the new unit's figures: the moment React writes them into the page (a mutation
  // observer runs before the figures' drawing, which follows in the same task).
  let arrived = NaN;
  const figs = document.querySelector('[data-testid=unit-figures]');
  const mo = new MutationObserver(() => {
    if (arrived === arrived) return;
    const title = document.querySelector('[data-testid=unit-title]')?.textContent;
    if (title !== prev && 'Unit ' + figs.dataset.unit === title) arrived = performance.now() - t0;
  });
  mo.observe(figs, { attributes: true, attributeFilter: ['data-unit'] });
  const check = () => {
    const title = document.querySelector('[data-testid=unit-title]')?.textContent;
    const shown = 'Unit ' + document.querySelector('[data-testid=unit-figures]')?.dataset.unit;
    const pane = document.querySelector('.content').getBoundingClientRect();
    const visible = Array.from(document.querySelectorAll('.unit-main .plot')).filter((p) => {
      const b = p.getBoundingClientRect();
      return b.bottom > pane.top && b.top < pane.bottom;
    });
    if (title !== prev && shown === title && visible.length > 0 && visible.every((p) => p.dataset.drawn === 'true')) (mo.disconnect(), resolve({ ms: performance.now() - t0, arrived, inView: visible.length }));
    else if (performance.now() - t0 > 120000) reject(new Error('a switch took over 2 minutes'));
    else requestAnimationFrame(check);
  };
  requestAnimationFrame(check);
})`;

/**
 * Unit-to-unit switches on the Unit page (Ctrl+Down), each timed from the key
 * press until the new unit's title and every figure in view are drawn (the
 * page draws figures as they come into view: renderer/components/Plot.tsx).
 * Timed inside the page (performance.now around the key event and the drawn
 * state, polled every animation frame), so the driver's round trips do not
 * count. Returns the switch times and how many figures were in view.
 */
async function unitSwitches(page: Page): Promise<{ times: number[]; arrived: number[]; inView: number; figures: number }> {
  await page.locator('.trow').first().dblclick();
  await page.locator('.unit-main .plot[data-drawn=true]').first().waitFor({ timeout: 300_000 });
  const times: number[] = [];
  const arrived: number[] = [];
  let inView = 0;
  for (let i = 0; i < switches; i++) {
    const r = (await page.evaluate(SWITCH_ONCE)) as { ms: number; arrived: number; inView: number };
    times.push(Math.round(r.ms));
    arrived.push(Math.round(r.arrived));
    inView = r.inView;
  }
  return { times, arrived, inView, figures: await page.locator('.unit-main .plot').count() };
}

const q = (xs: number[], p: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(p * xs.length))];

async function main(): Promise<void> {
  await ensureRendererBuild(ROOT, (l) => console.log(l));
  const work = mkdtempSync(join(tmpdir(), 'tagbench-bench-'));
  const sessionDir = join(work, 'session');
  mkdirSync(sessionDir);
  const spikes = makeSession(sessionDir);
  console.log(`generated session: ${units} units, ${spikes.toLocaleString('en')} spikes over ${durationS} s`);
  const bigBuild = join(work, 'build');
  process.env.TAGBENCH_DEMO_DIR = sessionDir;
  const { build } = await import('vite');
  await build({ configFile: join(ROOT, 'renderer', 'vite.config.ts'), logLevel: 'warn', build: { outDir: bigBuild } });
  delete process.env.TAGBENCH_DEMO_DIR;

  const demoServer = await startWebServer(join(ROOT, 'dist', 'renderer'), 0);
  const bigServer = await startWebServer(bigBuild, 0);
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ARGS });
  try {
    const page1 = await browser.newPage({ viewport: { width: 1366, height: 800 } });
    console.log(`bundled demo: open to drawn unit table ${await openToTable(page1, demoServer.url)} ms (target < 2000 ms)`);
    await page1.close();
    const page2 = await browser.newPage({ viewport: { width: 1366, height: 800 } });
    console.log(`${units}-unit session: open to drawn unit table ${await openToTable(page2, bigServer.url)} ms`);
    const sw = await unitSwitches(page2);
    console.log(
      `${units}-unit session: unit-to-unit switch over ${sw.times.length} switches (until the ${sw.inView} figures in view of ${sw.figures} are drawn): median ${q(sw.times, 0.5)} ms, p90 ${q(sw.times, 0.9)} ms, max ${Math.max(...sw.times)} ms (target < 100 ms)`,
    );
    console.log(`${units}-unit session: of which the new unit's figures arrived from the worker after: median ${q(sw.arrived, 0.5)} ms, p90 ${q(sw.arrived, 0.9)} ms (the rest is drawing)`);
  } finally {
    await browser.close();
    await demoServer.close();
    await bigServer.close();
    rmSync(work, { recursive: true, force: true });
  }
}

main().catch((e: unknown) => {
  console.error(`renderer benchmark failed: ${(e as Error).message}`);
  process.exit(1);
});
