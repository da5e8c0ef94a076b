/**
 * spikePieces and buildRecording's piecewise grouping: the recording built
 * from pieces of any length equals the one built from whole arrays, and both
 * equal a plain reference (filter by unit, then sort by time: Array.prototype.sort
 * with a numeric comparator). Exact equality (tolerance 0: times are copied, never computed).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildRecording } from '../../../core/io/build-recording';
import { spikePieces } from '../../../core/io/spike-pieces';

function cut<T extends Int32Array | Float64Array>(a: T, sizes: number[]): T[] {
  const out: T[] = [];
  let o = 0;
  for (let k = 0; o < a.length; k++) {
    const m = Math.max(1, sizes[k % sizes.length]);
    out.push(a.subarray(o, o + m) as T);
    o += m;
  }
  return out;
}

describe('spikePieces', () => {
  it('visits pieces in order with their first record, and units alone', () => {
    const p = spikePieces([Int32Array.from([0, 1]), Int32Array.from([1])], [Float64Array.from([5, 6]), Float64Array.from([7])]);
    expect(p.length).toBe(3);
    const seen: [number[], number[], number][] = [];
    p.forEach((u, t, first) => seen.push([Array.from(u), Array.from(t), first]));
    expect(seen).toEqual([[[0, 1], [5, 6], 0], [[1], [7], 2]]);
    const firsts: number[] = [];
    p.forEachUnit((_, first) => firsts.push(first));
    expect(firsts).toEqual([0, 2]);
    p.forEach(() => {}, true); // last visit: pieces are dropped
    expect(() => p.forEach(() => {})).toThrow(/after the last visit/);
  });
  it('rejects pieces of unequal length (a reader bug)', () => {
    expect(() => spikePieces([new Int32Array(2)], [new Float64Array(3)])).toThrow(/piece 0 has 2 unit codes but 3 times/);
  });
});

describe('buildRecording from pieces', () => {
  it('equals the whole-array build and a plain reference, for any piece lengths (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.integer({ min: 0, max: 4 }), fc.integer({ min: 0, max: 50 })), { minLength: 1, maxLength: 60 }),
        fc.array(fc.integer({ min: 1, max: 9 }), { minLength: 1, maxLength: 5 }),
        (rows, sizes) => {
          const ids = ['3', '10', 'b', '2', 'a'];
          const unit = Int32Array.from(rows, (r) => r[0]);
          const time = Float64Array.from(rows, (r) => r[1] / 4); // ties and disorder are common
          const cols = { file: 'spikes.csv', rowOf: (i: number) => i + 2, columns: { unit: 'unit', time: 'time' }, unitIds: ids };
          const a = buildRecording({ spikes: { ...cols, unit, time }, toleranceS: 1 });
          const b = buildRecording({ spikes: { ...cols, pieces: spikePieces(cut(unit, sizes), cut(time, sizes)) }, toleranceS: 1 });
          const view = (r: typeof a) => r.recording.units.map((u) => [u.id, Array.from(u.spikeTimes)]);
          expect(view(b)).toEqual(view(a));
          expect(b.warnings).toEqual(a.warnings);
          expect(b.recording.span).toEqual(a.recording.span);
          // every listed id is a unit (those without spikes get empty trains)
          const want = ids.map((id) => [id, rows.filter((r) => ids[r[0]] === id).map((r) => r[1] / 4).sort((x, y) => x - y)]);
          expect(new Map(view(b) as [string, number[]][])).toEqual(new Map(want as [string, number[]][]));
        },
      ),
      { numRuns: 200 },
    );
  });

  it('a reader whose second visit disagrees with the first (a file changed while read) is an input error', () => {
    const unitsFirst = Int32Array.from([0, 0, 1]);
    const unitsLater = Int32Array.from([0, 1, 1]);
    const time = Float64Array.from([1, 2, 3]);
    const pieces = { length: 3, forEachUnit: (v: (u: Int32Array, f: number) => void) => v(unitsFirst, 0), forEach: (v: (u: Int32Array, t: Float64Array, f: number) => void) => v(unitsLater, time, 0) };
    const cols = { file: 'spikes.npy', columns: { unit: 'units.npy', time: 'spikes.npy' }, unitIds: ['1', '2'] };
    expect(() => buildRecording({ spikes: { ...cols, pieces }, toleranceS: 1 })).toThrow('spikes.npy: the spike table changed while it was being read.');
  });

  it('names the first bad row across pieces, and units listed without spikes get empty trains', () => {
    const unit = Int32Array.from([0, 1, 0, 1, 0]);
    const time = Float64Array.from([1, 2, 3, -4, 5]);
    const cols = { file: 'spikes.csv', rowOf: (i: number) => i + 2, columns: { unit: 'unit', time: 'time' }, unitIds: ['1', '2'] };
    expect(() => buildRecording({ spikes: { ...cols, pieces: spikePieces(cut(unit, [2]), cut(time, [2])) }, toleranceS: 1 })).toThrow(
      'spikes.csv, row 5, column "time": time is negative (value "-4").',
    );
    time[3] = 4;
    const info = { file: 'unit_info.csv', rowOf: (i: number) => i + 2, columns: { unit: 'unit' }, ids: ['0', '1', '2'], meta: {} };
    const r = buildRecording({ spikes: { ...cols, pieces: spikePieces(cut(unit, [2]), cut(time, [2])) }, unitInfo: info, toleranceS: 1 });
    expect(r.recording.units.map((u) => [u.id, Array.from(u.spikeTimes)])).toEqual([['0', []], ['1', [1, 3, 5]], ['2', [2, 4]]]);
  });
});
