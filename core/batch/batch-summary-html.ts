import type { SessionCounts } from './combine-unit-tables';
import type { BatchJobResult } from './types';

/**
 * A self-contained HTML page (inline CSS, no scripts, no outside resources)
 * summarising a batch: totals, then one row per session with its status,
 * unit count, verdict counts (tag, ramp, each jump kind), time and, for
 * failures, the message. Status is written as a word (never colour alone).
 * All text is HTML-escaped. Ends with the cautions every tagbench report
 * carries (verdicts are statistical screens; laser safety; light artefacts).
 */
export function batchSummaryHtml(input: {
  readonly title: string;
  readonly toolVersion: string;
  readonly generatedAt: string;
  readonly results: readonly BatchJobResult[];
  readonly counts: Readonly<Record<string, SessionCounts>>;
  readonly combinedTable: string;
}): string {
  const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
  const r = input.results;
  const n = (s: string) => r.filter((x) => x.status === s).length;
  const kinds = [...new Set(Object.values(input.counts).flatMap((c) => Object.keys(c.jump)))].sort();
  const totalUnits = Object.values(input.counts).reduce((a, c) => a + c.units, 0);
  const sum = (f: (c: SessionCounts) => number) => Object.values(input.counts).reduce((a, c) => a + f(c), 0);
  const head = [
    'session',
    'status',
    'units',
    'tagged',
    'borderline',
    'ramp up',
    'ramp down',
    ...kinds.flatMap((k) => [`jump ${k} excited`, `jump ${k} suppressed`]),
    'time (s)',
    'message',
  ];
  const cellsOf = (x: BatchJobResult): string[] => {
    const c = input.counts[x.name];
    const v = (m: Readonly<Record<string, number>> | undefined, key: string) => (c ? String(m?.[key] ?? 0) : '');
    return [
      x.name,
      x.status,
      c ? String(c.units) : '',
      v(c?.tag, 'tagged'),
      v(c?.tag, 'borderline'),
      v(c?.ramp, 'up'),
      v(c?.ramp, 'down'),
      ...kinds.flatMap((k) => [v(c?.jump[k], 'excited'), v(c?.jump[k], 'suppressed')]),
      x.seconds.toFixed(1),
      x.status === 'failed' ? x.message : '',
    ];
  };
  const totals = [
    'all sessions',
    `${n('ok')} ok, ${n('skipped')} skipped, ${n('failed')} failed`,
    String(totalUnits),
    String(sum((c) => c.tag.tagged ?? 0)),
    String(sum((c) => c.tag.borderline ?? 0)),
    String(sum((c) => c.ramp.up ?? 0)),
    String(sum((c) => c.ramp.down ?? 0)),
    ...kinds.flatMap((k) => [String(sum((c) => c.jump[k]?.excited ?? 0)), String(sum((c) => c.jump[k]?.suppressed ?? 0))]),
    r.reduce((a, x) => a + x.seconds, 0).toFixed(1),
    '',
  ];
  const row = (cells: string[], cls = '') =>
    `<tr${cls ? ` class="${cls}"` : ''}>${cells.map((c, i) => (i === 0 ? `<th scope="row">${esc(c)}</th>` : `<td>${esc(c)}</td>`)).join('')}</tr>`;
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<title>${esc(input.title)}</title>
<style>
body { font: 14px/1.45 system-ui, sans-serif; margin: 2em; color: #222; }
table { border-collapse: collapse; margin: 1em 0; }
th, td { border: 1px solid #ccc; padding: 0.3em 0.6em; text-align: right; vertical-align: top; }
th[scope="col"], th[scope="row"], td:nth-child(2), td:last-child { text-align: left; }
thead th { background: #f2f2f2; }
tr.failed td:nth-child(2) { font-weight: bold; }
tr.failed td:last-child { white-space: pre-wrap; max-width: 40em; }
tfoot th, tfoot td { font-weight: bold; background: #fafafa; }
.note { color: #555; max-width: 60em; }
</style>
</head>
<body>
<h1>${esc(input.title)}</h1>
<p>tagbench ${esc(input.toolVersion)}, ${esc(input.generatedAt)}. ${r.length} sessions: ${n('ok')} analysed, ${n('skipped')} unchanged since the last run (skipped), ${n('failed')} failed. Combined table of all units: <code>${esc(input.combinedTable)}</code>; each session's own units.csv and run.json are in <code>sessions/&lt;name&gt;/</code>.</p>
<table>
<thead><tr>${head.map((h) => `<th scope="col">${esc(h)}</th>`).join('')}</tr></thead>
<tbody>
${r.map((x) => row(cellsOf(x), x.status)).join('\n')}
</tbody>
<tfoot>${row(totals)}</tfoot>
</table>
<p class="note">Verdicts are statistical screens, not proof of a cell's identity. Laser work follows your institution's laser-safety rules and your approved animal protocols; light can heat tissue and cause photoelectric artefacts at the electrode.</p>
</body>
</html>
`;
}
