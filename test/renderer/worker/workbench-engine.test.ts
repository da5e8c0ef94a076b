import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import { EMPTY_CURATION } from '../../../core/curation/types';
import { parseDelimited } from '../../../core/export/parse-delimited';
import type { SessionFileInput } from '../../../renderer/worker/api';
import { WorkbenchEngine } from '../../../renderer/worker/workbench-engine';

const TINY = resolve(__dirname, '../../fixtures/desktop/tiny-session');

function files(dir: string): SessionFileInput[] {
  return readdirSync(dir).map((name) => ({ name, blob: new Blob([readFileSync(join(dir, name))]) }));
}

/** Spike counts per unit, counted here from the CSV text (independent of the importer). */
function countSpikes(dir: string): Map<string, number> {
  const m = new Map<string, number>();
  for (const line of readFileSync(join(dir, 'spikes.csv'), 'utf8').trim().split('\n').slice(1)) {
    const u = line.split(',')[0];
    m.set(u, (m.get(u) ?? 0) + 1);
  }
  return m;
}

describe('the workbench engine (what the analysis worker runs)', () => {
  it('imports a session from Blobs, analyses it and summarises it', async () => {
    const engine = new WorkbenchEngine();
    const progress: string[] = [];
    const out = await engine.open(files(TINY), 'tiny', {}, (p) => progress.push(p.label));
    const counts = countSpikes(TINY);
    const unit = out.table.columns.find((c) => c.name === 'unit')!;
    const n = out.table.columns.find((c) => c.name === 'n_spikes')!;
    expect(out.table.rowCount).toBe(counts.size);
    for (let i = 0; i < out.table.rowCount; i++) expect(n.values[i]).toBe(counts.get(unit.values[i] as string));
    expect(out.summary).toMatchObject({ units: 8, spikes: 6352, pulses: 25, singlePulses: 25 });
    expect(out.summary.trialsByCondition).toEqual([{ condition: 'standard', count: 10 }, { condition: 'probe', count: 3 }]);
    expect(out.summary.eventsByLabel.map((e) => [e.label, e.count])).toEqual([['tone_on', 13], ['reward', 13], ['jump', 3]]);
    expect(out.inputs.map((f) => f.file)).toContain('spikes.csv');
    expect(out.inputs.find((f) => f.file === 'spikes.csv')!.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(progress.at(-1)).toBe('Analysis done');
  });

  it('re-runs with overrides, refuses unknown parameters with the key named', async () => {
    const engine = new WorkbenchEngine();
    await engine.open(files(TINY), 'tiny', {}, () => undefined);
    const r = await engine.analyse({ ramp: { binS: 0.05 } }, () => undefined);
    expect(r.parameters.ramp.binS).toBe(0.05);
    await expect(engine.analyse({ ramp: { binSize: 1 } }, () => undefined)).rejects.toThrow(/Analysis settings, column "ramp.binSize": unknown parameter/);
  });

  it('draws the event response of a unit and the population counts without excluded units', async () => {
    const engine = new WorkbenchEngine();
    await engine.open(files(TINY), 'tiny', {}, () => undefined);
    const a = DEFAULTS.align;
    const v = await engine.unitView(4, { event: 'reward', windowStartS: -3, windowStopS: 1, binMs: a.binMs, smoothing: 'none', smoothingWidthMs: 0, groupBy: 'condition' });
    expect(v.unitId).toBe('5');
    const ev = v.figures.find((f) => f.id === 'event-response')!;
    expect(ev.section).toBe('event');
    // The page's window reaches the figure: x axis from -3 to 1 s.
    expect(JSON.stringify(ev.spec.layout)).toContain('-3');
    expect(v.figures.some((f) => f.section === 'quality')).toBe(true);
    expect(v.figures.filter((f) => f.section === 'light').length).toBeGreaterThan(0);
    const at = '2026-01-01T00:00:00.000Z';
    const curation = { units: { '1': { labels: {}, include: { value: false, by: 't', at } }, '2': { labels: {}, include: { value: false, by: 't', at } } } };
    const pop = await engine.population(curation);
    expect(pop.units).toBe(6);
    expect((await engine.population(EMPTY_CURATION)).units).toBe(8);
    const text = await engine.tableText('csv', null);
    expect(text.split('\n')[0].startsWith('unit,n_spikes,rate_hz')).toBe(true);
    const curated = parseDelimited(await engine.tableText('csv', curation), ',', 'units_curated.csv');
    const header = curated[0];
    expect(header).toContain('included');
    expect(curated[1][header.indexOf('unit')]).toBe('1');
    expect(curated[1][header.indexOf('included')]).toBe('no');
    expect(curated[3][header.indexOf('included')]).toBe('yes');
  });

  it('writes the run.json of the current analysis, the record `tagbench export` writes (hashes checked with node:crypto)', async () => {
    const engine = new WorkbenchEngine();
    await engine.open(files(TINY), 'tiny', {}, () => undefined);
    await engine.analyse({ ramp: { binS: 0.05 } }, () => undefined);
    const at = '2026-01-01T00:00:00.000Z';
    const curation = { units: { '3': { labels: { tag: { value: 'tagged', by: 't', at } } }, '99': { labels: {}, include: { value: false, by: 't', at } } } };
    const run = JSON.parse(await engine.runRecordText({ curation, finishedAt: at, toolVersion: '9.9.9', source: 'tiny-session', sessionFile: 'tagbench-session.json', notices: [], outputs: ['units_curated.csv'] }));
    expect(run).toMatchObject({ tool: 'tagbench', version: '9.9.9', command: 'workbench export', finishedAt: at, sessionFile: 'tagbench-session.json', outputs: ['units_curated.csv'] });
    expect(run.curation).toEqual({ unitsCurated: 2, labels: 1, excluded: 1, orphans: ['99'] });
    expect(run.parameters.ramp.binS).toBe(0.05);
    expect(run.parameterFiles.at(-1)).toBe('Analysis settings');
    expect(run.recording).toMatchObject({ units: 8, spikes: 6352, pulses: 25, trials: 13 });
    for (const f of readdirSync(TINY)) {
      const rec = run.inputs.find((x: { file: string }) => x.file === f);
      if (rec) expect(rec.sha256).toBe(createHash('sha256').update(readFileSync(join(TINY, f))).digest('hex'));
    }
    expect(run.inputs.length).toBeGreaterThan(2);
    expect(run.columns.map((c: { name: string }) => c.name)).toContain('final_tag');
    expect(Object.keys(run.steps)).toEqual(['basic', 'light', 'ramp', 'jump', 'cluster', 'quality']);
  });

  it('answers prefetched unit views from its cache, equal to fresh ones, and forgets them when the analysis changes', async () => {
    const a = DEFAULTS.align;
    const view = { event: 'reward', windowStartS: -2, windowStopS: 1, binMs: a.binMs, smoothing: 'none', smoothingWidthMs: 0, groupBy: 'condition' };
    const engine = new WorkbenchEngine();
    await engine.open(files(TINY), 'tiny', {}, () => undefined);
    await engine.prefetchUnitViews([2, 3, -1, 99], view);
    const fresh = new WorkbenchEngine();
    await fresh.open(files(TINY), 'tiny', {}, () => undefined);
    const v2 = await engine.unitView(2, view);
    expect(v2).toEqual(await fresh.unitView(2, view));
    expect(await engine.unitView(2, view)).toBe(v2);
    // Another event window is another view.
    expect((await engine.unitView(2, { ...view, windowStartS: -1 })).figures).not.toEqual(v2.figures);
    await engine.analyse({ light: { windowEndMs: 4 } }, () => undefined);
    const after = await engine.unitView(2, view);
    expect(after).not.toBe(v2);
    const light = (v: typeof v2) => JSON.stringify(v.figures.filter((f) => f.section === 'light').map((f) => f.spec.layout));
    expect(light(after)).not.toBe(light(v2));
  });
});
