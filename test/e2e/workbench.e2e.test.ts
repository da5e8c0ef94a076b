/**
 * Browser end-to-end tests of the workbench: the production build served on
 * 127.0.0.1, driven in Debian's Chromium. One user's path through every
 * screen: open the demo, see every unit, open a unit page with its plots
 * drawn, change a parameter and re-run, label a unit and undo it, export the
 * unit table and read it back. Screenshots of each screen go to
 * test-artifacts/e2e/.
 */
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoDir } from '../../renderer/vite.config';
import { ARTIFACTS, openWorkbench, ROOT, type Workbench } from './browser';

const LONG = 180_000;
let wb: Workbench;

/** Spike counts per unit of the bundled demo, counted here from its spikes.csv (independently of the app). */
function demoSpikeCounts(): Map<string, number> {
  const text = readFileSync(join(demoDir(), 'spikes.csv'), 'utf8').trim().split('\n');
  const header = text[0].split(',');
  const u = header.indexOf('unit');
  const counts = new Map<string, number>();
  for (const line of text.slice(1)) {
    const id = line.split(',')[u];
    counts.set(id, (counts.get(id) ?? 0) + 1);
  }
  return counts;
}

/** NWB fixtures (h5py-written, test/fixtures/nwb/make_fixtures.py) and the values their generator recorded. */
const NWB_DIR = join(ROOT, 'test', 'fixtures', 'nwb');
function nwbExpected(file = 'session_uint8.nwb'): { ids: string[]; counts: number[] } {
  const u = JSON.parse(readFileSync(join(NWB_DIR, 'expected.json'), 'utf8')).files[file].units as { ids: string[]; spike_times: number[][] };
  return { ids: u.ids, counts: u.spike_times.map((s) => s.length) };
}

const shot = (name: string) => wb.page.screenshot({ path: join(ARTIFACTS, `${name}.png`) });

describe.sequential('workbench in a real browser', () => {
  beforeAll(async () => {
    wb = await openWorkbench();
    await wb.page.goto(wb.server.url, { waitUntil: 'domcontentloaded' });
    await wb.page.getByTestId('open-demo').waitFor({ timeout: LONG });
  }, LONG * 2);
  afterAll(async () => {
    await wb?.close();
  });

  it("serves React's production build, even though the build ran inside the test runner (NODE_ENV=test)", () => {
    const assets = join(ROOT, 'dist', 'renderer', 'assets');
    const entry = readdirSync(assets).filter((f) => /^index-.*\.js$/.test(f));
    expect(entry.length).toBe(1);
    // React prints this notice only from its development build
    expect(readFileSync(join(assets, entry[0]), 'utf8')).not.toContain('Download the React DevTools');
  });

  it('opens the bundled demo in one click and shows the session overview', async () => {
    await shot('1-start');
    await wb.page.getByTestId('open-demo').click();
    await wb.page.locator('[data-testid=timeline-plot][data-drawn=true]').waitFor({ timeout: LONG });
    const counts = demoSpikeCounts();
    const total = [...counts.values()].reduce((a, b) => a + b, 0);
    await expect.poll(() => wb.page.locator('.fact').first().innerText()).toContain(String(counts.size));
    expect(await wb.page.locator('.facts').innerText()).toContain(total.toLocaleString('en'));
    await shot('2-session-overview');
  }, LONG);

  it('lists every unit of the demo in the unit table, with the right spike counts', async () => {
    const counts = demoSpikeCounts();
    await wb.page.getByRole('button', { name: 'Unit table' }).click();
    await wb.page.getByTestId('unit-table').waitFor();
    expect(await wb.page.getByTestId('row-count').innerText()).toBe(`${counts.size} of ${counts.size} units`);
    const rows = wb.page.locator('.trow');
    // Virtualised: only the rows in view (plus a few) are in the page; scroll through to see them all.
    if (counts.size > 60) expect(await rows.count()).toBeLessThan(counts.size);
    const shown = new Map<string, number>();
    const table = wb.page.getByTestId('unit-table');
    for (let pass = 0; pass < 200 && shown.size < counts.size; pass++) {
      for (const cells of await rows.evaluateAll((els) => els.map((e) => Array.from(e.querySelectorAll('.cell')).map((c) => (c as HTMLElement).innerText)))) {
        shown.set(cells[0], Number(cells[1]));
      }
      await table.evaluate((el) => (el.scrollTop += el.clientHeight - 60));
      await wb.page.waitForTimeout(50);
    }
    await table.evaluate((el) => (el.scrollTop = 0));
    expect(shown).toEqual(counts);
    // Sorting by n_spikes descending puts the busiest unit first.
    await wb.page.getByRole('columnheader', { name: 'n_spikes' }).click();
    await wb.page.getByRole('columnheader', { name: /n_spikes/ }).click();
    const busiest = [...counts].sort((a, b) => b[1] - a[1])[0][0];
    expect(await rows.first().getAttribute('data-unit')).toBe(busiest);
    // Filtering keeps only matching units.
    await wb.page.getByLabel('Filter units').fill(`n_spikes>=${counts.get(busiest)}`);
    expect(await wb.page.getByTestId('row-count').innerText()).toBe(`1 of ${counts.size} units`);
    await wb.page.getByLabel('Filter units').fill('');
    await shot('3-unit-table');
  }, LONG);

  it('opens a unit page and draws its plots', async () => {
    const first = wb.page.locator('.trow').first();
    const id = await first.getAttribute('data-unit');
    await first.dblclick();
    await expect.poll(() => wb.page.getByTestId('unit-title').innerText()).toBe(`Unit ${id}`);
    await wb.page.locator('.unit-main .plot[data-drawn=true]').first().waitFor({ timeout: LONG });
    await shot('4-unit-page');
    // Figures draw when scrolled near; scroll through every one and wait until it is drawn.
    const figures = wb.page.locator('.unit-main .plot');
    await figures.first().waitFor({ timeout: LONG });
    const n = await figures.count();
    expect(n).toBeGreaterThanOrEqual(8);
    for (let i = 0; i < n; i++) {
      await figures.nth(i).scrollIntoViewIfNeeded();
      await expect.poll(() => figures.nth(i).getAttribute('data-drawn'), { timeout: LONG }).toBe('true');
    }
    const plot = wb.page.locator('[data-testid=plot-event-response][data-drawn=true]');
    await plot.scrollIntoViewIfNeeded();
    expect(await plot.locator('.scatterlayer .trace').count()).toBeGreaterThan(1);
    expect(await plot.locator('.xtitle').textContent()).toMatch(/^Time from \w+ \(s\)$/);
    expect(await plot.locator('.ytitle').first().textContent()).toMatch(/\((spikes\/s|Hz)\)|Trial|Event/);
    // The busiest unit's raster (tens of thousands of spikes) is drawn as SVG paths, never as plotly's WebGL notice.
    const rasterTicks = await plot.locator('.scatterlayer .trace path.js-line').evaluateAll((ps) => ps.reduce((k, p) => k + ((p.getAttribute('d') ?? '').match(/M/g)?.length ?? 0), 0));
    expect(rasterTicks).toBeGreaterThan(1000);
    await shot('4a-unit-page-event-response');
    const notices = await figures.evaluateAll((els) => els.filter((e) => e.querySelector('.no-webgl') || /WebGL is not supported/.test((e as HTMLElement).innerText)).map((e) => (e as HTMLElement).dataset.testid));
    expect(notices).toEqual([]);
    expect(await wb.page.locator('canvas').count()).toBe(0);
    await wb.page.locator('.unit-main').evaluate((el) => el.scrollIntoView());
    await wb.page.getByTestId('plot-light-following').scrollIntoViewIfNeeded();
    await shot('4c-unit-page-light-following');
    // Next unit by keyboard.
    await wb.page.keyboard.press('Control+ArrowDown');
    await expect.poll(() => wb.page.getByTestId('unit-title').innerText()).not.toBe(`Unit ${id}`);
    await wb.page.keyboard.press('Control+ArrowUp');
    await expect.poll(() => wb.page.getByTestId('unit-title').innerText()).toBe(`Unit ${id}`);
  }, LONG);

  it('sets a label by key, shows it in the table, and undoes it', async () => {
    const title = await wb.page.getByTestId('unit-title').innerText();
    const id = title.replace('Unit ', '');
    const yourTag = wb.page.getByRole('radiogroup', { name: 'Your tag label' });
    await wb.page.keyboard.press('1');
    await expect.poll(() => yourTag.getByRole('radio', { name: 'tagged', exact: true }).getAttribute('aria-checked')).toBe('true');
    expect(await wb.page.locator('.status-text').innerText()).toBe(`unit ${id}: tag labelled tagged`);
    await shot('4b-unit-page-labelled');
    await wb.page.getByRole('button', { name: 'Unit table' }).click();
    const labelCell = () => wb.page.locator(`.trow[data-unit="${id}"] .cell`).nth(-2).innerText();
    expect(await labelCell()).toBe('tag: tagged');
    await wb.page.keyboard.press('Control+z');
    await expect.poll(labelCell).toBe('');
    expect(await wb.page.locator('.status-text').innerText()).toBe(`Undone: change to unit ${id}.`);
    await wb.page.keyboard.press('Control+Shift+Z');
    await expect.poll(labelCell).toBe('tag: tagged');
    await wb.page.keyboard.press('Control+z');
    await expect.poll(labelCell).toBe('');
  }, LONG);

  it('changes a parameter, re-runs the analysis, and keeps the setting with the session', async () => {
    const tableText = () => wb.page.locator('.vtable-body').innerText();
    const before = await tableText();
    await wb.page.getByRole('button', { name: 'Analysis settings' }).click();
    await wb.page.locator('#p-light-windowEndMs').fill('4');
    await wb.page.getByTestId('rerun').click();
    await expect.poll(() => wb.page.locator('.status-text').innerText(), { timeout: 60_000 }).toMatch(/^Analysis re-run in \d+ ms with changed settings\.$/);
    // Marked: values that differ from the defaults (the demo's session.json also sets the span).
    expect(await wb.page.locator('tr.changed th').allInnerTexts()).toContain('windowEndMs');
    expect(await wb.page.locator('tr.changed th').allInnerTexts()).not.toContain('windowStartMs');
    await shot('5-analysis-settings');
    await wb.page.getByRole('button', { name: 'Unit table' }).click();
    expect(await tableText()).not.toBe(before);
    // The session file kept in this browser holds the new value (autosave).
    await expect
      .poll(() =>
        wb.page.evaluate(() => {
          for (let i = 0; i < localStorage.length; i++) {
            const k = localStorage.key(i)!;
            if (k.startsWith('tagbench:state:demo')) return JSON.parse(localStorage.getItem(k)!).parameters?.light?.windowEndMs;
          }
          return null;
        }),
      )
      .toBe(4);
  }, LONG);

  it('shows the population and the keyboard help', async () => {
    await wb.page.getByRole('button', { name: 'Population' }).click();
    await wb.page.locator('.population').waitFor({ timeout: LONG });
    // Units per verdict: every bar carries its count as text, drawn above the bars and inside the figure (not clipped).
    const counts = wb.page.locator('[data-testid=plot-verdict-counts][data-drawn=true]');
    await counts.waitFor({ timeout: LONG });
    const fit = await counts.evaluate((el) => {
      const box = el.querySelector('svg.main-svg')!.getBoundingClientRect();
      const labels = Array.from(el.querySelectorAll('.bars .point text')).map((t) => t.getBoundingClientRect());
      return { labels: labels.length, inside: labels.every((r) => r.top >= box.top && r.bottom <= box.bottom) };
    });
    expect(fit.labels).toBeGreaterThan(10);
    expect(fit.inside).toBe(true);
    await shot('6-population');
    await wb.page.keyboard.press('?');
    await wb.page.getByRole('dialog', { name: 'Keyboard shortcuts' }).waitFor();
    await shot('8-help');
    await wb.page.keyboard.press('Escape');
    expect(await wb.page.getByRole('dialog').count()).toBe(0);
  }, LONG);

  it('exports the unit table and reads it back', async () => {
    const counts = demoSpikeCounts();
    await wb.page.getByRole('button', { name: 'Export' }).click();
    await shot('7-export');
    const [download] = await Promise.all([wb.page.waitForEvent('download'), wb.page.getByTestId('export-units-csv').click()]);
    expect(download.suggestedFilename()).toBe('units.csv');
    const text = readFileSync((await download.path())!, 'utf8');
    const lines = text.trim().split('\n');
    expect(lines[0].split(',').slice(0, 3)).toEqual(['unit', 'n_spikes', 'rate_hz']);
    expect(lines).toHaveLength(counts.size + 1);
    for (const line of lines.slice(1)) {
      const [id, n] = line.split(',');
      expect(Number(n)).toBe(counts.get(id));
    }
    const [curated] = await Promise.all([wb.page.waitForEvent('download'), wb.page.getByTestId('export-curated-csv').click()]);
    const head = readFileSync((await curated.path())!, 'utf8').split('\n')[0].split(',');
    expect(head).toContain('final_tag');
    expect(head).toContain('included');
    // The HTML report: one file with the cautions, every unit and the plotting library inline.
    const [rep] = await Promise.all([wb.page.waitForEvent('download', { timeout: 600_000 }), wb.page.getByTestId('export-report').click()]);
    const html = readFileSync((await rep.path())!, 'utf8');
    expect(html.startsWith('<!doctype html>') || html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(html).toContain('tagbench report: demo');
    expect(html).toMatch(/statistical screen/);
    for (const id of counts.keys()) expect(html).toContain(id);
    expect(wb.pageErrors).toEqual([]);
  }, LONG);

  it('opens an NWB file picked through the file input and lists its units (h5wasm in the worker)', async () => {
    const e = nwbExpected();
    await wb.page.getByRole('button', { name: 'Start' }).click();
    const [chooser] = await Promise.all([wb.page.waitForEvent('filechooser'), wb.page.getByRole('button', { name: 'Open NWB file...' }).click()]);
    await chooser.setFiles(join(NWB_DIR, 'session_uint8.nwb'));
    await wb.page.locator('.facts').waitFor({ timeout: LONG });
    expect(await wb.page.locator('.session-name').innerText()).toBe(`session_uint8.nwb · ${e.ids.length} units`);
    await shot('10-nwb-overview');
    await wb.page.getByRole('button', { name: 'Unit table' }).click();
    expect(await wb.page.getByTestId('row-count').innerText()).toBe(`${e.ids.length} of ${e.ids.length} units`);
    const rows = await wb.page.locator('.trow').evaluateAll((els) => els.map((r) => Array.from(r.querySelectorAll('.cell')).map((c) => (c as HTMLElement).innerText)));
    expect(rows.map((r) => [r[0], Number(r[1])])).toEqual(e.ids.map((id, i) => [id, e.counts[i]]));
    await shot('11-nwb-unit-table');
    expect(wb.pageErrors).toEqual([]);
  }, LONG);

  it('opens an NWB file dropped on the Start screen', async () => {
    const e = nwbExpected();
    await wb.page.getByRole('button', { name: 'Start' }).click();
    const bytes = readFileSync(join(NWB_DIR, 'units_uint64.nwb')).toString('base64');
    const dt = await wb.page.evaluateHandle((b64) => {
      const raw = Uint8Array.from(atob(b64), (c) => c.charCodeAt(0));
      const d = new DataTransfer();
      d.items.add(new File([raw], 'units_uint64.nwb'));
      return d;
    }, bytes);
    await wb.page.getByTestId('dropzone').dispatchEvent('drop', { dataTransfer: dt });
    await wb.page.locator('.facts').waitFor({ timeout: LONG });
    const other = nwbExpected('units_uint64.nwb');
    expect(other.counts).not.toEqual(e.counts);
    expect(await wb.page.locator('.session-name').innerText()).toBe(`units_uint64.nwb · ${other.ids.length} units`);
    await wb.page.getByRole('button', { name: 'Unit table' }).click();
    const rows = await wb.page.locator('.trow').evaluateAll((els) => els.map((r) => Array.from(r.querySelectorAll('.cell')).map((c) => (c as HTMLElement).innerText)));
    expect(rows.map((r) => [r[0], Number(r[1])])).toEqual(other.ids.map((id, i) => [id, other.counts[i]]));
    expect(wb.pageErrors).toEqual([]);
  }, LONG);

  it('shows the importer message, not a stack trace, for an unreadable session folder', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tagbench-bad-session-'));
    writeFileSync(join(dir, 'spikes.csv'), 'unit,time\n1,0.5\n1,abc\n');
    await wb.page.getByRole('button', { name: 'Start' }).click();
    const [chooser] = await Promise.all([wb.page.waitForEvent('filechooser'), wb.page.getByRole('button', { name: 'Open session folder...' }).click()]);
    await chooser.setFiles(dir);
    const screen = wb.page.getByRole('alert');
    await screen.waitFor();
    const text = await screen.innerText();
    expect(text).toMatch(/^Could not open /);
    expect(text).toMatch(/spikes\.csv, row 3, column "time"/);
    expect(text).not.toMatch(/\n\s+at /);
    await shot('9-error-screen');
    await wb.page.getByRole('button', { name: 'Back to Start' }).click();
    await wb.page.getByTestId('open-demo').waitFor();
  }, LONG);
});
