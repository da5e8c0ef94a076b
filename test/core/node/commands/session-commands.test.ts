import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';

// The light analysis inside export/report is heavy; busy CI machines need room (no timing is asserted).
vi.setConfig({ testTimeout: 300_000, hookTimeout: 300_000 });
import { readDelimitedTable } from '../../../../core/export/read-delimited-table';
import { readTableJson } from '../../../../core/export/read-table-json';
import { CONTRACT_COLUMNS } from '../../../../core/table/contract-columns';
import { makeCurateCommand } from '../../../../core/node/commands/curate';
import { makeExportCommand } from '../../../../core/node/commands/export';
import { makeReportCommand } from '../../../../core/node/commands/report';
import { loadSessionFile } from '../../../../core/node/session-store';
import { openSession } from '../../../../core/node/open-session';
import { demoScenario } from '../../../../core/sim/demo-scenario';
import { simulateSession } from '../../../../core/sim/simulate-session';
import type { Recording } from '../../../../core/model/types';
import { captureIo, testDeps } from './helpers';

let root: string;
let data: string;
let rec: Recording;
beforeAll(() => {
  root = mkdtempSync(join(tmpdir(), 'tagbench-cmd-'));
  data = join(root, 'demo');
  mkdirSync(data);
  writeFileSync(join(data, 'spikes.csv'), 'unit,time\n1,0.5\n');
  writeFileSync(join(data, 'pulses.csv'), 'onset\n10\n');
  rec = simulateSession(demoScenario()).recording;
});
afterAll(() => rmSync(root, { recursive: true, force: true }));

describe('curate, export and report on a simulated session (demo scenario)', () => {
  it('creates a session file, curates units, refuses bad labels, and lists the curation', async () => {
    const deps = testDeps(rec);
    const curate = makeCurateCommand(deps);
    const sf = join(root, 'demo.session.json');
    let io = captureIo();
    expect(await curate.run([sf, '--create', data], io)).toBe(0);
    const s = loadSessionFile(sf).session;
    expect(s.units.length).toBe(48);
    expect(s.source).toBe('demo');
    expect(s.inputs.map((i) => i.file)).toEqual(['pulses.csv', 'spikes.csv']);
    await expect(curate.run([sf, '--create', data], io)).rejects.toThrow(/already exists; --create never overwrites/);

    io = captureIo();
    expect(await curate.run([sf, '--unit', '3', '--label', 'tagged', '--note', 'late but <b>clean</b> & "stable"', '--by', 'ana'], io)).toBe(0);
    expect(io.out.join('')).toBe(`unit 3: saved 2 decision(s) by ana to ${sf}.\n`);
    expect(await curate.run([sf, '--unit', '5', '--exclude'], captureIo())).toBe(0);
    expect(await curate.run([sf, '--unit', '7', '--column', 'quality', '--label', 'review'], captureIo())).toBe(0);
    await expect(curate.run([sf, '--unit', '3', '--label', 'yes'], captureIo())).rejects.toThrow('demo.session.json: "yes" is not a tag verdict: use one of tagged, borderline, untagged.');
    await expect(curate.run([sf, '--unit', '999', '--exclude'], captureIo())).rejects.toThrow(/unit "999" is not in this session/);
    await expect(curate.run([sf, '--unit', '3', '--include', '--exclude'], captureIo())).rejects.toThrow(/only one of/);
    await expect(curate.run([sf, '--unit', '3', '--bogus'], captureIo())).rejects.toThrow(/tagbench curate: unknown option \(value "--bogus"\)/);
    io = captureIo();
    expect(await curate.run([sf, '--unit', '3', '--label', 'tagged', '--by', 'ana'], io)).toBe(0);
    expect(io.out.join('')).toBe('unit 3: nothing changed.\n');
    io = captureIo();
    await curate.run([sf, '--show'], io);
    expect(io.out.join('')).toBe(
      'unit 3: tag=tagged (ana, 2026-03-01T14:05:00.000Z); note "late but <b>clean</b> & "stable"" (ana, 2026-03-01T14:05:00.000Z)\n' +
        'unit 5: excluded (tester, 2026-03-01T14:05:00.000Z)\n' +
        'unit 7: quality=review (tester, 2026-03-01T14:05:00.000Z)\n',
    );
  });

  it('undoes the last save from the command line, and redoes it with a second --undo', async () => {
    const deps = testDeps(rec);
    const curate = makeCurateCommand(deps);
    const sf = join(root, 'undo.session.json');
    await expect(curate.run([sf, '--undo'], captureIo())).rejects.toThrow(/session file not found/);
    expect(await curate.run([sf, '--create', data], captureIo())).toBe(0);
    await expect(curate.run([sf, '--undo'], captureIo())).rejects.toThrow(/nothing to undo/);
    expect(await curate.run([sf, '--unit', '2', '--label', 'borderline'], captureIo())).toBe(0);
    expect(await curate.run([sf, '--unit', '4', '--exclude'], captureIo())).toBe(0);
    const state = () => {
      const u = loadSessionFile(sf).session.curation.units;
      return { two: u['2']?.labels.tag?.value ?? null, four: u['4']?.include?.value ?? null };
    };
    expect(state()).toEqual({ two: 'borderline', four: false });
    const io = captureIo();
    expect(await curate.run([sf, '--undo'], io)).toBe(0);
    expect(io.out.join('')).toMatch(/^Restored the version of undo\.session\.json saved at .* \(1 curated unit\(s\); the undone version, 2 unit\(s\), is now undo\.session\.json\.bak: run --undo again to redo\)\.\n$/);
    expect(state()).toEqual({ two: 'borderline', four: null });
    expect(await curate.run([sf, '--undo'], captureIo())).toBe(0);
    expect(state()).toEqual({ two: 'borderline', four: false });
    // a broken session file is never "undone" over: the backup is loaded and the undo refused
    const broken = readFileSync(sf, 'utf8').slice(0, 50);
    writeFileSync(sf, broken);
    await expect(curate.run([sf, '--undo'], captureIo())).rejects.toThrow(/its backup was loaded, so there is no later version to undo/);
    expect(readFileSync(sf, 'utf8')).toBe(broken);
  });

  it('exports CSV, TSV and JSON with computed and final verdicts, and run.json; the files read back equal the table', async () => {
    const deps = testDeps(rec);
    const sf = join(root, 'demo.session.json');
    const out = join(root, 'export');
    const io = captureIo();
    expect(await makeExportCommand(deps).run([sf, '--out', out], io)).toBe(0);
    const opened = await openSession(sf, deps.importSource);
    const names = opened.table.columns.map((c) => c.name);
    // contract columns present come first, in contract order; curation columns last
    const contract = CONTRACT_COLUMNS.filter((c) => names.includes(c));
    expect(names.slice(0, contract.length)).toEqual(contract);
    expect(names.slice(-5)).toEqual(['included', 'note', 'curated', 'curated_by', 'curated_at']);
    const json = readTableJson(readFileSync(join(out, 'units.json'), 'utf8'), 'units.json');
    expect(json.columns.map((c) => c.name)).toEqual(names);
    opened.table.columns.forEach((c, j) => expect(Array.from(json.columns[j].values as ArrayLike<unknown>)).toEqual(Array.from(c.values as ArrayLike<unknown>)));
    const kinds = Object.fromEntries(opened.table.columns.map((c) => [c.name, c.kind]));
    const csv = readDelimitedTable(readFileSync(join(out, 'units.csv'), 'utf8'), ',', 'units.csv', kinds);
    const tsv = readDelimitedTable(readFileSync(join(out, 'units.tsv'), 'utf8'), '\t', 'units.tsv', kinds);
    const v = (t: typeof csv, n: string) => t.columns.find((c) => c.name === n)!.values;
    const row3 = (v(csv, 'unit') as string[]).indexOf('3');
    expect(v(csv, 'final_tag')[row3]).toBe('tagged');
    expect(v(csv, 'note')[row3]).toBe('late but <b>clean</b> & "stable"');
    expect(v(tsv, 'included')[(v(tsv, 'unit') as string[]).indexOf('5')]).toBe('no');
    expect(v(csv, 'quality')[(v(csv, 'unit') as string[]).indexOf('7')]).toBe('pass'); // computed stays
    expect(v(csv, 'final_quality')[(v(csv, 'unit') as string[]).indexOf('7')]).toBe('review');
    const run = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    // the same run.json fields as `tagbench run` writes (one builder: core/export/build-run-record.ts)
    expect(run).toMatchObject({ tool: 'tagbench', version: '0.1.0-test', command: 'export', finishedAt: '2026-03-01T14:05:00.000Z', curation: { unitsCurated: 3, labels: 2, excluded: 1, orphans: [] }, notices: [], outputs: ['units.csv', 'units.tsv', 'units.json'] });
    expect(run.inputs.map((i: { file: string }) => i.file)).toEqual(['pulses.csv', 'spikes.csv']);
    expect(run.columns.map((c: { name: string }) => c.name)).toEqual(names);
    expect(run.steps.quality.counts).toBeDefined();
    expect(run.recording.units).toBe(opened.table.rowCount);
  });

  it('exports again into its own earlier output folder (recognised by its run.json), and refuses a foreign folder', async () => {
    const deps = testDeps(rec);
    const sf = join(root, 'demo.session.json');
    const out = join(root, 'export-twice');
    expect(await makeExportCommand(deps).run([sf, '--out', out, '--format', 'csv'], captureIo())).toBe(0);
    expect(await makeExportCommand(deps).run([sf, '--out', out, '--format', 'tsv'], captureIo())).toBe(0);
    expect(readdirSync(out).sort()).toEqual(['run.json', 'units.tsv']);
    const foreign = join(root, 'foreign');
    mkdirSync(foreign);
    writeFileSync(join(foreign, 'notes.txt'), 'keep me');
    await expect(makeExportCommand(deps).run([sf, '--out', foreign], captureIo())).rejects.toThrow(/is not an earlier tagbench output/);
    expect(readFileSync(join(foreign, 'notes.txt'), 'utf8')).toBe('keep me');
  });

  it('refuses a session whose inputs changed, naming the file, unless told to go on', async () => {
    const deps = testDeps(rec);
    const sf = join(root, 'demo.session.json');
    const before = readFileSync(join(data, 'pulses.csv'));
    writeFileSync(join(data, 'pulses.csv'), 'onset\n10\n20\n');
    try {
      await expect(makeExportCommand(deps).run([sf, '--out', join(root, 'x')], captureIo())).rejects.toThrow(
        /^demo\.session\.json: the input files differ from those this session was curated on: pulses\.csv changed \(SHA-256 [0-9a-f]{12}\.\.\. then, [0-9a-f]{12}\.\.\. now\)\. .*--allow-changed-inputs/,
      );
      expect(existsSync(join(root, 'x'))).toBe(false); // nothing written
      const io = captureIo();
      expect(await makeExportCommand(deps).run([sf, '--out', join(root, 'x'), '--format', 'json', '--allow-changed-inputs'], io)).toBe(0);
      expect(io.err.join('')).toMatch(/pulses\.csv changed/);
      expect(JSON.parse(readFileSync(join(root, 'x', 'run.json'), 'utf8')).notices[0]).toMatch(/pulses\.csv changed/);
    } finally {
      writeFileSync(join(data, 'pulses.csv'), before);
    }
  });

  it('never writes into the input folder', async () => {
    const deps = testDeps(rec);
    await expect(makeExportCommand(deps).run([join(root, 'demo.session.json'), '--out', join(data, 'out')], captureIo())).rejects.toThrow(/lies inside the input session folder/);
    await expect(makeReportCommand(deps).run([join(root, 'demo.session.json'), '--out', join(data, 'report.html')], captureIo())).rejects.toThrow(/lies inside the input session folder/);
    // an input file's name is refused before anything else: a report is an .html file
    await expect(makeReportCommand(deps).run([join(root, 'demo.session.json'), '--out', join(data, 'spikes.csv')], captureIo())).rejects.toThrow(/--out.*should end in \.html/);
    await expect(makeReportCommand(deps).run([join(root, 'demo.session.json'), '--out', join(root, 'report.pdf')], captureIo())).rejects.toThrow(/the report is one HTML file/);
    expect(readFileSync(join(data, 'spikes.csv'), 'utf8')).toBe('unit,time\n1,0.5\n');
    expect(existsSync(join(data, 'report.html'))).toBe(false);
    expect(existsSync(join(root, 'report.pdf'))).toBe(false);
  });

  it('writes a self-contained report with escaped text and the figure data', async () => {
    const deps = testDeps(rec, 'window.Plotly={newPlot:function(){}}; /* </script> inside */');
    const out = join(root, 'report.html');
    const io = captureIo();
    expect(await makeReportCommand(deps).run([join(root, 'demo.session.json'), '--out', out], io)).toBe(0);
    const html = readFileSync(out, 'utf8');
    expect(html).toContain('late but &lt;b&gt;clean&lt;/b&gt; &amp; &quot;stable&quot;');
    expect(html).not.toContain('<b>clean</b>');
    expect(html).toContain('<\\/script> inside'); // the embedded library cannot end its script element
    expect(html.match(/<details class="unit"/g)!.length).toBe(48);
    expect(html).not.toMatch(/<script[^>]+src=|<link[^>]+href=|https?:\/\/(?!www\.w3\.org)/); // nothing fetched: opens offline
    // the simulated session has pulses: the light analysis' summary is rendered, with its false-identification figures first
    expect(html).not.toContain('no light-identification summary');
    expect(html).toContain('class="headline"');
    const figs = JSON.parse(/<script type="application\/json" id="tb-figures">([^<]*)<\/script>/.exec(html)![1]);
    expect(figs.pop.length).toBeGreaterThanOrEqual(2);
    expect(figs.units.length).toBe(48);
    // every unit has at least the quality figures (other areas add theirs through the registry)
    const unit0 = /<details class="unit" id="unit-0"[\s\S]*?<\/details>/.exec(html)![0];
    for (const title of ['Firing rate over the session', 'Autocorrelogram', 'ISI histogram', 'Mean waveform']) expect(unit0).toContain(`aria-label="${title}"`);
    expect(unit0.match(/class="fig"/g)!.length).toBe(figs.units[0].length);
  });
});
