import { verdictColumns } from '../curation/verdict-columns';
import { verdictWords } from '../curation/verdict-words';
import type { Parameters } from '../defaults';
import { figureHeight } from '../figures/draw/figure-height';
import { forScreen } from '../figures/draw/for-screen';
import { VERDICT_STYLE, type FigureSpec } from '../figures/theme';
import type { InputFileRecord } from '../io/import-result';
import type { Warning } from '../model/types';
import { formatNumber } from '../table/format-number';
import type { Column, UnitTable } from '../table/types';
import type { BuiltFigure } from './collect-report-figures';
import { embedJson } from './embed-json';
import { embedScript } from './embed-script';
import { escapeHtml as esc } from './escape-html';

/** Everything the HTML report shows. All of it is data; the builder is pure. */
export interface ReportInput {
  readonly title: string;
  /** ISO 8601 UTC time the report was made (core has no clock). */
  readonly createdAt: string;
  readonly toolVersion: string;
  /** Data source (folder or NWB file) and session file, as the user named them. */
  readonly source: string;
  readonly sessionFile: string | null;
  /** The unit table with curation applied (final_V, included, note, ...). */
  readonly table: UnitTable;
  readonly parameters: Parameters;
  /** Per-step summaries of the analysis (run.json's summaries). */
  readonly summaries: Readonly<Record<string, unknown>>;
  readonly inputs: readonly InputFileRecord[];
  readonly warnings: readonly Warning[];
  /** Things the reader must know (inputs changed since curation, backup used, ...). */
  readonly notices: readonly string[];
  readonly figures: { readonly population: readonly BuiltFigure[]; readonly units: readonly (readonly BuiltFigure[])[] };
  /** The minified plotly.js source, read at the Node edge. */
  readonly plotlySource: string;
}

/** Columns shown in the report's unit overview, when present (all columns are in each unit's section). */
const OVERVIEW = ['unit', 'n_spikes', 'rate_hz', 'tag', 'final_tag', 'tag_latency_ms', 'tag_p', 'ramp', 'final_ramp', 'quality', 'final_quality', 'contamination', 'presence_ratio', 'included'];

/**
 * Builds the HTML report: one self-contained file (no network access; the
 * plotting library and all figure data are inline) that opens offline in
 * any current browser. Sections: header and cautions; notices; counts per
 * verdict; light-identification criteria and what the light analysis
 * reported about them (summaries.light, including any estimated
 * false-identification rate, rendered as found; a note when absent);
 * quality screen; population figures; group averages (by `cluster` when the
 * table has one, else by final tag, else by quality); unit overview; one
 * collapsible section per unit with every column and its figures (drawn when
 * opened, so a 1,000-unit report stays quick).
 *
 * Every text from the data is escaped (escapeHtml); figure data are embedded
 * as JSON with "<" escaped; the plotly source has "</script" escaped.
 */
export function buildReport(r: ReportInput): string {
  const t = r.table;
  const col = new Map(t.columns.map((c) => [c.name, c]));
  const unitCol = col.get('unit');
  const ids = unitCol && unitCol.kind === 'string' ? unitCol.values : Array.from({ length: t.rowCount }, (_, i) => String(i));
  const parts: string[] = [];
  parts.push(`<header><h1>${esc(r.title)}</h1>
<p class="meta">Source <code>${esc(r.source)}</code>${r.sessionFile ? `, session file <code>${esc(r.sessionFile)}</code>` : ''}; ${t.rowCount} units; made ${esc(r.createdAt)} by tagbench ${esc(r.toolVersion)}.</p>
<p class="caution"><strong>Read with care.</strong> Every verdict here is a statistical screen, not proof of a unit's identity or quality. Light-evoked spikes can be mimicked by photoelectric artefacts at the electrode and by tissue heating; check waveforms and controls. Laser work follows your institution's laser-safety rules and your animal protocol.</p>
<nav>${['Verdicts', 'Criteria', 'Quality', 'Population', 'Groups', 'Units', 'Provenance'].map((s) => `<a href="#${s.toLowerCase()}">${s}</a>`).join(' · ')}</nav></header>`);
  if (r.notices.length) parts.push(`<section class="notices">${r.notices.map((n) => `<p class="notice">${esc(n)}</p>`).join('')}</section>`);

  // Counts per verdict
  const verdictCols = verdictColumns(t);
  const rows: string[] = [];
  for (const c of verdictCols) {
    const fin = col.get(`final_${c.name}`);
    for (const w of verdictWords(c.name)!) {
      const n = (c.values as readonly string[]).filter((v) => v === w).length;
      const nf = fin ? (fin.values as readonly string[]).filter((v) => v === w).length : null;
      rows.push(`<tr><td>${esc(c.name)}</td><td>${badge(w)}</td><td class="num">${n}</td><td class="num">${nf ?? ''}</td></tr>`);
    }
  }
  const inc = col.get('included');
  const excluded = inc && inc.kind === 'string' ? inc.values.filter((v) => v === 'no').length : 0;
  parts.push(`<section id="verdicts"><h2>Counts per verdict</h2>
${verdictCols.length ? `<table class="data"><thead><tr><th>Verdict</th><th>Word</th><th>Computed</th><th>Final (after curation)</th></tr></thead><tbody>${rows.join('')}</tbody></table>` : '<p>No verdict columns in this table.</p>'}
<p>${excluded} unit(s) excluded by hand (they stay in the table with <code>included = no</code>).</p>
${populationSlots(r.figures.population, (f) => f.id === 'verdict-counts')}</section>`);

  // Criteria and false-identification rate
  const light = r.summaries.light;
  parts.push(`<section id="criteria"><h2>Light-identification criteria</h2>
<p>Parameters in use (section <code>light</code>):</p>${renderValue(r.parameters.light)}
<h3>What the light analysis reported</h3>
${light === undefined ? '<p class="absent">The run has no light-identification summary (no pulses in the inputs, or the light analysis did not run), so no estimated false-identification rate can be shown.</p>' : `${falseIdHeadline(light)}${renderValue(light)}`}</section>`);

  // Quality
  parts.push(`<section id="quality"><h2>Quality screen</h2>
<p>Thresholds (section <code>quality</code>; common practice or our choice, see the README):</p>${renderValue(r.parameters.quality)}
${r.summaries.quality !== undefined ? `<h3>Summary</h3>${renderValue(r.summaries.quality)}` : ''}</section>`);

  // Population figures
  parts.push(`<section id="population"><h2>Population</h2>${populationSlots(r.figures.population, (f) => f.id !== 'verdict-counts')}</section>`);

  // Group averages
  parts.push(`<section id="groups"><h2>Group averages</h2>${groupAverages(t, col)}</section>`);

  // Unit overview
  const ov = OVERVIEW.map((n) => col.get(n)).filter((c): c is Column => c !== undefined);
  const ovRows: string[] = [];
  for (let i = 0; i < t.rowCount; i++) {
    ovRows.push(`<tr data-text="${esc(ids[i].toLowerCase())}">${ov.map((c) => (c.name === 'unit' ? `<td><a href="#unit-${i}">${esc(ids[i])}</a></td>` : cell(c, i))).join('')}</tr>`);
  }
  parts.push(`<section id="units"><h2>Units</h2>
<p><label>Find unit <input id="unit-filter" type="search" placeholder="unit id"></label> Click a unit to open its section. All columns are in each unit's section and in the exported table.</p>
<table class="data" id="unit-table"><thead><tr>${ov.map((c) => `<th title="${esc(c.description)}">${esc(c.name)}</th>`).join('')}</tr></thead><tbody>${ovRows.join('')}</tbody></table>
${ids.map((id, i) => unitSection(t, i, id, r.figures.units[i] ?? [])).join('\n')}</section>`);

  // Provenance
  parts.push(`<section id="provenance"><h2>Provenance</h2>
<h3>Input files</h3><table class="data"><thead><tr><th>File</th><th>Bytes</th><th>SHA-256</th></tr></thead><tbody>${r.inputs.map((f) => `<tr><td>${esc(f.file)}</td><td class="num">${f.bytes}</td><td><code>${esc(f.sha256)}</code></td></tr>`).join('')}</tbody></table>
<h3>Warnings</h3>${r.warnings.length ? `<ul>${r.warnings.map((w) => `<li><code>${esc(w.code)}</code> x${w.count}${w.file ? ` (${esc(w.file)})` : ''}: ${esc(w.message)}</li>`).join('')}</ul>` : '<p>None.</p>'}
<h3>All parameters</h3>${renderValue(r.parameters)}</section>`);

  // SVG traces only, every tick and point kept (forScreen exact): a report opened where WebGL
  // does not work (no GPU, remote desktops, some browsers' privacy settings) draws every figure
  const svg = (spec: FigureSpec): FigureSpec => {
    const heightPx = figureHeight(spec);
    const out = forScreen(spec, { widthPx: 900, heightPx, exact: true });
    return { ...out, layout: { ...out.layout, height: heightPx } };
  };
  const figureData = { pop: r.figures.population.map((f) => svg(f.spec)), units: r.figures.units.map((fs) => fs.map((f) => svg(f.spec))) };
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="tagbench ${esc(r.toolVersion)}">
<title>${esc(r.title)}</title>
<style>${CSS}</style></head>
<body>
${parts.join('\n')}
<script type="application/json" id="tb-figures">${embedJson(figureData)}</script>
<script>${embedScript(r.plotlySource)}</script>
<script>${embedScript(CLIENT_JS)}</script>
</body></html>
`;
}

function badge(word: string): string {
  const s = VERDICT_STYLE[word];
  return `<span class="badge" style="border-color:${s ? s.color : '#7f7f7f'}"><span class="dot" style="background:${s ? s.color : '#7f7f7f'}"></span>${esc(word)}</span>`;
}

function cell(c: Column, i: number): string {
  if (c.kind === 'number') return `<td class="num">${esc(formatNumber(c.values[i], Math.min(c.digits ?? 4, 4)))}</td>`;
  const v = c.values[i];
  return `<td>${VERDICT_STYLE[v] && verdictWords(c.name.replace(/^final_/, '')) ? badge(v) : esc(v)}</td>`;
}

/** Slots for the population figures that pass `keep`, each pointing at its index in the embedded data. */
function populationSlots(figs: readonly BuiltFigure[], keep: (f: BuiltFigure) => boolean): string {
  const slots = figs
    .map((f, k) => (keep(f) ? `<div class="fig" data-group="pop" data-index="${k}" role="img" aria-label="${esc(f.title)}"></div>` : ''))
    .join('');
  return slots ? `<div class="figs">${slots}</div>` : '<p class="absent">No figures apply.</p>';
}

function unitSection(t: UnitTable, i: number, id: string, figs: readonly BuiltFigure[]): string {
  const dl = t.columns
    .map((c) => {
      const v = c.kind === 'number' ? formatNumber(c.values[i], c.digits ?? 6) : c.values[i];
      const shown = c.kind === 'string' && VERDICT_STYLE[v] && verdictWords(c.name.replace(/^final_/, '')) ? badge(v) : esc(v === '' ? '—' : v);
      return `<dt title="${esc(c.description)}">${esc(c.name)}</dt><dd>${shown}</dd>`;
    })
    .join('');
  return `<details class="unit" id="unit-${i}" data-unit="${i}"><summary>Unit ${esc(id)}</summary>
<div class="unit-body"><dl>${dl}</dl>
${figs.length ? `<div class="figs">${figs.map((f, k) => `<div class="fig" data-group="unit" data-unit="${i}" data-index="${k}" role="img" aria-label="${esc(f.title)}"></div>`).join('')}</div>` : '<p class="absent">No figures apply to this unit.</p>'}</div></details>`;
}

/** Mean ± SD of numeric columns per group, transposed (one row per column). */
function groupAverages(t: UnitTable, col: Map<string, Column>): string {
  const by = ['cluster', 'final_tag', 'tag', 'final_quality', 'quality'].map((n) => col.get(n)).find((c) => c !== undefined);
  if (!by) return '<p class="absent">No column to group by (cluster, tag or quality).</p>';
  const keys = by.kind === 'string' ? by.values : Array.from(by.values, (v) => formatNumber(v));
  const groups = [...new Set(keys)].sort();
  const nums = t.columns.filter((c) => c.kind === 'number' && !c.name.endsWith('_p') && !c.name.endsWith('_q'));
  const stat = (c: Column, g: string) => {
    let n = 0;
    let s = 0;
    let s2 = 0;
    for (let i = 0; i < t.rowCount; i++) {
      const v = c.values[i] as number;
      if (keys[i] !== g || !Number.isFinite(v)) continue;
      n++;
      s += v;
      s2 += v * v;
    }
    if (n === 0) return '';
    const m = s / n;
    const sd = n > 1 ? Math.sqrt(Math.max(0, (s2 - n * m * m) / (n - 1))) : NaN;
    return `${formatNumber(m, 3)}${Number.isFinite(sd) ? ` ± ${formatNumber(sd, 2)}` : ''}`;
  };
  const head = `<tr><th>Column</th>${groups.map((g) => `<th>${esc(by.name)} = ${esc(g || '(empty)')}<br><span class="n">n = ${keys.filter((k) => k === g).length}</span></th>`).join('')}</tr>`;
  const body = nums.map((c) => `<tr><td title="${esc(c.description)}">${esc(c.name)}</td>${groups.map((g) => `<td class="num">${esc(stat(c, g))}</td>`).join('')}</tr>`).join('');
  return `<p>Grouped by <code>${esc(by.name)}</code>: mean ± SD (sample) over units with a value; p- and q-values are not averaged.</p><table class="data"><thead>${head}</thead><tbody>${body}</tbody></table>`;
}

/**
 * The light summary's false-identification figures, shown first: every
 * number (to depth 3) whose key mentions "false" (e.g. an expected number of
 * falsely tagged units or a false-identification rate), with its path.
 */
function falseIdHeadline(light: unknown): string {
  const found: string[] = [];
  const walk = (v: unknown, path: string, depth: number) => {
    if (depth > 3 || v === null || typeof v !== 'object' || Array.isArray(v)) return;
    for (const [k, x] of Object.entries(v as Record<string, unknown>)) {
      const p = path ? `${path}.${k}` : k;
      if (typeof x === 'number' && /false/i.test(k)) found.push(`<li><code>${esc(p)}</code> = ${esc(formatNumber(x, 4))}</li>`);
      else walk(x, p, depth + 1);
    }
  };
  walk(light, '', 0);
  return found.length
    ? `<div class="headline"><strong>Estimated false identification</strong> (as the light analysis reports it):<ul>${found.join('')}</ul></div>`
    : '<p class="absent">The light summary names no false-identification estimate.</p>';
}

/** A compact one-line form of a small value (for table cells). */
function compact(v: unknown): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return formatNumber(v, 4);
  if (typeof v !== 'object') return String(v);
  if (Array.isArray(v)) return v.map(compact).join('; ');
  return Object.entries(v as Record<string, unknown>).map(([k, x]) => `${k} ${compact(x)}`).join(', ');
}

/** Renders a JSON-like value as nested lists, lists of records as tables (scalars escaped; depth-limited). */
function renderValue(v: unknown, depth = 0): string {
  if (v === null || v === undefined) return '<span class="absent">none</span>';
  if (typeof v === 'number') return esc(formatNumber(v, 6));
  if (typeof v === 'string' || typeof v === 'boolean') return esc(String(v));
  if (Array.isArray(v)) {
    if (v.every((x) => x === null || typeof x !== 'object')) return esc(v.map((x) => (typeof x === 'number' ? formatNumber(x, 6) : String(x))).join(', '));
    if (v.every((x) => x !== null && typeof x === 'object' && !Array.isArray(x))) {
      const keys = [...new Set(v.flatMap((x) => Object.keys(x as object)))];
      const rows = v.map((x) => `<tr>${keys.map((k) => `<td>${esc(compact((x as Record<string, unknown>)[k]))}</td>`).join('')}</tr>`).join('');
      return `<table class="data small"><thead><tr>${keys.map((k) => `<th>${esc(k)}</th>`).join('')}</tr></thead><tbody>${rows}</tbody></table>`;
    }
    if (depth > 3) return esc(compact(v).slice(0, 300));
    return `<ol>${v.map((x) => `<li>${renderValue(x, depth + 1)}</li>`).join('')}</ol>`;
  }
  if (typeof v === 'object') {
    if (depth > 3) return esc(compact(v).slice(0, 300));
    const e = Object.entries(v as Record<string, unknown>);
    if (e.length === 0) return '<span class="absent">none</span>';
    return `<dl class="kv">${e.map(([k, x]) => `<dt>${esc(k)}</dt><dd>${renderValue(x, depth + 1)}</dd>`).join('')}</dl>`;
  }
  return esc(String(v));
}

const CSS = `
body{font:14px/1.45 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;color:#222;margin:0 auto;max-width:1200px;padding:16px 24px}
h1{font-size:24px;margin:8px 0}h2{font-size:19px;border-bottom:1px solid #ccc;padding-bottom:4px;margin-top:32px}h3{font-size:15px}
.meta{color:#555}.caution{background:#f4f4f4;border-left:4px solid #0072B2;padding:8px 12px}
.notice{background:#fff6e0;border-left:4px solid #E69F00;padding:8px 12px}
.headline{background:#eef6fb;border-left:4px solid #56B4E9;padding:8px 12px;margin:8px 0}table.small{font-size:12px}
nav a{margin:0 4px}code{font-size:12px}
table.data{border-collapse:collapse;margin:8px 0;font-size:13px}table.data th,table.data td{border:1px solid #ddd;padding:3px 8px;text-align:left;vertical-align:top}
table.data th{background:#f4f4f4}td.num{text-align:right;font-variant-numeric:tabular-nums}
.badge{display:inline-flex;align-items:center;gap:4px;border:1px solid;border-radius:10px;padding:0 7px;font-size:12px}
.dot{display:inline-block;width:8px;height:8px;border-radius:50%}
.absent{color:#777;font-style:italic}.n{font-weight:normal;color:#555}
dl.kv{display:grid;grid-template-columns:max-content auto;gap:2px 12px;margin:4px 0}dl.kv dt{color:#555}dl.kv dd{margin:0}
details.unit{border:1px solid #ddd;border-radius:4px;margin:6px 0}details.unit summary{cursor:pointer;padding:6px 10px;font-weight:600}
.unit-body{padding:4px 12px 12px}.unit-body dl{display:grid;grid-template-columns:repeat(auto-fill,minmax(260px,1fr));gap:2px 16px}
.unit-body dt{color:#555;font-size:12px}.unit-body dd{margin:0 0 4px}
.figs{display:grid;grid-template-columns:repeat(auto-fit,minmax(480px,1fr));gap:12px}.fig{min-height:360px}
@media print{details.unit{break-inside:avoid}}
`;

/** The report's own script: draws figures (population at load, a unit's when opened), unit filter, links. */
const CLIENT_JS = `
(function(){
  var data = JSON.parse(document.getElementById('tb-figures').textContent);
  var config = {displaylogo:false, responsive:true, modeBarButtonsToRemove:['sendDataToCloud']};
  function draw(el, spec){ if(el.dataset.drawn) return; el.dataset.drawn='1';
    if(!window.Plotly){ el.textContent='Plotting library unavailable.'; return; }
    Plotly.newPlot(el, spec.data, spec.layout, config); }
  document.querySelectorAll('.fig[data-group="pop"]').forEach(function(el){ draw(el, data.pop[+el.dataset.index]); });
  document.querySelectorAll('details.unit').forEach(function(d){
    d.addEventListener('toggle', function(){ if(!d.open) return;
      d.querySelectorAll('.fig').forEach(function(el){ draw(el, data.units[+el.dataset.unit][+el.dataset.index]); }); });
  });
  function openHash(){ var id=location.hash.slice(1); var d=id && document.getElementById(id);
    if(d && d.tagName==='DETAILS'){ d.open=true; d.scrollIntoView(); } }
  window.addEventListener('hashchange', openHash); openHash();
  var f=document.getElementById('unit-filter');
  if(f) f.addEventListener('input', function(){ var q=f.value.trim().toLowerCase();
    document.querySelectorAll('#unit-table tbody tr').forEach(function(tr){ tr.style.display = !q || tr.dataset.text.indexOf(q)>=0 ? '' : 'none'; }); });
})();
`;
