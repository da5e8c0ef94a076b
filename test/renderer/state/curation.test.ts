import { describe, expect, it } from 'vitest';
import { curationCsv, curationOf, editCuration, EMPTY_CURATION, MAX_UNDO, redoCuration, undoCuration, UNCURATED } from '../../../renderer/state/curation';
import { parseSavedState, serialiseState } from '../../../renderer/state/saved-state';

describe('curation with undo and redo', () => {
  it('sets a label, undoes and redoes it', () => {
    const s1 = editCuration(EMPTY_CURATION, '7', { label: 'unsure' });
    expect(curationOf(s1, '7')).toEqual({ label: 'unsure', note: '', included: true });
    expect(s1.undo.at(-1)?.what).toBe('unit 7: label unsure');
    const u = undoCuration(s1);
    expect(curationOf(u.state, '7')).toEqual(UNCURATED);
    expect(u.state.byUnit).toEqual({});
    const r = redoCuration(u.state);
    expect(curationOf(r.state, '7').label).toBe('unsure');
    expect(r.edit?.unitId).toBe('7');
  });
  it('a new edit clears the redo stack; a no-op edit adds no undo step', () => {
    let s = editCuration(EMPTY_CURATION, '1', { included: false });
    s = undoCuration(s).state;
    expect(s.redo).toHaveLength(1);
    s = editCuration(s, '2', { note: 'double-peaked waveform' });
    expect(s.redo).toHaveLength(0);
    expect(editCuration(s, '2', { note: 'double-peaked waveform' })).toBe(s);
  });
  it('undo and redo on empty stacks change nothing', () => {
    expect(undoCuration(EMPTY_CURATION)).toEqual({ state: EMPTY_CURATION, edit: null });
    expect(redoCuration(EMPTY_CURATION)).toEqual({ state: EMPTY_CURATION, edit: null });
  });
  it('keeps at most MAX_UNDO steps', () => {
    let s = EMPTY_CURATION;
    for (let i = 0; i < MAX_UNDO + 10; i++) s = editCuration(s, String(i), { included: false });
    expect(s.undo).toHaveLength(MAX_UNDO);
    expect(s.undo[0].unitId).toBe('10');
  });
  it('writes curation as CSV with quoting', () => {
    const s = editCuration(editCuration(EMPTY_CURATION, 'a', { note: 'says "hi", twice' }), 'b', { label: 'identified', included: false });
    expect(curationCsv(s, ['a', 'b', 'c'])).toBe('unit,label,included,note\na,,yes,"says ""hi"", twice"\nb,identified,no,\nc,,yes,\n');
  });
});

describe('saved workbench state', () => {
  it('round-trips parameters and curation (not the undo history)', () => {
    const cur = editCuration(EMPTY_CURATION, '3', { label: 'identified', note: 'clean' });
    const text = serialiseState('demo', { light: { windowEndMs: 8 } }, cur, new Date('2026-01-01T00:00:00Z'));
    const back = parseSavedState(text);
    expect(back.parameters).toEqual({ light: { windowEndMs: 8 } });
    expect(back.curation.byUnit).toEqual(cur.byUnit);
    expect(back.curation.undo).toEqual([]);
    expect(back.message).toBeNull();
  });
  it('ignores damaged text and damaged entries with a message, never throwing', () => {
    expect(parseSavedState(null).message).toBeNull();
    expect(parseSavedState('{oops').message).toMatch(/damaged/);
    expect(parseSavedState('{"format":"other"}').message).toMatch(/unknown format/);
    const partly = JSON.stringify({ format: 'tagbench-workbench', version: 1, curation: { a: { label: 'bogus', note: '', included: true }, b: { label: null, note: 'x', included: false } } });
    const r = parseSavedState(partly);
    expect(Object.keys(r.curation.byUnit)).toEqual(['b']);
    expect(r.message).toBe('1 damaged curation entry was ignored.');
  });
});
