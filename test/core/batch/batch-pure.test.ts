/**
 * The batch runner's pure parts: session names, combining units.csv tables,
 * the progress lines and the HTML summary. Expected values worked by hand
 * (no outside method is involved beyond RFC 4180 quoting).
 */
import { describe, expect, it } from 'vitest';
import { batchSummaryHtml } from '../../../core/batch/batch-summary-html';
import { combineUnitTables } from '../../../core/batch/combine-unit-tables';
import { renderBatchProgress } from '../../../core/batch/render-batch-progress';
import { sessionNames } from '../../../core/batch/session-names';
import type { BatchJobResult } from '../../../core/batch/types';
import { parseCsvRecords } from '../../../core/table/parse-csv-records';

describe('sessionNames', () => {
  it('takes the last path component, drops .nwb, makes names safe and unique in list order', () => {
    expect(sessionNames(['/d/m1/s1', '/e/m2/s1/', 'C:\\x\\s1', '/f/rec 3.nwb', '/g/a&b', '/h/s1-2'])).toEqual(['s1', 's1-2', 's1-3', 'rec_3', 'a_b', 's1-2-2']);
    expect(sessionNames(['/'])).toEqual(['session']);
  });
});

describe('combineUnitTables', () => {
  const a = 'unit,n_spikes,tag,ramp,jump_forward,jump_forward_p,tag_reason\n1,10,tagged,up,excited,0.01,"p<0.01, latency 3 ms"\n2,5,untagged,flat,none,0.5,\n';
  const b = 'unit,n_spikes,tag,ramp,extra\n7,3,borderline,down,"x ""y"""\n';
  it('prepends a session column, unions the columns in first-seen order and re-quotes cells', () => {
    const c = combineUnitTables([
      { session: 'A', text: a },
      { session: 'B', text: b },
    ]);
    expect(c.columns).toEqual(['session', 'unit', 'n_spikes', 'tag', 'ramp', 'jump_forward', 'jump_forward_p', 'tag_reason', 'extra']);
    expect(c.rows).toBe(3);
    expect(parseCsvRecords(c.csv)).toEqual([
      c.columns,
      ['A', '1', '10', 'tagged', 'up', 'excited', '0.01', 'p<0.01, latency 3 ms', ''],
      ['A', '2', '5', 'untagged', 'flat', 'none', '0.5', '', ''],
      ['B', '7', '3', 'borderline', 'down', '', '', '', 'x "y"'],
    ]);
    expect(c.counts.A).toEqual({ units: 2, tag: { tagged: 1, untagged: 1 }, ramp: { up: 1, flat: 1 }, jump: { forward: { excited: 1, none: 1 } } });
    expect(c.counts.B).toEqual({ units: 1, tag: { borderline: 1 }, ramp: { down: 1 }, jump: {} });
  });
  it('handles no tables, and rejects ragged rows and tables without a unit column', () => {
    expect(combineUnitTables([]).csv).toBe('session\n');
    expect(() => combineUnitTables([{ session: 'X', text: 'unit,a\n1\n' }])).toThrow(/row 2: 1 cells for 2 columns/);
    expect(() => combineUnitTables([{ session: 'X', text: 'id,a\n1,2\n' }])).toThrow(/no unit column/);
  });
});

describe('renderBatchProgress', () => {
  it('draws the overall bar and one line per worker', () => {
    const lines = renderBatchProgress({
      total: 4,
      ok: 1,
      skipped: 1,
      failed: 0,
      elapsedS: 12.4,
      width: 8,
      workers: [
        { worker: 1, name: 's3', stage: 'running', elapsedS: 2.25, fraction: 0.5 },
        { worker: 2, name: null, stage: '', elapsedS: 0, fraction: NaN },
        { worker: 3, name: 's4', stage: 'checking inputs', elapsedS: 0.1, fraction: NaN },
      ],
    });
    expect(lines[0]).toBe('batch [####....] 2/4 sessions  ok 1  skipped 1  failed 0  12 s');
    expect(lines[1]).toBe('  worker 1  [####....] ~50%  s3  running 2.3 s');
    expect(lines[2]).toBe('  worker 2              idle');
    expect(lines[3]).toMatch(/^ {2}worker 3 {2}\s+s4 {2}checking inputs 0\.1 s$/);
  });
});

describe('batchSummaryHtml', () => {
  const res = (name: string, status: BatchJobResult['status'], message = ''): BatchJobResult => ({
    index: 0,
    name,
    session: `/x/${name}`,
    status,
    message,
    seconds: 1.25,
    bytes: 0,
    listingKey: '',
    parametersKey: '',
  });
  it('is self-contained, escapes text, lists every session and totals the verdicts', () => {
    const html = batchSummaryHtml({
      title: 'T <1>',
      toolVersion: '0.1.0',
      generatedAt: '2026-01-01T00:00:00Z',
      results: [res('a', 'ok'), res('b<', 'failed', 'spikes.csv, row 2: "bad" & worse')],
      counts: { a: { units: 3, tag: { tagged: 2, untagged: 1 }, ramp: { up: 1, flat: 2 }, jump: { forward: { excited: 1, none: 2 } } } },
      combinedTable: '/o/units.csv',
    });
    expect(html.startsWith('<!doctype html>')).toBe(true);
    expect(html).not.toMatch(/<script|<link|src=|href=/);
    expect(html).toContain('<title>T &lt;1&gt;</title>');
    expect(html).toContain('<th scope="row">b&lt;</th><td>failed</td>');
    expect(html).toContain('spikes.csv, row 2: &quot;bad&quot; &amp; worse');
    expect(html).toContain('<th scope="col">jump forward excited</th>');
    expect(html).toContain('<tr><th scope="row">all sessions</th><td>1 ok, 0 skipped, 1 failed</td><td>3</td><td>2</td><td>0</td><td>1</td><td>0</td><td>1</td><td>0</td><td>2.5</td><td></td></tr>');
    expect(html).toMatch(/statistical screens/);
  });
});
