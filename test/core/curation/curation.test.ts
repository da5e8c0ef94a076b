import { describe, expect, it } from 'vitest';
import { applyCuration } from '../../../core/curation/apply-curation';
import { autosave, autosaveDue, AUTOSAVE_CLEAN, type AutosaveState } from '../../../core/curation/autosave';
import { checkCurationAction } from '../../../core/curation/check-curation-action';
import { compareInputs } from '../../../core/curation/compare-inputs';
import { curationReducer } from '../../../core/curation/curation-reducer';
import { historyDispatch, historyRedo, historyUndo, newHistory } from '../../../core/curation/history';
import { EMPTY_CURATION, type CurationAction } from '../../../core/curation/types';
import { assembleTable } from '../../../core/table/assemble-table';
import type { Column } from '../../../core/table/types';

const by = 'ana';
const at = (m: number) => `2026-03-01T14:${String(m).padStart(2, '0')}:00.000Z`;
const label = (unit: string, column: string, value: string | null, m = 0): CurationAction => ({ type: 'label', unit, column, value, by, at: at(m) });

describe('curationReducer', () => {
  it('stores label, note and include beside each other with who/when', () => {
    let s = curationReducer(EMPTY_CURATION, label('u1', 'tag', 'tagged', 1));
    s = curationReducer(s, { type: 'note', unit: 'u1', text: 'clean waveform', by: 'ben', at: at(2) });
    s = curationReducer(s, { type: 'include', unit: 'u2', value: false, by, at: at(3) });
    expect(s).toEqual({
      units: {
        u1: { labels: { tag: { value: 'tagged', by, at: at(1) } }, note: { text: 'clean waveform', by: 'ben', at: at(2) } },
        u2: { labels: {}, include: { value: false, by, at: at(3) } },
      },
    });
  });
  it('returns the same object for a no-op and drops a unit whose last decision is cleared', () => {
    const s = curationReducer(EMPTY_CURATION, label('u1', 'tag', 'tagged'));
    expect(curationReducer(s, label('u1', 'tag', 'tagged', 5))).toBe(s);
    expect(curationReducer(s, label('u1', 'ramp', null))).toBe(s);
    expect(curationReducer(s, label('u1', 'tag', null))).toEqual({ units: {} });
    expect(curationReducer(EMPTY_CURATION, { type: 'note', unit: 'u1', text: '', by, at: at(0) })).toBe(EMPTY_CURATION);
  });
  it('never modifies its input', () => {
    const s = curationReducer(EMPTY_CURATION, label('u1', 'tag', 'tagged'));
    const frozen = JSON.stringify(s);
    curationReducer(s, label('u1', 'tag', 'untagged'));
    curationReducer(s, { type: 'batch', actions: [label('u2', 'ramp', 'up'), label('u1', 'tag', null)] });
    expect(JSON.stringify(s)).toBe(frozen);
    expect(JSON.stringify(EMPTY_CURATION)).toBe('{"units":{}}');
  });
});

describe('curation undo/redo', () => {
  it('undoes and redoes step by step, a batch as one step, and a new action clears redo', () => {
    let h = newHistory(EMPTY_CURATION);
    h = historyDispatch(h, label('u1', 'tag', 'tagged'));
    const afterOne = h.present;
    h = historyDispatch(h, { type: 'batch', actions: [{ type: 'include', unit: 'u2', value: false, by, at: at(1) }, { type: 'include', unit: 'u3', value: false, by, at: at(1) }] });
    expect(Object.keys(h.present.units)).toEqual(['u1', 'u2', 'u3']);
    h = historyUndo(h);
    expect(h.present).toBe(afterOne);
    h = historyUndo(h);
    expect(h.present).toEqual(EMPTY_CURATION);
    expect(historyUndo(h)).toBe(h); // nothing more to undo
    h = historyRedo(historyRedo(h));
    expect(Object.keys(h.present.units)).toEqual(['u1', 'u2', 'u3']);
    expect(historyRedo(h)).toBe(h);
    h = historyUndo(h);
    h = historyDispatch(h, label('u4', 'ramp', 'down'));
    expect(h.future).toEqual([]);
    expect(Object.keys(h.present.units)).toEqual(['u1', 'u4']);
  });
  it('a no-op action adds no undo step; the history limit drops only the oldest steps', () => {
    let h = historyDispatch(newHistory(EMPTY_CURATION), label('u1', 'tag', 'tagged'));
    expect(historyDispatch(h, label('u1', 'tag', 'tagged'))).toBe(h);
    for (let i = 0; i < 5; i++) h = historyDispatch(h, { type: 'note', unit: 'u1', text: `n${i}`, by, at: at(i) }, 3);
    expect(h.past.length).toBe(3);
    expect(h.present.units.u1.note?.text).toBe('n4');
  });
});

describe('checkCurationAction', () => {
  const units = new Set(['u1', 'u2']);
  it.each([
    [label('u9', 'tag', 'tagged'), /unit "u9" is not in this session \(units: u1, u2\)/],
    [label('u1', 'rate_hz', 'up'), /"rate_hz" is not a verdict column/],
    [label('u1', 'tag', 'yes'), /"yes" is not a tag verdict: use one of tagged, borderline, untagged/],
    [label('u1', 'jump_forward', 'up'), /use one of excited, suppressed, none/],
    [label('u1', 'quality', 'good'), /use one of pass, review/],
    [{ ...label('u1', 'tag', 'tagged'), by: ' ' }, /user name/],
    [{ ...label('u1', 'tag', 'tagged'), at: 'yesterday' }, /ISO 8601/],
  ])('rejects %j', (a, re) => expect(checkCurationAction(a, units)).toMatch(re));
  it('accepts good actions, including clearing and jump kinds with underscores', () => {
    expect(checkCurationAction(label('u1', 'tag', null), units)).toBeNull();
    expect(checkCurationAction(label('u1', 'jump_far_back', 'excited'), units)).toBeNull();
    expect(checkCurationAction({ type: 'batch', actions: [label('u1', 'ramp', 'flat'), label('u3', 'ramp', 'flat')] }, units)).toMatch(/u3/);
  });
});

describe('applyCuration', () => {
  const col = (name: string, v: string[]): Column => ({ name, kind: 'string', values: v, description: name });
  const table = assembleTable(
    [col('unit', ['a', 'b', 'c']), col('tag', ['untagged', 'tagged', 'borderline']), { name: 'tag_p', kind: 'number', values: Float64Array.of(0.5, 0.001, 0.02), description: '' }, col('jump_fwd', ['none', 'excited', 'none']), { name: 'jump_fwd_delta_hz', kind: 'number', values: Float64Array.of(0, 2, 0), description: '' }, col('quality', ['pass', 'pass', 'review'])],
    3,
  );
  it('keeps computed verdicts and adds final values, include, note and stamps', () => {
    let s = curationReducer(EMPTY_CURATION, label('a', 'tag', 'tagged', 1));
    s = curationReducer(s, { type: 'include', unit: 'c', value: false, by: 'ben', at: at(7) });
    s = curationReducer(s, { type: 'note', unit: 'a', text: 'late but clean', by, at: at(4) });
    s = curationReducer(s, label('zz', 'tag', 'tagged'));
    const { table: t, orphans } = applyCuration(table, s);
    const v = (n: string) => t.columns.find((c) => c.name === n)!.values;
    expect(t.columns.map((c) => c.name)).toEqual(['unit', 'tag', 'tag_p', 'jump_fwd', 'jump_fwd_delta_hz', 'quality', 'final_tag', 'final_jump_fwd', 'final_quality', 'included', 'note', 'curated', 'curated_by', 'curated_at']);
    expect(v('tag')).toEqual(['untagged', 'tagged', 'borderline']); // computed stays as computed
    expect(v('final_tag')).toEqual(['tagged', 'tagged', 'borderline']);
    expect(v('included')).toEqual(['yes', 'yes', 'no']);
    expect(v('note')).toEqual(['late but clean', '', '']);
    expect(v('curated')).toEqual(['tag;note', '', 'include']);
    expect(v('curated_by')).toEqual(['ana', '', 'ben']);
    expect(v('curated_at')).toEqual([at(4), '', at(7)]);
    expect(orphans).toEqual(['zz']);
  });
});

describe('compareInputs', () => {
  const rec = (file: string, sha: string, bytes = 10) => ({ file, bytes, sha256: sha.repeat(64) });
  it('reports changed, missing and added files', () => {
    const m = compareInputs([rec('spikes.csv', 'a'), rec('pulses.csv', 'b'), rec('events.csv', 'c')], [rec('spikes.csv', 'a'), rec('pulses.csv', 'd'), rec('trials.csv', 'e')]);
    expect(m.changed.map((c) => c.file)).toEqual(['pulses.csv']);
    expect(m.missing).toEqual(['events.csv']);
    expect(m.added).toEqual(['trials.csv']);
    expect(m.same).toBe(false);
    expect(compareInputs([rec('x', 'a')], [rec('x', 'a')]).same).toBe(true);
    expect(compareInputs([rec('x', 'a', 10)], [rec('x', 'a', 11)]).changed.length).toBe(1);
  });
});

describe('autosave policy', () => {
  const opts = { debounceMs: 1000, maxDelayMs: 5000, retryMs: 3000 };
  it('debounces, caps the delay under steady editing, and never marks newer edits saved', () => {
    let s: AutosaveState = AUTOSAVE_CLEAN;
    expect(autosaveDue(s, 0, opts)).toEqual({ dirty: false, due: false, waitMs: Infinity });
    s = autosave(s, { type: 'edit', nowMs: 0 });
    expect(autosaveDue(s, 500, opts)).toEqual({ dirty: true, due: false, waitMs: 500 });
    // steady edits every 800 ms: the debounce never expires, but the cap at 5000 ms does
    for (let t = 800; t <= 4800; t += 800) s = autosave(s, { type: 'edit', nowMs: t });
    expect(autosaveDue(s, 4900, opts).due).toBe(false);
    expect(autosaveDue(s, 5000, opts).due).toBe(true);
    s = autosave(s, { type: 'save-start', nowMs: 5000 });
    expect(autosaveDue(s, 9000, opts).due).toBe(false); // one save at a time
    s = autosave(s, { type: 'edit', nowMs: 5100 }); // edit during the save
    s = autosave(s, { type: 'save-done', nowMs: 5200 });
    expect(autosaveDue(s, 5200, opts).dirty).toBe(true);
    expect(autosaveDue(s, 6100, opts).due).toBe(true);
    s = autosave(autosave(s, { type: 'save-start', nowMs: 6100 }), { type: 'save-done', nowMs: 6200 });
    expect(autosaveDue(s, 6200, opts).dirty).toBe(false);
  });
  it('retries a failed save after retryMs', () => {
    let s = autosave(AUTOSAVE_CLEAN, { type: 'edit', nowMs: 0 });
    s = autosave(autosave(s, { type: 'save-start', nowMs: 1000 }), { type: 'save-failed', nowMs: 1010 });
    expect(autosaveDue(s, 2000, opts)).toEqual({ dirty: true, due: false, waitMs: 2010 });
    expect(autosaveDue(s, 4010, opts).due).toBe(true);
  });
});

describe('applyCuration without the labelled verdict column', () => {
  it('still shows the label in final_V (empty elsewhere)', () => {
    const t = assembleTable([{ name: 'unit', kind: 'string', values: ['a', 'b'], description: '' }], 2);
    const s = curationReducer(EMPTY_CURATION, label('b', 'ramp', 'up'));
    const out = applyCuration(t, s).table;
    expect(out.columns.map((c) => c.name)).toEqual(['unit', 'final_ramp', 'included', 'note', 'curated', 'curated_by', 'curated_at']);
    expect(out.columns[1].values).toEqual(['', 'up']);
  });
});

describe('verdict columns (jump_K needs its jump_K_delta_hz companion)', () => {
  it('ignores derived jump columns', async () => {
    const { verdictColumns } = await import('../../../core/curation/verdict-columns');
    const { verdictWords } = await import('../../../core/curation/verdict-words');
    const s = (name: string): Column => ({ name, kind: 'string', values: ['none'], description: '' });
    const t = assembleTable([s('unit'), s('jump_fwd'), { name: 'jump_fwd_delta_hz', kind: 'number', values: Float64Array.of(1), description: '' }, s('jump_fwd_reason'), s('jump_fwd_shape'), s('jump_lone')], 1);
    expect(verdictColumns(t).map((c) => c.name)).toEqual(['jump_fwd']);
    expect(verdictWords('jump_fwd_reason')).toBeNull();
    expect(verdictWords('jump_fwd_q')).toBeNull();
    expect(verdictWords('jump_far_back')).not.toBeNull();
  });
});
