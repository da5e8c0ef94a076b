import { describe, expect, it } from 'vitest';
import { DEFAULTS } from '../../../core/defaults';
import { buildReport, type ReportInput } from '../../../core/report/build-report';
import { embedJson } from '../../../core/report/embed-json';
import { embedScript } from '../../../core/report/embed-script';
import { escapeHtml } from '../../../core/report/escape-html';
import { assembleTable } from '../../../core/table/assemble-table';

const table = assembleTable(
  [
    { name: 'unit', kind: 'string', values: ['<u1>', 'u2', 'u3'], description: 'id' },
    { name: 'rate_hz', kind: 'number', values: Float64Array.of(1, 3, 8), description: 'Hz' },
    { name: 'tag', kind: 'string', values: ['tagged', 'untagged', 'tagged'], description: '' },
    { name: 'cluster', kind: 'string', values: ['A', 'B', 'A'], description: '' },
    { name: 'note', kind: 'string', values: ['x & y', '', ''], description: '' },
  ],
  3,
);
const base: ReportInput = {
  title: 'Report <1>',
  createdAt: '2026-03-01T00:00:00.000Z',
  toolVersion: '0.1.0',
  source: 'demo',
  sessionFile: null,
  table,
  parameters: DEFAULTS,
  summaries: {},
  inputs: [{ file: 'spikes.csv', bytes: 10, sha256: 'a'.repeat(64) }],
  warnings: [],
  notices: ['inputs <changed>'],
  figures: { population: [], units: [[], [], []] },
  plotlySource: '',
};

describe('buildReport', () => {
  it('escapes every text from the data', () => {
    const html = buildReport(base);
    expect(html).toContain('<title>Report &lt;1&gt;</title>');
    expect(html).toContain('Unit &lt;u1&gt;');
    expect(html).toContain('x &amp; y');
    expect(html).toContain('inputs &lt;changed&gt;');
    expect(html).not.toContain('<u1>');
  });
  it('says so when there is no light summary, and renders one when there is', () => {
    expect(buildReport(base)).toContain('no estimated false-identification rate can be shown');
    const html = buildReport({ ...base, summaries: { light: { estimatedFalseIdentificationRate: 0.012, nullUnits: 250, criteria: { saltP: 0.01 } } } });
    expect(html).toContain('<dt>estimatedFalseIdentificationRate</dt><dd>0.012</dd>');
    expect(html).toContain('<dt>saltP</dt><dd>0.01</dd>');
  });
  it('counts verdicts and averages by cluster', () => {
    const html = buildReport(base);
    expect(html).toMatch(/<tr><td>tag<\/td><td><span class="badge"[^>]*><span class="dot"[^>]*><\/span>tagged<\/span><\/td><td class="num">2<\/td>/);
    // cluster A: rate 1 and 8 -> mean 4.5, sample SD 4.94975 -> "4.9"; cluster B: 3 (one unit, no SD)
    expect(html).toContain('<td title="Hz">rate_hz</td><td class="num">4.5 ± 4.9</td><td class="num">3</td>');
  });
});

describe('buildReport figures', () => {
  it('embeds SVG traces only, keeping every spike of a raster and every point of a line', () => {
    const xs = Array.from({ length: 3000 }, (_, i) => (i % 1000) / 1000);
    const ys = Array.from({ length: 3000 }, (_, i) => Math.floor(i / 1000) + 1);
    const raster = { type: 'scattergl', mode: 'markers', x: xs, y: ys, marker: { symbol: 'line-ns-open', size: 4 } };
    const line = { type: 'scattergl', mode: 'lines', x: xs.slice(0, 1000), y: xs.slice(0, 1000) };
    const spec = { data: [raster, line], layout: { yaxis: { title: { text: 'trial' } } } };
    const html = buildReport({ ...base, figures: { population: [{ id: 'raster', title: 'Raster', spec }], units: [[], [], []] } });
    const json = JSON.parse(html.match(/<script type="application\/json" id="tb-figures">([\s\S]*?)<\/script>/)![1]);
    const drawn = json.pop[0];
    expect(JSON.stringify(drawn)).not.toContain('scattergl');
    expect(drawn.layout.height).toBe(340); // one panel (figureHeight)
    // the raster became one path: a vertical segment (two points, then a null gap) per spike, all 3000 kept
    const [rasterOut, lineOut] = drawn.data;
    expect(rasterOut.type).toBe('scatter');
    expect(rasterOut.x.filter((x: number | null) => x !== null).length).toBe(2 * 3000);
    expect(lineOut.type).toBe('scatter');
    expect(lineOut.x.length).toBe(1000);
  });
});

describe('embedding helpers', () => {
  it('escapeHtml covers & < > " \'', () => expect(escapeHtml(`<a href="x">'&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;'));
  it('embedJson cannot end a script element and parses back', () => {
    const v = { note: '</script><!-- & \u2028', n: NaN };
    const s = embedJson(v);
    expect(s).not.toMatch(/[<>&\u2028]/);
    expect(JSON.parse(s)).toEqual({ note: '</script><!-- & \u2028', n: null });
  });
  it('embedScript escapes </script and <!-- and keeps JS meaning inside strings', () => {
    const js = 'var a = "</SCRIPT>"; var b = "<!--";';
    const out = embedScript(js);
    expect(out).toBe('var a = "<\\/SCRIPT>"; var b = "<\\!--";');
    expect(new Function(`${out}; return [a, b];`)()).toEqual(['</SCRIPT>', '<!--']);
  });
});

describe('buildReport light summary', () => {
  it('puts false-identification numbers first and renders lists of records as tables', () => {
    const html = buildReport({ ...base, summaries: { light: { trust: { expectedFalseTagged: 0.4, cells: [{ rateHz: 2, falseRate: 0.01 }, { rateHz: 8, falseRate: 0.02 }] } } } });
    expect(html).toContain('<li><code>trust.expectedFalseTagged</code> = 0.4</li>');
    expect(html).toContain('<table class="data small"><thead><tr><th>rateHz</th><th>falseRate</th></tr></thead><tbody><tr><td>2</td><td>0.01</td></tr><tr><td>8</td><td>0.02</td></tr></tbody></table>');
  });
});
